package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagCorrelator;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.LagStatistics;
import org.slackwater.core.analytics.correlation.LaggedCorrelation;

/**
 * One worker's correlation of a band of cells with the map's driver at every lag, giving for each
 * cell the {@link CellCorrelation} that {@code LaggedCorrelation.compute} on the cell's own {@link
 * DatedSeries} (deseasonalized with the map's {@link Deseasonalize}, if any) leads to:
 *
 * <ul>
 *   <li>Pearson with a driver without gaps: {@link MapLagKernel} on the whole band, all lags in one
 *       pass; only the reported lag gets a full row ({@link LagStatistics});
 *   <li>Spearman (ranks are taken afresh over each lag's pairs, which no prefix sum can share) and
 *       drivers with gaps: this worker's {@link LagCorrelator} on the cell laid onto the axis,
 *       every lag, the exact and slower path;
 *   <li>cells whose series cannot be correlated (no value, values over too few steps for the
 *       lags, no overlap with the driver at any lag, no value in the deseasonalizing baseline):
 *       LaggedCorrelation itself on the cell's series gathered again, so the refusal's words and
 *       dates are its own; the cell gets an invalid row with n = 0 and that message as the note.
 * </ul>
 *
 * Holds the kernel and reusable arrays and is therefore not thread-safe: one per worker.
 */
final class MapCellCorrelator {
  private final MapPeriods periods;
  private final TemporalStep step;
  private final DatedSeries driverSeries;
  private final MapDriver driver;
  private final CorrelationSettings settings;
  private final Deseasonalize deseasonalize;
  private final Deseasonalize.Prepared prepared;
  private final MapLagKernel kernel;
  /** Axis row of each period relative to the first period's. */
  private final int[] rowOf;
  private final int start;
  private final boolean sharedPass;
  private final LagCorrelator exact;
  private final double[] axis;
  private final double[] series;
  private final BestLag[] picks;
  private final boolean[] fast;
  private final CellCorrelation[] done;
  private final int[] runStart;
  private final int[] runFirst;
  private final int[] runLen;
  private final double[] sum;
  private final int[] valid;
  private final double[] laneSum;
  private final int[] laneMissing;
  private CellCorrelation empty;

  /**
   * @param width lanes of the kernel, a multiple of 4: the most cells of one band
   * @param prepared {@code deseasonalize} prepared for the periods' dates, or null with it
   */
  MapCellCorrelator(MapPeriods periods, TemporalStep step, DatedSeries driverSeries, MapDriver driver, int width,
      Deseasonalize deseasonalize, Deseasonalize.Prepared prepared) {
    this.periods = periods;
    this.step = step;
    this.driverSeries = driverSeries;
    this.driver = driver;
    this.settings = driver.settings();
    this.deseasonalize = deseasonalize;
    this.prepared = prepared;
    this.start = driver.axisIndex(0);
    this.rowOf = driver.periodRows();
    int rows = rowOf[rowOf.length - 1] + 1;
    this.kernel = new MapLagKernel(driver, width, rows, start);
    this.sharedPass = settings.method() == CorrelationMethod.PEARSON && driver.gapFree();
    this.exact = sharedPass ? null : new LagCorrelator(settings);
    this.axis = sharedPass ? null : driver.blankAxis();
    this.series = new double[periods.size()];
    this.picks = new BestLag[width];
    for (int j = 0; j < width; j++) {
      picks[j] = new BestLag();
    }
    this.fast = new boolean[width];
    this.done = new CellCorrelation[width];
    this.runStart = new int[width];
    this.runFirst = new int[width];
    this.runLen = new int[width];
    this.sum = new double[width];
    this.valid = new int[width];
    this.laneSum = new double[width];
    this.laneMissing = new int[width];
  }

  int width() {
    return kernel.width();
  }

  /**
   * The entries of {@code count} (at most {@link #width()}) cells at ascending tile offsets
   * {@code offset[0, count)} into {@code out[0, count)}.
   */
  void correlate(TileBand tile, int[] offset, int count, CellCorrelation[] out) {
    kernel.begin(count);
    tile.gather(offset, count, kernel.stride(), kernel.values(), runStart, runFirst, runLen, sum, valid, laneSum,
        laneMissing);
    Arrays.fill(done, null);
    if (prepared != null) {
      for (int j = 0; j < count; j++) {
        done[j] = deseasonalizeLane(tile, offset[j], j);
      }
      kernel.scan(count); // the anomalies' own count, mean, first and last
    } else {
      kernel.scanned(count, periods.size(), laneSum, laneMissing);
    }
    Arrays.fill(fast, false);
    boolean anyFast = false;
    int spanD = driver.last() - driver.first() + 1;
    for (int j = 0; j < count; j++) {
      if (done[j] != null) {
        continue;
      }
      if (kernel.count(j) == 0) {
        // Without deseasonalizing this is the shared empty entry; deseasonalized, the cell had
        // values that became NaN (their classes lack baseline values), LaggedCorrelation's case.
        done[j] = prepared == null ? empty() : reference(tile.series(offset[j]));
      } else if (settings.maxAbsLag() >= Math.min(kernel.span(j), spanD)) {
        done[j] = reference(tile.series(offset[j]));
      } else if (!sharedPass) {
        done[j] = exactLane(tile, offset[j], j);
      } else {
        fast[j] = true;
        anyFast = true;
      }
    }
    if (anyFast) {
      kernel.prepare(fast);
      int[] lags = settings.lags();
      for (int j = 0; j < count; j++) {
        picks[j].reset();
      }
      kernel.correlate((j, l, r, n, cross) -> picks[j].offer(l, lags[l], r, n, cross));
      for (int j = 0; j < count; j++) {
        if (!fast[j]) {
          continue;
        }
        BestLag pick = picks[j];
        if (pick.pairs() == 0) {
          done[j] = reference(tile.series(offset[j])); // no pair at any lag: LaggedCorrelation's refusal
          continue;
        }
        int l = pick.chosen();
        LagRow row = LagStatistics.row(lags[l], kernel.sums(j, l, pick.chosenCross()), settings);
        done[j] = CellCorrelation.of(row, lags.length, pick.validLags(), settings.alpha());
      }
    }
    System.arraycopy(done, 0, out, 0, count);
  }

  /** Deseasonalizes lane j in place; returns its entry where that already decides it, else null. */
  private CellCorrelation deseasonalizeLane(TileBand tile, int offset, int j) {
    boolean any = false;
    for (int p = 0; p < series.length; p++) {
      series[p] = kernel.value(rowOf[p], j);
      any |= series[p] == series[p];
    }
    if (!any) {
      return empty(); // the baseline would hold no value of it, the same refusal for every such cell
    }
    double[] anomalies;
    try {
      anomalies = prepared.apply(series);
    } catch (CorrelationInputException e) {
      return reference(tile.series(offset));
    }
    for (int p = 0; p < anomalies.length; p++) {
      kernel.set(rowOf[p], j, anomalies[p]);
    }
    return null;
  }

  /** Every lag by LagCorrelator on lane j laid onto the axis (Spearman, or a driver with gaps). */
  private CellCorrelation exactLane(TileBand tile, int offset, int j) {
    int rows = rowOf[rowOf.length - 1] + 1;
    for (int r = 0; r < rows; r++) {
      axis[start + r] = kernel.value(r, j);
    }
    try {
      return CellCorrelation.of(exact.compute(axis, driver.raw()));
    } catch (CorrelationInputException e) {
      return reference(tile.series(offset)); // the same refusal, with dates instead of axis positions
    } finally {
      Arrays.fill(axis, start, start + rows, Double.NaN);
    }
  }

  /** The entry of every cell without a single value, from the reference once per worker. */
  CellCorrelation empty() {
    if (empty == null) {
      double[] none = new double[periods.size()];
      Arrays.fill(none, Double.NaN);
      empty = reference(none);
    }
    return empty;
  }

  /** LaggedCorrelation on the cell's own series (its period means): the definition the map reproduces. */
  CellCorrelation reference(double[] values) {
    try {
      DatedSeries cell = new DatedSeries(step, periods.dates(), values);
      if (deseasonalize != null) {
        cell = deseasonalize.apply(cell);
      }
      return CellCorrelation.of(LaggedCorrelation.compute(cell, driverSeries, settings));
    } catch (CorrelationInputException e) {
      return CellCorrelation.refused(new LagRow(settings.minLag(), 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
          Double.NaN, Double.NaN, false, e.getMessage()), settings.lagCount());
    }
  }
}
