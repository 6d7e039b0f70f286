package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.slackwater.core.analytics.AreaStatistics;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.analytics.DailySeries;
import org.slackwater.core.analytics.IntegralUnits;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.analytics.TemporalAggregation;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionException;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.Period;

/**
 * Analyses and runs an area-series statement: the statistic of a variable over a region, per
 * native step, aggregated to the requested step, optionally converted to another unit.
 *
 * <p>Rules a reader of the result needs, also written into its metadata: native steps whose valid
 * area is below the coverage threshold (default {@value #DEFAULT_COVERAGE_PERCENT} %) are
 * missing; a step's value follows the statistic in time as {@link TemporalAggregation} describes;
 * a period partly outside the data is clipped to it with a warning, and one wholly outside is an
 * error.
 */
final class AreaSeriesStatement {
  static final double DEFAULT_COVERAGE_PERCENT = 50;

  private final Catalog catalog;
  private final ChunkCache cache;
  private final WeightsCache weights;
  private final String source;

  AreaSeriesStatement(Catalog catalog, ChunkCache cache, WeightsCache weights, String source) {
    this.catalog = catalog;
    this.cache = cache;
    this.weights = weights;
    this.source = source;
  }

  ResultTable run(AreaSeries q) throws IOException {
    CubeEntry cube = catalog.cube(q.variable().name()).orElseThrow(() -> unknownVariable(catalog, q.variable(), source));
    if (q.comparison().isPresent()) {
      throw QueryException.at(q.comparison().get(), source,
          "anomalies against a baseline are not available in this version", "ask for the plain series (leave out the 'as ...' clause)");
    }
    List<String> warnings = new ArrayList<>();
    RegionResolver.Resolved region = new RegionResolver(catalog, source).resolve(q.region());
    CellWeights w;
    try {
      w = weights.get(cube.descriptor().grid(), region.geometry());
    } catch (RegionException e) {
      throw QueryException.at(q.region(), source, region.label() + ": " + e.getMessage(), "");
    }

    if (!hasData(w, cube)) {
      throw QueryException.at(q.region(), source, "no cell of " + cube.name() + " inside " + region.label()
          + " ever holds a value (all are fill values, e.g. land)", "choose a region over the data, or a finer grid");
    }
    TimeAxis time = cube.descriptor().time();
    int[] range = stepRange(time, q.period(), cube.name(), warnings);
    SpatialStatistic stat = statistic(q);
    double coverage = q.coverage().map(c -> c.percent()).orElse(DEFAULT_COVERAGE_PERCENT);
    DailySeries daily = AreaStatistics.compute(cache, cube, w, stat, range[0], range[1], coverage / 100.0);
    TemporalStep step = TemporalStep.valueOf(q.step().kind().name());
    StepSeries series = TemporalAggregation.aggregate(daily, step, stat);

    String unit = cube.descriptor().units();
    double factor = 1;
    if (stat.kind() == SpatialStatistic.Kind.SUM) {
      IntegralUnits area = IntegralUnits.times(unit, "m2");
      unit = area.unit();
      factor = area.factor();
      if (step != TemporalStep.DAY || nativeStepDays(time) != 1) {
        // The time integral of the daily area integrals: sum of value x native step length.
        IntegralUnits overTime = IntegralUnits.times(unit, "day");
        unit = overTime.unit();
        factor *= overTime.factor() * nativeStepDays(time);
        warnings.add("sums integrate over each " + step.name().toLowerCase(Locale.ROOT).replace('_', ' ')
            + " (value x " + fmt(nativeStepDays(time)) + " day per step); a period with any step missing is left empty");
      }
    }
    UnitConversion conv = null;
    if (q.unit().isPresent()) {
      String want = q.unit().get().unit();
      try {
        conv = UnitConversion.between(unit, want);
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(q.unit().get(), source, e.getMessage(), "the data are in '" + unit + "'");
      }
      unit = want;
    }
    double[] values = series.value().clone();
    for (int i = 0; i < values.length; i++) {
      if (!Double.isNaN(values[i])) {
        values[i] *= factor;
        if (conv != null) {
          values[i] = conv.apply(values[i]);
        }
      }
    }
    int n = series.size();
    LocalDate[] end = new LocalDate[n];
    String[] label = new String[n];
    long[] days = new long[n], expected = new long[n];
    for (int i = 0; i < n; i++) {
      end[i] = step.end(series.start()[i]);
      label[i] = step.label(series.start()[i]);
      days[i] = series.stepsWithValue()[i];
      expected[i] = series.stepsExpected()[i];
    }
    String valueName = statName(q) + "_" + cube.name();
    List<Column> cols = new ArrayList<>();
    cols.add(new Column.Dates("time", series.start()));
    if (step != TemporalStep.DAY) {
      cols.add(new Column.Dates("end", end));
      cols.add(new Column.Strings("period", label));
    }
    cols.add(new Column.Doubles(valueName, unit, values));
    cols.add(new Column.Doubles("valid_fraction", "1", series.validFraction()));
    cols.add(new Column.Doubles("cells", "", series.meanValidCells()));
    if (step != TemporalStep.DAY) {
      cols.add(new Column.Longs("steps", "", days));
      cols.add(new Column.Longs("steps_expected", "", expected));
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("statistic", statName(q));
    meta.put("variable", cube.name());
    meta.put("cube_version", Integer.toString(cube.version()));
    meta.put("source_file", cube.provenance().sourceFile());
    meta.put("units", unit);
    meta.put("region", region.label());
    meta.put("region_area_m2", Double.toString(w.regionAreaM2()));
    meta.put("region_area_on_grid_m2", Double.toString(w.totalArea()));
    meta.put("region_cells", Integer.toString(w.size()));
    meta.put("step", step.name().toLowerCase(Locale.ROOT));
    meta.put("coverage_rule", "native steps with less than " + fmt(coverage) + " % of the region's area valid are missing");
    meta.put("calendar", time.calendar() + " (" + time.alignment().name().toLowerCase(Locale.ROOT) + ")");
    if (w.totalArea() < 0.98 * w.regionAreaM2()) {
      warnings.add(String.format(Locale.ROOT, "only %.0f %% of the region lies on the grid of %s", 100 * w.totalArea() / w.regionAreaM2(), cube.name()));
    }
    String title = statName(q) + " " + cube.name() + " over " + region.label() + ", by " + step.name().toLowerCase(Locale.ROOT).replace('_', ' ')
        + ", " + q.period().start() + " to " + q.period().endInclusive();
    return new ResultTable(title, cols, meta, warnings);
  }

  private int[] stepRange(TimeAxis time, Period p, String cube, List<String> warnings) {
    if (time.size() == 0) {
      throw QueryException.at(p, source, "the cube " + cube + " has no time steps", "");
    }
    LocalDate first = time.date(0), last = time.date(time.size() - 1);
    LocalDate start = p.start(), end = p.endInclusive();
    if (end.isBefore(first) || start.isAfter(last)) {
      throw QueryException.at(p, source, "no " + cube + " data from " + start + " to " + end,
          cube + " covers " + first + " to " + last);
    }
    if (start.isBefore(first) || end.isAfter(last)) {
      warnings.add("the period was clipped to the data: " + cube + " covers " + first + " to " + last);
    }
    int from = time.firstAtOrAfter(start.toEpochDay() * 86_400L);
    int to = time.firstAtOrAfter(end.plusDays(1).toEpochDay() * 86_400L);
    if (from >= to) {
      throw QueryException.at(p, source, "no " + cube + " time step falls between " + start + " and " + end, "");
    }
    return new int[] {from, to};
  }

  private static SpatialStatistic statistic(AreaSeries q) {
    return switch (q.statistic().kind()) {
      case MEAN -> SpatialStatistic.of(SpatialStatistic.Kind.MEAN);
      case SUM -> SpatialStatistic.of(SpatialStatistic.Kind.SUM);
      case MIN -> SpatialStatistic.of(SpatialStatistic.Kind.MIN);
      case MAX -> SpatialStatistic.of(SpatialStatistic.Kind.MAX);
      case MEDIAN -> SpatialStatistic.percentile(50);
      case PERCENTILE -> SpatialStatistic.percentile(q.statistic().percentile());
    };
  }

  private static String statName(AreaSeries q) {
    return switch (q.statistic().kind()) {
      case PERCENTILE -> "p" + fmt(q.statistic().percentile());
      default -> q.statistic().kind().name().toLowerCase(Locale.ROOT);
    };
  }

  private static boolean hasData(CellWeights w, CubeEntry cube) {
    for (int i = 0; i < w.size(); i++) {
      if (cube.footprint().contains(w.index(i))) {
        return true;
      }
    }
    return false;
  }

  /** The median spacing of the cube's steps in days (1 for daily data), robust to gaps. */
  private static double nativeStepDays(TimeAxis time) {
    if (time.size() < 2) {
      return 1;
    }
    long[] d = new long[time.size() - 1];
    for (int i = 0; i < d.length; i++) {
      d[i] = time.epochSecond(i + 1) - time.epochSecond(i);
    }
    java.util.Arrays.sort(d);
    return Math.round(d[d.length / 2] / 864.0) / 100.0;
  }

  static QueryException unknownVariable(Catalog catalog, Identifier id, String source) {
    List<String> names = catalog.cubes().stream().map(CubeEntry::name).toList();
    return CatalogStatements.unknown("variable", id.name(), names, id, source);
  }

  private static String fmt(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }

}
