package org.slackwater.core.watch;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * A watch tried on history against a list of event dates (e.g. bloom onsets from field records).
 *
 * <p><b>Firings</b> are the watch's episodes: from a day it is raised out of quiet to the day before
 * it clears (a raise to a higher severity inside an episode belongs to it). Each firing is:
 * <ul>
 *   <li>a <b>lead</b> when it starts within {@code leadDays} days before an event, or on the event
 *       day (lead 0: a detection, not a warning); its lead time is the event minus its start;
 *   <li><b>during an event</b> when it starts within {@code leadDays} days after an event (the
 *       event itself keeping the rule true), neither a hit nor a false alarm;
 *   <li>a <b>false alarm</b> otherwise.
 * </ul>
 * An event is <b>caught</b> when a lead firing points at it; its lead time is that of its earliest
 * lead firing. Events outside the evaluated days are left out (a warning names them). The hit rate
 * is caught / events; the false alarm ratio is false alarms / (lead + false alarm firings), the
 * usual verification measures of a yes/no warning (probability of detection, false alarm ratio).
 */
public final class WatchBacktest {
  /** Default window before an event in which a firing counts as its warning. */
  public static final int DEFAULT_LEAD_DAYS = 60;

  /** One episode of the watch. */
  public record Firing(LocalDate start, Optional<LocalDate> end, String peakLevel, String outcome, Optional<LocalDate> event, int leadDays) {}

  /** One event and whether the watch saw it coming. */
  public record Outcome(LocalDate event, boolean caught, Optional<LocalDate> firstWarning, int leadDays) {}

  public record Result(WatchRun run, int window, List<Firing> firings, List<Outcome> events, List<String> warnings) {
    public long caught() {
      return events.stream().filter(Outcome::caught).count();
    }

    public long falseAlarms() {
      return firings.stream().filter(f -> f.outcome().equals("false alarm")).count();
    }

    public double hitRate() {
      return events.isEmpty() ? Double.NaN : (double) caught() / events.size();
    }

    public double falseAlarmRatio() {
      long leads = firings.stream().filter(f -> f.outcome().equals("lead")).count();
      return leads + falseAlarms() == 0 ? Double.NaN : (double) falseAlarms() / (leads + falseAlarms());
    }
  }

  private WatchBacktest() {}

  public static Result of(WatchRun run, List<LocalDate> eventDates, int leadDays) {
    if (leadDays < 0 || leadDays > 366) {
      throw new IllegalArgumentException("the lead window must be 0 to 366 days, was " + leadDays);
    }
    List<String> warnings = new ArrayList<>(run.warnings());
    List<LocalDate> events = new ArrayList<>();
    for (LocalDate e : eventDates.stream().distinct().sorted().toList()) {
      if (e.isBefore(run.from()) || e.isAfter(run.to())) {
        warnings.add("event " + e + " lies outside the evaluated days " + run.from() + " to " + run.to() + " and is left out");
      } else {
        events.add(e);
      }
    }
    List<Firing> firings = new ArrayList<>();
    List<WatchDay> days = run.days();
    int i = 0;
    while (i < days.size()) {
      if (days.get(i).level() == 0) {
        i++;
        continue;
      }
      int j = i, peak = 0;
      while (j < days.size() && days.get(j).level() > 0) {
        peak = Math.max(peak, days.get(j).level());
        j++;
      }
      LocalDate start = days.get(i).day();
      Optional<LocalDate> end = j < days.size() ? Optional.of(days.get(j - 1).day()) : Optional.empty();
      firings.add(classify(start, end, WatchRun.LEVELS.get(peak), events, leadDays));
      i = j;
    }
    List<Outcome> outcomes = new ArrayList<>();
    for (LocalDate e : events) {
      Optional<Firing> first = firings.stream().filter(f -> f.outcome().equals("lead") && f.event().equals(Optional.of(e))).findFirst();
      outcomes.add(new Outcome(e, first.isPresent(), first.map(Firing::start), first.map(Firing::leadDays).orElse(-1)));
    }
    return new Result(run, leadDays, firings, outcomes, warnings);
  }

  private static Firing classify(LocalDate start, Optional<LocalDate> end, String peak, List<LocalDate> events, int leadDays) {
    // The nearest event on or after the start within the window is the one warned of.
    for (LocalDate e : events) {
      long before = ChronoUnit.DAYS.between(start, e);
      if (before >= 0 && before <= leadDays) {
        return new Firing(start, end, peak, "lead", Optional.of(e), (int) before);
      }
    }
    for (LocalDate e : events) {
      long after = ChronoUnit.DAYS.between(e, start);
      if (after > 0 && after <= leadDays) {
        return new Firing(start, end, peak, "during event", Optional.of(e), -1);
      }
    }
    return new Firing(start, end, peak, "false alarm", Optional.empty(), -1);
  }

  /** The backtest as one table: a row per event, then a row per firing; the summary in the metadata. */
  public static ResultTable table(Result r) {
    int n = r.events().size() + r.firings().size();
    String[] kind = new String[n], outcome = new String[n], peak = new String[n], caution = new String[n];
    LocalDate[] day = new LocalDate[n], end = new LocalDate[n], matched = new LocalDate[n];
    double[] lead = new double[n];
    int k = 0;
    for (Outcome o : r.events()) {
      kind[k] = "event";
      day[k] = o.event();
      outcome[k] = o.caught() ? "caught" : "missed";
      matched[k] = o.firstWarning().orElse(null);
      lead[k] = o.caught() ? o.leadDays() : Double.NaN;
      k++;
    }
    for (Firing f : r.firings()) {
      kind[k] = "firing";
      day[k] = f.start();
      end[k] = f.end().orElse(null);
      peak[k] = f.peakLevel();
      outcome[k] = f.outcome();
      matched[k] = f.event().orElse(null);
      lead[k] = f.leadDays() >= 0 ? f.leadDays() : Double.NaN;
      k++;
    }
    Arrays.fill(caution, WatchStatements.CAUTION);
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("watch", r.run().watch());
    meta.put("definition", r.run().text());
    meta.put("evaluated", r.run().from() + " to " + r.run().to());
    meta.put("lead_window_days", Integer.toString(r.window()));
    meta.put("events", Integer.toString(r.events().size()));
    meta.put("caught", Long.toString(r.caught()));
    meta.put("hit_rate", Double.toString(r.hitRate()));
    meta.put("firings", Integer.toString(r.firings().size()));
    meta.put("false_alarms", Long.toString(r.falseAlarms()));
    meta.put("false_alarm_ratio", Double.toString(r.falseAlarmRatio()));
    meta.put("lead_days", String.join(" ", r.events().stream().filter(Outcome::caught).map(o -> Integer.toString(o.leadDays())).toList()));
    meta.put("event_dates", String.join(",", r.events().stream().map(o -> o.event().toString()).toList()));
    meta.put("rules", "a firing is a lead when it starts 0 to " + r.window() + " days before an event, during an event when it starts"
        + " 1 to " + r.window() + " days after one, else a false alarm");
    meta.put("caution", WatchStatements.CAUTION);
    meta.put("result_kind", "backtest");
    List<String> warnings = new ArrayList<>(r.warnings());
    warnings.add(WatchStatements.CAUTION);
    String title = "backtest of watch \"" + r.run().watch() + "\", " + r.run().from() + " to " + r.run().to() + ": " + r.caught() + " of "
        + r.events().size() + " events caught, " + r.falseAlarms() + (r.falseAlarms() == 1 ? " false alarm" : " false alarms");
    return new ResultTable(title, List.of(new Column.Strings("kind", kind), new Column.Dates("day", day), new Column.Dates("end", end),
        new Column.Strings("peak_level", peak), new Column.Strings("outcome", outcome), new Column.Dates("matched", matched),
        new Column.Doubles("lead_days", "day", lead), new Column.Strings("caution", caution)), meta, warnings);
  }
}
