package org.slackwater.cli;

import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code ingest PATH}: asks the server to ingest a file under its ingest root ({@code POST
 * /api/cubes} with {@code {"path": PATH}} and the admin token) and prints one line per cube
 * published.
 */
@Command(name = "ingest", mixinStandardHelpOptions = true,
    description = {"Ingest a CF-NetCDF file that lies under the server's --ingest-root. Needs SLACKWATER_TOKEN.",
        "The file is read by the server, not sent: PATH is relative to the server's ingest root."})
final class IngestCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Parameters(paramLabel = "PATH", description = "The file, relative to the server's ingest root, e.g. rainfall.nc.")
  String path;

  @Override
  public Integer call() throws CliFailure {
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.adminRequest("/api/cubes")
        .header("Content-Type", "application/json")
        .POST(HttpRequest.BodyPublishers.ofString("{\"path\": " + FlatJson.quote(path) + "}", StandardCharsets.UTF_8)));
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    List<String> cubes = FlatJson.objects(a.text());
    if (cubes.isEmpty()) {
      cli.out.println("ingested nothing from " + path);
    }
    for (String cube : cubes) {
      cli.out.println(receipt(cube));
    }
    return Cli.OK;
  }

  /** One published cube, e.g. {@code ingested rainfall version 2: 1,234,560 values in 0.84 s}. */
  static String receipt(String cube) {
    String name = FlatJson.string(cube, "cube").orElse("?");
    String version = FlatJson.number(cube, "version").orElse("?");
    String values = FlatJson.number(cube, "values").map(v -> String.format(Locale.ROOT, "%,d", Long.parseLong(v))).orElse("?");
    String seconds = FlatJson.number(cube, "seconds").map(s -> String.format(Locale.ROOT, "%.2f", Double.parseDouble(s))).orElse("?");
    return "ingested " + name + " version " + version + ": " + values + " values in " + seconds + " s";
  }
}
