package org.slackwater.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The public-health caution that goes with every watch result: read from the server's answer (the
 * JSON {@code cautions} array or {@code caution} members, or the CSV {@code caution} column) and
 * printed on standard error as {@code caution: ...}, so standard output stays the result as sent.
 *
 * <p>When the answer's caution cannot be read (a PNG, an Arrow stream whose schema metadata holds
 * it, an answer without one), watch commands print {@link #FALLBACK}, the server's wording; a test
 * keeps the two equal. Never fails: an answer that cannot be parsed just has no caution of its own.
 */
final class Caution {
  /** The server's caution (org.slackwater.core.query.WatchStatements.CAUTION), word for word. */
  static final String FALLBACK = "Screening aid only: built from remote-sensing and model data, which can be wrong. "
      + "Confirm with water sampling, and follow local drinking-water regulations and licensed operators before acting.";

  private Caution() {}

  /** The distinct cautions the answer carries, in order; empty if none can be read. */
  static List<String> of(Answer a) {
    if (!a.ok()) {
      return List.of();
    }
    String type = a.contentType().toLowerCase(Locale.ROOT);
    if (!type.startsWith("application/json") && !type.startsWith("text/csv")) {
      return List.of();
    }
    String text = a.text();
    List<String> found = new ArrayList<>();
    if (!text.contains("caution")) {
      return List.of(); // most answers: no need to parse a large result
    }
    try {
      if (type.startsWith("application/json")) {
        collect(Json.parse(text), found);
      } else if (type.startsWith("text/csv")) {
        CsvTable t = CsvTable.parse(text);
        int c = t.header().indexOf("caution");
        if (c >= 0) {
          for (List<String> row : t.rows()) {
            if (c < row.size() && !row.get(c).isBlank()) {
              add(found, row.get(c));
            }
          }
        }
      }
    } catch (IllegalArgumentException e) {
      return List.of();
    }
    return List.copyOf(found);
  }

  /** For watch commands: the answer's cautions, or the fallback when it carries none that can be read. */
  static void printForWatch(Answer a, PrintStream err) {
    List<String> cautions = of(a);
    for (String c : cautions.isEmpty() ? List.of(FALLBACK) : cautions) {
      err.println("caution: " + c);
    }
  }

  /** For queries: the answer's cautions if it has any (a watch statement's result), else nothing. */
  static void printIfAny(Answer a, PrintStream err) {
    of(a).forEach(c -> err.println("caution: " + c));
  }

  private static void collect(Object v, List<String> found) {
    if (v instanceof Map<?, ?> m) {
      for (Map.Entry<?, ?> e : m.entrySet()) {
        if (("caution".equals(e.getKey()) && e.getValue() instanceof String s)) {
          add(found, s);
        } else if ("cautions".equals(e.getKey()) && e.getValue() instanceof List<?> l) {
          l.stream().filter(x -> x instanceof String).forEach(x -> add(found, (String) x));
        } else {
          collect(e.getValue(), found);
        }
      }
    } else if (v instanceof List<?> l) {
      // Result rows are arrays of cells; a caution column there repeats the metadata's caution.
      l.forEach(x -> collect(x, found));
    }
  }

  private static void add(List<String> found, String caution) {
    String c = caution.strip();
    if (!c.isEmpty() && !found.contains(c)) {
      found.add(c);
    }
  }
}
