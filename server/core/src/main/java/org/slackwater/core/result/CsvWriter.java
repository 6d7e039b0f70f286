package org.slackwater.core.result;

import java.io.IOException;
import java.io.Writer;

/**
 * Writes a {@link ResultTable} as CSV per RFC 4180: a header row, CRLF line ends, fields quoted
 * when they hold a comma, quote or line break. A column with a unit is headed {@code name [unit]}
 * so the unit survives in spreadsheets; missing values are empty fields.
 */
public final class CsvWriter {
  private CsvWriter() {}

  public static void write(ResultTable table, Writer out) throws IOException {
    int cols = table.columns().size();
    for (int c = 0; c < cols; c++) {
      Column col = table.columns().get(c);
      if (c > 0) {
        out.write(',');
      }
      field(out, col.unit().isEmpty() ? col.name() : col.name() + " [" + col.unit() + "]");
    }
    out.write("\r\n");
    for (int r = 0; r < table.rowCount(); r++) {
      for (int c = 0; c < cols; c++) {
        if (c > 0) {
          out.write(',');
        }
        field(out, Cells.text(table.columns().get(c), r));
      }
      out.write("\r\n");
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
