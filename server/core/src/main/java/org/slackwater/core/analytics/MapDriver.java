package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.analytics.correlation.AlignedPair;
import org.slackwater.core.analytics.correlation.Alignment;
import org.slackwater.core.analytics.correlation.CentredPrefix;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;

/**
 * The driver of a correlation map, prepared once for every cell and every lag. Every cell series
 * has the same dates (the {@link MapPeriods}), so {@link Alignment#align} would build the same step
 * axis for each of them; this holds that axis (where each period of the cells falls on it) and
 * what {@link org.slackwater.core.analytics.correlation.LagCorrelator} derives from the driver
 * alone: its first and last value, its values centred on their mean and their {@link
 * CentredPrefix} sums (the same class and order LagCorrelator uses), plus the centred values
 * zero-padded for the all-lags cross product of {@link MapLagKernel}.
 *
 * <p>Fails with a {@link CorrelationInputException} where the driver alone makes every cell fail:
 * {@code STEP_MISMATCH} (driver at another step), {@code EMPTY_SERIES} (no value), {@code
 * LAG_RANGE_TOO_LONG} (some |lag| reaches beyond the driver's span of values), and Alignment's
 * axis guard. Immutable once prepared; read concurrently by all workers.
 */
final class MapDriver {
  private final CorrelationSettings settings;
  private final int[] axisIndex;
  private final double[] raw;
  private final double[] centred;
  private final int first;
  private final int last;
  private final boolean gapFree;
  private final CentredPrefix prefix = new CentredPrefix();
  private final int pad;
  private final double[] padded;

  private MapDriver(CorrelationSettings settings, int[] axisIndex, double[] raw, int first, int last) {
    this.settings = settings;
    this.axisIndex = axisIndex;
    this.raw = raw;
    this.first = first;
    this.last = last;
    int len = raw.length;
    centred = new double[len];
    CentredPrefix.centre(raw, centred, len);
    prefix.fill(centred, len);
    gapFree = prefix.complete(first, last + 1);
    // Lag L pairs axis position i with i - L: padded[i - L + pad] for every lag, and for up to
    // three lags beyond the last, so the kernel can run four lags at a time without a remainder.
    pad = Math.max(0, settings.maxLag() + 3 * settings.lagStep());
    padded = new double[len + pad + Math.max(0, -settings.minLag())];
    for (int i = 0; i < len; i++) {
      double v = centred[i];
      padded[i + pad] = v == v ? v : 0;
    }
  }

  /**
   * @param periods the cells' periods; their step is the map's step
   * @param step the map's step
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
      String lags = settings.lagCount() == 1 ? "lag " + settings.minLag() + " reaches "
          : "lags " + settings.minLag() + " to " + settings.maxLag() + " reach ";
      throw new CorrelationInputException(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG,
          "lag range too long for the driver: " + lags + reach + " " + noun(step)
              + "s, but the driver has values over only " + span + " " + noun(step) + "s (" + pair.dateAt(first)
              + " to " + pair.dateAt(last) + "); keep every |lag| below " + span);
    }
    return new MapDriver(settings, axisIndex, raw, first, last);
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

  CorrelationSettings settings() {
    return settings;
  }

  /** Length of the shared axis. */
  int length() {
    return raw.length;
  }

  /** Axis position of the cells' period p. */
  int axisIndex(int p) {
    return axisIndex[p];
  }

  /** Number of the cells' periods. */
  int periods() {
    return axisIndex.length;
  }

  /** Each period's axis position relative to the first period's (a fresh array). */
  int[] periodRows() {
    int[] rows = new int[axisIndex.length];
    for (int p = 0; p < rows.length; p++) {
      rows[p] = axisIndex[p] - axisIndex[0];
    }
    return rows;
  }

  int first() {
    return first;
  }

  int last() {
    return last;
  }

  /** Whether no value is missing between the first and the last. */
  boolean gapFree() {
    return gapFree;
  }

  /** The driver on the axis, NaN where missing; shared, never modify. */
  double[] raw() {
    return raw;
  }

  /** Centred value at axis position j, 0 where missing or outside the axis. */
  double centredOrZero(int j) {
    return padded[j + pad];
  }

  /** Prefix sums of the centred values. */
  CentredPrefix prefix() {
    return prefix;
  }

  /**
   * The centred values with 0 for missing, at {@code padded()[i + padding()]} for axis position i;
   * readable for every i - L with i on the axis and L from minLag to maxLag + 3 lag steps.
   * Shared, never modify.
   */
  double[] padded() {
    return padded;
  }

  int padding() {
    return pad;
  }

  /** An axis-length array of NaN, for laying one cell onto the axis. */
  double[] blankAxis() {
    double[] a = new double[raw.length];
    Arrays.fill(a, Double.NaN);
    return a;
  }
}
