package org.slackwater.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/** {@code watch delete NAME}: removes a stored watch and its recorded transitions ({@code DELETE /api/watches/NAME}, admin token). */
@Command(name = "delete", mixinStandardHelpOptions = true, description = "Remove a stored watch. Needs SLACKWATER_TOKEN.")
final class WatchDeleteCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(paramLabel = "NAME", description = "The watch's name, e.g. \"North Intake bloom risk\".")
  String name;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.adminRequest(WatchCommand.path(name, "")).DELETE());
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    cli.out.println("deleted watch '" + name + "'");
    cli.out.flush();
    return Cli.OK;
  }
}
