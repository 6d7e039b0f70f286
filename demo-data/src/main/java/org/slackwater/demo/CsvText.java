package org.slackwater.demo;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/** Writes CSV (RFC 4180 quoting, LF line ends, UTF-8) with locale-independent number formatting. */
final class CsvText {

  private CsvText() {
  }

  static void write(Path file, List<String> header, List<List<String>> rows) throws IOException {
    try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      w.write(line(header));
      for (List<String> row : rows) {
        w.write(line(row));
      }
    }
  }

  private static String line(List<String> cells) {
    StringBuilder b = new StringBuilder();
    for (int i = 0; i < cells.size(); i++) {
      if (i > 0) {
        b.append(',');
      }
      String c = cells.get(i);
      if (c.contains(",") || c.contains("\"") || c.contains("\n")) {
        b.append('"').append(c.replace("\"", "\"\"")).append('"');
      } else {
        b.append(c);
      }
    }
    return b.append('\n').toString();
  }

  /** Fixed-point number text, always with a dot. */
  static String number(double v, int decimals) {
    return String.format(Locale.ROOT, "%." + decimals + "f", v);
  }
}
