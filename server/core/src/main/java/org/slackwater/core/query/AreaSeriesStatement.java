package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.Climatology;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonKind;

/**
 * The area-series statement: {@link #analyze} resolves it into a {@link Plan} (all names, dates,
 * units and weights checked), {@link #execute} computes the series, compares it with a baseline
 * climatology if asked ({@link Climatology}: anomaly, standardized anomaly, percentile rank) and
 * lays out the result table.
 */
final class AreaSeriesStatement {

  /** An analysed area-series statement. {@code baseline} is the native step range of the comparison's baseline. */
  record Plan(AreaSeries query, SeriesPlan series, Optional<Comparison> comparison, int[] baseline) {}

  private AreaSeriesStatement() {}

  static Plan analyze(AreaSeries q, SeriesPlanner planner) {
    double coverage = q.coverage().map(c -> c.percent()).orElse(SeriesPlanner.DEFAULT_COVERAGE_PERCENT);
    SeriesPlan series = planner.withGaps(planner.plan(q.statistic(), q.variable(), q.region(), q.period(), q.step().kind(), q.unit(), coverage), q.gaps());
    int[] baseline = null;
    if (q.comparison().isPresent()) {
      Comparison c = q.comparison().get();
      baseline = planner.baselineRange(series.cube().descriptor().time(), c.baseline(), c, series.cube().name());
    }
    return new Plan(q, series, q.comparison(), baseline);
  }

  static ResultTable execute(Plan plan, ChunkSource cache, String source) throws IOException {
    SeriesPlan sp = plan.series();
    StepSeries series = sp.compute(cache);
    TemporalStep step = sp.step();
    TimeAxis time = sp.cube().descriptor().time();
    List<String> warnings = new ArrayList<>(sp.warnings());
    Map<String, String> extra = new LinkedHashMap<>();
    double[] values = series.value().clone();
    String valueName = sp.statName() + "_" + sp.cube().name();
    String valueUnit = sp.unit();
    double[] baseMean = null, baseSd = null;
    long[] baseN = null;
    if (plan.comparison().isPresent()) {
      ComparisonKind kind = plan.comparison().get().kind();
      StepSeries base = sp.over(plan.baseline()[0], plan.baseline()[1]).compute(cache);
      Climatology clim = Climatology.of(base, Climatology.DEFAULT_DAY_WINDOW);
      int n = values.length;
      baseMean = new double[n];
      baseSd = new double[n];
      baseN = new long[n];
      for (int i = 0; i < n; i++) {
        LocalDate d = series.start()[i];
        baseMean[i] = clim.mean(d);
        baseSd[i] = clim.sd(d);
        baseN[i] = clim.n(d);
        values[i] = switch (kind) {
          case ANOMALY -> clim.anomaly(d, values[i]);
          case STANDARDIZED_ANOMALY -> clim.standardizedAnomaly(d, values[i]);
          case PERCENTILE_RANK -> clim.percentileRank(d, values[i]);
        };
      }
      valueName = prefix(kind).replace(' ', '_') + "_" + valueName;
      valueUnit = kind == ComparisonKind.ANOMALY ? sp.unit() : kind == ComparisonKind.STANDARDIZED_ANOMALY ? "1" : "%";
      int with = 0;
      for (double v : base.value()) {
        with += Double.isNaN(v) ? 0 : 1;
      }
      extra.put("baseline", time.date(plan.baseline()[0]) + " to " + time.date(plan.baseline()[1] - 1));
      extra.put("baseline_periods_with_value", with + " of " + base.size());
      extra.put("climatology", "by " + classDescription(step)
          + (step == TemporalStep.DAY ? ", pooled over +/-" + Climatology.DEFAULT_DAY_WINDOW + " days" : ""));
      if (with < 0.8 * base.size()) {
        warnings.add("the baseline has values for only " + with + " of its " + base.size() + " periods");
      }
    }

    int n = series.size();
    LocalDate[] end = new LocalDate[n];
    String[] label = new String[n];
    long[] steps = new long[n], expected = new long[n];
    for (int i = 0; i < n; i++) {
      end[i] = step.end(series.start()[i]);
      label[i] = step.label(series.start()[i]);
      steps[i] = series.stepsWithValue()[i];
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
      cols.add(new Column.Doubles("baseline_mean", sp.unit(), baseMean));
      cols.add(new Column.Doubles("baseline_sd", sp.unit(), baseSd));
      cols.add(new Column.Longs("baseline_n", "", baseN));
    }
    cols.add(new Column.Doubles("valid_fraction", "1", series.validFraction()));
    cols.add(new Column.Doubles("cells", "", series.meanValidCells()));
    if (step != TemporalStep.DAY) {
      cols.add(new Column.Longs("steps", "", steps));
      cols.add(new Column.Longs("steps_expected", "", expected));
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("statistic", sp.statName());
    meta.put("variable", sp.cube().name());
    meta.put("cube_version", Integer.toString(sp.cube().version()));
    meta.put("source_file", sp.cube().provenance().sourceFile());
    meta.put("units", valueUnit);
    meta.put("region", sp.regionLabel());
    meta.put("region_area_m2", Double.toString(sp.weights().regionAreaM2()));
    meta.put("region_area_on_grid_m2", Double.toString(sp.weights().totalArea()));
    meta.put("region_cells", Integer.toString(sp.weights().size()));
    meta.put("cell_areas", "exact cell fractions inside the region x cell area on the " + sp.areaModel());
    meta.put("step", step.name().toLowerCase(Locale.ROOT));
    meta.put("coverage_rule", "native steps with less than " + SeriesPlanner.fmt(sp.coveragePercent())
        + " % of the region's data area valid are missing");
    meta.put("missing_days_rule", sp.gaps().describe(SeriesPlanner.stepName(step))
        + (sp.stat().kind() == org.slackwater.core.analytics.SpatialStatistic.Kind.SUM && !sp.gaps().complete()
            ? "; a sum over allowed gaps is the mean of its days times the days of the " + SeriesPlanner.stepName(step) : ""));
    meta.put("calendar", time.calendar() + " (" + time.alignment().name().toLowerCase(Locale.ROOT) + ")");
    meta.putAll(extra);
    AreaSeries q = plan.query();
    String title = plan.comparison().map(c -> prefix(c.kind()) + " of ").orElse("") + sp.statName() + " " + sp.cube().name()
        + " over " + sp.regionLabel() + ", by " + SeriesPlanner.stepName(step) + ", " + q.period().start() + " to " + q.period().endInclusive();
    return new ResultTable(title, cols, meta, warnings);
  }

  private static String prefix(ComparisonKind kind) {
    return switch (kind) {
      case ANOMALY -> "anomaly";
      case STANDARDIZED_ANOMALY -> "standardized anomaly";
      case PERCENTILE_RANK -> "percentile rank";
    };
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
}
