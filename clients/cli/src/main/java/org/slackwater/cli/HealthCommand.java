package org.slackwater.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.ParentCommand;

/** {@code health}: whether the server answers, with its cube and region counts ({@code GET /api/health}). */
@Command(name = "health", mixinStandardHelpOptions = true, description = "Check that the server answers (JSON).")
final class HealthCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Override
  public Integer call() throws CliFailure {
    ServerConnection c = cli.connection();
    return cli.show(c.exchange(c.request("/api/health").GET()));
  }
}
