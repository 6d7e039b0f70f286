package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.hipparchus.distribution.continuous.TDistribution;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.Test;

/**
 * The statistics shared by LagCorrelator and the correlation map, from sums formed by hand here:
 * Bretherton et al.'s effective sample size on its worked example, Hipparchus for r and for the
 * t distribution's tail, and LagCorrelator's rows (whose formulas LagStatistics now is) on series
 * with gaps.
 */
class LagStatisticsTest {
  private static final CorrelationSettings CORRECTED = CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 0, 1, 0.05);

  @Test
  void effectiveSampleSizeOfTheWorkedExampleThroughARow() {
    // 100 pairs, both samples centred (sums 0), Σx² = 50, Σ x_i x_{i+1} = 25 over the 99 lag-1 pairs:
    // r1 = (99 / 99) x 25 / 50 = 0.5 on both sides.
    PairSums sums = new PairSums(100, 99, 0, 0, 50, 50, 10, 0, 0, 25, 0, 0, 25);
    LagRow row = LagStatistics.row(3, sums, CORRECTED);
    assertEquals(0.5, row.r1Target(), 1e-15);
    assertEquals(0.5, row.r1Driver(), 1e-15);
    // Bretherton et al. (1999) section 5, example in REFERENCES.md: N = 100, r1 = r2 = 0.5 -> 60
    // (N (1 - r1 r2) / (1 + r1 r2); the equation number is recorded there as unconfirmed).
    assertEquals(60.0, row.nEffective(), 1e-12);
    // r = Σxy / sqrt(Σx² Σy²) = 10 / 50 (Pearson's definition on centred sums).
    assertEquals(0.2, row.r(), 1e-15);
    // t = r sqrt((N_eff - 2) / (1 - r²)), p = 2 P(T_58 <= -|t|) from Hipparchus' Student t.
    double t = 0.2 * Math.sqrt(58 / 0.96);
    assertEquals(t, row.t(), 1e-12);
    assertEquals(2 * new TDistribution(58).cumulativeProbability(-t), row.pValue(), 1e-15);
    assertFalse(row.significant()); // p = 0.125 > 0.05
    assertEquals(3, row.lag());
    assertEquals("", row.note());
    // With the correction off the t test uses the 100 pairs themselves.
    LagRow plain = LagStatistics.row(3, sums, CORRECTED.withoutAutocorrelationCorrection());
    assertEquals(100.0, plain.nEffective(), 0.0);
    assertEquals(0.2 * Math.sqrt(98 / 0.96), plain.t(), 1e-12);
  }

  @Test
  void rowsFromSumsByHandEqualLagCorrelatorsRows() {
    Random random = new Random(1999);
    int len = 300;
    double[] driver = Fixtures.ar1(random, len, 0.6);
    double[] target = new double[len];
    for (int i = 0; i < len; i++) {
      target[i] = 40 + 0.7 * driver[Math.max(0, i - 4)] + random.nextGaussian();
      if (random.nextDouble() < 0.15) {
        target[i] = Double.NaN;
      }
      if (random.nextDouble() < 0.05) {
        driver[i] = Double.NaN;
      }
    }
    CorrelationSettings settings = CorrelationSettings.of(CorrelationMethod.PEARSON, -6, 9, 1, 0.05);
    CorrelationResult reference = new LagCorrelator(settings).compute(target, driver);
    double meanT = mean(target), meanD = mean(driver);
    for (LagRow expected : reference.rows()) {
      int lag = expected.lag();
      // The sums of PairSums' definition, pair by pair.
      int n = 0, m = 0, k = 0;
      double st = 0, sd = 0, stt = 0, sdd = 0, std = 0, t0 = 0, t1 = 0, tt = 0, d0 = 0, d1 = 0, dd = 0;
      double[] pt = new double[len], pd = new double[len];
      for (int i = Math.max(0, lag); i < Math.min(len, len + lag); i++) {
        double a = target[i] - meanT, b = driver[i - lag] - meanD;
        if (Double.isNaN(a) || Double.isNaN(b)) {
          continue;
        }
        pt[k] = target[i];
        pd[k++] = driver[i - lag];
        n++;
        st += a;
        sd += b;
        stt += a * a;
        sdd += b * b;
        std += a * b;
        int next = i + 1;
        if (next < Math.min(len, len + lag) && !Double.isNaN(target[next]) && !Double.isNaN(driver[next - lag])) {
          double a1 = target[next] - meanT, b1 = driver[next - lag] - meanD;
          m++;
          t0 += a;
          t1 += a1;
          tt += a * a1;
          d0 += b;
          d1 += b1;
          dd += b * b1;
        }
      }
      PairSums sums = new PairSums(n, m, st, sd, stt, sdd, std, t0, t1, tt, d0, d1, dd);
      LagRow row = LagStatistics.row(lag, sums, settings);
      assertEquals(expected.n(), row.n(), "lag " + lag);
      assertEquals(expected.r(), row.r(), 1e-12, "lag " + lag);
      assertEquals(expected.r1Target(), row.r1Target(), 1e-12, "lag " + lag);
      assertEquals(expected.r1Driver(), row.r1Driver(), 1e-12, "lag " + lag);
      assertEquals(expected.nEffective(), row.nEffective(), 1e-9, "lag " + lag);
      assertEquals(expected.pValue(), row.pValue(), 1e-12 * Math.max(1e-3, expected.pValue()), "lag " + lag);
      // Hipparchus' Pearson r on the same pairs: an independent r.
      assertEquals(new PearsonsCorrelation().correlation(java.util.Arrays.copyOf(pt, k), java.util.Arrays.copyOf(pd, k)),
          row.r(), 1e-12, "lag " + lag);
      // The ranking shortcut gives the row's r bit for bit (same arithmetic).
      assertEquals(row.r(), LagStatistics.r(n, st, sd, stt, sdd, std), 0.0, "lag " + lag);
    }
    assertEquals(4, reference.best().orElseThrow().lag(), "the planted lag");
  }

  @Test
  void invalidAndUncorrectedRowsSayWhy() {
    LagRow few = LagStatistics.row(2, new PairSums(3, 2, 0, 0, 3, 3, 1, 0, 0, 1, 0, 0, 1), CORRECTED);
    assertFalse(few.valid());
    assertEquals(3, few.n());
    assertEquals("only 3 pairs with values in both series at this lag; at least 4 are needed", few.note());
    assertTrue(Double.isNaN(LagStatistics.r(3, 0, 0, 3, 3, 1)));

    // A target whose values are all 2 (centred on an overall mean of 1): Σx = n, Σx² = n.
    LagRow constant = LagStatistics.row(0, new PairSums(10, 9, 10, 0, 10, 5, 0, 9, 9, 9, 0, 0, 1), CORRECTED);
    assertFalse(constant.valid());
    assertEquals("the target is constant over the pairs at this lag, so the correlation is undefined", constant.note());
    assertTrue(Double.isNaN(LagStatistics.r(10, 10, 0, 10, 5, 0)));

    // Two adjacent pairs only (fewer than 3): r is valid, the p-value uses n and says so.
    LagRow sparse = LagStatistics.row(0, new PairSums(6, 2, 0, 0, 6, 6, 3, 0, 0, 1, 0, 0, 1), CORRECTED);
    assertTrue(sparse.valid());
    assertEquals(0.5, sparse.r(), 1e-15);
    assertEquals(6.0, sparse.nEffective(), 0.0);
    assertTrue(sparse.note().startsWith("lag-1 autocorrelation not estimable"), sparse.note());
    assertTrue(Double.isNaN(sparse.r1Target()));
  }

  private static double mean(double[] v) {
    double s = 0;
    int n = 0;
    for (double x : v) {
      if (!Double.isNaN(x)) {
        s += x;
        n++;
      }
    }
    return s / n;
  }
}
