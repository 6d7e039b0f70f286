package org.slackwater.core.analytics.correlation;

/**
 * The statistics of one lag from its {@link PairSums}: Pearson's r, the lag-1 autocorrelations of
 * the paired samples, Bretherton et al.'s effective sample size, t and the two-sided p-value
 * ({@link Significance}), as one {@link LagRow}. This is the single implementation shared by
 * {@link LagCorrelator} (one pair of series) and the correlation map (many cells at once), so
 * that both give the same row, notes included, for the same sums.
 *
 * <p><b>Formulas.</b> With n pairs, means m_T = ΣT / n and m_D = ΣD / n: c_TT = ΣTT - n m_T²,
 * c_DD = ΣDD - n m_D², c_TD = ΣTD - n m_T m_D and r = c_TD / sqrt(c_TT c_DD), clamped to [-1, 1].
 * Lag-1 autocorrelation over M adjacent pairs: r1 = ((n - 1) / M) (adjTT - m (adj0 + adj1) + M m²)
 * / c, clamped to [-1, 1] (see {@link LagCorrelator} for why (n - 1) / M). N_eff, t and p as in
 * {@link Significance}.
 *
 * <p><b>Invalid rows</b> (r NaN, with a note saying why): fewer than {@value
 * LagCorrelator#MIN_PAIRS} pairs; a side constant over the pairs (its centred sum of squares at
 * most 1e-12 of its raw sum of squares). A valid row whose autocorrelations cannot be estimated
 * (fewer than {@value LagCorrelator#MIN_ADJACENT_PAIRS} adjacent pairs) keeps N_eff = n and says
 * in its note that the p-value is uncorrected. Stateless.
 */
public final class LagStatistics {
  /** Relative size below which a centred sum of squares counts as zero (a constant sample). */
  private static final double CONSTANT_TOLERANCE = 1e-12;

  private LagStatistics() {}

  /**
   * Pearson's r from the sums, or NaN where the row would be invalid (too few pairs, a constant
   * side): what ranking many lags needs, without building rows or p-values.
   */
  public static double r(int n, double sumT, double sumD, double sumTT, double sumDD, double sumTD) {
    if (n < LagCorrelator.MIN_PAIRS) {
      return Double.NaN;
    }
    double mt = sumT / n;
    double md = sumD / n;
    double ctt = sumTT - n * mt * mt;
    double cdd = sumDD - n * md * md;
    if (ctt <= CONSTANT_TOLERANCE * sumTT || cdd <= CONSTANT_TOLERANCE * sumDD) {
      return Double.NaN;
    }
    return clamp((sumTD - n * mt * md) / Math.sqrt(ctt * cdd));
  }

  /** The row of {@code lag} for these sums under {@code settings} (alpha, correction on or off). */
  public static LagRow row(int lag, PairSums s, CorrelationSettings settings) {
    int n = s.n();
    if (n < LagCorrelator.MIN_PAIRS) {
      return LagRow.invalid(lag, n, "only " + n + " pair" + (n == 1 ? "" : "s")
          + " with values in both series at this lag; at least " + LagCorrelator.MIN_PAIRS + " are needed");
    }
    double mt = s.sumT() / n;
    double md = s.sumD() / n;
    double ctt = s.sumTT() - n * mt * mt;
    double cdd = s.sumDD() - n * md * md;
    double ctd = s.sumTD() - n * mt * md;
    boolean constantT = ctt <= CONSTANT_TOLERANCE * s.sumTT();
    boolean constantD = cdd <= CONSTANT_TOLERANCE * s.sumDD();
    if (constantT || constantD) {
      return LagRow.invalid(lag, n, "the " + (constantT ? "target" : "driver")
          + " is constant over the pairs at this lag, so the correlation is undefined");
    }
    double r = clamp(ctd / Math.sqrt(ctt * cdd));
    int m = s.adjacent();
    double r1T = lagOne(n, m, s.adjTT() - mt * (s.adjT0() + s.adjT1()) + m * mt * mt, ctt);
    double r1D = lagOne(n, m, s.adjDD() - md * (s.adjD0() + s.adjD1()) + m * md * md, cdd);
    String note = "";
    double nEff = n;
    if (settings.correctForAutocorrelation()) {
      if (Double.isNaN(r1T) || Double.isNaN(r1D)) {
        note = "lag-1 autocorrelation not estimable (fewer than " + LagCorrelator.MIN_ADJACENT_PAIRS
            + " pairs of consecutive steps); p-value not corrected for autocorrelation";
      } else {
        nEff = Significance.effectiveSampleSize(n, r1T, r1D);
      }
    }
    double t = Significance.tStatistic(r, nEff);
    double p = Significance.twoSidedPValue(t, nEff - 2);
    return new LagRow(lag, n, r, r1T, r1D, nEff, t, p, p <= settings.alpha(), note);
  }

  /** r1 from the centred lag-1 sum and the centred sum of squares; NaN with too few adjacent pairs. */
  static double lagOne(int n, int m, double lagged, double centredSquares) {
    if (m < LagCorrelator.MIN_ADJACENT_PAIRS) {
      return Double.NaN;
    }
    return clamp((double) (n - 1) / m * lagged / centredSquares);
  }

  private static double clamp(double r) {
    return Math.max(-1, Math.min(1, r));
  }
}
