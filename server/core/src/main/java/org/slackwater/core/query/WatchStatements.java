package org.slackwater.core.query;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.QueryPrinter;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;

/**
 * Checks a watch definition against the data before it is stored: every series' variable and
 * region resolve and hold data cells, every threshold with a unit converts from the data's unit
 * (a threshold on a quantity with a unit must say its unit, so "above 10" on chlorophyll cannot
 * be read in the wrong unit), and every baseline lies within the data. The result describes the
 * watch rule by rule, with the caution that goes with every early-warning output.
 */
public final class WatchStatements {

  /** Carried by every watch result and alert. */
  public static final String CAUTION = "Screening aid only: built from remote-sensing and model data, which can be wrong. "
      + "Confirm with water sampling, and follow local drinking-water regulations and licensed operators before acting.";

  private WatchStatements() {}

  static ResultTable check(Watch w, SeriesPlanner planner) {
    List<String> rule = new ArrayList<>(), severity = new ArrayList<>(), condition = new ArrayList<>();
    int i = 1;
    for (WatchRule r : w.rules()) {
      check(r.condition(), w, planner);
      rule.add(Integer.toString(i++));
      severity.add(r.severity().name().toLowerCase(Locale.ROOT));
      condition.add(QueryPrinter.print(new Watch(w.name(), w.region(), List.of(r), w.position())).replaceFirst("(?s)^.*? when ", "when "));
    }
    String[] caution = new String[rule.size()];
    java.util.Arrays.fill(caution, CAUTION);
    // The caution is a column too, so that it travels in CSV and Arrow as well as in JSON.
    return new ResultTable("watch \"" + w.name() + "\" (checked, not stored)", List.of(
        new Column.Strings("rule", rule.toArray(String[]::new)), new Column.Strings("severity", severity.toArray(String[]::new)),
        new Column.Strings("condition", condition.toArray(String[]::new)), new Column.Strings("caution", caution)),
        Map.of("watch", w.name(), "region", QueryPrinter.print(w.region()), "caution", CAUTION),
        List.of("store a watch with POST /api/watches (admin token); this query only checks it", CAUTION));
  }

  private static void check(Condition c, Watch w, SeriesPlanner planner) {
    if (c instanceof AnyOf a) {
      a.operands().forEach(o -> check(o, w, planner));
    } else if (c instanceof AllOf a) {
      a.operands().forEach(o -> check(o, w, planner));
    } else if (c instanceof Not n) {
      check(n.operand(), w, planner);
    } else if (c instanceof ThresholdCondition t) {
      String unit = series(t.series(), w, planner);
      threshold(t.threshold(), unit, planner, true);
    } else {
      ComparisonCondition cc = (ComparisonCondition) c;
      String unit = series(cc.series(), w, planner);
      threshold(cc.threshold(), unit, planner, cc.kind() == ComparisonKind.ANOMALY);
      CubeEntry cube = planner.cube(cc.series().variable());
      planner.baselineRange(cube.descriptor().time(), cc.baseline(), cc, cube.name());
    }
  }

  /** Resolves the series over its whole data span; returns its unit. */
  private static String series(WatchSeries s, Watch w, SeriesPlanner planner) {
    CubeEntry cube = planner.cube(s.variable());
    TimeAxis t = cube.descriptor().time();
    Period all = new Period(PartialDate.ofDay(t.date(0).getYear(), t.date(0).getMonthValue(), t.date(0).getDayOfMonth(), s.position()),
        PartialDate.ofDay(t.date(t.size() - 1).getYear(), t.date(t.size() - 1).getMonthValue(), t.date(t.size() - 1).getDayOfMonth(), s.position()),
        s.position());
    String unit = planner.plan(s.statistic(), s.variable(), s.region().orElse(w.region()), all, StepKind.DAY, Optional.empty(),
        SeriesPlanner.DEFAULT_COVERAGE_PERCENT).unit();
    // A sum over a window of days is a total over that window: the daily rate times days (m3/day -> m3).
    if (s.window().isPresent() && s.statistic().kind() == org.slackwater.query.ast.StatisticKind.SUM) {
      unit = org.slackwater.core.analytics.IntegralUnits.times(unit, "day").unit();
    }
    return unit;
  }

  private static void threshold(Threshold th, String unit, SeriesPlanner planner, boolean needsUnit) {
    if (th.unit().isPresent()) {
      try {
        UnitConversion.between(unit, th.unit().get().unit());
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(th.unit().get(), planner.source(), "the threshold's unit does not fit the data: " + e.getMessage(),
            "the data are in '" + unit + "'");
      }
    } else if (needsUnit && !unit.equals("1")) {
      throw QueryException.at(th, planner.source(), "give the threshold's unit: the data are in '" + unit + "'",
          "e.g. 'above " + SeriesPlanner.fmt(th.value()) + " " + (unit.contains(" ") ? "\"" + unit + "\"" : unit) + "'");
    }
  }
}
