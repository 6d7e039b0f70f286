package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.analytics.correlation.AlignedPair;
import org.slackwater.core.analytics.correlation.Alignment;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;

/**
 * The driver of a correlation map, prepared once for every cell. Every cell series has the same
 * dates (the {@link MapPeriods}), so {@link Alignment#align} would build the same step axis for
 * each of them; this holds that axis (where each period of the cells falls on it) and everything
 * {@link org.slackwater.core.analytics.correlation.LagCorrelator} derives from the driver alone:
 * its first and last value, its values centred on their mean, and the prefix sums and missing
 * counts its gap-free fast path reads. The formulas are LagCorrelator's, term for term, so that
 * {@link MapLagKernel} reproduces its results.
 *
 * <p>Fails with a {@link CorrelationInputException} where the driver alone makes every cell fail:
 * {@code STEP_MISMATCH} (driver at another step), {@code EMPTY_SERIES} (no value), {@code
 * LAG_RANGE_TOO_LONG} (the lag reaches beyond the driver's span of values), and Alignment's axis
 * guard. Immutable; read concurrently by all workers.
 */
final class MapDriver {
  private final int lag;
  private final int[] axisIndex;
  private final double[] raw;
  private final double[] centred;
  private final int first;
  private final int last;
  // Prefix sums over the centred values (NaN counted as 0); index i covers positions [0, i).
  private final double[] sum;
  private final double[] squares;
  private final double[] lagged;
  private final int[] missing;

  private MapDriver(int lag, int[] axisIndex, double[] raw, int first, int last) {
    this.lag = lag;
    this.axisIndex = axisIndex;
    this.raw = raw;
    this.first = first;
    this.last = last;
    int len = raw.length;
    centred = new double[len];
    double s = 0;
    int n = 0;
    for (double v : raw) {
      if (v == v) {
        s += v;
        n++;
      }
    }
    double mean = s / n;
    for (int i = 0; i < len; i++) {
      centred[i] = raw[i] - mean;
    }
    sum = new double[len + 1];
    squares = new double[len + 1];
    lagged = new double[len + 1];
    missing = new int[len + 1];
    for (int i = 0; i < len; i++) {
      double x = centred[i];
      boolean absent = Double.isNaN(x);
      double x0 = absent ? 0 : x;
      double next = i + 1 < len && !Double.isNaN(centred[i + 1]) ? centred[i + 1] : 0;
      sum[i + 1] = sum[i] + x0;
      squares[i + 1] = squares[i] + x0 * x0;
      lagged[i + 1] = lagged[i] + x0 * next;
      missing[i + 1] = missing[i] + (absent ? 1 : 0);
    }
  }

  /**
   * @param periods the cells' periods; their step is the map's step
   * @param step the map's step
   * @param settings a single lag
   */
  static MapDriver prepare(MapPeriods periods, TemporalStep step, DatedSeries driver, CorrelationSettings settings) {
    if (driver.step() != step) {
      throw new CorrelationInputException(CorrelationInputException.Kind.STEP_MISMATCH,
          "the map is computed by " + noun(step) + " but the driver series is by " + noun(driver.step())
              + "; aggregate the driver to " + noun(step) + "s as well");
    }
    boolean any = false;
    for (int i = 0; i < driver.size() && !any; i++) {
      any = !Double.isNaN(driver.value(i));
    }
    if (!any) {
      throw new CorrelationInputException(CorrelationInputException.Kind.EMPTY_SERIES,
          "the driver has no values (every value is missing); choose a driver series with data in the period");
    }
    // Aligning the period numbers themselves tells where each period lands on the shared axis.
    double[] numbers = new double[periods.size()];
    for (int p = 0; p < numbers.length; p++) {
      numbers[p] = p;
    }
    AlignedPair pair = Alignment.align(new DatedSeries(step, periods.dates(), numbers), driver);
    double[] where = pair.target();
    int[] axisIndex = new int[numbers.length];
    for (int i = 0; i < where.length; i++) {
      if (!Double.isNaN(where[i])) {
        axisIndex[(int) where[i]] = i;
      }
    }
    double[] raw = pair.driver();
    int first = 0;
    while (Double.isNaN(raw[first])) {
      first++;
    }
    int last = raw.length - 1;
    while (Double.isNaN(raw[last])) {
      last--;
    }
    int span = last - first + 1;
    int reach = settings.maxAbsLag();
    if (reach >= span) {
      throw new CorrelationInputException(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG,
          "lag range too long for the driver: lag " + settings.minLag() + " reaches " + reach + " " + noun(step)
              + "s, but the driver has values over only " + span + " " + noun(step) + "s (" + pair.dateAt(first)
              + " to " + pair.dateAt(last) + "); keep |lag| below " + span);
    }
    return new MapDriver(settings.minLag(), axisIndex, raw, first, last);
  }

  private static String noun(TemporalStep step) {
    return switch (step) {
      case DAY -> "day";
      case WEEK -> "week";
      case MONTH -> "month";
      case SEASON -> "season";
      case YEAR -> "year";
      case WATER_YEAR -> "water year";
    };
  }

  int lag() {
    return lag;
  }

  /** Length of the shared axis. */
  int length() {
    return raw.length;
  }

  /**
   * The axis position of the first period if the periods occupy consecutive positions (no gap in
   * the cube's time axis at this step), else -1.
   */
  int contiguousBase() {
    for (int p = 1; p < axisIndex.length; p++) {
      if (axisIndex[p] != axisIndex[0] + p) {
        return -1;
      }
    }
    return axisIndex[0];
  }

  /** Axis position of the cells' period p. */
  int axisIndex(int p) {
    return axisIndex[p];
  }

  int first() {
    return first;
  }

  int last() {
    return last;
  }

  /** The driver on the axis, NaN where missing; shared, never modify. */
  double[] raw() {
    return raw;
  }

  /** The driver centred on its mean; shared, never modify. */
  double[] centred() {
    return centred;
  }

  boolean complete(int from, int to) {
    return missing[to] == missing[from];
  }

  double sum(int from, int to) {
    return sum[to] - sum[from];
  }

  double squares(int from, int to) {
    return squares[to] - squares[from];
  }

  /** Sum of x_i x_{i+1} for i in [from, to - 1). */
  double lagged(int from, int to) {
    return lagged[to - 1] - lagged[from];
  }

  /** An axis-length array of NaN, for a worker to fill with one cell after another. */
  double[] blankAxis() {
    double[] a = new double[raw.length];
    Arrays.fill(a, Double.NaN);
    return a;
  }
}
