package org.slackwater.core.analytics;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
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
 * {@link ChunkCache}. Per step the work is one pass over the region's cells.
 */
public final class AreaStatistics {

  private AreaStatistics() {}

  /**
   * @param from first step index (inclusive)
   * @param to last step index (exclusive)
   * @param minCoverage 0..1
   */
  public static DailySeries compute(ChunkCache cache, CubeEntry cube, CellWeights weights, SpatialStatistic stat,
      int from, int to, double minCoverage) throws IOException {
    int n = Math.max(0, to - from);
    int cells = weights.size();
    double regionArea = 0;
    for (int i = 0; i < cells; i++) {
      if (cube.footprint().contains(weights.index(i))) {
        regionArea += weights.area(i);
      }
    }
    double[] sumW = new double[n], sumWV = new double[n];
    double[] min = new double[n], max = new double[n];
    int[] count = new int[n];
    Arrays.fill(min, Double.POSITIVE_INFINITY);
    Arrays.fill(max, Double.NEGATIVE_INFINITY);
    boolean gather = stat.kind() == SpatialStatistic.Kind.PERCENTILE;
    float[][] gathered = gather ? new float[n][cells] : null;
    if (gather) {
      for (float[] row : gathered) {
        Arrays.fill(row, Float.NaN);
      }
    }

    Map<Long, List<Integer>> byTile = cellsByTile(cube, weights);
    long[] times = cube.descriptor().time().epochSeconds();
    for (ChunkRecord chunk : cube.chunks()) {
      ChunkKey k = chunk.key();
      int t0 = Math.max(from, k.t0()), t1 = Math.min(to, k.t0() + k.nt());
      List<Integer> members = byTile.get(tileId(k.y0(), k.x0()));
      if (t0 >= t1 || members == null) {
        continue;
      }
      float[] v = cache.get(cube, chunk);
      int plane = k.ny() * k.nx();
      int m = members.size();
      int[] offset = new int[m];
      double[] area = new double[m];
      for (int j = 0; j < m; j++) {
        int i = members.get(j);
        offset[j] = (weights.row(i) - k.y0()) * k.nx() + (weights.column(i) - k.x0());
        area[j] = weights.area(i);
      }
      for (int t = t0; t < t1; t++) {
        int base = (t - k.t0()) * plane;
        int s = t - from;
        double w = 0, wv = 0, lo = min[s], hi = max[s];
        int c = 0;
        for (int j = 0; j < m; j++) {
          float f = v[base + offset[j]];
          if (f == f) { // not NaN
            double a = area[j];
            w += a;
            wv += a * f;
            if (f < lo) lo = f;
            if (f > hi) hi = f;
            c++;
            if (gather) {
              gathered[s][members.get(j)] = f;
            }
          }
        }
        sumW[s] += w;
        sumWV[s] += wv;
        min[s] = lo;
        max[s] = hi;
        count[s] += c;
      }
    }

    double[] value = new double[n], frac = new double[n];
    for (int s = 0; s < n; s++) {
      frac[s] = regionArea > 0 ? sumW[s] / regionArea : 0;
      if (count[s] == 0 || frac[s] + 1e-12 < minCoverage) {
        value[s] = Double.NaN;
        continue;
      }
      value[s] = switch (stat.kind()) {
        case MEAN -> sumWV[s] / sumW[s];
        case SUM -> sumWV[s];
        case MIN -> min[s];
        case MAX -> max[s];
        case PERCENTILE -> weightedPercentile(gathered[s], weights, stat.percentile());
      };
    }
    return new DailySeries(Arrays.copyOfRange(times, from, from + n), value, frac, count);
  }

  /** Smallest value whose cumulative valid area reaches p % of the valid area. */
  static double weightedPercentile(float[] values, CellWeights weights, double p) {
    List<double[]> pairs = new ArrayList<>();
    double total = 0;
    for (int i = 0; i < values.length; i++) {
      if (!Float.isNaN(values[i])) {
        pairs.add(new double[] {values[i], weights.area(i)});
        total += weights.area(i);
      }
    }
    pairs.sort((a, b) -> Double.compare(a[0], b[0]));
    double target = p / 100.0 * total, cum = 0;
    for (double[] pair : pairs) {
      cum += pair[1];
      if (cum >= target * (1 - 1e-12)) {
        return pair[0];
      }
    }
    return pairs.get(pairs.size() - 1)[0];
  }

  private static Map<Long, List<Integer>> cellsByTile(CubeEntry cube, CellWeights weights) {
    int rows = cube.layout().rows(), cols = cube.layout().columns();
    Map<Long, List<Integer>> out = new LinkedHashMap<>();
    for (int i = 0; i < weights.size(); i++) {
      if (!cube.footprint().contains(weights.index(i))) {
        continue;
      }
      int y0 = weights.row(i) / rows * rows, x0 = weights.column(i) / cols * cols;
      out.computeIfAbsent(tileId(y0, x0), key -> new ArrayList<>()).add(i);
    }
    return out;
  }

  private static long tileId(int y0, int x0) {
    return ((long) y0 << 32) | x0;
  }
}
