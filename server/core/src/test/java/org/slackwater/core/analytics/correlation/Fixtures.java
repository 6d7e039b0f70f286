package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import java.util.Random;
import org.slackwater.core.analytics.TemporalStep;

/** Seeded synthetic series for the correlation tests. */
final class Fixtures {
  private Fixtures() {}

  /** x_t = phi x_{t-1} + e_t, e ~ N(0, 1), started from the stationary distribution. */
  static double[] ar1(Random random, int n, double phi) {
    double[] x = new double[n];
    x[0] = random.nextGaussian() / Math.sqrt(1 - phi * phi);
    for (int t = 1; t < n; t++) {
      x[t] = phi * x[t - 1] + random.nextGaussian();
    }
    return x;
  }

  static LocalDate[] days(LocalDate first, int n) {
    LocalDate[] d = new LocalDate[n];
    for (int i = 0; i < n; i++) {
      d[i] = first.plusDays(i);
    }
    return d;
  }

  static LocalDate[] months(LocalDate first, int n) {
    LocalDate[] d = new LocalDate[n];
    for (int i = 0; i < n; i++) {
      d[i] = first.plusMonths(i);
    }
    return d;
  }

  static DatedSeries daily(LocalDate first, double[] values) {
    return new DatedSeries(TemporalStep.DAY, days(first, values.length), values);
  }

  static DatedSeries monthly(LocalDate first, double[] values) {
    return new DatedSeries(TemporalStep.MONTH, months(first, values.length), values);
  }
}
