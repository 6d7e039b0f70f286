package org.slackwater.render;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.core.watch.WatchState;

/**
 * A watch run read for plotting: one row per day (column {@code day}, ascending, no repeats) with
 * its {@code state} and {@code level}, and one numeric column per condition value (every numeric
 * column; the text columns {@code rules_holding} and {@code caution} are not plotted). The
 * evaluated days come from the metadata {@code evaluated}, else from the first and last row.
 *
 * <p>Failure modes, each a {@link PlotException} naming the result, the row (1-based) and the
 * column: a missing column, a row without a day, days out of order or repeated, a state or level
 * the server does not write, a day outside the evaluated days, and a table that holds only the
 * raise and clear days (a transitions listing), which cannot show what happened between them.
 */
record WatchRunData(ResultTable table, WatchOutput output, LocalDate from, LocalDate to, List<LocalDate> days, List<WatchState> states,
    List<Integer> levels, List<Column> values) {

  /** The level names by level, as the server writes them. */
  static final List<String> LEVELS = WatchRun.LEVELS;

  private static final Set<String> NOT_VALUES = Set.of("day", "state", "level", "rules_holding", "caution");

  WatchRunData {
    days = List.copyOf(days);
    states = List.copyOf(states);
    levels = List.copyOf(levels);
    values = List.copyOf(values);
  }

  static WatchRunData of(ResultTable t) {
    WatchOutput out = WatchOutput.of(t);
    LocalDate[] day = Tables.dates(t, "day");
    String[] state = Tables.strings(t, "state"), level = Tables.strings(t, "level");
    int n = day.length;
    if (n == 0) {
      throw new PlotException("the watch run '" + t.title() + "' has no days, so there is nothing to plot; check the period asked for");
    }
    WatchState[] states = new WatchState[n];
    int[] levels = new int[n];
    for (int i = 0; i < n; i++) {
      String where = "row " + (i + 1) + " of the watch run '" + t.title() + "'";
      if (day[i] == null) {
        throw new PlotException(where + " has no day (column day); every row of a watch run is one day");
      }
      if (i > 0 && !day[i].isAfter(day[i - 1])) {
        throw new PlotException(where + " is dated " + day[i] + ", not after the row before (" + day[i - 1]
            + "); a watch run has one row per day in order");
      }
      states[i] = state(where, state[i]);
      levels[i] = LEVELS.indexOf(level[i]);
      if (levels[i] < 0) {
        throw new PlotException(where + " has level '" + level[i] + "' (column level); a level is one of " + String.join(", ", LEVELS));
      }
    }
    LocalDate from = out.from().orElse(day[0]), to = out.to().orElse(day[n - 1]);
    if ((day[0].isBefore(from) || day[n - 1].isAfter(to))) {
      LocalDate bad = day[0].isBefore(from) ? day[0] : day[n - 1];
      throw new PlotException("the watch run '" + t.title() + "' has a row dated " + bad + ", outside the evaluated days " + from + " to " + to
          + " (metadata evaluated); the table does not fit together, evaluate the watch again");
    }
    if (transitionsOnly(day, states)) {
      throw new PlotException("the watch run '" + t.title() + "' holds only the days the watch was raised or cleared, not every day,"
          + " so the days between cannot be drawn; ask for every day of the run (the evaluate endpoint gives them)");
    }
    List<Column> values = new ArrayList<>();
    for (Column c : t.columns()) {
      if (!NOT_VALUES.contains(c.name()) && (c instanceof Column.Doubles || c instanceof Column.Longs)) {
        values.add(c);
      }
    }
    return new WatchRunData(t, out, from, to, List.of(day), List.of(states), java.util.Arrays.stream(levels).boxed().toList(), values);
  }

  private static WatchState state(String where, String s) {
    for (WatchState st : WatchState.values()) {
      if (st.label().equals(s)) {
        return st;
      }
    }
    throw new PlotException(where + " has state '" + s + "' (column state); a state is one of quiet, raised, ongoing, cleared");
  }

  /** Days missing between rows, and every row a raise or a clear: what a transitions listing looks like. */
  private static boolean transitionsOnly(LocalDate[] day, WatchState[] states) {
    boolean gaps = false;
    for (int i = 1; i < day.length; i++) {
      gaps |= day[i].toEpochDay() - day[i - 1].toEpochDay() > 1;
    }
    for (WatchState s : states) {
      if (!s.transition()) {
        return false;
      }
    }
    return gaps;
  }

  long count(WatchState s) {
    return states.stream().filter(x -> x == s).count();
  }

  /** Days per level, levels ascending, only the levels that occur. */
  Map<Integer, Long> daysByLevel() {
    Map<Integer, Long> out = new TreeMap<>();
    for (int l : levels) {
      out.merge(l, 1L, Long::sum);
    }
    return out;
  }

  double[] values(Column c) {
    return Tables.numbers(table, c);
  }
}
