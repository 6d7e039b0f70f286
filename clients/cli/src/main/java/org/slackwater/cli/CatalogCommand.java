package org.slackwater.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/**
 * {@code catalog}: the cubes the server holds ({@code GET /api/cubes}) as a table for people: name,
 * unit, number of steps, first and last step, calendar, grid size and version. {@code --format
 * json} prints the server's JSON unchanged (what {@code cubes} prints).
 *
 * <p>Failure modes: the server's refusal (exit 1) or unreachability (3); an answer that is not the
 * expected JSON array is exit 1 with what was wrong, never a stack trace.
 */
@Command(name = "catalog", mixinStandardHelpOptions = true,
    description = {"List the cubes the server holds as a table: unit, steps, period, calendar, grid, version.",
        "'describe VARIABLE' shows one in full."})
final class CatalogCommand implements Callable<Integer> {
  enum Format { text, json }

  static final List<String> HEADER = List.of("cube", "units", "steps", "first", "last", "calendar", "grid", "version");

  @ParentCommand Cli cli;

  @Option(names = "--format", defaultValue = "text", paramLabel = "text|json",
      description = "text (an aligned table, default) or json (the server's answer as sent).")
  Format format = Format.text;

  @Override
  public Integer call() throws CliFailure {
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.request("/api/cubes").GET());
    if (!a.ok() || format == Format.json) {
      return cli.show(a);
    }
    cli.out.print(table(a.text()).render());
    cli.out.flush();
    return Cli.OK;
  }

  /** The table of a {@code GET /api/cubes} answer. */
  static CsvTable table(String json) throws CliFailure {
    Object parsed;
    try {
      parsed = Json.parse(json);
    } catch (IllegalArgumentException e) {
      throw new CliFailure(Cli.REFUSED, "the server's catalog is not JSON (" + e.getMessage() + "); try 'cubes' to see it as sent");
    }
    if (!(parsed instanceof List<?> cubes)) {
      throw new CliFailure(Cli.REFUSED, "the server's catalog is not a JSON array of cubes; try 'cubes' to see it as sent");
    }
    List<List<String>> rows = new ArrayList<>();
    for (Object cube : cubes) {
      Object grid = Json.member(cube, "grid").orElse(null);
      String size = grid == null ? "" : Json.text(grid, "rows") + " x " + Json.text(grid, "columns");
      rows.add(List.of(Json.text(cube, "name"), Json.text(cube, "units"), Json.text(cube, "steps"), Json.text(cube, "first"),
          Json.text(cube, "last"), Json.text(cube, "calendar"), size, Json.text(cube, "version")));
    }
    return new CsvTable(HEADER, rows);
  }
}
