package org.slackwater.cli;

import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch backtest NAME --events FILE [--date-column NAME] [--lead DAYS]}: runs a stored watch
 * over its whole record against past event dates ({@code POST /api/watches/NAME/backtest?lead=&format=},
 * the body one date per line). Nothing is recorded or sent. The events file is read and checked
 * here first ({@link EventDates}), so a bad line is reported with the file's line number before
 * anything is sent (exit 4). The result (each event caught or missed with its lead, each firing a
 * lead or a false alarm) is delivered like a query result, then the caution. A backtest runs the
 * watch over the whole record, so a {@link ProgressLine} shows while the client waits.
 */
@Command(name = "backtest", mixinStandardHelpOptions = true,
    description = {"Run a stored watch over its record against past events: which it caught, how early, false alarms.",
        "Nothing is recorded or sent."})
final class WatchBacktestCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(paramLabel = "NAME", description = "The watch's name.")
  String name;

  @Option(names = "--events", required = true, paramLabel = "FILE|-",
      description = {"Event dates: one YYYY-MM-DD per line, or a CSV whose first column (or --date-column) holds them.",
          "Blank lines and lines starting with # are skipped. '-': standard input."})
  String events;

  @Option(names = "--date-column", paramLabel = "NAME",
      description = "The CSV column holding the dates, named in the header row, e.g. onset for ground_truth.csv.")
  String dateColumn;

  @Option(names = "--lead", paramLabel = "DAYS",
      description = "How many days before an event a firing counts as a lead (server default if not given).")
  Integer lead;

  @Mixin OutputOptions output;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    if (lead != null && lead < 0) {
      throw new CliFailure(Cli.LOCAL, "--lead is a number of days before the event and cannot be negative");
    }
    String source = TextInput.label(events, "events file");
    EventDates dates = EventDates.read(TextInput.read(events, cli.in, "events file"), source, Optional.ofNullable(dateColumn));
    String query = (lead == null ? "" : "lead=" + lead + "&") + output.parameters(cli.terminal);
    ServerConnection c = cli.connection();
    Answer a;
    try (ProgressLine progress = ProgressLine.start("backtesting " + name, cli.terminal, cli.err, cli.clock)) {
      a = c.exchange(c.request(WatchCommand.path(name, "/backtest") + "?" + query)
          .header("Content-Type", "text/plain; charset=utf-8")
          .POST(HttpRequest.BodyPublishers.ofString(dates.body(), StandardCharsets.UTF_8)));
    }
    if (!a.ok()) {
      return Problems.print(a.text(), a.status(), cli.err);
    }
    int code = output.deliver(a, cli.out, cli.err);
    Caution.printForWatch(a, cli.err);
    return code;
  }
}
