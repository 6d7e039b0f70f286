package org.slackwater.cli;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A strict reader of JSON text (RFC 8259) for the server's nested answers (watches, the catalog)
 * and for checking a channels file before it is sent, without a JSON library so the client stays
 * one small jar. Values come back as {@code Map<String, Object>} (members in document order),
 * {@code List<Object>}, {@link String}, {@link BigDecimal}, {@link Boolean}, or {@code null} for
 * JSON null; maps and lists are unmodifiable.
 *
 * <p>Failure mode: {@link IllegalArgumentException} whose message starts with {@code line L,
 * column C:} (1-based, columns counted in characters) and says what was expected there. A member
 * name given twice keeps the last value, as most readers do (RFC 8259 section 4 leaves it open).
 */
final class Json {
  private final String text;
  private int pos;

  private Json(String text) {
    this.text = text;
  }

  static Object parse(String text) {
    Json p = new Json(text);
    p.space();
    Object v = p.value();
    p.space();
    if (p.pos < text.length()) {
      throw p.error("text after the end of the JSON value");
    }
    return v;
  }

  /** The member {@code name} of {@code value} if it is an object holding one. */
  static Optional<Object> member(Object value, String name) {
    return value instanceof Map<?, ?> m ? Optional.ofNullable(m.get(name)) : Optional.empty();
  }

  /** The member {@code name} as text: strings as they are, numbers and booleans as written; empty for null or absent. */
  static String text(Object value, String name) {
    return member(value, name).map(Json::scalar).orElse("");
  }

  /** A scalar as text for people; {@code null} as the empty string. */
  static String scalar(Object v) {
    if (v == null) {
      return "";
    }
    if (v instanceof BigDecimal d) {
      return d.toString();
    }
    return v.toString();
  }

  /** The elements of the member {@code name} if it is an array, else an empty list. */
  static List<Object> array(Object value, String name) {
    return member(value, name).filter(v -> v instanceof List<?>).map(v -> (List<Object>) castList(v)).orElse(List.of());
  }

  @SuppressWarnings("unchecked")
  private static List<Object> castList(Object v) {
    return (List<Object>) v;
  }

  private Object value() {
    if (pos >= text.length()) {
      throw error("the text ends where a value was expected");
    }
    char c = text.charAt(pos);
    return switch (c) {
      case '{' -> object();
      case '[' -> array();
      case '"' -> string();
      case 't' -> literal("true", Boolean.TRUE);
      case 'f' -> literal("false", Boolean.FALSE);
      case 'n' -> literal("null", null);
      default -> {
        if (c == '-' || (c >= '0' && c <= '9')) {
          yield number();
        }
        throw error("expected a value (object, array, string, number, true, false or null), found '" + c + "'");
      }
    };
  }

  private Map<String, Object> object() {
    pos++; // {
    Map<String, Object> out = new LinkedHashMap<>();
    space();
    if (peek('}')) {
      pos++;
      return Collections.unmodifiableMap(out);
    }
    while (true) {
      space();
      if (!peek('"')) {
        throw error("expected a member name in double quotes");
      }
      String name = string();
      space();
      expect(':', "expected ':' after the member name \"" + name + "\"");
      space();
      out.put(name, value());
      space();
      if (peek(',')) {
        pos++;
        continue;
      }
      expect('}', "expected ',' or '}' after the value of \"" + name + "\"");
      return Collections.unmodifiableMap(out);
    }
  }

  private List<Object> array() {
    pos++; // [
    List<Object> out = new ArrayList<>();
    space();
    if (peek(']')) {
      pos++;
      return Collections.unmodifiableList(out);
    }
    while (true) {
      space();
      out.add(value());
      space();
      if (peek(',')) {
        pos++;
        continue;
      }
      expect(']', "expected ',' or ']' after an array element");
      return Collections.unmodifiableList(out);
    }
  }

  private String string() {
    int start = pos;
    pos++; // "
    StringBuilder b = new StringBuilder();
    while (true) {
      if (pos >= text.length()) {
        pos = start;
        throw error("a string is not closed; add the closing '\"'");
      }
      char c = text.charAt(pos++);
      if (c == '"') {
        return b.toString();
      }
      if (c < 0x20) {
        pos--;
        throw error("a control character inside a string; write it as an escape such as \\n or \\u0009");
      }
      if (c != '\\') {
        b.append(c);
        continue;
      }
      if (pos >= text.length()) {
        throw error("the text ends inside an escape");
      }
      char e = text.charAt(pos++);
      switch (e) {
        case '"' -> b.append('"');
        case '\\' -> b.append('\\');
        case '/' -> b.append('/');
        case 'b' -> b.append('\b');
        case 'f' -> b.append('\f');
        case 'n' -> b.append('\n');
        case 'r' -> b.append('\r');
        case 't' -> b.append('\t');
        case 'u' -> {
          if (pos + 4 > text.length() || !text.substring(pos, pos + 4).matches("[0-9A-Fa-f]{4}")) {
            pos -= 2;
            throw error("\\u must be followed by four hex digits");
          }
          b.append((char) Integer.parseInt(text.substring(pos, pos + 4), 16));
          pos += 4;
        }
        default -> {
          pos -= 2;
          throw error("unknown escape '\\" + e + "'; JSON has \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX");
        }
      }
    }
  }

  private BigDecimal number() {
    int start = pos;
    if (peek('-')) {
      pos++;
    }
    if (peek('0')) {
      pos++;
    } else if (!digits()) {
      throw error("expected a digit");
    }
    if (peek('.')) {
      pos++;
      if (!digits()) {
        throw error("expected a digit after the decimal point");
      }
    }
    if (peek('e') || peek('E')) {
      pos++;
      if (peek('+') || peek('-')) {
        pos++;
      }
      if (!digits()) {
        throw error("expected a digit in the exponent");
      }
    }
    return new BigDecimal(text.substring(start, pos));
  }

  private boolean digits() {
    int start = pos;
    while (pos < text.length() && text.charAt(pos) >= '0' && text.charAt(pos) <= '9') {
      pos++;
    }
    return pos > start;
  }

  private Object literal(String word, Object value) {
    if (!text.startsWith(word, pos)) {
      throw error("expected a value; did you mean '" + word + "'?");
    }
    pos += word.length();
    return value;
  }

  private void space() {
    while (pos < text.length()) {
      char c = text.charAt(pos);
      if (c != ' ' && c != '\t' && c != '\n' && c != '\r') {
        return;
      }
      pos++;
    }
  }

  private boolean peek(char c) {
    return pos < text.length() && text.charAt(pos) == c;
  }

  private void expect(char c, String message) {
    if (!peek(c)) {
      throw error(message);
    }
    pos++;
  }

  private IllegalArgumentException error(String message) {
    int line = 1;
    int column = 1;
    for (int i = 0; i < Math.min(pos, text.length()); i++) {
      if (text.charAt(i) == '\n') {
        line++;
        column = 1;
      } else {
        column++;
      }
    }
    return new IllegalArgumentException("line " + line + ", column " + column + ": " + message);
  }
}
