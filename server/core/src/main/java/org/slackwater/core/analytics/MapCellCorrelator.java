package org.slackwater.core.analytics;

import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagCorrelator;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.LaggedCorrelation;

/**
 * One worker's correlation of cell series (values per {@link MapPeriods} period) with the map's
 * driver, giving the {@link LagRow} that {@code LaggedCorrelation.compute} would give for the
 * cell's {@link DatedSeries} (deseasonalized with the map's {@link Deseasonalize}, if any):
 *
 * <ul>
 *   <li>Pearson: {@link MapLagKernel} on the shared {@link MapDriver};
 *   <li>Spearman: this worker's {@link LagCorrelator} on the same axis arrays LaggedCorrelation
 *       would build (ranks need sorting per cell anyway, O(n log n));
 *   <li>anything those leave undecided (an invalid row, an uncorrected p-value, a cell series that
 *       cannot be correlated): LaggedCorrelation itself, so the note is its note. A failure of the
 *       cell's series ({@link CorrelationInputException}: no value, values over fewer steps than
 *       the lag, no overlap with the driver, no value in the deseasonalizing baseline) becomes an
 *       invalid row with n = 0 and the exception's message as its note.
 * </ul>
 *
 * Holds a reusable axis array and is therefore not thread-safe: one per worker.
 */
final class MapCellCorrelator {
  private final MapPeriods periods;
  private final TemporalStep step;
  private final DatedSeries driverSeries;
  private final MapDriver driver;
  private final CorrelationSettings settings;
  private final Deseasonalize deseasonalize;
  private final Deseasonalize.Prepared prepared;
  private final LagCorrelator ranks;
  private final double[] axis;
  /** The axis position of the first period when the periods lie consecutively on the axis, else -1. */
  private final int base;
  /** One cell's period means. */
  private final double[] series;
  private LagRow empty;

  /**
   * @param prepared {@code deseasonalize} prepared for the periods' dates, or null with it
   */
  MapCellCorrelator(MapPeriods periods, TemporalStep step, DatedSeries driverSeries, MapDriver driver,
      CorrelationSettings settings, Deseasonalize deseasonalize, Deseasonalize.Prepared prepared) {
    this.periods = periods;
    this.step = step;
    this.driverSeries = driverSeries;
    this.driver = driver;
    this.settings = settings;
    this.deseasonalize = deseasonalize;
    this.prepared = prepared;
    this.ranks = settings.method() == CorrelationMethod.SPEARMAN ? new LagCorrelator(settings) : null;
    this.axis = driver.blankAxis();
    this.base = driver.contiguousBase();
    this.series = new double[periods.size()];
  }

  /**
   * The row of a cell whose native values are {@code values[start + t - periods.from()]} (NaN =
   * missing); read, not kept.
   */
  LagRow correlate(float[] values, int start) {
    if (prepared == null && base >= 0) {
      // The common case: the period means go straight onto their consecutive axis positions.
      periods.means(values, start, axis, base);
      return onAxis(null);
    }
    periods.means(values, start, series, 0);
    return correlate(series);
  }

  /** The row of a cell whose period means are {@code values} (NaN = missing); read, not kept. */
  LagRow correlate(double[] values) {
    double[] v = values;
    if (prepared != null) {
      if (allMissing(values)) {
        return empty(); // the baseline would hold no value of it, the same refusal for every such cell
      }
      try {
        v = prepared.apply(values);
      } catch (CorrelationInputException e) {
        return reference(values);
      }
    }
    // Positions between periods (gaps in the cube's time axis) stay NaN from blankAxis().
    for (int p = 0; p < v.length; p++) {
      axis[driver.axisIndex(p)] = v[p];
    }
    return onAxis(values);
  }

  /**
   * The row of the cell now on the axis; {@code raw} is its series before deseasonalizing, or null
   * when the axis holds it unchanged.
   */
  private LagRow onAxis(double[] raw) {
    // What the kernel needs of the target, summed in axis order as LagCorrelator sums it.
    int first = -1, last = -1, count = 0;
    double total = 0;
    for (int i = driver.axisIndex(0), end = driver.axisIndex(series.length - 1); i <= end; i++) {
      double x = axis[i];
      if (x == x) {
        if (first < 0) {
          first = i;
        }
        last = i;
        total += x;
        count++;
      }
    }
    if (count == 0 && prepared == null) {
      return empty();
    }
    LagRow row = ranks == null ? MapLagKernel.pearson(axis, first, last, count, total, driver, settings) : ranked();
    if (row != null) {
      return row;
    }
    if (raw == null) {
      System.arraycopy(axis, base, series, 0, series.length);
      raw = series;
    }
    return reference(raw);
  }

  private static boolean allMissing(double[] values) {
    for (double x : values) {
      if (x == x) {
        return false;
      }
    }
    return true;
  }

  /** The row of every cell without a single value, from the reference once per worker. */
  LagRow empty() {
    if (empty == null) {
      double[] none = new double[periods.size()];
      java.util.Arrays.fill(none, Double.NaN);
      empty = reference(none);
    }
    return empty;
  }

  private LagRow ranked() {
    try {
      // Its rows, valid or not, are LaggedCorrelation's: only exception messages name dates.
      return ranks.compute(axis, driver.raw()).rows().get(0);
    } catch (CorrelationInputException e) {
      return null;
    }
  }

  /** LaggedCorrelation on the cell's own series: the definition the map reproduces. */
  LagRow reference(double[] values) {
    try {
      DatedSeries cell = new DatedSeries(step, periods.dates(), values);
      if (deseasonalize != null) {
        cell = deseasonalize.apply(cell);
      }
      return LaggedCorrelation.compute(cell, driverSeries, settings).rows().get(0);
    } catch (CorrelationInputException e) {
      int lag = settings.minLag();
      return new LagRow(lag, 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, false,
          e.getMessage());
    }
  }
}
