package org.slackwater.cli;

import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch create FILE|-}: checks and stores a watch ({@code POST /api/watches}, the body the
 * watch text, admin token) and prints its name and version; storing a watch under a name in use
 * replaces it with the next version. A mistake in the text is printed with line, column and caret
 * (exit 2), as for queries.
 */
@Command(name = "create", mixinStandardHelpOptions = true,
    description = {"Check and store a watch from FILE.swq ('-': standard input). Needs SLACKWATER_TOKEN.",
        "A watch of the same name is replaced by the next version."})
final class WatchCreateCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(paramLabel = "FILE|-", description = "The watch text, e.g. watch \"...\" over \"North Intake\" when ...")
  String file;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    String text = TextInput.read(file, cli.in, "watch file");
    if (text.isBlank()) {
      throw new CliFailure(Cli.LOCAL, TextInput.label(file, "watch file") + " is empty; write the watch as: watch \"NAME\" over \"REGION\" when ...");
    }
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.adminRequest("/api/watches")
        .header("Content-Type", "text/plain; charset=utf-8")
        .POST(HttpRequest.BodyPublishers.ofString(text, StandardCharsets.UTF_8)));
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    Object stored = WatchShowCommand.parse(a);
    String version = Json.text(stored, "version");
    String replaced = "";
    try {
      int v = Integer.parseInt(version);
      replaced = v > 1 ? " (replaces version " + (v - 1) + ")" : "";
    } catch (NumberFormatException e) {
      // The server always sends a number; without one there is just nothing to add.
    }
    cli.out.println("stored watch '" + Json.text(stored, "name") + "' version " + version + replaced);
    cli.out.flush();
    Caution.printForWatch(a, cli.err);
    return Cli.OK;
  }
}
