package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.BaselineStats;
import org.slackwater.core.analytics.CellStatistics;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.IntegralUnits;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.MapStatement;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.UnitRef;

/**
 * Maps: a statistic over time for each grid cell of a region, as a long table (one row per cell:
 * its centre, the fraction of it inside the region, the value). A difference map subtracts the
 * same statistic over a reference period; an anomaly map compares each cell with the same
 * calendar window in every baseline year (anomaly, standardized anomaly with the sample standard
 * deviation, or mid-rank percentile). Cells that never hold a value (land, for a water variable)
 * are listed with empty values, so a plot can draw them as missing.
 */
final class MapStatements {
  private MapStatements() {}

  record Plan(MapStatement query, CubeEntry cube, CellWeights weights, String regionLabel, String regionWkt, SpatialStatistic stat, String statName,
      int[] range, Optional<int[]> reference, Optional<ComparisonKind> comparison, List<int[]> baselineYears,
      double factor, UnitConversion conversion, String unit, List<String> warnings) {}

  static Plan analyze(MapStatement q, SeriesPlanner planner) {
    SeriesTerm term = q instanceof StatisticMap s ? s.values() : q instanceof DifferenceMap d ? d.values() : ((ComparisonMap) q).values();
    Optional<UnitRef> unitRef = q instanceof StatisticMap s ? s.unit() : q instanceof DifferenceMap d ? d.unit() : ((ComparisonMap) q).unit();
    CubeEntry cube = planner.cube(term.variable());
    SeriesPlanner.OnGrid on = planner.onGrid(cube, q.region());
    RegionResolver.Resolved region = on.region();
    CellWeights w = on.weights();
    List<String> warnings = new ArrayList<>();
    TimeAxis time = cube.descriptor().time();
    int[] range = planner.range(time, q.period(), cube.name(), warnings);
    Optional<int[]> reference = Optional.empty();
    if (q instanceof DifferenceMap d) {
      reference = Optional.of(planner.range(time, d.reference(), cube.name(), warnings));
    }
    SpatialStatistic stat = SeriesPlanner.statistic(term.statistic());
    String unit = cube.descriptor().units();
    double factor = 1;
    if (stat.kind() == SpatialStatistic.Kind.SUM) {
      IntegralUnits overTime = IntegralUnits.times(unit, "day");
      unit = overTime.unit();
      factor = overTime.factor() * SeriesPlanner.nativeStepDays(time);
    }
    UnitConversion conv = UnitConversion.between(unit, unit);
    if (unitRef.isPresent()) {
      try {
        conv = UnitConversion.between(unit, unitRef.get().unit());
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(unitRef.get(), planner.source(), e.getMessage(), "the data are in '" + unit + "'");
      }
      unit = unitRef.get().unit();
    }
    Optional<ComparisonKind> cmp = Optional.empty();
    List<int[]> years = List.of();
    if (q instanceof ComparisonMap c) {
      cmp = Optional.of(c.comparison().kind());
      int[] base = planner.baselineRange(time, c.comparison().baseline(), c.comparison(), cube.name());
      years = shiftedYears(time, q.period(), base);
      if (years.size() < 2) {
        throw QueryException.at(c.comparison(), planner.source(), "the baseline holds fewer than two years with the same calendar window",
            "choose a longer baseline");
      }
    }
    return new Plan(q, cube, w, region.label(), region.geometry().toText(), stat, SeriesPlanner.statName(term.statistic()), range, reference, cmp, years, factor, conv, unit, warnings);
  }

  /** The native step ranges of the period's calendar window shifted into each baseline year it fits in. */
  private static List<int[]> shiftedYears(TimeAxis time, Period p, int[] base) {
    LocalDate b0 = time.date(base[0]), b1 = time.date(base[1] - 1);
    List<int[]> out = new ArrayList<>();
    for (int y = b0.getYear(); y <= b1.getYear(); y++) {
      int shift = y - p.start().getYear();
      LocalDate s = p.start().plusYears(shift), e = p.endInclusive().plusYears(shift);
      if (s.isBefore(b0) || e.isAfter(b1)) {
        continue;
      }
      out.add(new int[] {time.firstAtOrAfter(s.toEpochDay() * 86_400L), time.firstAtOrAfter(e.plusDays(1).toEpochDay() * 86_400L)});
    }
    return out;
  }

  static ResultTable execute(Plan p, ChunkSource cache, String source) throws IOException {
    double[][] main = values(p, cache, p.range());
    int m = p.weights().size();
    double[] value = new double[m];
    long[] valid = new long[m];
    for (int i = 0; i < m; i++) {
      value[i] = main[i][0];
      valid[i] = (long) main[i][1];
    }
    List<Column> extra = new ArrayList<>();
    String valueName = p.statName() + "_" + p.cube().name(), valueUnit = p.unit();
    Map<String, String> meta = new LinkedHashMap<>();
    if (p.reference().isPresent()) {
      double[][] ref = values(p, cache, p.reference().get());
      double[] refValue = new double[m];
      for (int i = 0; i < m; i++) {
        refValue[i] = ref[i][0];
        value[i] = main[i][0] - ref[i][0];
      }
      extra.add(new Column.Doubles("period_value", p.unit(), column(main)));
      extra.add(new Column.Doubles("reference_value", p.unit(), refValue));
      valueName = "difference_" + valueName;
      meta.put("difference", "period minus reference, cell by cell");
    }
    if (p.comparison().isPresent()) {
      List<double[][]> years = new ArrayList<>();
      for (int[] r : p.baselineYears()) {
        years.add(values(p, cache, r));
      }
      double[] mean = new double[m], sd = new double[m];
      long[] n = new long[m];
      for (int i = 0; i < m; i++) {
        double[] b = new double[years.size()];
        for (int k = 0; k < b.length; k++) {
          b[k] = years.get(k)[i][0];
        }
        BaselineStats st = BaselineStats.of(b);
        mean[i] = st.mean();
        sd[i] = st.sd();
        n[i] = st.n();
        double v = main[i][0];
        value[i] = switch (p.comparison().get()) {
          case ANOMALY -> st.anomaly(v);
          case STANDARDIZED_ANOMALY -> st.standardizedAnomaly(v);
          case PERCENTILE_RANK -> st.percentileRank(v);
        };
      }
      ComparisonKind kind = p.comparison().get();
      valueName = kind.name().toLowerCase(Locale.ROOT).replace("percentile_rank", "percentile_rank") + "_" + valueName;
      valueUnit = kind == ComparisonKind.ANOMALY ? p.unit() : kind == ComparisonKind.STANDARDIZED_ANOMALY ? "1" : "%";
      extra.add(new Column.Doubles("baseline_mean", p.unit(), mean));
      extra.add(new Column.Doubles("baseline_sd", p.unit(), sd));
      extra.add(new Column.Longs("baseline_years", "", n));
      meta.put("baseline_windows", p.baselineYears().size() + " years, the period's calendar window in each");
    }
    LatLonGrid g = p.cube().descriptor().grid();
    double[] lat = new double[m], lon = new double[m], frac = new double[m];
    long[] row = new long[m], col = new long[m];
    for (int i = 0; i < m; i++) {
      row[i] = p.weights().row(i);
      col[i] = p.weights().column(i);
      lat[i] = g.latCenter(p.weights().row(i));
      lon[i] = g.lonCenter(p.weights().column(i));
      frac[i] = p.weights().fraction(i);
    }
    List<Column> cols = new ArrayList<>(List.of(new Column.Longs("row", "", row), new Column.Longs("column", "", col),
        new Column.Doubles("lat", "degrees_north", lat), new Column.Doubles("lon", "degrees_east", lon),
        new Column.Doubles("fraction_inside", "1", frac), new Column.Doubles(valueName, valueUnit, value)));
    cols.addAll(extra);
    cols.add(new Column.Longs("valid_steps", "", valid));
    Map<String, String> head = new LinkedHashMap<>();
    head.put("query", source);
    head.put("variable", p.cube().name());
    head.put("cube_version", Integer.toString(p.cube().version()));
    head.put("statistic", p.statName() + " over time, per cell");
    head.put("units", valueUnit);
    head.put("region", p.regionLabel());
    head.put("period", p.query().period().start() + " to " + p.query().period().endInclusive());
    head.put("grid", g.ny() + " x " + g.nx() + " cells");
    head.put("region_wkt", p.regionWkt());
    head.putAll(meta);
    String title = "map of " + valueName.replace('_', ' ') + " over " + p.regionLabel() + ", " + p.query().period().start() + " to "
        + p.query().period().endInclusive();
    return new ResultTable(title, cols, head, p.warnings());
  }

  private static double[][] values(Plan p, ChunkSource cache, int[] range) throws IOException {
    double[][] v = CellStatistics.compute(cache, p.cube(), p.weights(), p.stat(), range[0], range[1]);
    for (double[] cell : v) {
      if (!Double.isNaN(cell[0])) {
        cell[0] = p.conversion().apply(cell[0] * p.factor());
      }
    }
    return v;
  }

  private static double[] column(double[][] v) {
    double[] out = new double[v.length];
    for (int i = 0; i < v.length; i++) {
      out[i] = v[i][0];
    }
    return out;
  }
}
