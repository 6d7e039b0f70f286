package org.slackwater.bench;

import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import org.locationtech.jts.operation.valid.IsValidOp;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.options.CommandLineOptions;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionWeights;
import org.slackwater.core.region.SphericalArea;

/**
 * Exact weights of a 2,000-vertex estuary outline on a 1000 x 1000 grid (target: under 1 s).
 *
 * <p>The outline is generated deterministically: a star-shaped shore around the mouth of the
 * invented Wrenmouth estuary (44 N, 31 W) with bays, headlands and small-scale noise, about 30 %
 * of the grid inside. Baselines in the same run, on a regular sample of the grid's cells (scale
 * their time by the sample's share): {@code baselinePlainOverlaySample}, one JTS overlay per cell
 * without any shortcut, on every 50th row and column (x 2500), and {@code
 * baselinePreparedOverlaySample}, the former algorithm (prepared covers / intersects, then the
 * overlay for boundary cells), on every 10th row and column (x 100).
 *
 * <p>{@code java -cp slackwater-bench.jar org.slackwater.bench.RegionWeightsBenchmark [JMH options]}
 * runs the three and prints the time per grid, cells per second and the scaled ratios.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 5)
@Measurement(iterations = 5, time = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xmx4g"})
public class RegionWeightsBenchmark {
  static final int N = 1000, VERTICES = 2000;
  /** Every 50th row and column (400 cells) for the plain overlay, every 10th (10,000) for the prepared one. */
  static final int PLAIN_STRIDE = 50, PREPARED_STRIDE = 10;
  static final LatLonGrid GRID = LatLonGrid.regular(43.0, -32.0, 0.002, 0.002, N, N);
  private static final GeometryFactory GF = new GeometryFactory();

  private Polygon estuary;
  private PreparedGeometry prepared;

  @Setup(Level.Trial)
  public void setUp() {
    estuary = estuary();
    prepared = PreparedGeometryFactory.prepare(estuary);
    CellWeights w = RegionWeights.compute(GRID, estuary);
    System.out.printf("%n%d-vertex outline, %d of %d cells weighted (%.1f %%), valid polygon: %b%n",
        estuary.getNumPoints() - 1, w.size(), N * N, 100.0 * w.size() / (N * N), new IsValidOp(estuary).isValid());
  }

  @Benchmark
  public CellWeights weights() {
    return RegionWeights.compute(GRID, estuary);
  }

  /** Baseline: one plain JTS overlay per sampled cell, no prepared test. */
  @Benchmark
  public double baselinePlainOverlaySample() {
    double sum = 0;
    for (int y = PLAIN_STRIDE / 2; y < N; y += PLAIN_STRIDE) {
      for (int x = PLAIN_STRIDE / 2; x < N; x += PLAIN_STRIDE) {
        sum += SphericalArea.of(estuary.intersection(cell(y, x)));
      }
    }
    return sum;
  }

  /** Baseline: the former algorithm on the sampled cells (prepared covers / intersects, then overlay). */
  @Benchmark
  public double baselinePreparedOverlaySample() {
    double sum = 0;
    for (int y = PREPARED_STRIDE / 2; y < N; y += PREPARED_STRIDE) {
      for (int x = PREPARED_STRIDE / 2; x < N; x += PREPARED_STRIDE) {
        Polygon c = cell(y, x);
        if (prepared.covers(c)) {
          sum += SphericalArea.cell(GRID.latLower(y), GRID.latUpper(y), GRID.lonLower(x), GRID.lonUpper(x));
        } else if (prepared.intersects(c)) {
          sum += SphericalArea.of(estuary.intersection(c));
        }
      }
    }
    return sum;
  }

  private static Polygon cell(int y, int x) {
    double s = GRID.latLower(y), n = GRID.latUpper(y), w = GRID.lonLower(x), e = GRID.lonUpper(x);
    return GF.createPolygon(new Coordinate[] {
      new Coordinate(w, s), new Coordinate(e, s), new Coordinate(e, n), new Coordinate(w, n), new Coordinate(w, s)});
  }

  /**
   * The outline: radius around (31.0 W, 44.0 N) as a function of the angle, with three large
   * bays, seven headlands, and a random walk for the small-scale shore (seeded, so the same
   * polygon every run). Star-shaped, hence never self-crossing.
   */
  static Polygon estuary() {
    SplittableRandom rnd = new SplittableRandom(44031);
    Coordinate[] ring = new Coordinate[VERTICES + 1];
    double walk = 0;
    for (int i = 0; i < VERTICES; i++) {
      double a = 2 * Math.PI * i / VERTICES;
      walk = 0.9 * walk + 0.04 * (rnd.nextDouble() - 0.5);
      double r = 0.72 * (1 + 0.18 * Math.sin(3 * a + 0.4) + 0.09 * Math.sin(7 * a + 1.3) + walk);
      ring[i] = new Coordinate(-31.0 + r * Math.cos(a), 44.0 + 0.72 * r * Math.sin(a));
    }
    ring[VERTICES] = ring[0].copy();
    return GF.createPolygon(ring);
  }

  /** Runs the benchmarks (JMH options may follow) and prints the derived numbers. */
  public static void main(String[] args) throws Exception {
    var cli = new CommandLineOptions(args);
    var opts = new OptionsBuilder().parent(cli).include(RegionWeightsBenchmark.class.getName() + "\\.").build();
    String before = loadAverage();
    java.util.Collection<RunResult> results = new Runner(opts).run();
    String after = loadAverage();
    double fast = score(results, "weights"), plain = score(results, "baselinePlainOverlaySample"),
        prepared = score(results, "baselinePreparedOverlaySample");
    double plainScale = (double) PLAIN_STRIDE * PLAIN_STRIDE, preparedScale = (double) PREPARED_STRIDE * PREPARED_STRIDE;
    System.out.printf("%nweights for %d x %d cells: %.1f ms = %.3e cells/s%n", N, N, fast, N * (double) N / (fast * 1e-3));
    System.out.printf("plain per-cell overlay, sample x%.0f: %.0f ms per grid (%.0fx the sweep)%n", plainScale, plain * plainScale, plain * plainScale / fast);
    System.out.printf("former prepared + overlay, sample x%.0f: %.0f ms per grid (%.0fx the sweep)%n", preparedScale, prepared * preparedScale, prepared * preparedScale / fast);
    System.out.printf("load before: %s%nload after:  %s%n", before, after);
  }

  static double score(java.util.Collection<RunResult> results, String method) {
    return results.stream().filter(r -> r.getParams().getBenchmark().endsWith("." + method))
        .mapToDouble(r -> r.getPrimaryResult().getScore()).findFirst().orElse(Double.NaN);
  }

  /** The 1, 5 and 15 minute load averages, as uptime prints them. */
  static String loadAverage() {
    try {
      return java.nio.file.Files.readString(java.nio.file.Path.of("/proc/loadavg")).trim();
    } catch (java.io.IOException e) {
      return "unknown (" + e.getMessage() + ")";
    }
  }
}
