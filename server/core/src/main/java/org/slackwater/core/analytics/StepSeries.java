package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.Objects;

/**
 * A series reported at a {@link TemporalStep}.
 *
 * @param step the step
 * @param start first day of each period
 * @param value the aggregated statistic; NaN if the period's rule was not met
 * @param validFraction mean valid-area fraction over the period's native steps
 * @param meanValidCells mean number of valid cells over the period's native steps
 * @param stepsWithValue native steps in the period that had a value
 * @param stepsExpected native steps of the cube that fall in the period and in the query's dates
 */
public record StepSeries(TemporalStep step, LocalDate[] start, double[] value, double[] validFraction,
    double[] meanValidCells, int[] stepsWithValue, int[] stepsExpected) {
  public StepSeries {
    Objects.requireNonNull(step);
    int n = start.length;
    if (value.length != n || validFraction.length != n || meanValidCells.length != n
        || stepsWithValue.length != n || stepsExpected.length != n) {
      throw new IllegalArgumentException("series arrays differ in length");
    }
  }

  public int size() {
    return start.length;
  }
}
