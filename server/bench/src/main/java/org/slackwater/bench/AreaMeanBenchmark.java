package org.slackwater.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.io.WKTReader;
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
import org.slackwater.core.analytics.AreaStatistics;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.analytics.DailySeries;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionWeights;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.store.ChunkLayout;

/**
 * Warm area mean over a 250 x 250 x 7305 float32 cube with a polygon covering about 40 % of it
 * (target: >= 1.0e9 cell-values/s on 2 cores). Throughput in cell-values/s = 250 x 250 x 7305 x
 * 0.4 / time per operation. The baseline in the same run is a plain sequential sum over the same
 * values held in one heap array (memory bandwidth bound), so the ratio says how close the
 * operator gets to just reading the data.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 5)
@Measurement(iterations = 5, time = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xmx12g", "--add-opens=java.base/java.nio=ALL-UNNAMED", "--add-opens=java.base/sun.nio.ch=ALL-UNNAMED", "--add-opens=java.base/java.lang=ALL-UNNAMED", "--add-opens=java.base/java.util=ALL-UNNAMED", "--add-opens=java.base/java.lang.invoke=ALL-UNNAMED"})
public class AreaMeanBenchmark {
  static final int NY = 250, NX = 250;

  @Param({"7305"})
  int steps;

  private Path dir;
  private Workspace ws;
  private CubeEntry cube;
  private CellWeights weights;
  private ChunkCache cache;
  private float[] flat;
  private int[] insideCells;

  @Setup(Level.Trial)
  public void setUp() throws Exception {
    dir = Files.createTempDirectory("slackwater-bench-area");
    ws = Workspace.open(dir, 2L << 30, 8L << 30, ChunkLayout.DEFAULT);
    Path marker = Files.writeString(dir.resolve("synthetic.bench"), "synthetic");
    ws.ingestor();
    new org.slackwater.core.ingest.Ingestor(List.of(new Synthetic(steps)), ws.catalog(), ws.store(), ChunkLayout.DEFAULT)
        .ingest(marker, Optional.empty());
    cube = ws.catalog().cube("synthetic").orElseThrow();
    // A polygon over about 40 % of the grid (a rotated quadrilateral).
    Geometry poly = new WKTReader().read("POLYGON((-31.9 43.6, -30.4 43.9, -30.7 45.9, -31.6 45.6, -31.9 43.6))");
    weights = RegionWeights.compute(cube.descriptor().grid(), poly);
    cache = new ChunkCache(ws.store(), 8L << 30);
    AreaStatistics.compute(cache, cube, weights, SpatialStatistic.of(SpatialStatistic.Kind.MEAN), 0, steps, 0.5);
    flat = new float[steps * NY * NX];
    for (int i = 0; i < flat.length; i++) {
      flat[i] = Synthetic.value(i);
    }
    insideCells = weights.cellIndex();
    System.out.printf("%nregion covers %d of %d cells (%.1f %%)%n", weights.size(), NY * NX, 100.0 * weights.size() / (NY * NX));
  }

  @TearDown(Level.Trial)
  public void tearDown() throws IOException {
    ws.close();
    try (Stream<Path> w = Files.walk(dir)) {
      w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  @Benchmark
  public DailySeries areaMean() throws IOException {
    return AreaStatistics.compute(cache, cube, weights, SpatialStatistic.of(SpatialStatistic.Kind.MEAN), 0, steps, 0.5);
  }

  /** Baseline: read the region's cells of every step from one flat array and add them up. */
  @Benchmark
  public double baselineFlatSum() {
    double s = 0;
    int plane = NY * NX;
    for (int t = 0; t < steps; t++) {
      int base = t * plane;
      for (int c : insideCells) {
        s += flat[base + c];
      }
    }
    return s;
  }

  /** A cube of deterministic values with about 2 % missing. */
  static final class Synthetic implements CubeSource {
    private final int steps;

    Synthetic(int steps) {
      this.steps = steps;
    }

    static float value(long i) {
      long h = i * 0x9E3779B97F4A7C15L;
      return (h >>> 58) == 0 ? Float.NaN : (float) ((h >>> 40) & 0xFFFF) / 1000f;
    }

    @Override
    public String name() {
      return "synthetic";
    }

    @Override
    public boolean accepts(Path file) {
      return file.toString().endsWith(".bench");
    }

    @Override
    public List<String> variables(Path file) {
      return List.of("synthetic");
    }

    @Override
    public SourceCube open(Path file, String variable) {
      long[] secs = new long[steps];
      for (int t = 0; t < steps; t++) {
        secs[t] = (java.time.LocalDate.of(2006, 1, 1).toEpochDay() + t) * 86400L;
      }
      CubeDescriptor d = new CubeDescriptor("synthetic", "", "benchmark field", "1", "1",
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
                dest[k++] = value(((long) t * NY + y) * NX + x);
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
