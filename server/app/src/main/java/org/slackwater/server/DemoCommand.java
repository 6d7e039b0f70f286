package org.slackwater.server;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.ingest.FileDigest;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.region.Region;
import org.slackwater.demo.DemoManifest;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code demo}: generates the invented Wrenmouth estuary scenario if it is not there yet, ingests
 * any file whose cube is missing or stale, loads the regions, and serves. Safe to run again: a
 * second start reuses what the first one built.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
    description = "Build (if needed) and serve the invented Wrenmouth estuary demo scenario.")
public final class DemoCommand implements Callable<Integer> {

  static final List<String> EXAMPLES = List.of(
      "mean chlorophyll over \"Outer Bay\" during 2014 by month",
      "sum rainfall over \"Harle Watershed\" from 2014-01 to 2014-05 by month",
      "p90 turbidity over \"North Intake\" from 2014-06 to 2014-09 by week");

  @Option(names = "--dir", defaultValue = "slackwater-data/demo", description = "Where the demo files and store live (default ${DEFAULT-VALUE}).")
  Path dir;

  @Option(names = "--small", description = "A two-year scenario on coarser grids (for quick trials and tests).")
  boolean small;

  @Option(names = "--no-serve", description = "Prepare the data, then exit without serving.")
  boolean noServe;

  @CommandLine.Mixin
  Main.ServeOptions serve;

  @Override
  public Integer call() throws Exception {
    Path files = dir.resolve(small ? "files-small" : "files");
    Path store = dir.resolve(small ? "store-small" : "store");
    DemoManifest manifest = ensureFiles(files);
    try (Workspace ws = Workspace.open(store, serve.earth)) {
      prepare(ws, manifest);
      if (noServe) {
        return 0;
      }
      try (HttpServer server = HttpServer.start(ws, serve.config())) {
        System.out.println("listening on " + server.url());
        System.out.println(HttpServer.kernelLine());
        System.out.println("try:");
        for (String q : EXAMPLES) {
          System.out.println("  curl -s --data-binary '" + q + "' " + server.url() + "/api/query");
        }
        System.out.flush();
        server.awaitClose();
      }
    }
    return 0;
  }

  private DemoManifest ensureFiles(Path files) throws IOException {
    DemoOptions options = small ? DemoOptions.small() : DemoOptions.full();
    long start = System.nanoTime();
    if (Files.isRegularFile(files.resolve("ground_truth.csv"))) {
      return existing(files);
    }
    System.out.println("generating the demo scenario in " + files + " ...");
    DemoManifest m = DemoScenario.generate(files, options);
    System.out.printf("generated %d files in %.1f s%n", m.netcdfFiles().size() + 3, (System.nanoTime() - start) / 1e9);
    return m;
  }

  private static DemoManifest existing(Path files) throws IOException {
    List<Path> nc;
    try (var s = Files.list(files)) {
      nc = s.filter(p -> p.getFileName().toString().endsWith(".nc")).sorted().toList();
    }
    return new DemoManifest(files, nc, files.resolve("regions.geojson"), files.resolve("stations.csv"), files.resolve("ground_truth.csv"));
  }

  /** Ingests files whose cube is missing or came from different bytes; (re)loads every region. */
  public static void prepare(Workspace ws, DemoManifest manifest) throws IOException, IngestException {
    for (Path f : manifest.netcdfFiles()) {
      String cube = f.getFileName().toString().replaceFirst("\\.nc$", "");
      Optional<CubeEntry> have = ws.catalog().cube(cube);
      if (have.isPresent() && have.get().provenance().sourceFile().equals(f.getFileName().toString())
          && have.get().provenance().sourceSha256().equals(FileDigest.sha256(f))) {
        continue;
      }
      // A regenerated demo file replaces its cube rather than appending to it.
      for (IngestReport r : ws.ingestor().ingest(f, org.slackwater.core.ingest.IngestOptions.defaults().replacingCube())) {
        System.out.printf("ingested %s: %,d values in %.2f s (%.0f MB/s)%n", r.cube(), r.values(), r.seconds(), r.valueMegabytesPerSecond());
      }
    }
    for (Region r : GeoJsonRegions.parse(Files.readString(manifest.regions()))) {
      ws.catalog().putRegion(r);
    }
  }
}
