package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The false-positive rate of the t-test on independent AR(1) pairs, with and without the
 * Bretherton et al. (1999) effective sample size. Seeded, so the rates are reproducible; the
 * bounds are wide enough for Monte Carlo error (2,000 trials: standard error about 0.5 % at 5 %).
 */
class MonteCarloTest {
  private static final int TRIALS = 2000;
  private static final int N = 200;
  private static final double PHI = 0.8;

  @ParameterizedTest
  @EnumSource(CorrelationMethod.class)
  void effectiveSampleSizeKeepsTheFalsePositiveRateNearAlpha(CorrelationMethod method) {
    Random random = new Random(20240601L);
    LagCorrelator corrected = new LagCorrelator(CorrelationSettings.of(method, 0, 0, 1, 0.05));
    LagCorrelator plain = new LagCorrelator(
        CorrelationSettings.of(method, 0, 0, 1, 0.05).withoutAutocorrelationCorrection());
    int hitsCorrected = 0;
    int hitsPlain = 0;
    double r1Sum = 0;
    for (int trial = 0; trial < TRIALS; trial++) {
      double[] a = Fixtures.ar1(random, N, PHI);
      double[] b = Fixtures.ar1(random, N, PHI);
      LagRow withNeff = corrected.compute(a, b).rows().get(0);
      LagRow withN = plain.compute(a, b).rows().get(0);
      hitsCorrected += withNeff.significant() ? 1 : 0;
      hitsPlain += withN.significant() ? 1 : 0;
      r1Sum += withNeff.r1Target();
    }
    double rateCorrected = (double) hitsCorrected / TRIALS;
    double ratePlain = (double) hitsPlain / TRIALS;
    // The lag-1 estimate should find phi, slightly low by the estimator's small-sample bias, about
    // -(1 + 4 phi) / n = -0.02 for Pearson (from memory); ranks are a little less autocorrelated still.
    assertEquals(PHI, r1Sum / TRIALS, 0.05, "mean lag-1 autocorrelation");
    // Bretherton et al. (1999): with N_eff the test holds its nominal level, here 5 % (bounds 2-9 % per the brief).
    assertTrue(rateCorrected > 0.02 && rateCorrected < 0.09, "false-positive rate with N_eff: " + rateCorrected);
    // Without it the test is far too liberal: for AR(1) with phi = 0.8 the variance of r is about
    // (1 + phi^2) / (1 - phi^2) / N = 4.6 / N (Bartlett's formula, from memory), i.e. P(|Z| > 1.96 / 2.13) ~ 36 %.
    assertTrue(ratePlain > 0.15, "false-positive rate with N: " + ratePlain);
  }
}
