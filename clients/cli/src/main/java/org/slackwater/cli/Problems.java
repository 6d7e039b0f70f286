package org.slackwater.cli;

import java.io.PrintStream;
import java.util.Optional;

/**
 * Prints a problem-details answer (RFC 9457) for a person: {@code error: line L:C: detail}, the
 * excerpt with its caret and the hint for a query error; {@code error: detail} otherwise. An answer
 * that is not a problem document (a proxy's error page, say) is shown by status and a short start
 * of its body.
 *
 * @see Cli exit codes: {@link Cli#QUERY_ERROR} for a problem with a line and column, {@link
 *     Cli#NOT_ALLOWED} for 401 and 403, {@link Cli#NOT_FOUND} for 404, {@link Cli#REFUSED} for any
 *     other refusal
 */
final class Problems {
  private static final int MAX_SHOWN = 300;

  private Problems() {}

  static int print(String body, int status, PrintStream err) {
    Optional<String> detail = FlatJson.string(body, "detail");
    if (detail.isEmpty()) {
      String shown = body.strip();
      if (shown.length() > MAX_SHOWN) {
        shown = shown.substring(0, MAX_SHOWN) + "...";
      }
      err.println("error: the server answered " + status + (shown.isEmpty() ? "" : ": " + shown));
      return byStatus(status);
    }
    Optional<String> line = FlatJson.number(body, "line");
    Optional<String> column = FlatJson.number(body, "column");
    if (line.isPresent() && column.isPresent()) {
      err.println("error: line " + line.get() + ":" + column.get() + ": " + detail.get());
      FlatJson.string(body, "excerpt").filter(e -> !e.isEmpty()).ifPresent(excerpt -> {
        // Indented as a block, so the caret line keeps its place under the offending column.
        for (String l : excerpt.split("\n")) {
          err.println("  " + l);
        }
      });
      FlatJson.string(body, "hint").ifPresent(h -> err.println("hint: " + h));
      return Cli.QUERY_ERROR;
    }
    err.println("error: " + detail.get());
    FlatJson.string(body, "hint").ifPresent(h -> err.println("hint: " + h));
    return byStatus(status);
  }

  /** The exit code of a refusal without a position in the query. */
  static int byStatus(int status) {
    return switch (status) {
      case 401, 403 -> Cli.NOT_ALLOWED;
      case 404 -> Cli.NOT_FOUND;
      default -> Cli.REFUSED;
    };
  }
}
