package org.slackwater.cli;

import java.io.PrintStream;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Prints a problem-details answer (RFC 9457) for a person: "error: line L:C: detail", the excerpt
 * with its caret, and the hint. Reads the few fields it needs without a JSON library, so the CLI
 * stays a single small jar.
 */
final class Problems {
  private Problems() {}

  static int print(String body, int status, PrintStream err) {
    String detail = field(body, "detail");
    String line = number(body, "line");
    String column = number(body, "column");
    if (detail == null) {
      err.println("error: the server answered " + status + (body.isBlank() ? "" : ": " + body));
      return Cli.REFUSED;
    }
    if (line != null && column != null) {
      err.println("error: line " + line + ":" + column + ": " + detail);
      String excerpt = field(body, "excerpt");
      if (excerpt != null) {
        for (String l : excerpt.split("\n")) {
          err.println("  " + l);
        }
      }
      String hint = field(body, "hint");
      if (hint != null) {
        err.println("hint: " + hint);
      }
      return Cli.QUERY_ERROR;
    }
    err.println("error: " + detail);
    return Cli.REFUSED;
  }

  /** A string member of a flat JSON object, unescaped. */
  static String field(String json, String name) {
    Matcher m = Pattern.compile("\"" + name + "\"\\s*:\\s*\"((?:[^\"\\\\]|\\\\.)*)\"").matcher(json);
    return m.find() ? unescape(m.group(1)) : null;
  }

  private static String number(String json, String name) {
    Matcher m = Pattern.compile("\"" + name + "\"\\s*:\\s*(\\d+)").matcher(json);
    return m.find() ? m.group(1) : null;
  }

  private static String unescape(String s) {
    StringBuilder b = new StringBuilder();
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c != '\\' || i + 1 == s.length()) {
        b.append(c);
        continue;
      }
      char n = s.charAt(++i);
      switch (n) {
        case 'n' -> b.append('\n');
        case 't' -> b.append('\t');
        case 'r' -> b.append('\r');
        case 'u' -> {
          b.append((char) Integer.parseInt(s.substring(i + 1, i + 5), 16));
          i += 4;
        }
        default -> b.append(n);
      }
    }
    return b.toString();
  }
}
