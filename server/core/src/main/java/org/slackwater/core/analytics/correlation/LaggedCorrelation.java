package org.slackwater.core.analytics.correlation;

/**
 * Correlation between a target and a driver series at a range of lags, with p-values corrected
 * for autocorrelation. One call aligns the series on their dates ({@link Alignment}: lag k pairs
 * driver(d - k steps) with target(d), positive = driver leads) and runs a {@link LagCorrelator};
 * see those classes for the exact definitions, failure modes and cost.
 *
 * <p>Error messages name dates (rather than axis positions) so that they read well as they are.
 */
public final class LaggedCorrelation {
  private LaggedCorrelation() {}

  /** With the autocorrelation correction on. */
  public static CorrelationResult compute(DatedSeries target, DatedSeries driver, CorrelationMethod method,
      int minLag, int maxLag, int lagStep, double alpha) {
    return compute(target, driver, CorrelationSettings.of(method, minLag, maxLag, lagStep, alpha));
  }

  public static CorrelationResult compute(DatedSeries target, DatedSeries driver, CorrelationSettings settings) {
    AlignedPair pair = Alignment.align(target, driver);
    return new LagCorrelator(settings).compute(pair.target, pair.driver, i -> pair.dateAt(i).toString(),
        StepOrdinal.noun(pair.step()) + "s");
  }
}
