package org.slackwater.core.analytics;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;

/**
 * A lagged correlation per cell: the values behind a correlation map. Each cell of the region gets
 * its own series at the map's step (for every period of the native steps {@code [from, to)}, the
 * mean of the cell's valid native values, NaN if none: {@link TemporalAggregation} for a {@code
 * mean}, partial periods at both ends included), deseasonalized if asked, and is correlated with
 * one driver series at every lag of the settings. Each lag's row is the row {@link
 * org.slackwater.core.analytics.correlation.LaggedCorrelation} gives for that cell's series (same
 * n, r, lag-1 autocorrelations, effective N, t, p, significance and note), the statistics coming
 * from the one shared implementation ({@link
 * org.slackwater.core.analytics.correlation.LagStatistics}); with the sums formed in a shared pass
 * they agree to rounding (within 1e-12 relative), no longer to the bit.
 *
 * <p><b>One entry per cell</b> ({@link CellCorrelation}): with one lag, that lag's row; with many,
 * the row of the best valid lag (largest |r|, ties to the smaller |lag|, then the positive one),
 * or without a valid lag the invalid row of the lag with the most pairs; plus the lags tried, the
 * valid ones, and significance after a Bonferroni correction over the valid lags (p &lt;= alpha /
 * valid lags), as {@code rank drivers} reports it.
 *
 * <p><b>Cells that cannot be correlated</b> give invalid rows (r NaN), never a failure: cells
 * outside the cube's footprint or without a value in the period, and cells whose series
 * LaggedCorrelation would refuse (values over no more steps than the largest |lag|, no overlap
 * with the driver at any lag, no value in the deseasonalizing baseline) get n = 0 and that
 * refusal's message as the note; too few pairs or a constant cell give LaggedCorrelation's invalid
 * row.
 *
 * <p><b>Failures</b> concern the request as a whole, before any chunk is read: a period without
 * native steps ({@code EMPTY_SERIES}); a driver at another step ({@code STEP_MISMATCH}), without
 * values ({@code EMPTY_SERIES}), or whose values span no more steps than the largest |lag| ({@code
 * LAG_RANGE_TOO_LONG}), all as {@link CorrelationInputException}s; a step range outside the cube
 * or weights of another grid ({@link IllegalArgumentException}, a caller's mistake); an unreadable
 * chunk ({@link IOException}).
 *
 * <p><b>Cost.</b> The driver is aligned, centred and summed once ({@link MapDriver}); the native
 * step to period cut is made once ({@link MapPeriods}). Tiles are visited one after another: the
 * tile's chunks over the period are read through the cache once each (in parallel; chunks without
 * a value are not read), then its cells are split into bands of up to {@code width} cells run in
 * parallel on the common fork-join pool. A worker gathers its band's period means time-major
 * ({@link TileBand}) and, for Pearson with a driver without gaps, computes every lag of every cell
 * of the band in one pass ({@link MapLagKernel}): O(periods x lags) multiply-adds per cell, no
 * per-lag pass over the data, a full row for the reported lag only. Spearman and drivers with gaps
 * take the exact per-cell path ({@link
 * org.slackwater.core.analytics.correlation.LagCorrelator}, O(periods x lags) with a dozen sums
 * per step, plus O(periods log periods) for ranks).
 *
 * <p><b>Memory.</b> The chunks of one tile over the period, which the cache holds anyway (steps x
 * tile cells x 4 bytes, about 120 MB for 20 years of days on a 64 x 64 tile); plus per worker (at
 * most the pool's parallelism + 1) one {@link MapLagKernel}: the band's values, prefix snapshots
 * and cross products, at most {@value #BLOCK_VALUES} doubles (4 MB) by the choice of width, or for
 * an axis too long for 4 cells in that budget, 4 x (axis rows + 3 x prefix positions + {@value
 * MapLagKernel#LAG_GROUP}) doubles; the gap lists of a band (at most one int per value); and
 * arrays of the axis length. Tiles one at a time keep this bound whatever the region's size, and
 * every core still has work when the region lies in a single tile.
 */
public final class CorrelationMap {
  /**
   * Doubles a worker's kernel holds at most (cells x rows plus snapshots): 4 MB, room for one row
   * of a 64-column tile over 20 years of days. (Four rows, 16 MB, measured no faster.)
   */
  static final int BLOCK_VALUES = 1 << 19;
  /** Most cells of one band (the kernel's width). */
  static final int MAX_WIDTH = 64;

  private CorrelationMap() {}

  /**
   * How this JVM forms the maps' cross products: VECTOR (started with {@code
   * --add-modules=jdk.incubator.vector}), FUSED or PLAIN; for logs and benchmarks.
   */
  public static String arithmetic() {
    return MapLagKernel.Arithmetic.BEST.name();
  }

  /**
   * Per cell of {@code weights} on {@code cube}: the cell's own series at {@code step} over native
   * steps {@code [from, to)}, correlated at every lag of {@code settings} with {@code driver}
   * (already aggregated at the same step, deseasonalized by the caller if wanted; the cell series
   * are deseasonalized with {@code deseasonalize} if given).
   *
   * @return one entry per weight entry, in the weights' order (unmodifiable)
   */
  public static List<CellCorrelation> compute(ChunkSource cache, CubeEntry cube, CellWeights weights, int from,
      int to, TemporalStep step, DatedSeries driver, CorrelationSettings settings,
      Optional<Deseasonalize> deseasonalize) throws IOException {
    Objects.requireNonNull(cache, "cache");
    Objects.requireNonNull(cube, "cube");
    Objects.requireNonNull(weights, "weights");
    Objects.requireNonNull(step, "step");
    Objects.requireNonNull(driver, "driver");
    Objects.requireNonNull(settings, "settings");
    Objects.requireNonNull(deseasonalize, "deseasonalize");
    long[] times = cube.descriptor().time().epochSeconds();
    checkRange(cube, weights, from, to, times.length);
    if (from == to) {
      throw new CorrelationInputException(CorrelationInputException.Kind.EMPTY_SERIES,
          "the period holds no time step of cube '" + cube.name() + "'; choose dates within its time axis");
    }
    MapPeriods periods = MapPeriods.of(times, from, to, step);
    MapDriver prepared = MapDriver.prepare(periods, step, driver, settings);
    Deseasonalize des = deseasonalize.orElse(null);
    Deseasonalize.Prepared classes = des == null ? null : des.prepare(step, periods.dates());
    int[] rowOf = prepared.periodRows();
    int width = width(rowOf[rowOf.length - 1] + 1, settings.lagCount());
    // Bands small enough to bound a worker's memory, and several per tile so every core has work.
    int tileCells = cube.layout().rows() * cube.layout().columns();
    int perTile = 4 * ForkJoinPool.getCommonPoolParallelism();
    int band = Math.max(1, Math.min(width, (tileCells + perTile - 1) / perTile));
    Workers workers = new Workers(band, () -> new Worker(width,
        new MapCellCorrelator(periods, step, driver, prepared, width, des, classes)));

    CellCorrelation[] rows = new CellCorrelation[weights.size()];
    // Every all-missing cell gets the same entry; asking the reference once costs O(periods x lags).
    Worker first = workers.take();
    CellCorrelation empty = first.correlator.empty();
    workers.give(first);

    for (TilePlan tile : plan(cube, weights, from, to, rows, empty)) {
      runTile(cache, cube, tile, weights, periods, rowOf, workers, rows);
    }
    return List.of(rows);
  }

  /**
   * The most cells per band, a multiple of 4 from 4 to {@value #MAX_WIDTH}, whose kernel stays
   * within {@value #BLOCK_VALUES} doubles (4 where even that is more).
   */
  static int width(int rows, int lagCount) {
    int w = MAX_WIDTH;
    while (w > 4 && MapLagKernel.footprint(w, rows, lagCount) > BLOCK_VALUES) {
      w -= 4;
    }
    return w;
  }

  /** A tile's cells (weight entries, ascending) and its chunks over the period, by first step. */
  private record TilePlan(int[] cells, List<ChunkRecord> chunks) {}

  /**
   * The tiles holding cells of the weights inside the cube's footprint; cells outside it, and the
   * cells of a tile without any chunk in the period, get the {@code empty} row right away.
   */
  private static List<TilePlan> plan(CubeEntry cube, CellWeights weights, int from, int to, CellCorrelation[] rows,
      CellCorrelation empty) {
    Map<Long, List<Integer>> members = new LinkedHashMap<>();
    int tileRows = cube.layout().rows(), tileCols = cube.layout().columns();
    for (int i = 0; i < weights.size(); i++) {
      if (cube.footprint().contains(weights.index(i))) {
        long tile = tileId(weights.row(i) / tileRows * tileRows, weights.column(i) / tileCols * tileCols);
        members.computeIfAbsent(tile, k -> new ArrayList<>()).add(i);
      } else {
        rows[i] = empty;
      }
    }
    Map<Long, List<ChunkRecord>> chunks = new LinkedHashMap<>();
    for (ChunkRecord c : cube.chunks()) {
      ChunkKey k = c.key();
      long tile = tileId(k.y0(), k.x0());
      if (members.containsKey(tile) && Math.max(from, k.t0()) < Math.min(to, k.t0() + k.nt())) {
        chunks.computeIfAbsent(tile, t -> new ArrayList<>()).add(c);
      }
    }
    List<TilePlan> plans = new ArrayList<>();
    members.forEach((tile, cells) -> {
      List<ChunkRecord> own = new ArrayList<>(chunks.getOrDefault(tile, List.of()));
      if (own.isEmpty()) {
        cells.forEach(i -> rows[i] = empty);
        return;
      }
      own.sort(Comparator.comparingInt(c -> c.key().t0()));
      plans.add(new TilePlan(cells.stream().mapToInt(Integer::intValue).toArray(), own));
    });
    return plans;
  }

  private static void runTile(ChunkSource cache, CubeEntry cube, TilePlan plan, CellWeights weights,
      MapPeriods periods, int[] rowOf, Workers workers, CellCorrelation[] rows) throws IOException {
    List<ChunkRecord> sorted = plan.chunks();
    int[] cells = plan.cells();
    ChunkKey[] keys = sorted.stream().map(ChunkRecord::key).toArray(ChunkKey[]::new);
    float[][] values = new float[keys.length][];
    try {
      IntStream.range(0, keys.length).parallel().forEach(c -> {
        ChunkRecord chunk = sorted.get(c);
        if (chunk.validCount() == 0) {
          return; // every value missing: nothing to read
        }
        try {
          values[c] = cache.get(cube, chunk);
        } catch (IOException e) {
          throw new UncheckedIOException(e);
        }
      });
    } catch (UncheckedIOException e) {
      throw e.getCause();
    }
    TileBand tile = new TileBand(periods, keys, values, rowOf);
    int band = workers.bandCells;
    int bands = (cells.length + band - 1) / band;
    IntStream.range(0, bands).parallel().forEach(k -> {
      Worker w = workers.take();
      try {
        int start = k * band, count = Math.min(band, cells.length - start);
        for (int j = 0; j < count; j++) {
          int i = cells[start + j];
          w.offset[j] = tile.offset(weights.row(i), weights.column(i));
        }
        w.correlator.correlate(tile, w.offset, count, w.out);
        for (int j = 0; j < count; j++) {
          rows[cells[start + j]] = w.out[j];
        }
      } finally {
        workers.give(w);
      }
    });
  }

  private static void checkRange(CubeEntry cube, CellWeights weights, int from, int to, int steps) {
    if (from < 0 || to > steps || from > to) {
      throw new IllegalArgumentException("native steps [" + from + ", " + to + ") are outside cube '" + cube.name()
          + "', which has steps [0, " + steps + ")");
    }
    int nx = cube.descriptor().grid().nx(), cellCount = cube.descriptor().grid().cells();
    if (weights.nx() != nx || (weights.size() > 0 && weights.index(weights.size() - 1) >= cellCount)) {
      throw new IllegalArgumentException("the cell weights were computed for another grid than cube '" + cube.name()
          + "' (" + cube.descriptor().grid().ny() + " x " + nx + " cells)");
    }
  }

  private static long tileId(int y0, int x0) {
    return ((long) y0 << 32) | x0;
  }

  /** One worker's arrays, reused from band to band and tile to tile. */
  private static final class Worker {
    final int[] offset;
    final CellCorrelation[] out;
    final MapCellCorrelator correlator;

    Worker(int cells, MapCellCorrelator correlator) {
      offset = new int[cells];
      out = new CellCorrelation[cells];
      this.correlator = correlator;
    }
  }

  /** Workers handed out to whichever pool thread runs a band, so none is built per band. */
  private static final class Workers {
    private final ConcurrentLinkedQueue<Worker> idle = new ConcurrentLinkedQueue<>();
    private final java.util.function.Supplier<Worker> factory;
    final int bandCells;

    Workers(int bandCells, java.util.function.Supplier<Worker> factory) {
      this.bandCells = bandCells;
      this.factory = factory;
    }

    Worker take() {
      Worker w = idle.poll();
      return w != null ? w : factory.get();
    }

    void give(Worker w) {
      idle.offer(w);
    }
  }
}
