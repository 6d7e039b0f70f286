package org.slackwater.core.analytics.correlation;

import org.hipparchus.distribution.continuous.TDistribution;

/**
 * The t-test of a correlation coefficient, with the effective sample size for two autocorrelated
 * series.
 *
 * <p>Effective sample size (Bretherton, Widmann, Dymnikov, Wallace and Bladé 1999, "The effective
 * number of spatial degrees of freedom of a time-varying field", J. Climate 12, 1990-2009,
 * section 5): N_eff = N (1 - r1 r2) / (1 + r1 r2), with r1, r2 the lag-1 autocorrelations of the
 * two series; it assumes both behave like AR(1) processes. The result is clamped to [3, N]:
 * <ul>
 *   <li>at most N, because when r1 r2 &lt; 0 the formula exceeds N, and claiming more independent
 *       pairs than there are pairs would make the test less conservative than the plain one;
 *   <li>at least 3, because N_eff - 2 is the t distribution's degrees of freedom: as r1 r2
 *       approaches 1 the formula approaches 0 and the test would be undefined, while df = 1
 *       (Cauchy) still gives a very conservative but defined p-value.
 * </ul>
 *
 * <p>t = r sqrt((N_eff - 2) / (1 - r^2)) with df = N_eff - 2, which need not be an integer; the
 * two-sided p-value is 2 P(T &lt;= -|t|) from Hipparchus' {@link TDistribution}.
 */
public final class Significance {
  private Significance() {}

  /** Bretherton et al. (1999) N_eff for n pairs, clamped to [3, n] (n itself if n &lt; 3). */
  public static double effectiveSampleSize(int n, double r1, double r2) {
    if (Double.isNaN(r1) || Double.isNaN(r2)) {
      throw new IllegalArgumentException("lag-1 autocorrelations must be numbers (got " + r1 + ", " + r2 + ")");
    }
    double product = r1 * r2;
    double raw = product <= -1 ? Double.POSITIVE_INFINITY : n * (1 - product) / (1 + product);
    return Math.max(Math.min(3, n), Math.min(n, raw));
  }

  /** t = r sqrt((nEff - 2) / (1 - r^2)); infinite (with r's sign) for |r| = 1. */
  public static double tStatistic(double r, double nEffective) {
    double rc = Math.max(-1, Math.min(1, r));
    double oneMinus = 1 - rc * rc;
    if (oneMinus <= 0) {
      return Math.copySign(Double.POSITIVE_INFINITY, rc);
    }
    return rc * Math.sqrt((nEffective - 2) / oneMinus);
  }

  /** 2 P(T &lt;= -|t|) for Student's t with {@code df} (&gt; 0, possibly non-integer) degrees of freedom. */
  public static double twoSidedPValue(double t, double df) {
    if (Double.isNaN(t)) {
      return Double.NaN;
    }
    if (Double.isInfinite(t)) {
      return 0;
    }
    return 2 * new TDistribution(df).cumulativeProbability(-Math.abs(t));
  }
}
