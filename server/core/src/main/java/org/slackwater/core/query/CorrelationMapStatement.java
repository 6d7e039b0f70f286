package org.slackwater.core.query;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.CellCorrelation;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
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
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.Node;

/**
 * {@code map correlation of X over R1 with Y over R2 ... by <step> [lags a to b unit [step n
 * unit] | at lag N unit]}: every cell of X over R1, as its own series at the step, correlated with
 * the area series of Y over R2 at each lag (positive lag: Y leads), with the same
 * effective-sample-size significance as {@code correlate}. The lag clause is {@code correlate}'s
 * and is read the same way: in steps of the series, every {@code n}-th lag from {@code a} up to at
 * most {@code b} (a step that does not divide the range stops short of {@code b}, as there).
 * Computed by {@link org.slackwater.core.analytics.CorrelationMap}.
 *
 * <p><b>One lag</b> ({@code at lag}, or no lag clause for lag 0): one row per cell with row,
 * column, lat, lon, fraction_inside, r, n, n_effective, p_value, significant, as {@code correlate}
 * gives that lag. <b>Several lags</b> ({@code lags a to b}): one row per cell for its best lag
 * (largest |r|; equal |r| to the smaller |lag|, then the positive one), with best_lag, r, n,
 * n_effective, p_value, significant (this lag alone), significant_after_bonferroni (p &lt;= alpha /
 * the cell's valid lags, as {@code rank drivers}) and valid_lags. A cell without any valid lag
 * shows the lag with the most pairs and empty r and p. Cells without data have empty values.
 *
 * <p>Errors, each with the line and column of the lag clause: lags that are not whole steps of the
 * series; more than {@link CorrelationSettings#MAX_LAGS} lags; a lag range at least as long as the
 * driver's values (with a hint). Other refusals of the whole map point at the statement.
 */
final class CorrelationMapStatement {
  private CorrelationMapStatement() {}

  record Plan(CorrelationMap query, CubeEntry cube, CellWeights weights, String regionLabel, String regionWkt, int[] range, TemporalStep step,
      SeriesPlan driver, CorrelationSettings settings, Optional<Deseasonalize> deseasonalize, Node lagClause, List<String> warnings) {}

  static Plan analyze(CorrelationMap q, SeriesPlanner planner) {
    Optional<LagRange> lags = q.lags();
    CubeEntry cube = planner.cube(q.values().variable());
    SeriesPlanner.OnGrid on = planner.onGrid(cube, q.region());
    RegionResolver.Resolved region = on.region();
    CellWeights w = on.weights();
    List<String> warnings = new ArrayList<>();
    int[] range = planner.range(cube.descriptor().time(), q.period(), cube.name(), warnings);
    SeriesPlan driver = planner.plan(q.driver().statistic(), q.driver().variable(), q.driverRegion(), q.period(), q.step().kind(),
        Optional.empty(), SeriesPlanner.DEFAULT_COVERAGE_PERCENT);
    TemporalStep step = driver.step();
    CorrelationSettings settings = settings(lags, q.method(), step, planner.source());
    Optional<Deseasonalize> ds = q.deseasonalized().map(d -> d.baseline()
        .map(b -> Deseasonalize.anomalies().withBaseline(b.start(), b.endInclusive())).orElse(Deseasonalize.anomalies()));
    Node lagClause = lags.<Node>map(l -> l).orElse(q);
    return new Plan(q, cube, w, region.label(), region.geometry().toText(), range, step, driver, settings, ds, lagClause, warnings);
  }

  /** The lags in steps of the series; no lag clause means lag 0. */
  static CorrelationSettings settings(Optional<LagRange> lags, org.slackwater.query.ast.CorrelationMethod method, TemporalStep step,
      String source) {
    CorrelationMethod m = method == org.slackwater.query.ast.CorrelationMethod.SPEARMAN ? CorrelationMethod.SPEARMAN : CorrelationMethod.PEARSON;
    if (lags.isEmpty()) {
      return CorrelationSettings.of(m, 0, 0, 1, DriverStatements.ALPHA);
    }
    LagRange l = lags.get();
    int first = DriverStatements.inSteps(l.first(), l.unit(), step, l, source);
    int last = DriverStatements.inSteps(l.last(), l.unit(), step, l, source);
    int by = Math.max(1, DriverStatements.inSteps(l.step(), l.unit(), step, l, source));
    try {
      return CorrelationSettings.of(m, first, last, by, DriverStatements.ALPHA);
    } catch (CorrelationInputException e) {
      throw QueryException.at(l, source, e.getMessage(), "map fewer lags, e.g. with a larger lag step");
    }
  }

  static ResultTable execute(Plan p, ChunkSource cache, String source) throws IOException {
    DatedSeries driver = CorrelationTables.prepared(p.driver(), cache, p.deseasonalize());
    List<CellCorrelation> cells;
    try {
      cells = org.slackwater.core.analytics.CorrelationMap.compute(cache, p.cube(), p.weights(), p.range()[0], p.range()[1],
          p.step(), driver, p.settings(), p.deseasonalize());
    } catch (CorrelationInputException e) {
      if (e.kind() == CorrelationInputException.Kind.LAG_RANGE_TOO_LONG) {
        throw QueryException.at(p.lagClause(), source, e.getMessage(), "use smaller lags or a longer period");
      }
      throw QueryException.at(p.query(), source, e.getMessage(), "");
    }
    return table(p, cells, source);
  }

  /** The result table of computed cells (one entry per weight entry, in order). */
  static ResultTable table(Plan p, List<CellCorrelation> cells, String source) {
    int m = cells.size();
    boolean many = p.settings().lagCount() > 1;
    LatLonGrid g = p.cube().descriptor().grid();
    long[] row = new long[m], col = new long[m], n = new long[m], lag = new long[m], validLags = new long[m];
    double[] lat = new double[m], lon = new double[m], frac = new double[m], r = new double[m], neff = new double[m], pv = new double[m];
    String[] sig = new String[m], bonferroni = new String[m];
    for (int i = 0; i < m; i++) {
      row[i] = p.weights().row(i);
      col[i] = p.weights().column(i);
      lat[i] = g.latCenter(p.weights().row(i));
      lon[i] = g.lonCenter(p.weights().column(i));
      frac[i] = p.weights().fraction(i);
      CellCorrelation c = cells.get(i);
      LagRow lr = c.row();
      lag[i] = lr.lag();
      n[i] = lr.n();
      r[i] = lr.r();
      neff[i] = lr.nEffective();
      pv[i] = lr.pValue();
      sig[i] = lr.valid() ? (lr.significant() ? "yes" : "no") : null;
      bonferroni[i] = lr.valid() ? (c.significantAfterBonferroni() ? "yes" : "no") : null;
      validLags[i] = c.validLags();
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("values", p.cube().name() + " per cell over " + p.regionLabel());
    meta.put("driver", p.driver().statName() + " " + p.driver().cube().name() + " over " + p.driver().regionLabel());
    String unit = SeriesPlanner.stepName(p.step());
    CorrelationSettings s = p.settings();
    if (many) {
      // The last lag computed, which a step that does not divide the range puts short of the one written.
      int[] all = s.lags();
      meta.put("lags", all[0] + " to " + all[all.length - 1] + " " + unit + " step " + s.lagStep() + ", " + s.lagCount()
          + " lags (positive: the driver leads)");
      meta.put("best_lag", "largest |r|; equal |r| to the smaller |lag|, then the positive one");
      meta.put("significant_after_bonferroni", "p_value <= alpha / valid_lags");
    } else {
      meta.put("lag", s.minLag() + " " + unit + " (positive: the driver leads)");
    }
    meta.put("method", s.method().name().toLowerCase(Locale.ROOT));
    meta.put("alpha", Double.toString(s.alpha()));
    meta.put("deseasonalized", p.deseasonalize().isPresent() ? "yes" : "no");
    meta.put("region_wkt", p.regionWkt());
    List<String> warnings = new ArrayList<>(p.warnings());
    warnings.addAll(p.driver().warnings());
    List<Column> columns = new ArrayList<>(List.of(
        new Column.Longs("row", "", row), new Column.Longs("column", "", col), new Column.Doubles("lat", "degrees_north", lat),
        new Column.Doubles("lon", "degrees_east", lon), new Column.Doubles("fraction_inside", "1", frac)));
    if (many) {
      columns.add(new Column.Longs("best_lag", unit, lag));
    }
    columns.addAll(List.of(new Column.Doubles("r", "1", r), new Column.Longs("n", "", n), new Column.Doubles("n_effective", "", neff),
        new Column.Doubles("p_value", "1", pv), new Column.Strings("significant", sig)));
    if (many) {
      columns.add(new Column.Strings("significant_after_bonferroni", bonferroni));
      columns.add(new Column.Longs("valid_lags", "", validLags));
    }
    return new ResultTable("map of the correlation of " + p.cube().name() + " with " + p.driver().cube().name(), columns, meta,
        warnings);
  }
}
