package org.slackwater.server;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** The server's command line: {@code serve}, {@code demo}, {@code ingest}, {@code bench-ingest}. */
@Command(name = "slackwater", mixinStandardHelpOptions = true, version = "Slackwater 0.1.0",
    description = "Water-quality analytics server for gridded environmental data.",
    subcommands = {Main.Serve.class, DemoCommand.class, Main.Ingest.class, IngestBenchmark.class, HttpBenchmark.class})
public final class Main implements Runnable {

  public static void main(String[] args) {
    CommandLine cl = new CommandLine(new Main()).setCaseInsensitiveEnumValuesAllowed(true);
    // Failures the user can act on are one line, not a stack trace.
    cl.setExecutionExceptionHandler((ex, line, parsed) -> {
      System.err.println("error: " + ex.getMessage());
      return ex instanceof IngestException ? 2 : 1;
    });
    System.exit(cl.execute(args));
  }

  @Override
  public void run() {
    new CommandLine(this).usage(System.out);
  }

  /** Options shared by the commands that serve. */
  static final class ServeOptions {
    @Option(names = "--host", defaultValue = "127.0.0.1", description = "Address to listen on (default ${DEFAULT-VALUE}).")
    String host;

    @Option(names = "--port", defaultValue = "8080", description = "Port to listen on; 0 picks a free one (default ${DEFAULT-VALUE}).")
    int port;

    @Option(names = "--max-body", defaultValue = "1048576", description = "Largest request body in bytes (default ${DEFAULT-VALUE}).")
    int maxBody;

    @Option(names = "--admin-token", description = "Bearer token for admin endpoints (default: $SLACKWATER_ADMIN_TOKEN; none = admin off).")
    String adminToken;

    @Option(names = "--ingest-root", description = "Directory POST /api/cubes may ingest files from (default: off).")
    Path ingestRoot;

    @Option(names = "--earth", defaultValue = "sphere",
        description = "Figure of the Earth for cell areas: sphere (radius 6371000 m) or wgs84 (default ${DEFAULT-VALUE}).")
    org.slackwater.core.region.AreaModel earth;

    ServerConfig config() {
      String token = adminToken != null ? adminToken : System.getenv("SLACKWATER_ADMIN_TOKEN");
      return new ServerConfig(host, port, maxBody, Optional.ofNullable(token).filter(s -> !s.isBlank()), Optional.ofNullable(ingestRoot));
    }
  }

  @Command(name = "serve", mixinStandardHelpOptions = true, description = "Serve an existing data directory.")
  static final class Serve implements Callable<Integer> {
    @Option(names = "--data", required = true, description = "The data directory (catalog and cubes).")
    Path data;

    @CommandLine.Mixin
    ServeOptions serve;

    @Option(names = "--drop-folder", paramLabel = "DIR",
        description = "Directory watched for new files to ingest or append; done/ and failed/ inside it receive them (default: off).")
    Path dropFolder;

    @Override
    public Integer call() throws Exception {
      ServerConfig config = dropFolder == null ? serve.config() : serve.config().withDropFolder(dropFolder);
      try (Workspace ws = Workspace.open(data, serve.earth); HttpServer server = HttpServer.start(ws, config);
          DropFolder drop = config.dropFolder().isPresent() ? DropFolder.start(ws.ingestor(), config.dropFolder().get()) : null) {
        System.out.println("listening on " + server.url());
        System.out.println(HttpServer.kernelLine());
        if (drop != null) {
          System.out.println("watching the drop folder " + drop.directory());
        }
        server.awaitClose();
      }
      return 0;
    }
  }

  @Command(name = "ingest", mixinStandardHelpOptions = true, description = "Ingest CF-NetCDF files into a data directory.")
  static final class Ingest implements Callable<Integer> {
    @Option(names = "--data", required = true, description = "The data directory (catalog and cubes).")
    Path data;

    @Option(names = "--variable", description = "Only this variable of each file.")
    String variable;

    @Option(names = "--reprocessed", description = "The files are reprocessed versions: their values replace the days the cube holds.")
    boolean reprocessed;

    @Option(names = "--replace-cube", description = "Replace the whole cube with the file instead of appending to it.")
    boolean replaceCube;

    @Parameters(arity = "1..*", description = "Files to ingest.")
    List<Path> files;

    @Override
    public Integer call() throws Exception {
      int failed = 0;
      try (Workspace ws = Workspace.open(data)) {
        for (Path f : files) {
          try {
            org.slackwater.core.ingest.IngestOptions o = org.slackwater.core.ingest.IngestOptions.of(Optional.ofNullable(variable));
            o = reprocessed ? o.asReprocessed() : o;
            o = replaceCube ? o.replacingCube() : o;
            for (IngestReport r : ws.ingestor().ingest(f, o)) {
              System.out.printf("%s: %s%n", f.getFileName(), r.summary());
            }
          } catch (IngestException e) {
            System.err.println("error: " + e.getMessage());
            failed++;
          }
        }
      }
      return failed == 0 ? 0 : 1;
    }
  }
}
