package org.slackwater.cli;

import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch channels NAME FILE}: sets where a watch's alerts go ({@code PUT
 * /api/watches/NAME/channels}, the body the file's JSON array of webhook and e-mail destinations,
 * admin token), replacing the destinations it had; {@code []} removes them all. The file is checked
 * to be JSON here first, so a syntax error is reported with the file's line and column (exit 4);
 * the server checks the destinations themselves (exit 1 with its message).
 */
@Command(name = "channels", mixinStandardHelpOptions = true,
    description = {"Set where a watch's alerts go: FILE is a JSON array of webhook and e-mail destinations",
        "('-': standard input; [] removes them). Needs SLACKWATER_TOKEN."})
final class WatchChannelsCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(index = "0", paramLabel = "NAME", description = "The watch's name.")
  String name;

  @Parameters(index = "1", paramLabel = "FILE|-", description = "The destinations, e.g. [{\"id\": \"ops\", \"kind\": \"webhook\", \"url\": ..., \"secret\": ...}]")
  String file;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    String source = TextInput.label(file, "channels file");
    String json = TextInput.read(file, cli.in, "channels file");
    Object parsed;
    try {
      parsed = Json.parse(json);
    } catch (IllegalArgumentException e) {
      throw new CliFailure(Cli.LOCAL, source + " is not JSON: " + e.getMessage());
    }
    if (!(parsed instanceof List<?>)) {
      throw new CliFailure(Cli.LOCAL, source + " must hold a JSON array of destinations, [ {...}, ... ], or [] for none");
    }
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.adminRequest(WatchCommand.path(name, "/channels"))
        .header("Content-Type", "application/json")
        .PUT(HttpRequest.BodyPublishers.ofString(json, StandardCharsets.UTF_8)));
    if (!a.ok()) {
      return cli.refusedAdmin(a, c);
    }
    Object w = WatchShowCommand.parse(a);
    List<Object> stored = Json.array(w, "channels");
    cli.out.println("watch '" + Json.text(w, "name") + "' sends alerts to " + (stored.isEmpty() ? "no destinations" : stored.size() + " destination(s):"));
    for (Object ch : stored) {
      cli.out.println("  " + Json.scalar(ch));
    }
    cli.out.flush();
    Caution.printForWatch(a, cli.err);
    return Cli.OK;
  }
}
