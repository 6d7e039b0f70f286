package org.slackwater.core.analytics.correlation;

import java.util.Objects;

/**
 * What to compute: the method, the lags {@code minLag, minLag + lagStep, ...} up to and including
 * {@code maxLag} at most (in steps; positive = driver leads, see {@link Alignment}), the
 * significance level, and whether p-values use the effective sample size of Bretherton et al.
 * (1999) instead of the number of pairs.
 *
 * <p>Turning the correction off is for comparisons and for series known to be serially
 * independent; with autocorrelated data it makes far too many correlations look significant.
 *
 * <p>Fails with {@code BAD_SETTING}: minLag greater than maxLag, lagStep below 1, alpha outside
 * (0, 1), more than {@value #MAX_LAGS} lags.
 *
 * @param method Pearson or Spearman
 * @param minLag smallest lag, in steps
 * @param maxLag largest lag, in steps
 * @param lagStep distance between successive lags, in steps (at least 1)
 * @param alpha two-sided significance level, e.g. 0.05
 * @param correctForAutocorrelation use N_eff (true) or N (false) for the t-test
 */
public record CorrelationSettings(CorrelationMethod method, int minLag, int maxLag, int lagStep, double alpha,
    boolean correctForAutocorrelation) {
  /** More lags than any sensible request; a guard against a typo allocating gigabytes. */
  public static final int MAX_LAGS = 100_000;

  public CorrelationSettings {
    Objects.requireNonNull(method, "method");
    if (minLag > maxLag) {
      throw bad("the lag range runs backwards: from " + minLag + " to " + maxLag + "; write the smaller lag first");
    }
    if (lagStep < 1) {
      throw bad("the lag step must be at least 1 (got " + lagStep + ")");
    }
    if (!(alpha > 0 && alpha < 1)) {
      throw bad("the significance level alpha must lie strictly between 0 and 1 (got " + alpha + "); 0.05 is usual");
    }
    if (((long) maxLag - minLag) / lagStep + 1 > MAX_LAGS) {
      throw bad("lags " + minLag + " to " + maxLag + " by " + lagStep + " make more than " + MAX_LAGS
          + " lags; use a larger lag step or a shorter range");
    }
  }

  /** Settings with the autocorrelation correction on. */
  public static CorrelationSettings of(CorrelationMethod method, int minLag, int maxLag, int lagStep, double alpha) {
    return new CorrelationSettings(method, minLag, maxLag, lagStep, alpha, true);
  }

  public CorrelationSettings withoutAutocorrelationCorrection() {
    return new CorrelationSettings(method, minLag, maxLag, lagStep, alpha, false);
  }

  public int lagCount() {
    return (int) (((long) maxLag - minLag) / lagStep + 1);
  }

  /** The lags in increasing order. */
  public int[] lags() {
    int[] lags = new int[lagCount()];
    for (int i = 0; i < lags.length; i++) {
      lags[i] = minLag + i * lagStep;
    }
    return lags;
  }

  /** The largest |lag| of the range. */
  public int maxAbsLag() {
    int last = minLag + (lagCount() - 1) * lagStep;
    return Math.max(Math.abs(minLag), Math.abs(last));
  }

  private static CorrelationInputException bad(String message) {
    return new CorrelationInputException(CorrelationInputException.Kind.BAD_SETTING, message);
  }
}
