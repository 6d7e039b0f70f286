package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.store.ChunkKey;

/**
 * The period means of cells of one spatial tile, gathered time-major from the tile's time chunks:
 * for a band of cells (lanes), {@code out[row * width + lane]}, one row per position of the map's
 * step axis. A chunk is stored (time, row, column), so a step of a band is a few runs of
 * consecutive floats, read in order and written as one contiguous row: no transposition, and the
 * cells of a band stay side by side for the all-lags kernel ({@link MapLagKernel}).
 *
 * <p>A period's value is the mean of the cell's valid native values in it, summed from 0 in time
 * order as {@link TemporalAggregation} sums a mean (so the same to the last bit), NaN without one;
 * a native step without a chunk (none stored, or every value missing) adds nothing. Axis rows that
 * no period occupies (gaps in the cube's time axis) are NaN. Immutable once built; {@link #gather}
 * may run concurrently for different bands.
 */
final class TileBand {
  private final MapPeriods periods;
  private final float[][] chunks;
  /** Per native step (from periods.from()): index into chunks, or -1, and the step's offset in it. */
  private final int[] chunkOf;
  private final int[] base;
  /** Axis row of each period, relative to the first period's. */
  private final int[] rowOf;
  private final int rows;
  private final int y0;
  private final int x0;
  private final int nx;

  /**
   * @param keys the tile's chunks (all of one tile: {@code y0, x0, ny, nx} equal)
   * @param values each key's values, or null for a chunk known to hold no value
   * @param rowOf the axis row of each period, 0 for the first, ascending
   */
  TileBand(MapPeriods periods, ChunkKey[] keys, float[][] values, int[] rowOf) {
    this.periods = periods;
    this.chunks = values;
    this.rowOf = rowOf;
    this.rows = rowOf[rowOf.length - 1] + 1;
    int from = periods.from(), n = periods.to() - from;
    chunkOf = new int[n];
    base = new int[n];
    Arrays.fill(chunkOf, -1);
    for (int c = 0; c < keys.length; c++) {
      ChunkKey k = keys[c];
      int plane = k.ny() * k.nx();
      int t0 = Math.max(from, k.t0()), t1 = Math.min(from + n, k.t0() + k.nt());
      for (int t = t0; t < t1; t++) {
        chunkOf[t - from] = values[c] == null ? -1 : c;
        base[t - from] = (t - k.t0()) * plane;
      }
    }
    y0 = keys[0].y0();
    x0 = keys[0].x0();
    nx = keys[0].nx();
  }

  /** Number of axis rows from the first period to the last. */
  int rows() {
    return rows;
  }

  /** Offset of grid cell (row, column) within this tile's plane. */
  int offset(int row, int column) {
    return (row - y0) * nx + (column - x0);
  }

  /**
   * The period means of {@code count} cells at ascending tile offsets {@code offset[0, count)}
   * into {@code out[r * width + j]} for axis row r and lane j; lanes from count to width are not
   * written. On the way, per lane: the sum of the means in row order into {@code laneSum} and the
   * number of periods without one into {@code laneMissing} (counting NaN only, the rare case, keeps
   * the per-value work to one addition). {@code runStart}, {@code runFirst} and {@code runLen} are
   * scratch of at least count, {@code sum} and {@code valid} of at least width.
   */
  void gather(int[] offset, int count, int width, double[] out, int[] runStart, int[] runFirst, int[] runLen,
      double[] sum, int[] valid, double[] laneSum, int[] laneMissing) {
    Arrays.fill(laneSum, 0, count, 0.0);
    Arrays.fill(laneMissing, 0, count, 0);
    int runs = OffsetRuns.cut(offset, count, runStart, runFirst, runLen);
    if (rows != rowOf.length) {
      Arrays.fill(out, 0, rows * width, Double.NaN); // rows between periods stay missing
    }
    int from = periods.from();
    int size = periods.size();
    boolean single = periods.singleSteps();
    for (int p = 0; p < size; p++) {
      int dst = rowOf[p] * width;
      if (single) {
        int c = chunkOf[p];
        if (c < 0) {
          Arrays.fill(out, dst, dst + count, Double.NaN);
          for (int j = 0; j < count; j++) {
            laneMissing[j]++;
          }
          continue;
        }
        float[] v = chunks[c];
        for (int r = 0; r < runs; r++) {
          int src = base[p] + runStart[r], j0 = runFirst[r];
          for (int i = 0, len = runLen[r]; i < len; i++) {
            double m = 0.0 + v[src + i]; // 0 + v, as a sum from 0 rounds it (-0 -> +0)
            out[dst + j0 + i] = m;
            if (m == m) {
              laneSum[j0 + i] += m;
            } else {
              laneMissing[j0 + i]++;
            }
          }
        }
        continue;
      }
      Arrays.fill(sum, 0, count, 0.0);
      Arrays.fill(valid, 0, count, 0);
      for (int t = periods.firstStep(p) - from, end = periods.endStep(p) - from; t < end; t++) {
        int c = chunkOf[t];
        if (c < 0) {
          continue;
        }
        float[] v = chunks[c];
        for (int r = 0; r < runs; r++) {
          int src = base[t] + runStart[r], j0 = runFirst[r];
          for (int i = 0, len = runLen[r]; i < len; i++) {
            float f = v[src + i];
            if (f == f) { // not NaN
              sum[j0 + i] += f;
              valid[j0 + i]++;
            }
          }
        }
      }
      for (int j = 0; j < count; j++) {
        if (valid[j] == 0) {
          out[dst + j] = Double.NaN;
          laneMissing[j]++;
        } else {
          double m = sum[j] / valid[j];
          out[dst + j] = m;
          laneSum[j] += m;
        }
      }
    }
  }

  /** The period means of the single cell at {@code offset}, one per period (for the reference path). */
  double[] series(int offset) {
    double[] column = new double[rows];
    gather(new int[] {offset}, 1, 1, column, new int[1], new int[1], new int[1], new double[1], new int[1],
        new double[1], new int[1]);
    double[] out = new double[rowOf.length];
    for (int p = 0; p < out.length; p++) {
      out[p] = column[rowOf[p]];
    }
    return out;
  }
}
