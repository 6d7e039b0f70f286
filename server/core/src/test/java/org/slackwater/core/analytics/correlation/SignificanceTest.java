package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class SignificanceTest {

  @Test
  void tStatisticWorkedExamples() {
    // Worked examples in REFERENCES.md "Correlation and significance": t = r sqrt((n-2)/(1-r^2))
    assertEquals(4.526, Significance.tStatistic(0.65, 30), 5e-4); // r = 0.65, n = 30 -> t = 4.526
    assertEquals(-1.98, Significance.tStatistic(-0.405, 22), 5e-3); // r = -0.405, n = 22 -> t = -1.98
  }

  @Test
  void twoSidedPValueOfTheWorkedExample() {
    // REFERENCES.md: r = 0.65, n = 30 -> two-sided p "about 1.0e-4" (so accept 0.95e-4 .. 1.05e-4)
    double p = Significance.twoSidedPValue(Significance.tStatistic(0.65, 30), 28);
    assertTrue(p > 0.95e-4 && p < 1.05e-4, "p = " + p);
  }

  @Test
  void studentTTailsFromTheReferenceTable() {
    // REFERENCES.md: t(29) CDF at -2.656 = 0.006358; the two-sided p is twice the lower tail
    assertEquals(0.006358, Significance.twoSidedPValue(-2.656, 29) / 2, 5e-7);
    // REFERENCES.md: upper tail of t(29) at 2.75 = 0.005078 (symmetric, so half the two-sided p)
    assertEquals(0.005078, Significance.twoSidedPValue(2.75, 29) / 2, 5e-7);
  }

  @Test
  void effectiveSampleSizeFormula() {
    // Bretherton et al. (1999) section 5, example in REFERENCES.md: N = 100, r1 = r2 = 0.5 -> 60
    assertEquals(60.0, Significance.effectiveSampleSize(100, 0.5, 0.5), 1e-12);
    // Same formula, N (1 - r1 r2) / (1 + r1 r2): N = 200, r1 = 0.8, r2 = 0.5 -> 200 * 0.6 / 1.4
    assertEquals(200 * 0.6 / 1.4, Significance.effectiveSampleSize(200, 0.8, 0.5), 1e-12);
    // Independent series: no reduction
    assertEquals(50.0, Significance.effectiveSampleSize(50, 0.9, 0.0), 1e-12);
  }

  @Test
  void effectiveSampleSizeIsClampedToThreeAndN() {
    // Our documented clamp (class comment of Significance): r1 r2 < 0 would exceed N ...
    assertEquals(100.0, Significance.effectiveSampleSize(100, 0.5, -0.5), 0.0);
    // ... and r1 r2 -> 1 would fall below 3 (100 * 0.0199 / 1.9801 = 1.005)
    assertEquals(3.0, Significance.effectiveSampleSize(100, 0.99, 0.99), 0.0);
    assertEquals(3.0, Significance.effectiveSampleSize(100, 1.0, 1.0), 0.0);
    assertThrows(IllegalArgumentException.class, () -> Significance.effectiveSampleSize(100, Double.NaN, 0.5));
  }

  @Test
  void perfectCorrelationHasZeroPValue() {
    // Limit of the formula: |r| = 1 makes t infinite and p = 0.
    assertEquals(Double.NEGATIVE_INFINITY, Significance.tStatistic(-1, 10));
    assertEquals(0.0, Significance.twoSidedPValue(Double.POSITIVE_INFINITY, 8));
  }
}
