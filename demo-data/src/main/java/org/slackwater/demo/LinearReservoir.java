package org.slackwater.demo;

/**
 * A discrete linear reservoir: outflow is storage divided by the residence time k (days), taken from
 * the storage at the start of the day, so a day's inflow leaves no earlier than the next day. The unit
 * impulse response is therefore Q(t) = (1/k) (1 - 1/k)^(t-1) for t >= 1, which sums to 1 (mass is
 * conserved). Mutable: one instance per simulated store.
 */
final class LinearReservoir {

  private final double k;
  private double storage;

  /**
   * @throws IllegalArgumentException when k is below one day (the explicit step would overshoot)
   */
  LinearReservoir(double kDays, double initialStorage) {
    if (!(kDays >= 1)) {
      throw new IllegalArgumentException("residence time must be at least 1 day, got " + kDays);
    }
    this.k = kDays;
    this.storage = initialStorage;
  }

  /** Advances one day with {@code inflow} (mm) and returns that day's outflow (mm d-1). */
  double step(double inflow) {
    double out = storage / k;
    storage += inflow - out;
    return out;
  }

  double storage() {
    return storage;
  }
}
