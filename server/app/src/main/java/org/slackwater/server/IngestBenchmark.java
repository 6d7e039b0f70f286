package org.slackwater.server;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.OperatingSystemMXBean;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;

/**
 * {@code bench-ingest}: ingests the demo scenario's NetCDF files into a fresh store and prints
 * throughput in MB/s of float32 values (values x 4 bytes / wall time, per cube and overall), the
 * process CPU time of each round's ingests, and peak memory while ingesting (heap pools' peaks,
 * reset before each file, and the Arrow allocator's peak).
 *
 * <p>Beside each cube it prints a baseline measured in the same run on the same file: NetCDF-Java's
 * plain {@code Variable.read()} of the whole variable into memory (file opened beforehand, no
 * conversion, nothing written), in MB/s of the same float32-equivalent values, and the ingest's
 * throughput as a ratio of it. A ratio of 1 means the ingest (decode, footprint, chunk encoding,
 * SHA-256, fsync, publish) costs as much as merely reading the values the way NetCDF-Java's
 * own API reads them; above 1, less. A benchmark, not a test: the numbers depend on the machine
 * and on what else runs on it, and are read by a person.
 */
@Command(name = "bench-ingest", mixinStandardHelpOptions = true,
    description = "Benchmark: ingest the demo files and print MB/s of values, a Variable.read() baseline and peak memory.")
final class IngestBenchmark implements Callable<Integer> {

  @Option(names = "--files", description = "Directory of demo files (default: generate the full scenario into a temporary directory).")
  Path files;

  @Option(names = "--rounds", defaultValue = "2", description = "Ingest rounds; the first warms the JIT (default ${DEFAULT-VALUE}).")
  int rounds;

  @Override
  public Integer call() throws Exception {
    Path tmp = Files.createTempDirectory("slackwater-bench-");
    try {
      Path dir = files;
      if (dir == null) {
        dir = tmp.resolve("files");
        DemoScenario.generate(dir, DemoOptions.full());
      }
      List<Path> nc;
      try (Stream<Path> s = Files.list(dir)) {
        nc = s.filter(p -> p.toString().endsWith(".nc")).sorted().toList();
      }
      long heapPeak = 0;
      for (int round = 1; round <= rounds; round++) {
        Path store = tmp.resolve("store-" + round);
        long values = 0;
        double seconds = 0;
        long baselineValues = 0;
        double baselineSeconds = 0;
        double cpu = 0;
        try (Workspace ws = Workspace.open(store)) {
          for (Path f : nc) {
            resetHeapPeaks(); // the baseline's whole-variable arrays are not the ingest's memory
            long cpu0 = processCpuNanos();
            List<IngestReport> reports = ws.ingestor().ingest(f, Optional.empty());
            cpu += (processCpuNanos() - cpu0) / 1e9;
            heapPeak = Math.max(heapPeak, heapPeaks());
            for (IngestReport r : reports) {
              values += r.values();
              seconds += r.seconds();
              String variable = ws.catalog().cube(r.cube()).orElseThrow().provenance().sourceVariable();
              Baseline b = baseline(f, variable);
              baselineValues += b.values();
              baselineSeconds += b.seconds();
              System.out.printf("round %d  %-20s %,14d values %7.2f s %8.1f MB/s   Variable.read() %8.1f MB/s   ratio %5.2f%n",
                  round, r.cube(), r.values(), r.seconds(), r.valueMegabytesPerSecond(), b.megabytesPerSecond(),
                  r.valueMegabytesPerSecond() / b.megabytesPerSecond());
            }
          }
          double mbps = values * 4.0 / 1e6 / seconds;
          double baseMbps = baselineValues * 4.0 / 1e6 / baselineSeconds;
          System.out.printf("round %d  total %,d values in %.2f s: %.1f MB/s of values (process CPU %.2f s); "
                  + "Variable.read() %.1f MB/s; ratio %.2f; Arrow allocator peak %.1f MB%n",
              round, values, seconds, mbps, cpu, baseMbps, mbps / baseMbps, ws.allocator().getPeakMemoryAllocation() / 1e6);
        }
      }
      System.out.printf("peak heap while ingesting (sum of pool peaks) %.1f MB; max heap %.1f MB; %d processors%n", heapPeak / 1e6,
          Runtime.getRuntime().maxMemory() / 1e6, Runtime.getRuntime().availableProcessors());
      return 0;
    } finally {
      try (Stream<Path> w = Files.walk(tmp)) {
        w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
      }
    }
  }

  /** How long NetCDF-Java's {@code Variable.read()} of the whole variable takes (the open is not timed). */
  private static Baseline baseline(Path file, String variable) throws Exception {
    try (NetcdfFile nc = NetcdfFile.open(file.toString())) {
      Variable v = nc.findVariable(NetcdfFile.makeValidPathName(variable));
      if (v == null) {
        throw new IllegalStateException("file " + file + " lost variable " + variable + " during the benchmark");
      }
      long t0 = System.nanoTime();
      long n = v.read().getSize();
      return new Baseline(n, (System.nanoTime() - t0) / 1e9);
    }
  }

  private record Baseline(long values, double seconds) {
    double megabytesPerSecond() {
      return values * 4.0 / 1e6 / seconds;
    }
  }

  private static long heapPeaks() {
    long sum = 0;
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      if (pool.getType() == MemoryType.HEAP) {
        sum += pool.getPeakUsage().getUsed();
      }
    }
    return sum;
  }

  private static void resetHeapPeaks() {
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      if (pool.getType() == MemoryType.HEAP) {
        pool.resetPeakUsage();
      }
    }
  }

  /** CPU time of the whole process (all threads, JIT and GC included), or 0 where the JVM does not say. */
  private static long processCpuNanos() {
    OperatingSystemMXBean os = ManagementFactory.getOperatingSystemMXBean();
    if (os instanceof com.sun.management.OperatingSystemMXBean sun) {
      return Math.max(0, sun.getProcessCpuTime());
    }
    return 0;
  }
}
