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
import org.slackwater.core.analytics.Climatology;
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
import org.slackwater.query.ast.Comparison;
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
    TemporalStep step = TemporalStep.valueOf(q.step().kind().name());
    StepSeries series = series(cube, w, stat, step, range, coverage);

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
    UnitConversion conv = UnitConversion.between(unit, unit);
    if (q.unit().isPresent()) {
      String want = q.unit().get().unit();
      try {
        conv = UnitConversion.between(unit, want);
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(q.unit().get(), source, e.getMessage(), "the data are in '" + unit + "'");
      }
      unit = want;
    }
    double[] values = scaled(series.value(), factor, conv);

    Map<String, String> meta = new LinkedHashMap<>();
    String valueName = statName(q) + "_" + cube.name();
    String valueUnit = unit;
    double[] baseMean = null, baseSd = null;
    long[] baseN = null;
    if (q.comparison().isPresent()) {
      Comparison cmp = q.comparison().get();
      int[] baseRange = baselineRange(time, cmp, cube.name());
      StepSeries base = series(cube, w, stat, step, baseRange, coverage);
      Climatology clim = Climatology.of(new StepSeries(step, base.start(), scaled(base.value(), factor, conv), base.validFraction(),
          base.meanValidCells(), base.stepsWithValue(), base.stepsExpected()), Climatology.DEFAULT_DAY_WINDOW);
      int n = values.length;
      baseMean = new double[n];
      baseSd = new double[n];
      baseN = new long[n];
      for (int i = 0; i < n; i++) {
        LocalDate d = series.start()[i];
        baseMean[i] = clim.mean(d);
        baseSd[i] = clim.sd(d);
        baseN[i] = clim.n(d);
        values[i] = switch (cmp.kind()) {
          case ANOMALY -> clim.anomaly(d, values[i]);
          case STANDARDIZED_ANOMALY -> clim.standardizedAnomaly(d, values[i]);
          case PERCENTILE_RANK -> clim.percentileRank(d, values[i]);
        };
      }
      switch (cmp.kind()) {
        case ANOMALY -> valueName = "anomaly_" + valueName;
        case STANDARDIZED_ANOMALY -> {
          valueName = "standardized_anomaly_" + valueName;
          valueUnit = "1";
        }
        case PERCENTILE_RANK -> {
          valueName = "percentile_rank_" + valueName;
          valueUnit = "%";
        }
      }
      int with = 0, expected = 0;
      for (int i = 0; i < base.size(); i++) {
        with += base.value()[i] == base.value()[i] ? 1 : 0;
        expected++;
      }
      meta.put("baseline", time.date(baseRange[0]) + " to " + time.date(baseRange[1] - 1));
      meta.put("baseline_periods_with_value", with + " of " + expected);
      meta.put("climatology", "by " + classDescription(step) + (step == TemporalStep.DAY
          ? ", pooled over +/-" + Climatology.DEFAULT_DAY_WINDOW + " days" : ""));
      if (with < 0.8 * expected) {
        warnings.add("the baseline has values for only " + with + " of its " + expected + " periods");
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
    List<Column> cols = new ArrayList<>();
    cols.add(new Column.Dates("time", series.start()));
    if (step != TemporalStep.DAY) {
      cols.add(new Column.Dates("end", end));
      cols.add(new Column.Strings("period", label));
    }
    cols.add(new Column.Doubles(valueName, valueUnit, values));
    if (baseMean != null) {
      cols.add(new Column.Doubles("baseline_mean", unit, baseMean));
      cols.add(new Column.Doubles("baseline_sd", unit, baseSd));
      cols.add(new Column.Longs("baseline_n", "", baseN));
    }
    cols.add(new Column.Doubles("valid_fraction", "1", series.validFraction()));
    cols.add(new Column.Doubles("cells", "", series.meanValidCells()));
    if (step != TemporalStep.DAY) {
      cols.add(new Column.Longs("steps", "", days));
      cols.add(new Column.Longs("steps_expected", "", expected));
    }
    Map<String, String> head = new LinkedHashMap<>();
    head.put("query", source);
    head.put("statistic", statName(q));
    head.put("variable", cube.name());
    head.put("cube_version", Integer.toString(cube.version()));
    head.put("source_file", cube.provenance().sourceFile());
    head.put("units", valueUnit);
    head.put("region", region.label());
    head.put("region_area_m2", Double.toString(w.regionAreaM2()));
    head.put("region_area_on_grid_m2", Double.toString(w.totalArea()));
    head.put("region_cells", Integer.toString(w.size()));
    head.put("step", step.name().toLowerCase(Locale.ROOT));
    head.put("coverage_rule", "native steps with less than " + fmt(coverage) + " % of the region's data area valid are missing");
    head.put("calendar", time.calendar() + " (" + time.alignment().name().toLowerCase(Locale.ROOT) + ")");
    head.putAll(meta);
    if (w.totalArea() < 0.98 * w.regionAreaM2()) {
      warnings.add(String.format(Locale.ROOT, "only %.0f %% of the region lies on the grid of %s", 100 * w.totalArea() / w.regionAreaM2(), cube.name()));
    }
    String title = q.comparison().map(c -> switch (c.kind()) {
          case ANOMALY -> "anomaly of ";
          case STANDARDIZED_ANOMALY -> "standardized anomaly of ";
          case PERCENTILE_RANK -> "percentile rank of ";
        }).orElse("")
        + statName(q) + " " + cube.name() + " over " + region.label() + ", by " + step.name().toLowerCase(Locale.ROOT).replace('_', ' ')
        + ", " + q.period().start() + " to " + q.period().endInclusive();
    return new ResultTable(title, cols, head, warnings);
  }

  private StepSeries series(CubeEntry cube, CellWeights w, SpatialStatistic stat, TemporalStep step, int[] range, double coverage) throws IOException {
    DailySeries daily = AreaStatistics.compute(cache, cube, w, stat, range[0], range[1], coverage / 100.0);
    return TemporalAggregation.aggregate(daily, step, stat);
  }

  private static double[] scaled(double[] v, double factor, UnitConversion conv) {
    double[] out = v.clone();
    for (int i = 0; i < out.length; i++) {
      if (!Double.isNaN(out[i])) {
        out[i] = conv.apply(out[i] * factor);
      }
    }
    return out;
  }

  /** The baseline's step range: as given, or the cube's complete calendar years. */
  private int[] baselineRange(TimeAxis time, Comparison cmp, String cube) {
    LocalDate first = time.date(0), last = time.date(time.size() - 1);
    LocalDate start, end;
    if (cmp.baseline().isPresent()) {
      Period b = cmp.baseline().get();
      start = b.start();
      end = b.endInclusive();
      if (start.isBefore(first) || end.isAfter(last)) {
        throw QueryException.at(b, source, "the baseline " + start + " to " + end + " reaches outside the " + cube + " data",
            cube + " covers " + first + " to " + last + "; choose baseline years within it");
      }
    } else {
      int y0 = first.getDayOfYear() == 1 ? first.getYear() : first.getYear() + 1;
      int y1 = last.getMonthValue() == 12 && last.getDayOfMonth() == 31 ? last.getYear() : last.getYear() - 1;
      if (y1 < y0) {
        throw QueryException.at(cmp, source, "the " + cube + " data hold no complete year to use as a baseline",
            "give one with 'against <from> to <to>'");
      }
      start = LocalDate.of(y0, 1, 1);
      end = LocalDate.of(y1, 12, 31);
    }
    int from = time.firstAtOrAfter(start.toEpochDay() * 86_400L);
    int to = time.firstAtOrAfter(end.plusDays(1).toEpochDay() * 86_400L);
    return new int[] {from, to};
  }

  private static String classDescription(TemporalStep step) {
    return switch (step) {
      case DAY -> "day of year";
      case WEEK -> "ISO week";
      case MONTH -> "calendar month";
      case SEASON -> "season";
      case YEAR, WATER_YEAR -> "year (one class)";
    };
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
