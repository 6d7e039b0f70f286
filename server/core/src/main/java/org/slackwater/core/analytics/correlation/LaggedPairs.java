package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import java.util.Objects;

/**
 * The complete pairs at one lag, in target date order: {@code driver[i]} is the driver's value on
 * {@code driverDates[i]}, which is {@code lag} steps before {@code targetDates[i]}. Pairs with a
 * missing value on either side are not included. Arrays are copied in and out.
 *
 * @param lag the lag in steps (positive: driver leads)
 * @param targetDates the target period of each pair
 * @param driverDates the driver period of each pair
 * @param target the target values
 * @param driver the driver values
 */
public record LaggedPairs(int lag, LocalDate[] targetDates, LocalDate[] driverDates, double[] target, double[] driver) {
  public LaggedPairs {
    Objects.requireNonNull(targetDates);
    Objects.requireNonNull(driverDates);
    Objects.requireNonNull(target);
    Objects.requireNonNull(driver);
    int n = targetDates.length;
    if (driverDates.length != n || target.length != n || driver.length != n) {
      throw new IllegalArgumentException("pair arrays differ in length");
    }
    targetDates = targetDates.clone();
    driverDates = driverDates.clone();
    target = target.clone();
    driver = driver.clone();
  }

  public int size() {
    return target.length;
  }

  @Override
  public LocalDate[] targetDates() {
    return targetDates.clone();
  }

  @Override
  public LocalDate[] driverDates() {
    return driverDates.clone();
  }

  @Override
  public double[] target() {
    return target.clone();
  }

  @Override
  public double[] driver() {
    return driver.clone();
  }
}
