package org.slackwater.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/** {@code cubes [NAME]}: the catalog as JSON ({@code GET /api/cubes} or {@code /api/cubes/NAME}). */
@Command(name = "cubes", mixinStandardHelpOptions = true, description = "List the cubes the server holds, or show one (JSON).")
final class CubesCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Parameters(arity = "0..1", paramLabel = "NAME", description = "Show only this cube.")
  String name;

  @Override
  public Integer call() throws CliFailure {
    ServerConnection c = cli.connection();
    String path = name == null ? "/api/cubes" : "/api/cubes/" + Cli.segment(name);
    return cli.show(c.exchange(c.request(path).GET()));
  }
}
