package org.slackwater.cli;

import java.net.http.HttpRequest;
import java.time.LocalDate;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch evaluate NAME [--from D] [--to D]}: runs a stored watch over a range of days
 * ({@code POST /api/watches/NAME/evaluate?from=&to=&format=}, admin token). The server records the
 * days it is raised and cleared and sends alerts to the watch's destinations; the result (one row
 * per day: state, level, rules holding, the rule values) is delivered like a query result, then
 * the caution is printed on standard error. Without dates the server takes the last 30 days of
 * data. A {@link ProgressLine} shows while the client waits.
 */
@Command(name = "evaluate", mixinStandardHelpOptions = true,
    description = {"Run a stored watch over a range of days; the server records its transitions and sends alerts.",
        "Needs SLACKWATER_TOKEN. Without --from/--to: the last 30 days of data."})
final class WatchEvaluateCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(paramLabel = "NAME", description = "The watch's name.")
  String name;

  @Option(names = "--from", paramLabel = "YYYY-MM-DD", converter = WatchCommand.IsoDate.class, description = "First day.")
  LocalDate from;

  @Option(names = "--to", paramLabel = "YYYY-MM-DD", converter = WatchCommand.IsoDate.class, description = "Last day.")
  LocalDate to;

  @Mixin OutputOptions output;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    if (from != null && to != null && to.isBefore(from)) {
      throw new CliFailure(Cli.LOCAL, "--to " + to + " is before --from " + from + "; swap them");
    }
    String query = (from == null ? "" : "from=" + from + "&") + (to == null ? "" : "to=" + to + "&") + output.parameters(cli.terminal);
    ServerConnection c = cli.connection();
    Answer a;
    try (ProgressLine progress = ProgressLine.start("evaluating " + name, cli.terminal, cli.err, cli.clock)) {
      a = c.exchange(c.adminRequest(WatchCommand.path(name, "/evaluate") + "?" + query).POST(HttpRequest.BodyPublishers.noBody()));
    }
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    int code = output.deliver(a, cli.out, cli.err);
    Caution.printForWatch(a, cli.err);
    return code;
  }
}
