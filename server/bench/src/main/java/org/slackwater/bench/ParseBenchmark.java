package org.slackwater.bench;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.slackwater.query.QueryParser;
import org.slackwater.query.ast.Script;

/**
 * Parsing a typical statement (target: median below 1 ms after warm-up). The baseline in the same
 * run is the trivial {@code list variables}, so the ratio shows what the clauses cost.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xmx1g", "--add-opens=java.base/java.nio=ALL-UNNAMED", "--add-opens=java.base/sun.nio.ch=ALL-UNNAMED", "--add-opens=java.base/java.lang=ALL-UNNAMED", "--add-opens=java.base/java.util=ALL-UNNAMED", "--add-opens=java.base/java.lang.invoke=ALL-UNNAMED"})
public class ParseBenchmark {
  static final String TYPICAL = "p90 turbidity over circle(44.10 N, 31.20 W, 3 km) clipped to \"Mid Reach\" "
      + "from 2014-06-01 to 2014-09-30 by week in FNU as percentile against 2006 to 2020 with coverage at least 60 %";

  private java.nio.file.Path dir;
  private org.slackwater.core.Workspace ws;

  /** A small synthetic cube and a region, so that analysis resolves real names, weights and dates. */
  @org.openjdk.jmh.annotations.Setup
  public void setUp() throws Exception {
    dir = java.nio.file.Files.createTempDirectory("slackwater-bench-parse");
    ws = org.slackwater.core.Workspace.open(dir);
    java.nio.file.Path marker = java.nio.file.Files.writeString(dir.resolve("synthetic.bench"), "synthetic");
    new org.slackwater.core.ingest.Ingestor(java.util.List.of(new AreaMeanBenchmark.Synthetic(730)), ws.catalog(), ws.store(),
        org.slackwater.core.store.ChunkLayout.DEFAULT).ingest(marker, java.util.Optional.empty());
    ws.catalog().putRegion(org.slackwater.core.region.GeoJsonRegions.parseNamed("Bench Bay",
        "{\"type\":\"Polygon\",\"coordinates\":[[[-31.9,43.6],[-30.4,43.9],[-30.7,45.9],[-31.6,45.6],[-31.9,43.6]]]}"));
    ws.engine().analyze(ANALYSED);
  }

  @org.openjdk.jmh.annotations.TearDown
  public void tearDown() throws Exception {
    ws.close();
    try (var w = java.nio.file.Files.walk(dir)) {
      w.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  static final String ANALYSED = "p90 synthetic over \"Bench Bay\" from 2006-03-01 to 2006-09-30 by week "
      + "as percentile against 2006 to 2006 with coverage at least 60 %";

  /** Parse + analyse (names, region weights from the cache, dates, units), no computation. */
  @Benchmark
  public java.util.List<Object> parseAndAnalyse() {
    return ws.engine().analyze(ANALYSED);
  }

  @Benchmark
  public Script typicalStatement() {
    return QueryParser.parse(TYPICAL);
  }

  @Benchmark
  public Script baselineListVariables() {
    return QueryParser.parse("list variables");
  }
}
