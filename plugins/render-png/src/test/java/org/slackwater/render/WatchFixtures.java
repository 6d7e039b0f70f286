package org.slackwater.render;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.watch.WatchBacktest;
import org.slackwater.core.watch.WatchDay;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.core.watch.WatchState;
import org.slackwater.core.watch.WatchTables;

/**
 * Watch outputs made by the server's own code (core's {@link WatchTables} and
 * {@link WatchBacktest}, on the test class path through the provided dependency) from runs built
 * here day by day, so that the tables have exactly the server's layout. The episodes and event
 * dates are those of the demo server's "North Intake bloom risk" backtest over 2006 to 2025 (the
 * invented Wrenmouth scenario).
 */
final class WatchFixtures {
  private WatchFixtures() {}

  static final String WATCH = "North Intake bloom risk";
  static final String DEFINITION = "watch \"North Intake bloom risk\" over \"North Intake\" when standardized anomaly of mean"
      + " water_temperature over 5 days above 1 against 2006 to 2025 and mean cloud_fraction over 5 days below 0.25";
  static final List<String> CONDITIONS = List.of("standardized anomaly of mean water_temperature over 5 days [1]",
      "mean cloud_fraction over 5 days [1]", "percentile of sum runoff over \"Harle Watershed\" over 150 days [%]");

  /** A stretch of days at one level: first and last day (both included), level 1..3. */
  record Episode(LocalDate first, LocalDate last, int level) {}

  static Episode episode(String first, String last, int level) {
    return new Episode(LocalDate.parse(first), LocalDate.parse(last), level);
  }

  /** The demo backtest's six firings (all at warning). */
  static final List<Episode> DEMO_EPISODES = List.of(episode("2006-10-07", "2006-10-08", 2), episode("2009-06-22", "2009-06-29", 2),
      episode("2014-05-30", "2014-06-10", 2), episode("2014-06-12", "2014-06-23", 2), episode("2014-08-01", "2014-08-04", 2),
      episode("2018-06-09", "2018-06-30", 2));

  static final List<LocalDate> DEMO_EVENTS = List.of(LocalDate.parse("2009-07-04"), LocalDate.parse("2014-06-20"),
      LocalDate.parse("2018-06-28"), LocalDate.parse("2023-06-19"));

  /**
   * A run over {@code from..to} with the given episodes; every day's values are smooth made-up
   * numbers (a seasonal cycle), NaN on the days listed in {@code noData}.
   */
  static WatchRun run(LocalDate from, LocalDate to, List<Episode> episodes, List<LocalDate> noData) {
    List<WatchDay> days = new ArrayList<>();
    int previous = 0;
    for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
      int level = 0;
      for (Episode e : episodes) {
        if (!d.isBefore(e.first()) && !d.isAfter(e.last())) {
          level = Math.max(level, e.level());
        }
      }
      Map<String, Double> values = new LinkedHashMap<>();
      double phase = 2 * Math.PI * d.getDayOfYear() / 365.25;
      boolean missing = noData.contains(d);
      values.put(CONDITIONS.get(0), missing ? Double.NaN : 1.4 * Math.sin(phase * 3) + (level > 0 ? 1.2 : 0));
      values.put(CONDITIONS.get(1), missing ? Double.NaN : 0.45 + 0.3 * Math.cos(phase * 5) - (level > 0 ? 0.3 : 0));
      values.put(CONDITIONS.get(2), missing ? Double.NaN : 70 + 20 * Math.sin(phase));
      List<Integer> rules = level > 0 ? List.of(1) : List.of();
      days.add(new WatchDay(d, level, WatchState.of(previous, level), rules, values));
      previous = level;
    }
    return new WatchRun(WATCH, DEFINITION, from, to, CONDITIONS, days, List.of("evaluated from " + from + " to " + to));
  }

  /** The demo backtest: 4 events, 3 caught (leads 12, 21, 19 days), 6 firings, 1 false alarm, over 2006 to 2025. */
  static ResultTable demoBacktest() {
    WatchRun history = run(LocalDate.parse("2006-01-01"), LocalDate.parse("2025-12-31"), DEMO_EPISODES, List.of());
    return WatchBacktest.table(WatchBacktest.of(history, DEMO_EVENTS, WatchBacktest.DEFAULT_LEAD_DAYS));
  }

  /** The demo's evaluation of May to July 2014: raised 2014-05-30 (warning), an alert 2014-06-14 to 06-16, cleared 2014-06-25. */
  static ResultTable demoRun() {
    WatchRun run = run(LocalDate.parse("2014-05-01"), LocalDate.parse("2014-07-31"),
        List.of(episode("2014-05-30", "2014-06-24", 2), episode("2014-06-14", "2014-06-16", 3), episode("2014-07-20", "2014-07-21", 1)),
        List.of(LocalDate.parse("2014-07-05"), LocalDate.parse("2014-07-06")));
    return WatchTables.of(run, false);
  }
}
