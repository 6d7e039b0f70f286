package org.slackwater.cli;

import java.math.BigDecimal;
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
 * published, or per cube the file left unchanged when the server says so ({@code "change":
 * "unchanged"} with a {@code note}).
 *
 * <p>The server answers only when the ingest is done, so while the client waits it draws a
 * {@link ProgressLine} on standard error, when that is a terminal. Failure modes: the server's
 * refusal, printed as its problem (exit 1, 5 for the token, 6 for a missing file); no answer (3).
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
    Answer a;
    try (ProgressLine progress = ProgressLine.start("ingesting " + path, cli.terminal, cli.err, cli.clock)) {
      a = c.exchange(c.adminRequest("/api/cubes")
          .header("Content-Type", "application/json")
          .POST(HttpRequest.BodyPublishers.ofString("{\"path\": " + FlatJson.quote(path) + "}", StandardCharsets.UTF_8)));
    }
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    Object parsed;
    try {
      parsed = Json.parse(a.text());
    } catch (IllegalArgumentException e) {
      throw new CliFailure(Cli.REFUSED, "the server's ingest receipt is not JSON (" + e.getMessage() + ")");
    }
    List<?> cubes = parsed instanceof List<?> l ? l : List.of();
    if (cubes.isEmpty()) {
      cli.out.println("ingested nothing from " + path);
    }
    for (Object cube : cubes) {
      cli.out.println(receipt(cube));
    }
    return Cli.OK;
  }

  /**
   * One cube of the answer, e.g. {@code ingested rainfall version 2: 1,234,560 values in 0.84 s}
   * ({@code ingested rainfall version 2 (appended): ...} when the server names the change), or
   * {@code rainfall unchanged (version 1): <the server's note>}.
   */
  static String receipt(Object cube) {
    String name = orQuestionMark(Json.text(cube, "cube"));
    String version = orQuestionMark(Json.text(cube, "version"));
    String change = Json.text(cube, "change").toLowerCase(Locale.ROOT);
    if (change.equals("unchanged")) {
      String note = Json.text(cube, "note").strip();
      return name + " unchanged (version " + version + ")" + (note.isEmpty() ? "" : ": " + note);
    }
    String how = change.isEmpty() ? "" : " (" + change + ")";
    String values = Json.member(cube, "values").filter(v -> v instanceof BigDecimal)
        .map(v -> String.format(Locale.ROOT, "%,d", ((BigDecimal) v).longValue())).orElse("?");
    String seconds = Json.member(cube, "seconds").filter(v -> v instanceof BigDecimal)
        .map(v -> String.format(Locale.ROOT, "%.2f", ((BigDecimal) v).doubleValue())).orElse("?");
    return "ingested " + name + " version " + version + how + ": " + values + " values in " + seconds + " s";
  }

  private static String orQuestionMark(String s) {
    return s.isEmpty() ? "?" : s;
  }
}
