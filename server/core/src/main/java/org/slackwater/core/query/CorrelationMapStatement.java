package org.slackwater.core.query;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.CorrelationMap;

/**
 * {@code map correlation of X over R1 with Y over R2 ... by <step> [at lag N]}: every cell of X
 * over R1, as its own series at the step, correlated with the area series of Y over R2 at one lag
 * (positive: Y leads), with the same effective-sample-size significance as {@code correlate}.
 * Computed by {@link org.slackwater.core.analytics.CorrelationMap}.
 */
final class CorrelationMapStatement {
  private CorrelationMapStatement() {}

  record Plan(CorrelationMap query, CubeEntry cube, CellWeights weights, String regionLabel, String regionWkt, int[] range, TemporalStep step,
      SeriesPlan driver, CorrelationSettings settings, Optional<Deseasonalize> deseasonalize, List<String> warnings) {}

  static Plan analyze(CorrelationMap q, SeriesPlanner planner) {
    CubeEntry cube = planner.cube(q.values().variable());
    SeriesPlanner.OnGrid on = planner.onGrid(cube, q.region());
    RegionResolver.Resolved region = on.region();
    CellWeights w = on.weights();
    List<String> warnings = new ArrayList<>();
    int[] range = planner.range(cube.descriptor().time(), q.period(), cube.name(), warnings);
    SeriesPlan driver = planner.plan(q.driver().statistic(), q.driver().variable(), q.driverRegion(), q.period(), q.step().kind(),
        Optional.empty(), SeriesPlanner.DEFAULT_COVERAGE_PERCENT);
    TemporalStep step = driver.step();
    int lag = q.lag().map(d -> DriverStatements.inSteps(d.amount(), d.unit(), step, d, planner.source())).orElse(0);
    CorrelationMethod m = q.method() == org.slackwater.query.ast.CorrelationMethod.SPEARMAN ? CorrelationMethod.SPEARMAN : CorrelationMethod.PEARSON;
    CorrelationSettings settings = CorrelationSettings.of(m, lag, lag, 1, DriverStatements.ALPHA);
    Optional<Deseasonalize> ds = q.deseasonalized().map(d -> d.baseline()
        .map(b -> Deseasonalize.anomalies().withBaseline(b.start(), b.endInclusive())).orElse(Deseasonalize.anomalies()));
    return new Plan(q, cube, w, region.label(), region.geometry().toText(), range, step, driver, settings, ds, warnings);
  }

  static ResultTable execute(Plan p, ChunkSource cache, String source) throws IOException {
    DatedSeries driver = CorrelationTables.prepared(p.driver(), cache, p.deseasonalize());
    List<LagRow> rows = org.slackwater.core.analytics.CorrelationMap.compute(cache, p.cube(), p.weights(), p.range()[0], p.range()[1],
        p.step(), driver, p.settings(), p.deseasonalize());
    int m = rows.size();
    LatLonGrid g = p.cube().descriptor().grid();
    long[] row = new long[m], col = new long[m], n = new long[m];
    double[] lat = new double[m], lon = new double[m], frac = new double[m], r = new double[m], neff = new double[m], pv = new double[m];
    String[] sig = new String[m];
    for (int i = 0; i < m; i++) {
      row[i] = p.weights().row(i);
      col[i] = p.weights().column(i);
      lat[i] = g.latCenter(p.weights().row(i));
      lon[i] = g.lonCenter(p.weights().column(i));
      frac[i] = p.weights().fraction(i);
      LagRow lr = rows.get(i);
      n[i] = lr.n();
      r[i] = lr.r();
      neff[i] = lr.nEffective();
      pv[i] = lr.pValue();
      sig[i] = lr.valid() ? (lr.significant() ? "yes" : "no") : null;
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("values", p.cube().name() + " per cell over " + p.regionLabel());
    meta.put("driver", p.driver().statName() + " " + p.driver().cube().name() + " over " + p.driver().regionLabel());
    meta.put("lag", p.settings().minLag() + " " + SeriesPlanner.stepName(p.step()) + " (positive: the driver leads)");
    meta.put("method", p.settings().method().name().toLowerCase(Locale.ROOT));
    meta.put("deseasonalized", p.deseasonalize().isPresent() ? "yes" : "no");
    meta.put("region_wkt", p.regionWkt());
    List<String> warnings = new ArrayList<>(p.warnings());
    warnings.addAll(p.driver().warnings());
    return new ResultTable("map of the correlation of " + p.cube().name() + " with " + p.driver().cube().name(), List.of(
        new Column.Longs("row", "", row), new Column.Longs("column", "", col), new Column.Doubles("lat", "degrees_north", lat),
        new Column.Doubles("lon", "degrees_east", lon), new Column.Doubles("fraction_inside", "1", frac), new Column.Doubles("r", "1", r),
        new Column.Longs("n", "", n), new Column.Doubles("n_effective", "", neff), new Column.Doubles("p_value", "1", pv),
        new Column.Strings("significant", sig)), meta, warnings);
  }
}
