package org.slackwater.render;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.slackwater.core.result.ResultTable;

/**
 * A backtest result read for plotting: the evaluated days, the events (caught or missed, with the
 * lead of their first warning) and the firings (start, last day or still on, peak level, outcome),
 * in the layout the server writes (one row per event, then one per firing, kind in column
 * {@code kind}).
 *
 * <p>Failure modes, each a {@link PlotException} naming the result, the row (1-based, as in the
 * CSV) and the column: a missing column, no {@code evaluated} days, a row kind other than event or
 * firing, a row without a day, an outcome that does not belong to its kind, a firing that ends
 * before it starts, a row outside the evaluated days.
 */
record BacktestData(ResultTable table, WatchOutput output, LocalDate from, LocalDate to, List<Event> events, List<Firing> firings,
    OptionalInt leadWindow) {

  /** What a firing was, in the order the plot's lanes show them. */
  enum Outcome {
    LEAD("lead"), DURING_EVENT("during event"), FALSE_ALARM("false alarm");

    final String label;

    Outcome(String label) {
      this.label = label;
    }

    static Optional<Outcome> of(String label) {
      for (Outcome o : values()) {
        if (o.label.equals(label)) {
          return Optional.of(o);
        }
      }
      return Optional.empty();
    }
  }

  /** An event and whether the watch warned of it; {@code leadDays} for caught events only. */
  record Event(LocalDate day, boolean caught, Optional<LocalDate> firstWarning, OptionalInt leadDays) {}

  /** One episode of the watch; {@code end} empty while it is still on at the end of the evaluated days. */
  record Firing(LocalDate start, Optional<LocalDate> end, String peakLevel, Outcome outcome, Optional<LocalDate> event) {
    /** The last day drawn: the firing's own last day, or the end of the evaluated days. */
    LocalDate lastDay(LocalDate to) {
      return end.orElse(to);
    }
  }

  BacktestData {
    events = List.copyOf(events);
    firings = List.copyOf(firings);
  }

  static BacktestData of(ResultTable t) {
    WatchOutput out = WatchOutput.of(t);
    if (out.from().isEmpty()) {
      throw new PlotException("the backtest '" + t.title() + "' does not give the days it evaluated (metadata evaluated,"
          + " 'yyyy-mm-dd to yyyy-mm-dd'), which its time axis needs; ask the server for the backtest again, or for format=json");
    }
    LocalDate from = out.from().get(), to = out.to().orElseThrow();
    String[] kind = Tables.strings(t, "kind"), outcome = Tables.strings(t, "outcome");
    LocalDate[] day = Tables.dates(t, "day"), end = Tables.dates(t, "end"), matched = Tables.dates(t, "matched");
    double[] lead = Tables.numbers(t, "lead_days");
    String[] peak = Tables.optionalStrings(t, "peak_level").orElse(new String[kind.length]);

    List<Event> events = new ArrayList<>();
    List<Firing> firings = new ArrayList<>();
    for (int i = 0; i < kind.length; i++) {
      String where = "row " + (i + 1) + " of the backtest '" + t.title() + "'";
      if (day[i] == null) {
        throw new PlotException(where + " has no day (column day); every event and firing needs its date");
      }
      if (day[i].isBefore(from) || day[i].isAfter(to)) {
        throw new PlotException(where + " is dated " + day[i] + ", outside the evaluated days " + from + " to " + to
            + " (metadata evaluated); the table does not fit together, ask the server for the backtest again");
      }
      if ("event".equals(kind[i])) {
        events.add(event(where, day[i], outcome[i], matched[i], lead[i]));
      } else if ("firing".equals(kind[i])) {
        firings.add(firing(where, day[i], end[i], peak[i], outcome[i], matched[i], to));
      } else {
        throw new PlotException(where + " is of kind '" + kind[i] + "' (column kind); a backtest row is an 'event' or a 'firing'");
      }
    }
    return new BacktestData(t, out, from, to, events, firings, leadWindow(t));
  }

  private static Event event(String where, LocalDate day, String outcome, LocalDate matched, double lead) {
    boolean caught = "caught".equals(outcome);
    if (!caught && !"missed".equals(outcome)) {
      throw new PlotException(where + " is an event with outcome '" + outcome + "' (column outcome); an event is 'caught' or 'missed'");
    }
    OptionalInt leadDays = OptionalInt.empty();
    if (caught && Double.isFinite(lead)) {
      leadDays = OptionalInt.of((int) Math.round(lead));
    } else if (caught && matched != null) {
      leadDays = OptionalInt.of((int) ChronoUnit.DAYS.between(matched, day));
    }
    return new Event(day, caught, Optional.ofNullable(caught ? matched : null), leadDays);
  }

  private static Firing firing(String where, LocalDate start, LocalDate end, String peak, String outcome, LocalDate matched, LocalDate to) {
    Outcome o = Outcome.of(outcome).orElseThrow(() -> new PlotException(where + " is a firing with outcome '" + outcome
        + "' (column outcome); a firing is a 'lead', 'during event' or 'false alarm'"));
    if (end != null && end.isBefore(start)) {
      throw new PlotException(where + " is a firing that ends (" + end + ", column end) before it starts (" + start
          + ", column day); the end is the firing's last day");
    }
    if (end != null && end.isAfter(to)) {
      throw new PlotException(where + " is a firing that ends on " + end + ", after the evaluated days end (" + to
          + ", metadata evaluated); the table does not fit together, ask the server for the backtest again");
    }
    return new Firing(start, Optional.ofNullable(end), peak == null ? "" : peak, o, Optional.ofNullable(matched));
  }

  private static OptionalInt leadWindow(ResultTable t) {
    String v = t.metadata().get("lead_window_days");
    try {
      return v == null ? OptionalInt.empty() : OptionalInt.of(Integer.parseInt(v.strip()));
    } catch (NumberFormatException e) {
      return OptionalInt.empty(); // only the subtitle uses it; the rows carry the outcomes themselves
    }
  }

  long caught() {
    return events.stream().filter(Event::caught).count();
  }

  long count(Outcome o) {
    return firings.stream().filter(f -> f.outcome() == o).count();
  }
}
