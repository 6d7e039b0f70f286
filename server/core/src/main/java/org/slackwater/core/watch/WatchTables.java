package org.slackwater.core.watch;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * Watch runs as result tables: one row per day (or per transition), the values that decided each
 * day, and the caution in a column of its own so that it travels in CSV and Arrow as well as JSON.
 */
public final class WatchTables {
  private WatchTables() {}

  /** Every day of the run ({@code transitionsOnly} false) or only the raised and cleared days. */
  public static ResultTable of(WatchRun run, boolean transitionsOnly) {
    List<WatchDay> days = transitionsOnly ? run.transitions() : run.days();
    int n = days.size();
    LocalDate[] day = new LocalDate[n];
    String[] state = new String[n], level = new String[n], rules = new String[n], caution = new String[n];
    double[][] values = new double[run.conditions().size()][n];
    for (int i = 0; i < n; i++) {
      WatchDay d = days.get(i);
      day[i] = d.day();
      state[i] = d.state().label();
      level[i] = d.levelName();
      rules[i] = d.rulesHolding().stream().map(String::valueOf).collect(Collectors.joining(" "));
      caution[i] = WatchStatements.CAUTION;
      for (int c = 0; c < values.length; c++) {
        values[c][i] = d.values().getOrDefault(run.conditions().get(c), Double.NaN);
      }
    }
    List<Column> cols = new java.util.ArrayList<>(List.of(new Column.Dates("day", day), new Column.Strings("state", state),
        new Column.Strings("level", level), new Column.Strings("rules_holding", rules)));
    for (int c = 0; c < values.length; c++) {
      String label = run.conditions().get(c);
      int bracket = label.lastIndexOf(" [");
      String unit = bracket > 0 ? label.substring(bracket + 2, label.length() - 1) : "";
      String name = (bracket > 0 ? label.substring(0, bracket) : label).replaceAll("[^A-Za-z0-9]+", "_").replaceAll("^_|_$", "");
      cols.add(new Column.Doubles(name, unit, values[c]));
    }
    cols.add(new Column.Strings("caution", caution));
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("watch", run.watch());
    meta.put("definition", run.text());
    meta.put("evaluated", run.from() + " to " + run.to());
    meta.put("raised", Long.toString(run.days().stream().filter(d -> d.state() == WatchState.RAISED).count()));
    meta.put("caution", WatchStatements.CAUTION);
    meta.put("result_kind", "watch_run");
    List<String> warnings = new java.util.ArrayList<>(run.warnings());
    warnings.add(WatchStatements.CAUTION);
    return new ResultTable("watch \"" + run.watch() + "\", " + run.from() + " to " + run.to() + (transitionsOnly ? ", transitions" : ""),
        cols, meta, warnings);
  }
}
