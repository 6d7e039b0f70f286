package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.hipparchus.stat.correlation.SpearmansCorrelation;
import org.hipparchus.stat.ranking.NaNStrategy;
import org.hipparchus.stat.ranking.NaturalRanking;
import org.hipparchus.stat.ranking.TiesStrategy;
import org.junit.jupiter.api.Test;
import org.slackwater.core.analytics.TemporalStep;

/**
 * r and p at every lag against Hipparchus on the same pairs, with the pairs built here
 * independently of {@link Alignment}: a map from date to value and {@code LocalDate.minusMonths}.
 */
class HipparchusReferenceTest {
  private static final LocalDate START = LocalDate.of(2001, 1, 1);

  /** Monthly series with rounded values (many ties), NaN gaps and absent months. */
  private static DatedSeries gappyTiedSeries(Random random, int months, double phi) {
    double[] base = Fixtures.ar1(random, months, phi);
    List<LocalDate> dates = new ArrayList<>();
    List<Double> values = new ArrayList<>();
    for (int i = 0; i < months; i++) {
      if (random.nextDouble() < 0.08) {
        continue; // the month is absent altogether
      }
      dates.add(START.plusMonths(i));
      values.add(random.nextDouble() < 0.12 ? Double.NaN : Math.round(base[i] * 2) / 2.0);
    }
    return new DatedSeries(TemporalStep.MONTH, dates.toArray(LocalDate[]::new),
        values.stream().mapToDouble(Double::doubleValue).toArray());
  }

  /** Complete pairs (driver at d - lag months, target at d) as {target[], driver[]}. */
  private static double[][] pairsByHand(DatedSeries target, DatedSeries driver, int lag) {
    Map<LocalDate, Double> drv = new HashMap<>();
    for (int i = 0; i < driver.size(); i++) {
      drv.put(driver.date(i), driver.value(i));
    }
    List<double[]> pairs = new ArrayList<>();
    for (int i = 0; i < target.size(); i++) {
      Double x = drv.get(target.date(i).minusMonths(lag));
      double y = target.value(i);
      if (x != null && !x.isNaN() && !Double.isNaN(y)) {
        pairs.add(new double[] {y, x});
      }
    }
    double[][] out = new double[2][pairs.size()];
    for (int q = 0; q < pairs.size(); q++) {
      out[0][q] = pairs.get(q)[0];
      out[1][q] = pairs.get(q)[1];
    }
    return out;
  }

  @Test
  void pearsonEqualsHipparchusAtEveryLag() {
    Random random = new Random(11);
    for (int trial = 0; trial < 20; trial++) {
      DatedSeries target = gappyTiedSeries(random, 120, 0.6);
      DatedSeries driver = gappyTiedSeries(random, 120, 0.3);
      CorrelationResult result = LaggedCorrelation.compute(target, driver, CorrelationMethod.PEARSON, -12, 12, 1, 0.05);
      for (LagRow row : result.rows()) {
        double[][] p = pairsByHand(target, driver, row.lag());
        assertEquals(p[0].length, row.n(), "pairs at lag " + row.lag());
        // Reference: Hipparchus PearsonsCorrelation.correlation(double[], double[])
        assertEquals(new PearsonsCorrelation().correlation(p[0], p[1]), row.r(), 1e-12, "r at lag " + row.lag());
      }
    }
  }

  @Test
  void spearmanEqualsHipparchusWithTiesAveraged() {
    Random random = new Random(12);
    // Reference: Hipparchus SpearmansCorrelation, ties given their average rank.
    SpearmansCorrelation reference = new SpearmansCorrelation(new NaturalRanking(NaNStrategy.FAILED, TiesStrategy.AVERAGE));
    int tiedPairs = 0;
    for (int trial = 0; trial < 20; trial++) {
      DatedSeries target = gappyTiedSeries(random, 120, 0.6);
      DatedSeries driver = gappyTiedSeries(random, 120, 0.3);
      CorrelationResult result = LaggedCorrelation.compute(target, driver, CorrelationMethod.SPEARMAN, -12, 12, 3, 0.05);
      for (LagRow row : result.rows()) {
        double[][] p = pairsByHand(target, driver, row.lag());
        tiedPairs += p[0].length - (int) java.util.Arrays.stream(p[0]).distinct().count();
        assertEquals(p[0].length, row.n(), "pairs at lag " + row.lag());
        assertEquals(reference.correlation(p[0], p[1]), row.r(), 1e-12, "rho at lag " + row.lag());
      }
    }
    assertTrue(tiedPairs > 1000, "the data must contain many ties to test tie handling, had " + tiedPairs);
  }

  @Test
  void pValuesEqualHipparchusWhenTheCorrectionIsOff() {
    Random random = new Random(13);
    DatedSeries target = gappyTiedSeries(random, 90, 0.5);
    DatedSeries driver = gappyTiedSeries(random, 90, 0.5);
    // Make some lags clearly correlated so small p-values are compared too.
    double[] v = target.values();
    for (int i = 0; i < v.length; i++) {
      int j = java.util.Arrays.asList(driver.dates()).indexOf(target.date(i).minusMonths(2));
      if (j >= 0 && !Double.isNaN(driver.value(j)) && !Double.isNaN(v[i])) {
        v[i] = v[i] + 1.5 * driver.value(j);
      }
    }
    target = new DatedSeries(TemporalStep.MONTH, target.dates(), v);
    CorrelationSettings settings = CorrelationSettings.of(CorrelationMethod.PEARSON, -6, 6, 1, 0.05)
        .withoutAutocorrelationCorrection();
    CorrelationResult result = LaggedCorrelation.compute(target, driver, settings);
    double smallest = 1;
    for (LagRow row : result.rows()) {
      double[][] p = pairsByHand(target, driver, row.lag());
      double[][] matrix = new double[p[0].length][];
      for (int q = 0; q < matrix.length; q++) {
        matrix[q] = new double[] {p[0][q], p[1][q]};
      }
      // Reference: Hipparchus PearsonsCorrelation(matrix).getCorrelationPValues(), two-sided, t with n - 2 df
      double expected = new PearsonsCorrelation(matrix).getCorrelationPValues().getEntry(0, 1);
      assertEquals(row.n(), row.nEffective(), 0.0, "N_eff = N with the correction off");
      assertEquals(expected, row.pValue(), 1e-9 * Math.max(expected, 1e-6), "p at lag " + row.lag());
      smallest = Math.min(smallest, row.pValue());
    }
    assertTrue(smallest < 1e-6, "the planted relation should give a small p-value somewhere, got " + smallest);
  }
  @Test
  void gapFreeSeriesAgreeToo() {
    // Without gaps the kernel takes its prefix-sum path; check it the same way, on values far from
    // zero (offset 1000) to exercise the conditioning of the sums.
    Random random = new Random(14);
    double[] a = Fixtures.ar1(random, 730, 0.7);
    double[] b = Fixtures.ar1(random, 730, 0.4);
    for (int i = 0; i < a.length; i++) {
      a[i] += 1000;
      b[i] = 1000 + 0.5 * b[i] + (i >= 3 ? 0.3 * (a[i - 3] - 1000) : 0);
    }
    DatedSeries target = Fixtures.daily(START, a);
    DatedSeries driver = Fixtures.daily(START.plusDays(10), b);
    CorrelationResult result = LaggedCorrelation.compute(target, driver, CorrelationMethod.PEARSON, -30, 30, 1, 0.05);
    for (LagRow row : result.rows()) {
      double[][] p = pairsByDay(target, driver, row.lag());
      assertEquals(p[0].length, row.n(), "pairs at lag " + row.lag());
      // Reference: Hipparchus PearsonsCorrelation.correlation(double[], double[])
      assertEquals(new PearsonsCorrelation().correlation(p[0], p[1]), row.r(), 1e-11, "r at lag " + row.lag());
      // Usual lag-1 estimator sum (x_t - m)(x_{t+1} - m) / sum (x_t - m)^2 (e.g. Box and Jenkins), no gaps here
      assertEquals(lagOne(p[0]), row.r1Target(), 1e-10, "r1 of the target at lag " + row.lag());
      assertEquals(lagOne(p[1]), row.r1Driver(), 1e-10, "r1 of the driver at lag " + row.lag());
    }
  }

  private static double lagOne(double[] x) {
    double m = java.util.Arrays.stream(x).average().orElseThrow();
    double num = 0;
    double den = 0;
    for (int t = 0; t < x.length; t++) {
      den += (x[t] - m) * (x[t] - m);
      if (t + 1 < x.length) {
        num += (x[t] - m) * (x[t + 1] - m);
      }
    }
    return num / den;
  }

  private static double[][] pairsByDay(DatedSeries target, DatedSeries driver, int lag) {
    Map<LocalDate, Double> drv = new HashMap<>();
    for (int i = 0; i < driver.size(); i++) {
      drv.put(driver.date(i), driver.value(i));
    }
    List<double[]> pairs = new ArrayList<>();
    for (int i = 0; i < target.size(); i++) {
      Double x = drv.get(target.date(i).minusDays(lag));
      if (x != null) {
        pairs.add(new double[] {target.value(i), x});
      }
    }
    double[][] out = new double[2][pairs.size()];
    for (int q = 0; q < pairs.size(); q++) {
      out[0][q] = pairs.get(q)[0];
      out[1][q] = pairs.get(q)[1];
    }
    return out;
  }
}
