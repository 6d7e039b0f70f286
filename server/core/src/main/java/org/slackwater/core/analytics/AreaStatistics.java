package org.slackwater.core.analytics;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
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
 * {@link ChunkCache}. Time chunks are independent (they fill disjoint steps), so they run in
 * parallel on the common fork-join pool. Within a chunk the region's cells are grouped into runs
 * of consecutive columns, so the per-step loop reads memory contiguously and keeps its
 * accumulators in registers.
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

    // Chunks grouped by their first step: each group writes only its own steps.
    TreeMap<Integer, List<ChunkRecord>> byTime = new TreeMap<>();
    for (ChunkRecord chunk : cube.chunks()) {
      ChunkKey k = chunk.key();
      if (Math.max(from, k.t0()) < Math.min(to, k.t0() + k.nt()) && byTile.containsKey(tileId(k.y0(), k.x0()))) {
        byTime.computeIfAbsent(k.t0(), t -> new ArrayList<>()).add(chunk);
      }
    }
    try {
      byTime.values().parallelStream().forEach(group -> {
        for (ChunkRecord chunk : group) {
          try {
            accumulate(cache.get(cube, chunk), chunk.key(), byTile.get(tileId(chunk.key().y0(), chunk.key().x0())),
                weights, from, to, extremes, gather, acc);
          } catch (IOException e) {
            throw new UncheckedIOException(e);
          }
        }
      });
    } catch (UncheckedIOException e) {
      throw e.getCause();
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

  private static void accumulate(float[] v, ChunkKey k, int[] members, CellWeights weights, int from, int to,
      boolean extremes, boolean gather, Accumulators acc) {
    int t0 = Math.max(from, k.t0()), t1 = Math.min(to, k.t0() + k.nt());
    int plane = k.ny() * k.nx();
    int m = members.length;
    // Members are in row-major order; cut them into runs of consecutive offsets.
    int[] offset = new int[m];
    double[] area = new double[m];
    for (int j = 0; j < m; j++) {
      int i = members[j];
      offset[j] = (weights.row(i) - k.y0()) * k.nx() + (weights.column(i) - k.x0());
      area[j] = weights.area(i);
    }
    int[] runStart = new int[m], runFirst = new int[m], runLen = new int[m];
    int runs = OffsetRuns.cut(offset, m, runStart, runFirst, runLen);
    for (int t = t0; t < t1; t++) {
      int base = (t - k.t0()) * plane;
      int s = t - from;
      double w = 0, wv = 0;
      int c = 0;
      for (int r = 0; r < runs; r++) {
        int o = base + runStart[r], a0 = runFirst[r], len = runLen[r];
        for (int i = 0; i < len; i++) {
          float f = v[o + i];
          if (f == f) { // not NaN
            double a = area[a0 + i];
            w += a;
            wv += a * f;
            c++;
          }
        }
      }
      acc.sumW[s] += w;
      acc.sumWV[s] += wv;
      acc.count[s] += c;
      if (extremes || gather) {
        double lo = acc.min[s], hi = acc.max[s];
        for (int j = 0; j < m; j++) {
          float f = v[base + offset[j]];
          if (f == f) {
            if (f < lo) lo = f;
            if (f > hi) hi = f;
            if (gather) {
              acc.gathered[s][members[j]] = f;
            }
          }
        }
        acc.min[s] = lo;
        acc.max[s] = hi;
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
    Map<Long, List<Integer>> lists = new LinkedHashMap<>();
    for (int i = 0; i < weights.size(); i++) {
      if (!cube.footprint().contains(weights.index(i))) {
        continue;
      }
      int y0 = weights.row(i) / rows * rows, x0 = weights.column(i) / cols * cols;
      lists.computeIfAbsent(tileId(y0, x0), key -> new ArrayList<>()).add(i);
    }
    Map<Long, int[]> out = new LinkedHashMap<>();
    lists.forEach((k, v) -> out.put(k, v.stream().mapToInt(Integer::intValue).toArray()));
    return out;
  }

  private static long tileId(int y0, int x0) {
    return ((long) y0 << 32) | x0;
  }
}
