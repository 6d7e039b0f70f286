package org.slackwater.core.analytics;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;

/**
 * Area statistics per time step over the valid cells of a region (see {@link SpatialStatistic}).
 * A step whose valid area is below {@code minCoverage} of the region's area within the cube's
 * {@link org.slackwater.core.cube.Footprint} (cells that ever hold a value: water, for a water
 * variable) is missing (NaN), so a mean over a few cloud-free cells is never passed off as the
 * region's.
 *
 * <p>Reads only the chunks that hold the region's cells and the requested steps, through the
 * {@link ChunkCache}. Each chunk is one task ({@link WorkSharing}: the caller and the common
 * fork-join pool's workers take chunks until none is left) that sums its own steps; the chunks'
 * sums are then added in time and catalog order, so results do not depend on the threads. Each
 * tile's cells are laid out once per call ({@link TileCells}: runs of consecutive columns with
 * their areas), and {@link StepSums} adds up four steps per pass over them, so the loop reads
 * memory contiguously and keeps four independent sums in registers. Results equal a plain per-step
 * loop's to rounding (the valid area is summed in another order; see {@link StepSums}).
 */
public final class AreaStatistics {

  private AreaStatistics() {}

  /**
   * @param from first step index (inclusive)
   * @param to last step index (exclusive)
   * @param minCoverage 0..1
   */
  public static DailySeries compute(ChunkSource cache, CubeEntry cube, CellWeights weights, SpatialStatistic stat,
      int from, int to, double minCoverage) throws IOException {
    int n = Math.max(0, to - from);
    double regionArea = 0;
    for (int i = 0; i < weights.size(); i++) {
      if (cube.footprint().contains(weights.index(i))) {
        regionArea += weights.area(i);
      }
    }
    boolean gather = stat.kind() == SpatialStatistic.Kind.PERCENTILE;
    boolean extremes = stat.kind() == SpatialStatistic.Kind.MIN || stat.kind() == SpatialStatistic.Kind.MAX;
    Accumulators acc = new Accumulators(n, gather ? weights.size() : 0);
    Map<Long, int[]> byTile = cellsByTile(cube, weights);

    // One task per chunk, in time order and within a time in the catalog's order.
    TreeMap<Integer, List<ChunkRecord>> byTime = new TreeMap<>();
    Map<Long, TileCells> tiles = new HashMap<>();
    for (ChunkRecord chunk : cube.chunks()) {
      ChunkKey k = chunk.key();
      long tile = tileId(k.y0(), k.x0());
      int[] members = byTile.get(tile);
      if (Math.max(from, k.t0()) < Math.min(to, k.t0() + k.nt()) && members != null) {
        byTime.computeIfAbsent(k.t0(), t -> new ArrayList<>()).add(chunk);
        tiles.computeIfAbsent(tile, id -> TileCells.of(members, weights, k));
      }
    }
    List<ChunkRecord> work = new ArrayList<>();
    byTime.values().forEach(work::addAll);
    ChunkTotals[] parts = new ChunkTotals[work.size()];
    WorkSharing.run(work.size(), i -> {
      ChunkRecord chunk = work.get(i);
      ChunkKey k = chunk.key();
      parts[i] = ChunkTotals.of(cache.get(cube, chunk), k, tiles.get(tileId(k.y0(), k.x0())), from, to, extremes || gather,
          gather ? acc.gathered : null);
    });
    // Added up in task order, so the sums do not depend on which thread ran which chunk.
    for (ChunkTotals p : parts) {
      p.addTo(acc, from);
    }

    double[] value = new double[n], frac = new double[n];
    long[] times = cube.descriptor().time().epochSeconds();
    for (int s = 0; s < n; s++) {
      frac[s] = regionArea > 0 ? acc.sumW[s] / regionArea : 0;
      if (acc.count[s] == 0 || frac[s] + 1e-12 < minCoverage) {
        value[s] = Double.NaN;
        continue;
      }
      value[s] = switch (stat.kind()) {
        case MEAN -> acc.sumWV[s] / acc.sumW[s];
        case SUM -> acc.sumWV[s];
        case MIN -> acc.min[s];
        case MAX -> acc.max[s];
        case PERCENTILE -> weightedPercentile(acc.gathered[s], weights, stat.percentile());
      };
    }
    return new DailySeries(Arrays.copyOfRange(times, from, from + n), value, frac, acc.count);
  }

  /** Per-step sums; each step is written by exactly one task. */
  private static final class Accumulators {
    final double[] sumW, sumWV, min, max;
    final int[] count;
    final float[][] gathered;

    Accumulators(int n, int gatherCells) {
      sumW = new double[n];
      sumWV = new double[n];
      min = new double[n];
      max = new double[n];
      count = new int[n];
      Arrays.fill(min, Double.POSITIVE_INFINITY);
      Arrays.fill(max, Double.NEGATIVE_INFINITY);
      gathered = gatherCells > 0 ? new float[n][] : null;
      if (gathered != null) {
        for (int s = 0; s < n; s++) {
          gathered[s] = new float[gatherCells];
          Arrays.fill(gathered[s], Float.NaN);
        }
      }
    }
  }

  /** One chunk's per-step sums over its tile's cells (and extremes, if asked), steps t0 to t1. */
  private static final class ChunkTotals {
    final int t0;
    final double[] sumW, sumWV, min, max;
    final int[] count;

    private ChunkTotals(int t0, int steps, boolean extremes) {
      this.t0 = t0;
      sumW = new double[steps];
      sumWV = new double[steps];
      count = new int[steps];
      min = extremes ? new double[steps] : null;
      max = extremes ? new double[steps] : null;
    }

    /** {@code gathered}, if given, receives each valid value at [step - from][weights index]. */
    static ChunkTotals of(float[] v, ChunkKey k, TileCells cells, int from, int to, boolean extremes, float[][] gathered) {
      int t0 = Math.max(from, k.t0()), t1 = Math.min(to, k.t0() + k.nt());
      ChunkTotals p = new ChunkTotals(t0, t1 - t0, extremes);
      StepSums.add(v, k.t0(), t0, t1, t0, cells, p.sumW, p.sumWV, p.count);
      if (!extremes) {
        return p;
      }
      int[] offset = cells.offset, members = cells.members;
      for (int t = t0; t < t1; t++) {
        int base = (t - k.t0()) * cells.plane;
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        float[] into = gathered != null ? gathered[t - from] : null;
        for (int j = 0; j < offset.length; j++) {
          float f = v[base + offset[j]];
          if (f == f) {
            if (f < lo) lo = f;
            if (f > hi) hi = f;
            if (into != null) {
              into[members[j]] = f; // each cell lies in one tile: no other task writes it
            }
          }
        }
        p.min[t - t0] = lo;
        p.max[t - t0] = hi;
      }
      return p;
    }

    void addTo(Accumulators acc, int from) {
      for (int j = 0; j < count.length; j++) {
        int s = t0 - from + j;
        acc.sumW[s] += sumW[j];
        acc.sumWV[s] += sumWV[j];
        acc.count[s] += count[j];
        if (min != null) {
          acc.min[s] = Math.min(acc.min[s], min[j]);
          acc.max[s] = Math.max(acc.max[s], max[j]);
        }
      }
    }
  }

  /** Smallest value whose cumulative valid area reaches p % of the valid area. */
  static double weightedPercentile(float[] values, CellWeights weights, double p) {
    int n = 0;
    double total = 0;
    double[][] pairs = new double[values.length][];
    for (int i = 0; i < values.length; i++) {
      if (!Float.isNaN(values[i])) {
        pairs[n++] = new double[] {values[i], weights.area(i)};
        total += weights.area(i);
      }
    }
    Arrays.sort(pairs, 0, n, (a, b) -> Double.compare(a[0], b[0]));
    double target = p / 100.0 * total, cum = 0;
    for (int i = 0; i < n; i++) {
      cum += pairs[i][1];
      if (cum >= target * (1 - 1e-12)) {
        return pairs[i][0];
      }
    }
    return pairs[n - 1][0];
  }

  /** The region's cells that are in the cube's footprint, grouped by tile, each group in row-major order. */
  private static Map<Long, int[]> cellsByTile(CubeEntry cube, CellWeights weights) {
    int rows = cube.layout().rows(), cols = cube.layout().columns();
    int across = cube.layout().chunksAlong(cube.descriptor().grid().nx(), cols);
    int tiles = across * cube.layout().chunksAlong(cube.descriptor().grid().ny(), rows);
    int[] tileOf = new int[weights.size()], count = new int[tiles];
    for (int i = 0; i < weights.size(); i++) {
      if (cube.footprint().contains(weights.index(i))) {
        tileOf[i] = weights.row(i) / rows * across + weights.column(i) / cols;
        count[tileOf[i]]++;
      } else {
        tileOf[i] = -1;
      }
    }
    int[][] members = new int[tiles][];
    for (int k = 0; k < tiles; k++) {
      members[k] = count[k] > 0 ? new int[count[k]] : null;
      count[k] = 0;
    }
    for (int i = 0; i < weights.size(); i++) {
      if (tileOf[i] >= 0) {
        members[tileOf[i]][count[tileOf[i]]++] = i;
      }
    }
    Map<Long, int[]> out = new HashMap<>();
    for (int k = 0; k < tiles; k++) {
      if (members[k] != null) {
        out.put(tileId(k / across * rows, k % across * cols), members[k]);
      }
    }
    return out;
  }

  private static long tileId(int y0, int x0) {
    return ((long) y0 << 32) | x0;
  }
}
