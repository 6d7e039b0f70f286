package org.slackwater.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * A CSV answer (RFC 4180: header row, fields quoted when they hold a comma, quote or line break,
 * CRLF or LF line ends) shown as aligned columns for a person: the header as the server wrote it
 * (so units stay in it, e.g. {@code value [mg m-3]}), a dashed rule, then the rows. Columns whose
 * every non-empty cell is a number are right-aligned so the digits line up; others are
 * left-aligned. Columns are two spaces apart; line breaks inside a field are shown as spaces.
 *
 * <p>Failure mode: {@link IllegalArgumentException} for text that is not RFC 4180 CSV (an
 * unterminated quoted field, a quote inside an unquoted field).
 */
record CsvTable(List<String> header, List<List<String>> rows) {
  private static final Pattern NUMBER = Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?|NaN|[-+]?Infinity");
  private static final String GAP = "  ";

  CsvTable {
    header = List.copyOf(header);
    rows = rows.stream().map(List::copyOf).toList();
  }

  static CsvTable parse(String csv) {
    List<List<String>> records = records(csv);
    if (records.isEmpty()) {
      return new CsvTable(List.of(), List.of());
    }
    return new CsvTable(records.get(0), records.subList(1, records.size()));
  }

  /** The table as text lines, each ending in a line feed. */
  String render() {
    int cols = header.size();
    for (List<String> r : rows) {
      cols = Math.max(cols, r.size());
    }
    int[] width = new int[cols];
    boolean[] numeric = new boolean[cols];
    for (int c = 0; c < cols; c++) {
      width[c] = length(cell(header, c));
      numeric[c] = true;
      boolean any = false;
      for (List<String> r : rows) {
        String v = cell(r, c);
        width[c] = Math.max(width[c], length(v));
        if (!v.isEmpty()) {
          any = true;
          numeric[c] &= NUMBER.matcher(v).matches();
        }
      }
      numeric[c] &= any;
    }
    StringBuilder out = new StringBuilder();
    line(out, header, width, numeric);
    List<String> rule = new ArrayList<>();
    for (int c = 0; c < cols; c++) {
      rule.add("-".repeat(width[c]));
    }
    line(out, rule, width, numeric);
    for (List<String> r : rows) {
      line(out, r, width, numeric);
    }
    return out.toString();
  }

  private static void line(StringBuilder out, List<String> cells, int[] width, boolean[] numeric) {
    StringBuilder b = new StringBuilder();
    for (int c = 0; c < width.length; c++) {
      if (c > 0) {
        b.append(GAP);
      }
      String v = cell(cells, c);
      String pad = " ".repeat(width[c] - length(v));
      b.append(numeric[c] ? pad + v : v + pad);
    }
    out.append(b.toString().stripTrailing()).append('\n');
  }

  private static String cell(List<String> cells, int c) {
    return c < cells.size() ? cells.get(c).replace("\r\n", " ").replace('\n', ' ').replace('\r', ' ') : "";
  }

  private static int length(String s) {
    return s.codePointCount(0, s.length());
  }

  private static List<List<String>> records(String csv) {
    List<List<String>> out = new ArrayList<>();
    List<String> record = new ArrayList<>();
    StringBuilder field = new StringBuilder();
    boolean quoted = false;
    boolean wasQuoted = false;
    int line = 1;
    int quoteLine = 1;
    int i = 0;
    while (i < csv.length()) {
      char ch = csv.charAt(i);
      if (quoted) {
        if (ch == '"') {
          if (i + 1 < csv.length() && csv.charAt(i + 1) == '"') {
            field.append('"');
            i += 2;
            continue;
          }
          quoted = false;
        } else {
          if (ch == '\n') {
            line++;
          }
          field.append(ch);
        }
        i++;
        continue;
      }
      switch (ch) {
        case '"' -> {
          if (field.length() > 0 || wasQuoted) {
            throw new IllegalArgumentException("line " + line + ": a quote inside an unquoted field");
          }
          quoted = true;
          wasQuoted = true;
          quoteLine = line;
        }
        case ',' -> {
          record.add(field.toString());
          field.setLength(0);
          wasQuoted = false;
        }
        case '\r', '\n' -> {
          if (ch == '\r' && i + 1 < csv.length() && csv.charAt(i + 1) == '\n') {
            i++;
          }
          record.add(field.toString());
          out.add(record);
          record = new ArrayList<>();
          field.setLength(0);
          wasQuoted = false;
          line++;
        }
        default -> {
          if (wasQuoted) {
            throw new IllegalArgumentException("line " + line + ": text after a closing quote");
          }
          field.append(ch);
        }
      }
      i++;
    }
    if (quoted) {
      throw new IllegalArgumentException("line " + quoteLine + ": a quoted field is not closed");
    }
    if (field.length() > 0 || !record.isEmpty() || wasQuoted) {
      record.add(field.toString());
      out.add(record);
    }
    return out;
  }
}
