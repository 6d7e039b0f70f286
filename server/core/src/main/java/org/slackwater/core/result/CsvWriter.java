package org.slackwater.core.result;

import java.io.IOException;
import java.io.Writer;

/**
 * Writes a {@link ResultTable} or a {@link TableStream} as CSV per RFC 4180: a header row, CRLF line ends, fields quoted
 * when they hold a comma, quote or line break. A column with a unit is headed {@code name [unit]}
 * so the unit survives in spreadsheets; missing values are empty fields.
 */
public final class CsvWriter {
  private CsvWriter() {}

  public static void write(ResultTable table, Writer out) throws IOException {
    write(TableStream.of(table), out);
  }

  /** The header row, then each batch's rows as the stream gives them. */
  public static void write(TableStream stream, Writer out) throws IOException {
    ResultTable header = stream.header();
    int cols = header.columns().size();
    for (int c = 0; c < cols; c++) {
      Column col = header.columns().get(c);
      if (c > 0) {
        out.write(',');
      }
      field(out, col.unit().isEmpty() ? col.name() : col.name() + " [" + col.unit() + "]");
    }
    out.write("\r\n");
    for (ResultTable table = stream.next(); table != null; table = stream.next()) {
      for (int r = 0; r < table.rowCount(); r++) {
        for (int c = 0; c < cols; c++) {
          if (c > 0) {
            out.write(',');
          }
          field(out, Cells.text(table.columns().get(c), r));
        }
        out.write("\r\n");
      }
    }
    out.flush();
  }

  private static void field(Writer out, String s) throws IOException {
    if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
      out.write(s);
      return;
    }
    out.write('"');
    out.write(s.replace("\"", "\"\""));
    out.write('"');
  }
}
