package org.slackwater.render;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.slackwater.core.watch.WatchState;
import org.slackwater.render.BacktestData.Event;
import org.slackwater.render.BacktestData.Outcome;

/**
 * Titles and summary lines of the watch plots, counted from the rows drawn (not copied from the
 * metadata), so that the words and the picture cannot disagree.
 */
final class WatchTitles {
  private WatchTitles() {}

  static String backtestTitle(BacktestData d) {
    return "backtest of " + d.output().named() + ", " + d.from() + " to " + d.to();
  }

  /** "3 of 4 events caught, leads 12/21/19 days, 1 false alarm in 2006-2025". */
  static String backtestSummary(BacktestData d) {
    List<String> parts = new ArrayList<>();
    if (d.events().isEmpty()) {
      parts.add("no events in the evaluated days");
    } else {
      parts.add(d.caught() + " of " + d.events().size() + (d.events().size() == 1 ? " event" : " events") + " caught");
      List<String> leads = d.events().stream().filter(e -> e.caught() && e.leadDays().isPresent())
          .map(e -> Integer.toString(e.leadDays().getAsInt())).toList();
      if (!leads.isEmpty()) {
        parts.add((leads.size() == 1 ? "lead " : "leads ") + String.join("/", leads) + (leads.size() == 1 && leads.get(0).equals("1") ? " day" : " days"));
      }
    }
    long f = d.count(Outcome.FALSE_ALARM);
    parts.add((f == 0 ? "no false alarms" : f == 1 ? "1 false alarm" : f + " false alarms") + " " + period(d.from(), d.to()));
    return String.join(", ", parts);
  }

  /** Hit rate and false alarm ratio with their counts, and the number of firings (the legend gives the lead window). */
  static String backtestMeasures(BacktestData d) {
    List<String> parts = new ArrayList<>();
    if (!d.events().isEmpty()) {
      parts.add("hit rate " + percent(d.caught(), d.events().size()) + " (" + d.caught() + " of " + d.events().size() + ")");
    }
    long leads = d.count(Outcome.LEAD), f = d.count(Outcome.FALSE_ALARM);
    if (leads + f > 0) {
      parts.add("false alarm ratio " + percent(f, leads + f) + " (" + f + " of " + (leads + f) + " warnings)");
    }
    parts.add(d.firings().size() == 1 ? "1 firing" : d.firings().size() + " firings");
    return String.join(Titles.SEP, parts);
  }

  /** The event marker's label: "2009-07-04 caught (lead 12 d)", "2023-06-19 missed". */
  static String eventLabel(Event e, boolean withDate) {
    String what = e.caught() ? "caught" + e.leadDays().stream().mapToObj(n -> " (lead " + n + " d)").findFirst().orElse("") : "missed";
    return withDate ? e.day() + " " + what : what;
  }

  static String runTitle(WatchRunData d) {
    return d.output().named() + ", " + d.from() + " to " + d.to();
  }

  /** "92 days  ·  raised on 1 day, cleared on 1 day  ·  at a level on 26 days (warning 26)". */
  static String runSummary(WatchRunData d) {
    List<String> parts = new ArrayList<>();
    parts.add(days(d.days().size()));
    long raised = d.count(WatchState.RAISED), cleared = d.count(WatchState.CLEARED);
    parts.add("raised on " + days(raised) + ", cleared on " + days(cleared));
    Map<Integer, Long> byLevel = d.daysByLevel();
    long atLevel = byLevel.entrySet().stream().filter(e -> e.getKey() > 0).mapToLong(Map.Entry::getValue).sum();
    if (atLevel == 0) {
      parts.add("no rule held on any day");
    } else {
      String levels = byLevel.entrySet().stream().filter(e -> e.getKey() > 0)
          .map(e -> WatchRunData.LEVELS.get(e.getKey()) + " " + e.getValue()).collect(Collectors.joining(", "));
      parts.add("at a level on " + days(atLevel) + " (" + levels + ")");
    }
    return String.join(Titles.SEP, parts);
  }

  /** "in 2006-2025" for whole years, "from 2014-05-01 to 2014-07-31" otherwise. */
  static String period(LocalDate from, LocalDate to) {
    boolean wholeYears = from.getDayOfYear() == 1 && to.plusDays(1).getDayOfYear() == 1;
    if (wholeYears) {
      return from.getYear() == to.getYear() ? "in " + from.getYear() : "in " + from.getYear() + "-" + to.getYear();
    }
    return "from " + from + " to " + to;
  }

  private static String days(long n) {
    return n == 1 ? "1 day" : n + " days";
  }

  private static String percent(long part, long whole) {
    return String.format(Locale.ROOT, "%.0f %%", 100.0 * part / whole);
  }
}
