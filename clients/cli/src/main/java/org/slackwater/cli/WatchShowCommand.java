package org.slackwater.cli;

import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch show NAME}: one stored watch ({@code GET /api/watches/NAME}) for people: name,
 * version, when stored, the day automatic runs reached, the alert destinations (the server hides
 * secrets), the definition, and the recorded transitions with the values that triggered them; or
 * the server's JSON with {@code --format json}.
 */
@Command(name = "show", mixinStandardHelpOptions = true,
    description = "Show a stored watch: definition, version, alert destinations, recorded transitions.")
final class WatchShowCommand implements Callable<Integer> {
  @ParentCommand WatchCommand watch;

  @Parameters(paramLabel = "NAME", description = "The watch's name, e.g. \"North Intake bloom risk\".")
  String name;

  @Option(names = "--format", defaultValue = "text", paramLabel = "text|json",
      description = "text (for reading, default) or json (the server's answer as sent).")
  CatalogCommand.Format format = CatalogCommand.Format.text;

  @Override
  public Integer call() throws CliFailure {
    Cli cli = watch.cli;
    ServerConnection c = cli.connection();
    Answer a = c.exchange(c.request(WatchCommand.path(name, "")).GET());
    if (!a.ok()) {
      return Problems.print(a.text(), a.status(), cli.err);
    }
    if (format == CatalogCommand.Format.json) {
      cli.show(a);
    } else {
      cli.out.print(render(parse(a)));
      cli.out.flush();
    }
    Caution.printForWatch(a, cli.err);
    return Cli.OK;
  }

  /** A JSON answer, or exit 1 saying it is not JSON. */
  static Object parse(Answer a) throws CliFailure {
    try {
      return Json.parse(a.text());
    } catch (IllegalArgumentException e) {
      throw new CliFailure(Cli.REFUSED, "the server's answer is not JSON (" + e.getMessage() + ")");
    }
  }

  /** The text view of a watch document. */
  static String render(Object w) {
    StringBuilder b = new StringBuilder();
    b.append("watch:         ").append(Json.text(w, "name")).append('\n');
    b.append("version:       ").append(Json.text(w, "version")).append('\n');
    b.append("stored:        ").append(Json.text(w, "created")).append('\n');
    String to = Json.text(w, "evaluated_to");
    b.append("evaluated to:  ").append(to.isEmpty() ? "(no automatic run yet)" : to).append('\n');
    List<Object> channels = Json.array(w, "channels");
    b.append("alerts to:     ").append(channels.isEmpty() ? "(no destinations; 'watch channels NAME FILE' sets them)" : "").append('\n');
    for (Object ch : channels) {
      b.append("  ").append(ch instanceof Map<?, ?> ? Json.text(ch, "id") : Json.scalar(ch)).append('\n');
    }
    b.append("definition:\n");
    for (String line : Json.text(w, "text").split("\\R")) {
      b.append("  ").append(line).append('\n');
    }
    List<Object> transitions = Json.array(w, "transitions");
    b.append("transitions:   ").append(transitions.isEmpty() ? "none recorded" : transitions.size() + " recorded").append('\n');
    for (Object t : transitions) {
      b.append("  ").append(Json.text(t, "day")).append("  ").append(Json.text(t, "state")).append(", level ")
          .append(Json.text(t, "level")).append(", watch version ").append(Json.text(t, "version")).append('\n');
      Object values = Json.member(t, "values").orElse(Map.of());
      if (values instanceof Map<?, ?> m) {
        for (Map.Entry<?, ?> e : m.entrySet()) {
          b.append("      ").append(e.getKey()).append(" = ").append(e.getValue() == null ? "no data" : Json.scalar(e.getValue())).append('\n');
        }
      }
    }
    return b.toString();
  }
}
