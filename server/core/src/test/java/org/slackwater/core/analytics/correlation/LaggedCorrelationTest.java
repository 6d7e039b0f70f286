package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class LaggedCorrelationTest {
  private static final LocalDate START = LocalDate.of(2003, 1, 1);

  @Test
  void plantedLagIsFoundWithTheDriverLeading() {
    Random random = new Random(5);
    int n = 400;
    double[] driver = Fixtures.ar1(random, n, 0.6);
    double[] target = new double[n];
    Arrays.fill(target, Double.NaN);
    for (int t = 5; t < n; t++) {
      target[t] = driver[t - 5] + 0.8 * random.nextGaussian(); // the target follows the driver 5 days later
    }
    for (CorrelationMethod method : CorrelationMethod.values()) {
      CorrelationResult result = LaggedCorrelation.compute(Fixtures.daily(START, target), Fixtures.daily(START, driver),
          method, -10, 10, 1, 0.05);
      LagRow best = result.best().orElseThrow();
      // Constructed: target(d) = driver(d - 5) + noise, so by the lag convention the best lag is +5.
      assertEquals(5, best.lag(), method + " best lag");
      assertTrue(best.significant() && result.bestSignificant() && result.bestSignificantAfterBonferroni(), method.name());
      assertTrue(best.r() > 0.6, method + " r = " + best.r());
      assertEquals(21, result.rows().size());
    }
  }

  @Test
  void lagOneAutocorrelationByHand() {
    // Usual estimator sum (x_t - m)(x_{t+1} - m) / sum (x_t - m)^2 (e.g. Box and Jenkins), worked by hand:
    // 1..8: m = 4.5, deviations -3.5..3.5; sum d_t d_{t+1} = 8.75 + 3.75 + 0.75 - 0.25 + 0.75 + 3.75 + 8.75 = 26.25,
    // sum d^2 = 42 -> r1 = 0.625. With the value of day 4 missing: used 1,2,3,5,6,7,8 (m = 32/7), adjacent pairs
    // (1,2),(2,3),(5,6),(6,7),(7,8).
    double[] target = {1, 2, 3, 4, 5, 6, 7, 8};
    double[] driver = {3, 1, 4, 1, 5, 9, 2, 6};
    LagCorrelator kernel = new LagCorrelator(CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 0, 1, 0.05));
    LagRow full = kernel.compute(target, driver).rows().get(0);
    assertEquals(26.25 / 42, full.r1Target(), 1e-12);
    double[] gappy = target.clone();
    gappy[3] = Double.NaN;
    LagRow gap = kernel.compute(gappy, driver).rows().get(0);
    double m = 32.0 / 7;
    double[] used = {1, 2, 3, 5, 6, 7, 8};
    double squares = 0;
    for (double v : used) {
      squares += (v - m) * (v - m);
    }
    double lagged = (1 - m) * (2 - m) + (2 - m) * (3 - m) + (5 - m) * (6 - m) + (6 - m) * (7 - m) + (7 - m) * (8 - m);
    // Documented gap rule: numerator over the M = 5 calendar-adjacent pairs, scaled by (N - 1) / M = 6 / 5.
    assertEquals(6.0 / 5 * lagged / squares, gap.r1Target(), 1e-12);
    assertEquals(7, gap.n());
  }

  @Test
  void effectiveSampleSizeUsesBothLagOneAutocorrelations() {
    Random random = new Random(8);
    double[] a = Fixtures.ar1(random, 300, 0.7);
    double[] b = Fixtures.ar1(random, 300, 0.5);
    LagRow row = new LagCorrelator(CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 0, 1, 0.05))
        .compute(a, b).rows().get(0);
    // Bretherton et al. (1999): N_eff = N (1 - r1 r2) / (1 + r1 r2)
    double p = row.r1Target() * row.r1Driver();
    assertEquals(300 * (1 - p) / (1 + p), row.nEffective(), 1e-9);
    // t = r sqrt((N_eff - 2) / (1 - r^2)) (REFERENCES.md)
    assertEquals(row.r() * Math.sqrt((row.nEffective() - 2) / (1 - row.r() * row.r())), row.t(), 1e-12);
  }

  @Test
  void lagsWithTooFewPairsAreNaNRowsWithAReason() {
    double[] target = {1, 2, Double.NaN, Double.NaN, 5, 3, 8, 1, 2, 9};
    double[] driver = {2, 1, 4, 3, 6, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN};
    CorrelationResult result = LaggedCorrelation.compute(Fixtures.daily(START, target), Fixtures.daily(START, driver),
        CorrelationMethod.PEARSON, -4, 4, 1, 0.05);
    LagRow lag0 = result.row(0).orElseThrow(); // pairs on days 0, 1, 4 only
    assertEquals(3, lag0.n());
    assertFalse(lag0.valid());
    assertTrue(Double.isNaN(lag0.pValue()) && !lag0.significant());
    assertTrue(lag0.note().contains("at least 4"), lag0.note());
    LagRow lag3 = result.row(3).orElseThrow(); // target days 3..7 with driver days 0..4; target day 3 missing
    assertEquals(4, lag3.n());
    assertTrue(lag3.valid());
    assertTrue(result.best().orElseThrow().n() >= 4);
  }

  @Test
  void constantSampleGivesAReason() {
    double[] target = {1, 2, 3, 4, 5, 6};
    double[] driver = {7, 7, 7, 7, 7, 7};
    LagRow row = new LagCorrelator(CorrelationSettings.of(CorrelationMethod.SPEARMAN, 0, 0, 1, 0.05))
        .compute(target, driver).rows().get(0);
    assertFalse(row.valid());
    assertTrue(row.note().contains("driver is constant"), row.note());
  }

  @Test
  void bestTiesGoToTheSmallerLag() {
    CorrelationSettings s = CorrelationSettings.of(CorrelationMethod.PEARSON, -3, 3, 1, 0.05);
    LagRow a = new LagRow(-2, 50, -0.4, 0, 0, 50, -3, 0.004, true, "");
    LagRow b = new LagRow(1, 50, 0.4, 0, 0, 50, 3, 0.004, true, "");
    LagRow c = new LagRow(3, 50, 0.4, 0, 0, 50, 3, 0.004, true, "");
    LagRow d = new LagRow(-1, 50, 0.4, 0, 0, 50, 3, 0.004, true, "");
    LagRow e = LagRow.invalid(0, 2, "too few");
    // Rule of the brief: largest |r|, ties to the smaller |lag|; between -k and +k our rule picks +k.
    assertEquals(1, new CorrelationResult(s, List.of(a, b, c, d, e)).best().orElseThrow().lag());
    assertEquals(-2, new CorrelationResult(s, List.of(a, c)).best().orElseThrow().lag());
    assertTrue(new CorrelationResult(s, List.of(e)).best().isEmpty());
    assertFalse(new CorrelationResult(s, List.of(e)).bestSignificant());
  }

  @Test
  void lagRangeLongerThanTheSeriesIsRefused() {
    DatedSeries target = Fixtures.monthly(LocalDate.of(2001, 1, 1), new double[30]);
    DatedSeries driver = Fixtures.monthly(LocalDate.of(2001, 1, 1), new double[60]);
    CorrelationInputException e = assertThrows(CorrelationInputException.class,
        () -> LaggedCorrelation.compute(target, driver, CorrelationMethod.PEARSON, -40, 40, 1, 0.05));
    assertEquals(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG, e.kind());
    assertTrue(e.getMessage().startsWith("lag range too long for the series"), e.getMessage());
    assertTrue(e.getMessage().contains("30 months") && e.getMessage().contains("below 30"), e.getMessage());
  }

  @Test
  void seriesThatNeverMeetAreRefused() {
    double[] v = new double[20];
    for (int i = 0; i < v.length; i++) {
      v[i] = i % 3;
    }
    DatedSeries target = Fixtures.monthly(LocalDate.of(2001, 1, 1), v);
    DatedSeries driver = Fixtures.monthly(LocalDate.of(2005, 1, 1), v);
    CorrelationInputException e = assertThrows(CorrelationInputException.class,
        () -> LaggedCorrelation.compute(target, driver, CorrelationMethod.SPEARMAN, -6, 6, 1, 0.05));
    assertEquals(CorrelationInputException.Kind.NO_OVERLAP, e.kind());
    assertTrue(e.getMessage().contains("2001-01-01") && e.getMessage().contains("2005-01-01"), e.getMessage());
    CorrelationInputException empty = assertThrows(CorrelationInputException.class,
        () -> LaggedCorrelation.compute(target, Fixtures.monthly(LocalDate.of(2001, 1, 1),
            new double[] {Double.NaN, Double.NaN}), CorrelationMethod.PEARSON, 0, 0, 1, 0.05));
    assertEquals(CorrelationInputException.Kind.EMPTY_SERIES, empty.kind());
  }

  @Test
  void badSettingsAreExplained() {
    assertEquals(CorrelationInputException.Kind.BAD_SETTING, assertThrows(CorrelationInputException.class,
        () -> CorrelationSettings.of(CorrelationMethod.PEARSON, 3, -3, 1, 0.05)).kind());
    assertTrue(assertThrows(CorrelationInputException.class,
        () -> CorrelationSettings.of(CorrelationMethod.PEARSON, -3, 3, 0, 0.05)).getMessage().contains("lag step"));
    assertTrue(assertThrows(CorrelationInputException.class,
        () -> CorrelationSettings.of(CorrelationMethod.PEARSON, -3, 3, 1, 5)).getMessage().contains("alpha"));
    CorrelationSettings s = CorrelationSettings.of(CorrelationMethod.PEARSON, -7, 8, 5, 0.05);
    assertEquals(4, s.lagCount()); // -7, -2, 3, 8
    assertEquals(8, s.maxAbsLag());
  }

  @Test
  void kernelIsReusableAcrossCallsOfDifferentLengths() {
    Random random = new Random(3);
    LagCorrelator kernel = new LagCorrelator(CorrelationSettings.of(CorrelationMethod.SPEARMAN, -2, 2, 1, 0.05));
    double[] longA = Fixtures.ar1(random, 500, 0.3);
    double[] longB = Fixtures.ar1(random, 500, 0.3);
    double[] shortA = Fixtures.ar1(random, 40, 0.3);
    double[] shortB = Fixtures.ar1(random, 40, 0.3);
    CorrelationResult first = new LagCorrelator(kernel.settings()).compute(shortA, shortB);
    kernel.compute(longA, longB);
    CorrelationResult again = kernel.compute(shortA, shortB);
    assertEquals(first, again);
  }
}
