package org.slackwater.core.analytics.correlation;

/**
 * The correlation at one lag.
 *
 * <p>A row is {@linkplain #valid() valid} when r could be computed: at least {@value
 * LagCorrelator#MIN_PAIRS} complete pairs and neither side constant. Otherwise r, t and p are NaN,
 * {@code significant} is false and {@code note} says why. A valid row may carry a note too (e.g.
 * that the autocorrelation could not be estimated, so the p-value is uncorrected).
 *
 * @param lag lag in steps; positive = driver leads the target
 * @param n complete pairs used
 * @param r correlation coefficient (Pearson, or Spearman's rank correlation)
 * @param r1Target lag-1 autocorrelation of the target's paired sample (of its ranks for Spearman)
 * @param r1Driver lag-1 autocorrelation of the driver's paired sample (of its ranks for Spearman)
 * @param nEffective sample size used for the t-test: Bretherton et al. (1999) N_eff clamped to [3, n],
 *     or n with the correction off
 * @param t t statistic r sqrt((nEffective - 2) / (1 - r^2))
 * @param pValue two-sided p-value from Student's t with nEffective - 2 degrees of freedom
 * @param significant pValue &lt;= alpha (this lag alone, no correction for trying many lags)
 * @param note empty, or why the row is NaN, or a caveat about the p-value
 */
public record LagRow(int lag, int n, double r, double r1Target, double r1Driver, double nEffective, double t,
    double pValue, boolean significant, String note) {
  public LagRow {
    note = note == null ? "" : note;
  }

  public boolean valid() {
    return !Double.isNaN(r);
  }

  static LagRow invalid(int lag, int n, String reason) {
    return new LagRow(lag, n, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, false, reason);
  }
}
