package org.slackwater.netcdf;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A reader for the subset of CDL (the netCDF text notation that ncgen compiles) used by the test
 * files, so that tests take their expected numbers from the same text ncgen read, not from a
 * second copy in Java.
 *
 * <p>It knows dimensions, variable declarations, numeric and text attributes with CDL type
 * suffixes (b, s, f, none = int or double) and the data section, where {@code NaN} is NaN and
 * {@code _} is the variable's fill value.
 */
record Cdl(Map<String, Integer> dimensions, Map<String, Var> variables, Map<String, Attr> globals) {

  /** A CDL attribute: numbers with their CDL type, or text. */
  record Attr(String type, double[] numbers, String text) {
    double number() {
      return numbers[0];
    }
  }

  record Var(String type, List<String> dims, Map<String, Attr> attributes, double[] data) {
    Attr attr(String name) {
      return attributes.get(name);
    }

    double number(String name, double fallback) {
      Attr a = attributes.get(name);
      return a == null ? fallback : a.number();
    }

    String text(String name) {
      Attr a = attributes.get(name);
      return a == null ? null : a.text();
    }
  }

  static Cdl read(Path file) {
    try {
      return parse(Files.readString(file));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  Var var(String name) {
    Var v = variables.get(name);
    if (v == null) {
      throw new IllegalArgumentException("no variable " + name + " in the CDL");
    }
    return v;
  }

  private static final Pattern DIM = Pattern.compile("(\\w+)\\s*=\\s*(\\d+|UNLIMITED)");
  private static final Pattern DECL = Pattern.compile("(byte|short|int|float|double)\\s+(\\w+)\\s*(?:\\(([^)]*)\\))?");
  private static final Pattern ATTR = Pattern.compile("(\\w*):(\\w+)\\s*=\\s*(.*)", Pattern.DOTALL);
  private static final Pattern DATA = Pattern.compile("(\\w+)\\s*=\\s*(.*)", Pattern.DOTALL);

  static Cdl parse(String text) {
    String body = text.replaceAll("//[^\\n]*", "");
    body = body.substring(body.indexOf('{') + 1, body.lastIndexOf('}'));
    Map<String, Integer> dims = new LinkedHashMap<>();
    Map<String, String> types = new LinkedHashMap<>();
    Map<String, List<String>> varDims = new LinkedHashMap<>();
    Map<String, Map<String, Attr>> attrs = new LinkedHashMap<>();
    Map<String, Attr> globals = new LinkedHashMap<>();
    Map<String, double[]> data = new LinkedHashMap<>();
    String section = "";
    for (String raw : splitStatements(body)) {
      String st = raw.trim();
      for (String s : new String[] {"dimensions:", "variables:", "data:"}) {
        if (st.startsWith(s)) {
          section = s;
          st = st.substring(s.length()).trim();
        }
      }
      if (st.isEmpty()) {
        continue;
      }
      switch (section) {
        case "dimensions:" -> {
          Matcher m = DIM.matcher(st);
          if (!m.matches()) {
            throw new IllegalArgumentException("bad dimension: " + st);
          }
          dims.put(m.group(1), m.group(2).equals("UNLIMITED") ? -1 : Integer.parseInt(m.group(2)));
        }
        case "variables:" -> {
          Matcher a = ATTR.matcher(st);
          Matcher d = DECL.matcher(st);
          if (a.matches()) {
            Attr value = attr(a.group(3).trim());
            (a.group(1).isEmpty() ? globals : attrs.get(a.group(1))).put(a.group(2), value);
          } else if (d.matches()) {
            types.put(d.group(2), d.group(1));
            varDims.put(d.group(2), d.group(3) == null ? List.of() : List.of(d.group(3).trim().split("\\s*,\\s*")));
            attrs.put(d.group(2), new LinkedHashMap<>());
          } else {
            throw new IllegalArgumentException("bad declaration: " + st);
          }
        }
        case "data:" -> {
          Matcher m = DATA.matcher(st);
          if (!m.matches()) {
            throw new IllegalArgumentException("bad data: " + st);
          }
          String name = m.group(1);
          Attr fill = attrs.get(name).get("_FillValue");
          String[] items = m.group(2).trim().split("\\s*,\\s*");
          double[] values = new double[items.length];
          for (int i = 0; i < items.length; i++) {
            values[i] = items[i].equals("_") ? fill.number() : number(items[i]);
          }
          data.put(name, values);
        }
        default -> throw new IllegalArgumentException("statement outside a section: " + st);
      }
    }
    Map<String, Var> vars = new LinkedHashMap<>();
    for (String name : types.keySet()) {
      vars.put(name, new Var(types.get(name), varDims.get(name), Map.copyOf(attrs.get(name)), data.get(name)));
    }
    return new Cdl(Map.copyOf(dims), vars, Map.copyOf(globals));
  }

  private static List<String> splitStatements(String body) {
    List<String> out = new ArrayList<>();
    StringBuilder cur = new StringBuilder();
    boolean inString = false;
    for (char c : body.toCharArray()) {
      if (c == '"') {
        inString = !inString;
      }
      if (c == ';' && !inString) {
        out.add(cur.toString());
        cur.setLength(0);
      } else {
        cur.append(c);
      }
    }
    if (!cur.toString().isBlank()) {
      out.add(cur.toString());
    }
    return out;
  }

  private static Attr attr(String value) {
    if (value.startsWith("\"")) {
      return new Attr("char", null, value.substring(1, value.length() - 1));
    }
    String[] items = value.split("\\s*,\\s*");
    double[] numbers = new double[items.length];
    for (int i = 0; i < items.length; i++) {
      numbers[i] = number(items[i]);
    }
    return new Attr(typeOf(items[0]), numbers, null);
  }

  /** The CDL type of a constant: suffix b, s, f, or int without a point, double with one. */
  private static String typeOf(String item) {
    char last = Character.toLowerCase(item.charAt(item.length() - 1));
    if (last == 'b') {
      return "byte";
    } else if (last == 's') {
      return "short";
    } else if (last == 'f') {
      return "float";
    }
    return item.matches("[+-]?\\d+") ? "int" : "double";
  }

  /** A CDL number; float-suffixed constants are rounded to float as ncgen stores them. */
  static double number(String item) {
    String s = item.trim();
    if (s.equals("NaN") || s.equals("NaNf")) {
      return Double.NaN;
    }
    String type = typeOf(s);
    String digits = type.equals("int") || type.equals("double") ? s : s.substring(0, s.length() - 1);
    double d = Double.parseDouble(digits);
    return type.equals("float") ? (float) d : d;
  }
}
