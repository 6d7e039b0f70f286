package org.slackwater.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/** {@code watch list}: the stored watches ({@code GET /api/watches}) as a table of name, version and when stored, or the server's JSON. */
@Command(name = "list", mixinStandardHelpOptions = true, description = "List the stored watches: name, version, when stored.")
final class WatchListCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Option(names = "--format", defaultValue = "text", paramLabel = "text|json",
      description = "text (an aligned table, default) or json (the server's answer as sent).")
  CatalogCommand.Format format = CatalogCommand.Format.text;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.request("/api/watches").GET());
    if (!a.ok()) {
      return Problems.print(a.text(), a.status(), cli.err);
    }
    if (format == CatalogCommand.Format.json) {
      cli.show(a);
    } else {
      List<List<String>> rows = new ArrayList<>();
      for (Object w : Json.array(WatchShowCommand.parse(a), "watches")) {
        rows.add(List.of(Json.text(w, "name"), Json.text(w, "version"), Json.text(w, "created")));
      }
      if (rows.isEmpty()) {
        cli.out.println("no watches stored; 'watch create FILE' stores one");
      } else {
        cli.out.print(new CsvTable(List.of("watch", "version", "stored"), rows).render());
      }
      cli.out.flush();
    }
    Caution.printForWatch(a, cli.err);
    return Cli.OK;
  }
}
