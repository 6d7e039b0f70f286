package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Two series laid on one gap-free axis of calendar steps: index i is the period {@code i} steps
 * after {@link #firstDate()}, for both series. A period a series lacks (absent date or NaN) is NaN.
 * On this axis lag k pairs {@code target[i]} with {@code driver[i - k]}.
 *
 * <p>Immutable; the arrays are copied out. The package reads them in place.
 */
public final class AlignedPair {
  private final TemporalStep step;
  private final long firstOrdinal;
  final double[] target;
  final double[] driver;

  AlignedPair(TemporalStep step, long firstOrdinal, double[] target, double[] driver) {
    this.step = step;
    this.firstOrdinal = firstOrdinal;
    this.target = target;
    this.driver = driver;
  }

  public TemporalStep step() {
    return step;
  }

  public int length() {
    return target.length;
  }

  public LocalDate firstDate() {
    return StepOrdinal.date(step, firstOrdinal);
  }

  /** The first day of the period at axis index {@code i}. */
  public LocalDate dateAt(int i) {
    return StepOrdinal.date(step, firstOrdinal + i);
  }

  public double[] target() {
    return target.clone();
  }

  public double[] driver() {
    return driver.clone();
  }
}
