package org.slackwater.core.query;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationResult;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.LaggedCorrelation;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * Lagged correlation and driver ranking tables from analysed series. Lags are in steps of the
 * series; positive lag = the driver leads the target (the driver's value {@code lag} steps
 * earlier is paired with the target's). Significance uses the effective sample size of
 * Bretherton et al. (1999) for autocorrelated series; choosing the best of many lags inflates
 * false positives, so the tables also report whether the best lag survives a Bonferroni
 * correction over the lags tried.
 */
final class CorrelationTables {
  private CorrelationTables() {}

  /** A series ready for correlation: computed, optionally deseasonalized over the baseline. */
  static DatedSeries prepared(SeriesPlan plan, ChunkSource cache, Optional<Deseasonalize> deseasonalize) throws IOException {
    DatedSeries s = DatedSeries.of(plan.compute(cache));
    return deseasonalize.isPresent() ? deseasonalize.get().apply(s) : s;
  }

  static ResultTable lags(String title, CorrelationResult res, TemporalStep step, Map<String, String> meta, List<String> warnings) {
    List<LagRow> rows = res.rows();
    int n = rows.size();
    long[] lag = new long[n], count = new long[n];
    double[] r = new double[n], r1t = new double[n], r1d = new double[n], neff = new double[n], t = new double[n], p = new double[n];
    String[] sig = new String[n], note = new String[n];
    for (int i = 0; i < n; i++) {
      LagRow row = rows.get(i);
      lag[i] = row.lag();
      count[i] = row.n();
      r[i] = row.r();
      r1t[i] = row.r1Target();
      r1d[i] = row.r1Driver();
      neff[i] = row.nEffective();
      t[i] = row.t();
      p[i] = row.pValue();
      sig[i] = row.valid() ? (row.significant() ? "yes" : "no") : null;
      note[i] = row.note().isEmpty() ? null : row.note();
    }
    Map<String, String> m = new LinkedHashMap<>(meta);
    m.put("lag_unit", SeriesPlanner.stepName(step) + " (positive: the driver leads)");
    m.put("method", res.settings().method().name().toLowerCase(Locale.ROOT));
    m.put("alpha", Double.toString(res.settings().alpha()));
    m.put("effective_sample_size", res.settings().correctForAutocorrelation()
        ? "Bretherton et al. (1999): N (1 - r1 r2) / (1 + r1 r2)" : "off");
    res.best().ifPresent(b -> {
      m.put("best_lag", Integer.toString(b.lag()));
      m.put("best_r", Double.toString(b.r()));
      m.put("best_p", Double.toString(b.pValue()));
      m.put("best_significant", b.significant() ? "yes" : "no");
      m.put("best_significant_after_bonferroni", res.bestSignificantAfterBonferroni() ? "yes" : "no");
    });
    return new ResultTable(title, List.of(
        new Column.Longs("lag", SeriesPlanner.stepName(step), lag), new Column.Longs("n", "", count),
        new Column.Doubles("r", "1", r), new Column.Doubles("r1_target", "1", r1t), new Column.Doubles("r1_driver", "1", r1d),
        new Column.Doubles("n_effective", "", neff), new Column.Doubles("t", "1", t), new Column.Doubles("p_value", "1", p),
        new Column.Strings("significant", sig), new Column.Strings("note", note)), m, warnings);
  }

  /** One candidate driver's best lag. */
  record Ranked(String driver, String region, String statistic, CorrelationResult result) {}

  static ResultTable ranking(String title, List<Ranked> drivers, TemporalStep step, Map<String, String> meta, List<String> warnings) {
    List<Ranked> sorted = new ArrayList<>(drivers);
    sorted.sort(Comparator.comparingDouble((Ranked d) -> d.result().best().map(b -> -Math.abs(b.r())).orElse(Double.POSITIVE_INFINITY)));
    int n = sorted.size();
    long[] rank = new long[n], lag = new long[n], count = new long[n];
    String[] name = new String[n], where = new String[n], stat = new String[n], sig = new String[n], bonf = new String[n], direction = new String[n];
    double[] r = new double[n], p = new double[n], neff = new double[n];
    for (int i = 0; i < n; i++) {
      Ranked d = sorted.get(i);
      rank[i] = i + 1;
      name[i] = d.driver();
      where[i] = d.region();
      stat[i] = d.statistic();
      Optional<LagRow> b = d.result().best();
      lag[i] = b.map(LagRow::lag).orElse(0);
      count[i] = b.map(LagRow::n).orElse(0);
      r[i] = b.map(LagRow::r).orElse(Double.NaN);
      p[i] = b.map(LagRow::pValue).orElse(Double.NaN);
      neff[i] = b.map(LagRow::nEffective).orElse(Double.NaN);
      direction[i] = b.map(x -> x.r() > 0 ? "higher with higher target" : "lower with higher target").orElse(null);
      sig[i] = b.map(x -> x.significant() ? "yes" : "no").orElse(null);
      bonf[i] = b.isPresent() ? (d.result().bestSignificantAfterBonferroni() ? "yes" : "no") : null;
    }
    Map<String, String> m = new LinkedHashMap<>(meta);
    m.put("lag_unit", SeriesPlanner.stepName(step) + " (positive: the driver leads)");
    m.put("ranked_by", "largest |r| at the best lag, on deseasonalized anomalies");
    return new ResultTable(title, List.of(
        new Column.Longs("rank", "", rank), new Column.Strings("driver", name), new Column.Strings("region", where), new Column.Strings("statistic", stat),
        new Column.Longs("best_lag", SeriesPlanner.stepName(step), lag), new Column.Doubles("r", "1", r),
        new Column.Strings("direction", direction), new Column.Longs("n", "", count), new Column.Doubles("n_effective", "", neff),
        new Column.Doubles("p_value", "1", p), new Column.Strings("significant", sig),
        new Column.Strings("significant_after_bonferroni", bonf)), m, warnings);
  }

  static CorrelationResult correlate(DatedSeries target, DatedSeries driver, CorrelationSettings settings) {
    return LaggedCorrelation.compute(target, driver, settings);
  }
}
