package org.slackwater.cli;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code query}: runs query text ({@code POST /api/query}) and prints or saves the result in the
 * format asked for. A result that carries a caution (a watch statement's check) gets it printed on
 * standard error as well.
 */
@Command(name = "query", mixinStandardHelpOptions = true,
    description = {"Run a query and print (or save) the result.",
        "The query is TEXT, the contents of -f FILE.swq, or standard input (no TEXT, or TEXT '-')."})
final class QueryCommand implements Callable<Integer> {
  private static final int NOT_ACCEPTABLE = 406;

  @ParentCommand Cli cli;

  @Parameters(arity = "0..1", paramLabel = "TEXT", description = "The query text; '-' or nothing reads standard input.")
  String text;

  @Option(names = {"-f", "--file"}, paramLabel = "FILE.swq", description = "Read the query from a file.")
  Path file;

  @Mixin OutputOptions output;

  @Override
  public Integer call() throws CliFailure {
    return run(cli, QueryText.resolve(text, file, cli.in), output);
  }

  /** Sends {@code query} and delivers the answer as {@code output} says; returns the exit code. */
  static int run(Cli cli, String query, OutputOptions output) throws CliFailure {
    ServerConnection c = cli.connection();
    java.net.http.HttpRequest.Builder request = c.request("/api/query?" + output.parameters(cli.terminal))
        .header("Content-Type", "text/plain; charset=utf-8")
        .POST(java.net.http.HttpRequest.BodyPublishers.ofString(query, StandardCharsets.UTF_8));
    Answer a;
    if (output.table) {
      a = c.exchange(request);
    } else {
      Arrival arrival = c.exchangeStreaming(request);
      if (arrival instanceof ServerConnection.Streamed s) {
        return output.deliver(s, cli.out, cli.err);
      }
      a = (Answer) arrival;
    }
    if (!a.ok()) {
      int code = Problems.print(a.text(), a.status(), cli.err);
      if (a.status() == NOT_ACCEPTABLE && output.format == OutputOptions.Format.csv) {
        // The server's own advice names its URL parameter; on the command line it is an option.
        cli.err.println("hint: CSV holds one table; run several statements with --format json");
      }
      return code;
    }
    int code = output.deliver(a, cli.out, cli.err);
    Caution.printIfAny(a, cli.err);
    return code;
  }
}
