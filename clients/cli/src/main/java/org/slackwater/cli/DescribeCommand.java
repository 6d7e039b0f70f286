package org.slackwater.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/** {@code describe VARIABLE}: the catalog entry of one variable, through the query {@code describe VARIABLE}. */
@Command(name = "describe", mixinStandardHelpOptions = true,
    description = "Show one variable's catalog entry: units, grid, period, calendar, provenance.")
final class DescribeCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Parameters(paramLabel = "VARIABLE", description = "The variable, e.g. chlorophyll.")
  String variable;

  @Mixin OutputOptions output;

  @Override
  public Integer call() throws CliFailure {
    return QueryCommand.run(cli, "describe " + variable, output);
  }
}
