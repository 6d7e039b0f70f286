package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import java.util.Arrays;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Pairs a target with a driver by date at a lag.
 *
 * <p><b>Lag convention.</b> Lag k, in steps of the series' own {@link TemporalStep}, pairs the
 * driver's value for the period k steps <em>before</em> d with the target's value for period d:
 * {@code (driver(d - k), target(d))}. A <b>positive lag means the driver leads</b> the target (the
 * driver's past explains the target's present); a negative lag means the target leads. Steps are
 * calendar steps: for a daily series a step is a day, for weekly an ISO week, for monthly a
 * calendar month; a caller who speaks of "3 months" on a weekly series converts first.
 *
 * <p>Pairing is by date equality of period starts. Series from model calendars were placed on real
 * dates by their source ({@code TimeAxis.Alignment}), so no calendar arithmetic happens here
 * beyond counting steps. Only complete pairs count (pairwise-complete): a pair with NaN on either
 * side, or whose date one series lacks, is dropped.
 *
 * <p>Fails with {@code STEP_MISMATCH} if the series are at different steps, {@code BAD_SETTING}
 * if the two series together span more than {@value #MAX_AXIS_STEPS} steps.
 */
public final class Alignment {
  /** Guard against building a huge axis for two series dated centuries apart. */
  public static final int MAX_AXIS_STEPS = 50_000_000;

  private Alignment() {}

  /**
   * Both series on one axis from the earlier first date to the later last date. Cost O(T + D +
   * axis length); the axis is built once and then serves every lag.
   */
  public static AlignedPair align(DatedSeries target, DatedSeries driver) {
    TemporalStep step = target.step();
    if (driver.step() != step) {
      throw new CorrelationInputException(CorrelationInputException.Kind.STEP_MISMATCH,
          "the target is a " + StepOrdinal.adjective(step) + " series but the driver is "
              + StepOrdinal.adjective(driver.step()) + "; aggregate both to the same step before correlating");
    }
    if (target.size() == 0 || driver.size() == 0) {
      throw new CorrelationInputException(CorrelationInputException.Kind.EMPTY_SERIES,
          "the " + (target.size() == 0 ? "target" : "driver") + " series has no dates");
    }
    long first = Math.min(StepOrdinal.of(step, target.date(0)), StepOrdinal.of(step, driver.date(0)));
    long last = Math.max(StepOrdinal.of(step, target.date(target.size() - 1)),
        StepOrdinal.of(step, driver.date(driver.size() - 1)));
    long length = last - first + 1;
    if (length > MAX_AXIS_STEPS) {
      throw new CorrelationInputException(CorrelationInputException.Kind.BAD_SETTING,
          "the series together span " + length + " " + StepOrdinal.noun(step) + "s (" + StepOrdinal.date(step, first)
              + " to " + StepOrdinal.date(step, last) + "), more than " + MAX_AXIS_STEPS
              + "; restrict the dates or aggregate to a longer step");
    }
    return new AlignedPair(step, first, dense(target, first, (int) length), dense(driver, first, (int) length));
  }

  /** The complete pairs at {@code lag} (see the class comment for the convention). */
  public static LaggedPairs pairsAt(DatedSeries target, DatedSeries driver, int lag) {
    AlignedPair axis = align(target, driver);
    int len = axis.length();
    int lo = Math.max(0, lag);
    int hi = (int) Math.min(len, (long) len + lag);
    int n = 0;
    for (int i = lo; i < hi; i++) {
      if (complete(axis.target[i], axis.driver[i - lag])) {
        n++;
      }
    }
    LocalDate[] targetDates = new LocalDate[n];
    LocalDate[] driverDates = new LocalDate[n];
    double[] t = new double[n];
    double[] d = new double[n];
    int q = 0;
    for (int i = lo; i < hi; i++) {
      if (complete(axis.target[i], axis.driver[i - lag])) {
        targetDates[q] = axis.dateAt(i);
        driverDates[q] = axis.dateAt(i - lag);
        t[q] = axis.target[i];
        d[q] = axis.driver[i - lag];
        q++;
      }
    }
    return new LaggedPairs(lag, targetDates, driverDates, t, d);
  }

  private static boolean complete(double a, double b) {
    return !Double.isNaN(a) && !Double.isNaN(b);
  }

  private static double[] dense(DatedSeries s, long first, int length) {
    double[] out = new double[length];
    Arrays.fill(out, Double.NaN);
    for (int i = 0; i < s.size(); i++) {
      out[(int) (StepOrdinal.of(s.step(), s.date(i)) - first)] = s.value(i);
    }
    return out;
  }
}
