package org.slackwater.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Just enough JSON for the server's small answers (problem documents, ingest and region receipts),
 * without a JSON library so the client stays one small jar. Reads string and number members by
 * name from flat objects (the first member of that name wins, wherever it is) and splits an array
 * of flat objects; writes string literals (RFC 8259 section 7).
 */
final class FlatJson {
  private static final Pattern NUMBER = Pattern.compile("-?\\d+(?:\\.\\d+)?(?:[eE][+-]?\\d+)?");

  private FlatJson() {}

  /** A string member, unescaped. */
  static Optional<String> string(String json, String name) {
    Matcher m = Pattern.compile("\"" + Pattern.quote(name) + "\"\\s*:\\s*\"((?:[^\"\\\\]|\\\\.)*)\"").matcher(json);
    return m.find() ? Optional.of(unescape(m.group(1))) : Optional.empty();
  }

  /** A number member as written. */
  static Optional<String> number(String json, String name) {
    Matcher m = Pattern.compile("\"" + Pattern.quote(name) + "\"\\s*:\\s*(" + NUMBER.pattern() + ")").matcher(json);
    return m.find() ? Optional.of(m.group(1)) : Optional.empty();
  }

  /** The objects of an array of flat objects (objects without nested objects), in order. */
  static List<String> objects(String jsonArray) {
    List<String> out = new ArrayList<>();
    Matcher m = Pattern.compile("\\{(?:[^{}\"]|\"(?:[^\"\\\\]|\\\\.)*\")*\\}").matcher(jsonArray);
    while (m.find()) {
      out.add(m.group());
    }
    return out;
  }

  /** {@code s} as a JSON string literal. */
  static String quote(String s) {
    StringBuilder b = new StringBuilder("\"");
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '"' -> b.append("\\\"");
        case '\\' -> b.append("\\\\");
        case '\n' -> b.append("\\n");
        case '\r' -> b.append("\\r");
        case '\t' -> b.append("\\t");
        default -> {
          if (c < 0x20) {
            b.append(String.format("\\u%04x", (int) c));
          } else {
            b.append(c);
          }
        }
      }
    }
    return b.append('"').toString();
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
        case 'b' -> b.append('\b');
        case 'f' -> b.append('\f');
        case 'u' -> {
          if (i + 4 < s.length()) {
            b.append((char) Integer.parseInt(s.substring(i + 1, i + 5), 16));
            i += 4;
          }
        }
        default -> b.append(n);
      }
    }
    return b.toString();
  }
}
