package org.slackwater.core.analytics.correlation;

import org.slackwater.core.analytics.PeriodOfYear;
import java.util.Objects;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Per {@linkplain PeriodOfYear period-of-year class}: the number of baseline values pooled, their
 * mean and sample standard deviation (NaN when undefined). Arrays are indexed by class and copied
 * in and out.
 *
 * @param step the step whose classes these are
 * @param count baseline values pooled into each class (after the daily window)
 * @param mean class mean; NaN without values
 * @param sd class sample standard deviation (n - 1); NaN with fewer than 2 values
 */
public record ClassClimatology(TemporalStep step, int[] count, double[] mean, double[] sd) {
  public ClassClimatology {
    Objects.requireNonNull(step);
    int k = PeriodOfYear.classCount(step);
    if (count.length != k || mean.length != k || sd.length != k) {
      throw new IllegalArgumentException("expected " + k + " classes for step " + step);
    }
    count = count.clone();
    mean = mean.clone();
    sd = sd.clone();
  }

  @Override
  public int[] count() {
    return count.clone();
  }

  @Override
  public double[] mean() {
    return mean.clone();
  }

  @Override
  public double[] sd() {
    return sd.clone();
  }
}
