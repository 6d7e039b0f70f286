package org.slackwater.cli;

import java.io.IOException;
import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code regions}: the regions as GeoJSON ({@code GET /api/regions}); {@code regions add NAME
 * FILE}: stores a region ({@code PUT /api/regions/NAME} with the admin token).
 */
@Command(name = "regions", mixinStandardHelpOptions = true, description = {"List the regions (GeoJSON).", "'regions add NAME FILE.geojson' stores one."},
    subcommands = RegionsCommand.Add.class)
final class RegionsCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Override
  public Integer call() throws CliFailure {
    ServerConnection c = cli.connection();
    return cli.show(c.exchange(c.request("/api/regions").GET()));
  }

  /** {@code regions add NAME FILE}. */
  @Command(name = "add", mixinStandardHelpOptions = true,
      description = {"Store a region under NAME (replacing one of that name). Needs SLACKWATER_TOKEN.",
          "FILE is a GeoJSON Feature or geometry: a Polygon or MultiPolygon, or a Point with a radius_m property."})
  static final class Add implements Callable<Integer> {
    @ParentCommand RegionsCommand regions;

    @Parameters(index = "0", paramLabel = "NAME", description = "The region's name in queries, e.g. \"Outer Bay\".")
    String name;

    @Parameters(index = "1", paramLabel = "FILE.geojson", description = "The region's outline.")
    Path file;

    @Override
    public Integer call() throws CliFailure {
      Cli cli = regions.cli;
      String geoJson;
      try {
        geoJson = Files.readString(file, StandardCharsets.UTF_8);
      } catch (IOException e) {
        throw new CliFailure(Cli.LOCAL, "cannot read the region file '" + file + "' (" + Cli.describe(e) + ")", e);
      }
      ServerConnection c = cli.connection();
      Answer a = c.exchange(c.adminRequest("/api/regions/" + Cli.segment(name))
          .header("Content-Type", "application/geo+json")
          .PUT(HttpRequest.BodyPublishers.ofString(geoJson, StandardCharsets.UTF_8)));
      if (!a.ok()) {
        return cli.refusedAdmin(a, c);
      }
      String stored = FlatJson.string(a.text(), "region").orElse(name);
      String area = FlatJson.number(a.text(), "area_km2")
          .map(s -> String.format(Locale.ROOT, " (%.3f km2)", Double.parseDouble(s))).orElse("");
      cli.out.println("stored region '" + stored + "'" + area);
      return Cli.OK;
    }
  }
}
