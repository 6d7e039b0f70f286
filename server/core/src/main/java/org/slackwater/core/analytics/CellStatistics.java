package org.slackwater.core.analytics;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Arrays;
import java.util.List;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;

/**
 * A statistic over time for each cell of a region: the values behind a map. Over the native steps
 * {@code [from, to)} each cell's valid values give
 *
 * <ul>
 *   <li>mean: their mean (at least one needed);
 *   <li>sum: their total, only if every step is valid (a total over gaps would be too low);
 *   <li>min, max: their extremes;
 *   <li>percentile p: the smallest value v with at least p % of the values ≤ v.
 * </ul>
 *
 * Cells are those of the {@link CellWeights} (any area inside the region). Reads each needed
 * chunk once; time chunks run in parallel, and a cell's values of one time chunk are reduced
 * before the next, so memory is one chunk per thread plus a value per cell and step for
 * percentiles only.
 */
public final class CellStatistics {

  private CellStatistics() {}

  /**
   * @return per weight entry (same order as {@code weights}): [value, valid steps]
   */
  public static double[][] compute(ChunkSource cache, CubeEntry cube, CellWeights weights, SpatialStatistic stat, int from, int to) throws IOException {
    int m = weights.size(), n = Math.max(0, to - from);
    int rows = cube.layout().rows(), cols = cube.layout().columns();
    double[] sum = new double[m], min = new double[m], max = new double[m];
    int[] count = new int[m];
    Arrays.fill(min, Double.POSITIVE_INFINITY);
    Arrays.fill(max, Double.NEGATIVE_INFINITY);
    boolean gather = stat.kind() == SpatialStatistic.Kind.PERCENTILE;
    float[][] all = gather ? new float[m][n] : null;
    List<ChunkRecord> chunks = cube.chunks().stream()
        .filter(c -> Math.max(from, c.key().t0()) < Math.min(to, c.key().t0() + c.key().nt())).toList();
    // Cells of one tile are written only by that tile's chunks; tiles run in parallel, time chunks in order.
    java.util.Map<Long, List<ChunkRecord>> byTile = new java.util.LinkedHashMap<>();
    for (ChunkRecord c : chunks) {
      byTile.computeIfAbsent(((long) c.key().y0() << 32) | c.key().x0(), k -> new java.util.ArrayList<>()).add(c);
    }
    int[][] members = new int[byTile.size()][];
    List<Long> tiles = List.copyOf(byTile.keySet());
    for (int ti = 0; ti < tiles.size(); ti++) {
      long id = tiles.get(ti);
      int y0 = (int) (id >>> 32), x0 = (int) id;
      members[ti] = java.util.stream.IntStream.range(0, m)
          .filter(i -> weights.row(i) / rows * rows == y0 && weights.column(i) / cols * cols == x0).toArray();
    }
    try {
      java.util.stream.IntStream.range(0, tiles.size()).parallel().forEach(ti -> {
        if (members[ti].length == 0) {
          return;
        }
        for (ChunkRecord c : byTile.get(tiles.get(ti))) {
          try {
            float[] v = cache.get(cube, c);
            ChunkKey k = c.key();
            int t0 = Math.max(from, k.t0()), t1 = Math.min(to, k.t0() + k.nt()), plane = k.ny() * k.nx();
            for (int i : members[ti]) {
              int off = (weights.row(i) - k.y0()) * k.nx() + (weights.column(i) - k.x0());
              double s = 0, lo = min[i], hi = max[i];
              int cnt = 0;
              for (int t = t0; t < t1; t++) {
                float f = v[(t - k.t0()) * plane + off];
                if (f == f) {
                  s += f;
                  cnt++;
                  if (f < lo) lo = f;
                  if (f > hi) hi = f;
                  if (gather) {
                    all[i][count[i] + cnt - 1] = f;
                  }
                }
              }
              sum[i] += s;
              count[i] += cnt;
              min[i] = lo;
              max[i] = hi;
            }
          } catch (IOException e) {
            throw new UncheckedIOException(e);
          }
        }
      });
    } catch (UncheckedIOException e) {
      throw e.getCause();
    }
    double[][] out = new double[m][2];
    for (int i = 0; i < m; i++) {
      int c = count[i];
      out[i][1] = c;
      out[i][0] = c == 0 ? Double.NaN : switch (stat.kind()) {
        case MEAN -> sum[i] / c;
        case SUM -> c == n ? sum[i] : Double.NaN;
        case MIN -> min[i];
        case MAX -> max[i];
        case PERCENTILE -> {
          float[] s = Arrays.copyOf(all[i], c);
          Arrays.sort(s);
          int rank = (int) Math.ceil(stat.percentile() / 100.0 * c - 1e-9);
          yield s[Math.max(0, Math.min(c - 1, rank - 1))];
        }
      };
    }
    return out;
  }
}
