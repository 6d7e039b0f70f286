package org.slackwater.bench;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
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
import org.openjdk.jmh.infra.BenchmarkParams;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.options.CommandLineOptions;
import org.openjdk.jmh.runner.options.OptionsBuilder;
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
 * (target: >= 1.0e9 cell-values/s on 2 cores, and >= 2x a straightforward numpy weighted mean).
 * Throughput in cell-values/s = steps x region cells / time per operation. The baseline in the
 * same run is a plain sequential sum over the same values held in one heap array, so the ratio
 * says how close the operator gets to just reading the data.
 *
 * <p>{@code java -cp slackwater-bench.jar org.slackwater.bench.AreaMeanBenchmark [JMH options]}
 * runs both benchmarks with {@value #EXPORT_PROPERTY} set: the trial then writes the cube's values,
 * the weights and the operator's result as raw little-endian files under {@code
 * server/bench/target/area-mean-data} (generated, never committed), and the driver runs
 * {@code server/bench/numpy/area_mean.py} on them right after, and prints the throughput with both
 * ratios and the load averages.
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

  /** System property naming a directory: when set, the trial exports the data for the numpy script. */
  static final String EXPORT_PROPERTY = "slackwater.bench.export";
  static final String POLYGON = "POLYGON((-31.9 43.6, -30.4 43.9, -30.7 45.9, -31.6 45.6, -31.9 43.6))";

  @Setup(Level.Trial)
  public void setUp(BenchmarkParams params) throws Exception {
    // Arrow logs every buffer it reads at DEBUG; the trial reads 320 chunk files.
    ((ch.qos.logback.classic.Logger) org.slf4j.LoggerFactory.getLogger("org.apache.arrow")).setLevel(ch.qos.logback.classic.Level.INFO);
    dir = Files.createTempDirectory("slackwater-bench-area");
    ws = Workspace.open(dir, 2L << 30, 8L << 30, ChunkLayout.DEFAULT);
    Path marker = Files.writeString(dir.resolve("synthetic.bench"), "synthetic");
    ws.ingestor();
    new org.slackwater.core.ingest.Ingestor(List.of(new Synthetic(steps)), ws.catalog(), ws.store(), ChunkLayout.DEFAULT)
        .ingest(marker, Optional.empty());
    cube = ws.catalog().cube("synthetic").orElseThrow();
    // A polygon over about 40 % of the grid (a rotated quadrilateral).
    Geometry poly = new WKTReader().read(POLYGON);
    weights = RegionWeights.compute(cube.descriptor().grid(), poly);
    cache = new ChunkCache(ws.store(), 8L << 30);
    DailySeries first = AreaStatistics.compute(cache, cube, weights, SpatialStatistic.of(SpatialStatistic.Kind.MEAN), 0, steps, 0.5);
    flat = new float[steps * NY * NX];
    for (int i = 0; i < flat.length; i++) {
      flat[i] = Synthetic.value(i);
    }
    insideCells = weights.cellIndex();
    System.out.printf("%nregion covers %d of %d cells (%.1f %%)%n", weights.size(), NY * NX, 100.0 * weights.size() / (NY * NX));
    String export = System.getProperty(EXPORT_PROPERTY);
    if (export != null && !export.isEmpty() && params.getBenchmark().endsWith(".areaMean")) {
      export(Path.of(export), first);
    }
  }

  /**
   * values.f32: the cube, (step, row, column) float32 with NaN for missing, the same values the
   * store holds; weights.f64: each cell's area inside the region (m², 0 outside), float64 because
   * that is what the operator uses; java_mean.f64: the operator's mean per step; meta.json: shape.
   * All little-endian.
   */
  private void export(Path to, DailySeries result) throws IOException {
    Files.createDirectories(to);
    ByteBuffer buf = ByteBuffer.allocateDirect(1 << 24).order(ByteOrder.LITTLE_ENDIAN);
    try (FileChannel ch = FileChannel.open(to.resolve("values.f32"), StandardOpenOption.CREATE, StandardOpenOption.WRITE,
        StandardOpenOption.TRUNCATE_EXISTING)) {
      for (float f : flat) {
        if (!buf.hasRemaining()) {
          drain(buf, ch);
        }
        buf.putFloat(f);
      }
      drain(buf, ch);
    }
    double[] w = new double[NY * NX];
    for (int i = 0; i < weights.size(); i++) {
      w[weights.index(i)] = cube.footprint().contains(weights.index(i)) ? weights.area(i) : 0;
    }
    writeDoubles(to.resolve("weights.f64"), w);
    writeDoubles(to.resolve("java_mean.f64"), result.value());
    Files.writeString(to.resolve("meta.json"), String.format("{\"steps\": %d, \"ny\": %d, \"nx\": %d}%n", steps, NY, NX));
    System.out.println("exported the cube, weights and result to " + to.toAbsolutePath());
  }

  private static void writeDoubles(Path file, double[] values) throws IOException {
    ByteBuffer b = ByteBuffer.allocate(values.length * 8).order(ByteOrder.LITTLE_ENDIAN);
    b.asDoubleBuffer().put(values);
    Files.write(file, b.array());
  }

  private static void drain(ByteBuffer buf, FileChannel ch) throws IOException {
    buf.flip();
    while (buf.hasRemaining()) {
      ch.write(buf);
    }
    buf.clear();
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

  /**
   * Driver: both benchmarks with the export on, then the numpy script on the exported data, then
   * the ratios. JMH options (e.g. {@code -f 1 -wi 2 -i 5}) pass through; {@code -Dslackwater.bench.data}
   * and {@code -Dslackwater.bench.numpy} override where the data go and where the script is.
   */
  public static void main(String[] args) throws Exception {
    Path data = Path.of(System.getProperty("slackwater.bench.data", "server/bench/target/area-mean-data")).toAbsolutePath();
    Path script = Path.of(System.getProperty("slackwater.bench.numpy", "server/bench/numpy/area_mean.py")).toAbsolutePath();
    if (!Files.isRegularFile(script)) {
      System.err.println("numpy script not found at " + script + "; run from the repository root or pass -Dslackwater.bench.numpy=PATH");
      System.exit(2);
    }
    var opts = new OptionsBuilder().parent(new CommandLineOptions(args))
        .include(AreaMeanBenchmark.class.getName() + "\\.")
        .jvmArgsPrepend("-D" + EXPORT_PROPERTY + "=" + data)
        .build();
    String loadBefore = loadAverage();
    Collection<RunResult> results = new Runner(opts).run();
    String loadJava = loadAverage();
    Process p = new ProcessBuilder("python3", script.toString(), data.toString()).redirectErrorStream(true).start();
    double numpyRate = Double.NaN;
    Pattern rate = Pattern.compile("numpy: ([0-9.eE+-]+) cell-values/s");
    try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        System.out.println(line);
        Matcher m = rate.matcher(line);
        if (m.find()) {
          numpyRate = Double.parseDouble(m.group(1));
        }
      }
    }
    int exit = p.waitFor();
    String loadAfter = loadAverage();
    int steps = Integer.parseInt(results.iterator().next().getParams().getParam("steps"));
    int cells = RegionWeights.compute(LatLonGrid.regular(43.5, -32, 0.01, 0.01, NY, NX), new WKTReader().read(POLYGON)).size();
    double mean = score(results, "areaMean"), flatSum = score(results, "baselineFlatSum");
    double javaRate = (double) steps * cells / (mean * 1e-3);
    System.out.printf("%narea mean: %.1f ms/op = %.3e cell-values/s (%d steps x %d cells)%n", mean, javaRate, steps, cells);
    System.out.printf("baselineFlatSum: %.1f ms/op; area mean is %.2fx it%n", flatSum, flatSum / mean);
    System.out.printf("numpy (exit %d): %.3e cell-values/s; area mean is %.2fx it%n", exit, numpyRate, javaRate / numpyRate);
    System.out.printf("load before: %s%nload after the JMH runs: %s%nload after numpy: %s%n", loadBefore, loadJava, loadAfter);
  }

  static double score(Collection<RunResult> results, String method) {
    return results.stream().filter(r -> r.getParams().getBenchmark().endsWith("." + method))
        .mapToDouble(r -> r.getPrimaryResult().getScore()).findFirst().orElse(Double.NaN);
  }

  /** The 1, 5 and 15 minute load averages, as uptime prints them. */
  static String loadAverage() {
    try {
      return Files.readString(Path.of("/proc/loadavg")).trim();
    } catch (IOException e) {
      return "unknown (" + e.getMessage() + ")";
    }
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
