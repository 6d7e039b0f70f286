package org.slackwater.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.slackwater.core.Workspace;
import org.slackwater.core.analytics.CellCorrelation;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.analytics.CorrelationMap;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.store.ChunkLayout;

/**
 * Warm correlation map of every cell of a 250 x 250 x 7305 daily float32 cube against a daily
 * driver at 31 lags (-15 to 15 days), Pearson with the autocorrelation correction (target: under
 * 5 s on 2 cores). The cells follow the driver at a planted lag of -5 to 15 days plus noise.
 *
 * <p>Baseline in the same run ({@code baselineFlatDotProducts}): the bare arithmetic of the
 * per-lag way, 31 dot products per cell (x(t) d(t - L), LagCorrelator's four-sum loop) over the
 * same values held cell by cell in one flat heap array, on the same common pool: no centring, no
 * other sums, no statistics, no reading from the store. The map's trial also times that baseline
 * in its own JVM (before and after measuring, the best of each) and prints the ratio map /
 * baseline at the end, so the ratio compares like with like under the load of that moment.
 * {@code correlationMapOneLag} is the same map at lag 0 alone.
 *
 * <p>{@code -p gappyPercent=100} gives every cell about 3 % scattered missing days, which the
 * shared pass handles with per-gap corrections (O(gaps x lags) per cell).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(value = 1, jvmArgsAppend = {"-Xmx14g", "--add-modules=jdk.incubator.vector", "--add-opens=java.base/java.nio=ALL-UNNAMED", "--add-opens=java.base/sun.nio.ch=ALL-UNNAMED", "--add-opens=java.base/java.lang=ALL-UNNAMED", "--add-opens=java.base/java.util=ALL-UNNAMED", "--add-opens=java.base/java.lang.invoke=ALL-UNNAMED"})
public class CorrelationMapBenchmark {
  static final int NY = 250, NX = 250;
  static final int FIRST_LAG = -15, LAST_LAG = 15;
  /** Driver days before the cube's first day and after its last, so every lag finds partners. */
  static final int LEAD = 64;
  static final LocalDate START = LocalDate.of(2006, 1, 1);

  @Param({"7305"})
  int steps;

  /** Percent of the cells with about 3 % of their days missing. */
  @Param({"0"})
  int gappyPercent;

  private Path dir;
  private Workspace ws;
  private CubeEntry cube;
  private CellWeights weights;
  private ChunkCache cache;
  private DatedSeries driver;
  private CorrelationSettings lags31;
  private CorrelationSettings lag0;
  private float[] flat;
  private double[] driverFlat;
  private final List<Long> mapNanos = new ArrayList<>();
  private long baselineBefore;

  @Setup(Level.Trial)
  public void setUp() throws Exception {
    // The bench module has no logging configuration: keep Arrow's per-buffer debug lines out.
    ((ch.qos.logback.classic.Logger) org.slf4j.LoggerFactory.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME))
        .setLevel(ch.qos.logback.classic.Level.INFO);
    dir = Files.createTempDirectory("slackwater-bench-cmap");
    ws = Workspace.open(dir, 2L << 30, 8L << 30, ChunkLayout.DEFAULT);
    Path marker = Files.writeString(dir.resolve("synthetic.cmapbench"), "synthetic");
    Synthetic source = new Synthetic(steps, gappyPercent);
    new org.slackwater.core.ingest.Ingestor(List.of(source), ws.catalog(), ws.store(), ChunkLayout.DEFAULT)
        .ingest(marker, Optional.empty());
    cube = ws.catalog().cube("cmap").orElseThrow();
    int cells = NY * NX;
    int[] all = IntStream.range(0, cells).toArray();
    double[] ones = new double[cells];
    Arrays.fill(ones, 1);
    weights = new CellWeights(NX, all, ones, ones, cells);
    LocalDate[] dates = new LocalDate[steps + 2 * LEAD];
    double[] values = new double[steps + 2 * LEAD];
    for (int i = 0; i < dates.length; i++) {
      dates[i] = START.plusDays(i - LEAD);
      values[i] = source.driver[i];
    }
    driver = new DatedSeries(TemporalStep.DAY, dates, values);
    lags31 = CorrelationSettings.of(CorrelationMethod.PEARSON, FIRST_LAG, LAST_LAG, 1, 0.05);
    lag0 = CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 0, 1, 0.05);
    cache = new ChunkCache(ws.store(), 8L << 30);
    flat = new float[cells * steps];
    for (int c = 0; c < cells; c++) {
      for (int t = 0; t < steps; t++) {
        flat[c * steps + t] = source.value(t, c / NX, c % NX);
      }
    }
    driverFlat = source.driver.clone();
    List<CellCorrelation> warm = map(lags31); // fills the chunk cache: the map is measured warm
    long valid = warm.stream().filter(e -> e.row().valid()).count();
    long planted = IntStream.range(0, cells).filter(c -> warm.get(c).row().lag() == Synthetic.plantedLag(c)).count();
    System.out.printf("%n%d cells x %d days x %d lags; %d valid, planted lag found in %d%n", cells, steps,
        lags31.lagCount(), valid, planted);
    baselineBefore = bestOf(2);
  }

  @TearDown(Level.Trial)
  public void tearDown() throws IOException {
    if (!mapNanos.isEmpty()) {
      long baseline = Math.min(baselineBefore, bestOf(2));
      long[] sorted = mapNanos.stream().mapToLong(Long::longValue).sorted().toArray();
      long median = sorted[sorted.length / 2];
      System.out.printf("%ncorrelation map, %d lags, %s arithmetic: median %.3f s over %d calls;"
          + " flat dot-product baseline %.3f s; ratio map / baseline %.2f%n", lags31.lagCount(),
          CorrelationMap.arithmetic(), median / 1e9, sorted.length, baseline / 1e9, (double) median / baseline);
    }
    ws.close();
    try (Stream<Path> w = Files.walk(dir)) {
      w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  private List<CellCorrelation> map(CorrelationSettings settings) throws IOException {
    return CorrelationMap.compute(cache, cube, weights, 0, steps, TemporalStep.DAY, driver, settings, Optional.empty());
  }

  private long bestOf(int runs) {
    long best = Long.MAX_VALUE;
    for (int i = 0; i < runs; i++) {
      long t0 = System.nanoTime();
      baselineFlatDotProducts();
      best = Math.min(best, System.nanoTime() - t0);
    }
    return best;
  }

  @Benchmark
  public List<CellCorrelation> correlationMap() throws IOException {
    long t0 = System.nanoTime();
    List<CellCorrelation> r = map(lags31);
    mapNanos.add(System.nanoTime() - t0);
    return r;
  }

  @Benchmark
  public List<CellCorrelation> correlationMapOneLag() throws IOException {
    return map(lag0);
  }

  /** Baseline: 31 dot products per cell from one flat cell-major array (missing values as 0). */
  @Benchmark
  public double baselineFlatDotProducts() {
    return IntStream.range(0, NY * NX).parallel().mapToDouble(c -> {
      double s = 0;
      int base = c * steps;
      for (int lag = FIRST_LAG; lag <= LAST_LAG; lag++) {
        // x(t) d(t - lag) for t in [max(0, lag), steps); d(i) is driverFlat[i + LEAD].
        int t0 = Math.max(0, lag);
        s += dot(flat, base + t0, driverFlat, t0 - lag + LEAD, steps - t0);
      }
      return s;
    }).sum();
  }

  /** LagCorrelator's dot-product loop: four partial sums; a NaN counts as 0 as the map counts it. */
  private static double dot(float[] a, int aFrom, double[] b, int bFrom, int n) {
    double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
    int q = 0;
    for (; q + 3 < n; q += 4) {
      s0 += zero(a[aFrom + q]) * b[bFrom + q];
      s1 += zero(a[aFrom + q + 1]) * b[bFrom + q + 1];
      s2 += zero(a[aFrom + q + 2]) * b[bFrom + q + 2];
      s3 += zero(a[aFrom + q + 3]) * b[bFrom + q + 3];
    }
    for (; q < n; q++) {
      s0 += zero(a[aFrom + q]) * b[bFrom + q];
    }
    return (s0 + s1) + (s2 + s3);
  }

  private static double zero(float v) {
    return v == v ? v : 0;
  }

  /** Cells = 8 + 2 driver(t - planted lag) + noise; the driver an AR(1) series, phi = 0.6. */
  static final class Synthetic implements CubeSource {
    private final int steps;
    private final int gappyPercent;
    final double[] driver;

    Synthetic(int steps, int gappyPercent) {
      this.steps = steps;
      this.gappyPercent = gappyPercent;
      driver = new double[steps + 2 * LEAD];
      double q = 0;
      for (int i = 0; i < driver.length; i++) {
        q = 0.6 * q + (unit(hash(i, -1)) - 0.5) * 3.46; // unit variance innovations
        driver[i] = 20 + q;
      }
    }

    static int plantedLag(int cell) {
      return (int) Long.remainderUnsigned(hash(cell, -2), 21) - 5;
    }

    static long hash(long a, long b) {
      long h = (a * 0x9E3779B97F4A7C15L) ^ (b * 0xC2B2AE3D27D4EB4FL);
      h ^= h >>> 31;
      h *= 0xBF58476D1CE4E5B9L;
      return h ^ (h >>> 29);
    }

    private static double unit(long h) {
      return (h >>> 11) * 0x1.0p-53;
    }

    float value(int t, int y, int x) {
      int c = y * NX + x;
      long h = hash(((long) t << 20) | c, 7);
      if (Long.remainderUnsigned(hash(c, -3), 100) < gappyPercent && (h & 31) == 0) {
        return Float.NaN; // about 3 % of the days of a gappy cell
      }
      return (float) (8 + 2 * driver[t + LEAD - plantedLag(c)] + (unit(h) - 0.5) * 6);
    }

    @Override
    public String name() {
      return "cmap";
    }

    @Override
    public boolean accepts(Path file) {
      return file.toString().endsWith(".cmapbench");
    }

    @Override
    public List<String> variables(Path file) {
      return List.of("cmap");
    }

    @Override
    public SourceCube open(Path file, String variable) {
      long[] secs = new long[steps];
      for (int t = 0; t < steps; t++) {
        secs[t] = (START.toEpochDay() + t) * 86400L;
      }
      CubeDescriptor d = new CubeDescriptor("cmap", "", "benchmark field", "1", "1",
          LatLonGrid.regular(43.5, -32, 0.01, 0.01, NY, NX), new TimeAxis("standard", "days since 2006-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
      return new SourceCube() {
        @Override
        public CubeDescriptor descriptor() {
          return d;
        }

        @Override
        public void read(int t0, int nt, int y0, int ny, int x0, int nx, float[] dest) {
          int k = 0;
          for (int t = t0; t < t0 + nt; t++) {
            for (int y = y0; y < y0 + ny; y++) {
              for (int x = x0; x < x0 + nx; x++) {
                dest[k++] = value(t, y, x);
              }
            }
          }
        }

        @Override
        public void close() {}
      };
    }
  }
}
