package org.slackwater.server;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
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

/**
 * {@code bench-ingest}: ingests the demo scenario's NetCDF files into a fresh store and prints
 * throughput in MB/s of float32 values (values x 4 bytes / wall time, per file and overall) and
 * peak memory (heap pools' peak, and the Arrow allocator's peak). A benchmark, not a test: the
 * numbers depend on the machine and are read by a person.
 */
@Command(name = "bench-ingest", mixinStandardHelpOptions = true,
    description = "Benchmark: ingest the demo files and print MB/s of values and peak memory.")
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
      for (int round = 1; round <= rounds; round++) {
        Path store = tmp.resolve("store-" + round);
        long values = 0;
        double seconds = 0;
        try (Workspace ws = Workspace.open(store)) {
          for (Path f : nc) {
            for (IngestReport r : ws.ingestor().ingest(f, Optional.empty())) {
              values += r.values();
              seconds += r.seconds();
              System.out.printf("round %d  %-20s %,14d values %7.2f s %8.1f MB/s%n", round, r.cube(), r.values(), r.seconds(), r.valueMegabytesPerSecond());
            }
          }
          System.out.printf("round %d  total %,d values in %.2f s: %.1f MB/s of values; Arrow allocator peak %.1f MB%n",
              round, values, seconds, values * 4.0 / 1e6 / seconds, ws.allocator().getPeakMemoryAllocation() / 1e6);
        }
      }
      long heapPeak = 0;
      for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
        if (pool.getType() == MemoryType.HEAP) {
          heapPeak += pool.getPeakUsage().getUsed();
        }
      }
      System.out.printf("peak heap (sum of pool peaks) %.1f MB; max heap %.1f MB%n", heapPeak / 1e6, Runtime.getRuntime().maxMemory() / 1e6);
      return 0;
    } finally {
      try (Stream<Path> w = Files.walk(tmp)) {
        w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
      }
    }
  }
}
