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
@Fork(value = 1, jvmArgsAppend = {"-Xmx1g"})
public class ParseBenchmark {
  static final String TYPICAL = "p90 turbidity over circle(44.10 N, 31.20 W, 3 km) clipped to \"Mid Reach\" "
      + "from 2014-06-01 to 2014-09-30 by week in FNU as percentile against 2006 to 2020 with coverage at least 60 %";

  @Benchmark
  public Script typicalStatement() {
    return QueryParser.parse(TYPICAL);
  }

  @Benchmark
  public Script baselineListVariables() {
    return QueryParser.parse("list variables");
  }
}
