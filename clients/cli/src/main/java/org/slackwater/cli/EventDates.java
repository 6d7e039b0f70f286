package org.slackwater.cli;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/**
 * The event dates of a backtest, read from the user's file before anything is sent, so that a
 * mistake is reported with the file's own line numbers: one ISO 8601 calendar date (YYYY-MM-DD)
 * per line, or a CSV (RFC 4180) whose first column holds them, or, with a column name, a CSV with
 * a header row whose named column holds them (the demo's {@code ground_truth.csv} has its onsets
 * in the third column, {@code onset}). Blank lines and lines starting with {@code #} are skipped.
 * Without a column name, a first line whose first field is not a date is taken as a header.
 *
 * <p>Each line is one record: quoted fields may hold commas, not line breaks. The dates are sent
 * to the server as {@link #body()}, one per line, in the file's order.
 *
 * <p>Failure mode: {@link CliFailure} with {@link Cli#LOCAL}, naming the file, the line, the
 * value, and how to write it: a value that is not a date (or not a day of the calendar), a
 * column that is not in the header (the header's columns are listed), a row without that column,
 * a line that is not CSV, a file without dates.
 */
record EventDates(List<LocalDate> dates) {
  private static final Pattern DATE_SHAPE = Pattern.compile("\\d{4}-\\d{2}-\\d{2}");

  EventDates {
    dates = List.copyOf(dates);
  }

  /** Reads {@code text}; {@code source} names it in messages, e.g. {@code events file 'onsets.csv'}. */
  static EventDates read(String text, String source, Optional<String> column) throws CliFailure {
    List<LocalDate> out = new ArrayList<>();
    String[] lines = text.split("\\R", -1);
    int index = column.isPresent() ? -1 : 0;
    boolean first = true;
    for (int i = 0; i < lines.length; i++) {
      int lineNo = i + 1;
      String line = lines[i];
      if (i == 0 && line.startsWith("\uFEFF")) {
        line = line.substring(1); // a byte order mark some spreadsheets write
      }
      if (line.isBlank() || line.strip().startsWith("#")) {
        continue;
      }
      List<String> fields = fields(line, source, lineNo);
      if (index < 0) {
        index = headerIndex(fields, column.get(), source, lineNo);
        first = false;
        continue;
      }
      if (index >= fields.size()) {
        throw new CliFailure(Cli.LOCAL, source + " line " + lineNo + " has " + fields.size() + " field(s), no '" + column.orElseThrow()
            + "' column (column " + (index + 1) + "); give every row a value there");
      }
      String cell = fields.get(index).strip();
      Optional<LocalDate> day = parse(cell);
      if (day.isEmpty() && first && column.isEmpty()) {
        first = false;
        continue; // a header such as "date" or "onset,event"
      }
      first = false;
      if (day.isEmpty()) {
        throw new CliFailure(Cli.LOCAL, source + " line " + lineNo + ": " + why(cell) + "; write event dates as YYYY-MM-DD, one per line"
            + (column.isPresent() ? " in the '" + column.get() + "' column" : " or as the first CSV column (or name the column with --date-column)"));
      }
      out.add(day.get());
    }
    if (out.isEmpty()) {
      throw new CliFailure(Cli.LOCAL, source + " holds no event dates; give one YYYY-MM-DD per line"
          + (column.isPresent() ? " under the '" + column.get() + "' header" : ""));
    }
    return new EventDates(out);
  }

  /** The request body: one date per line. */
  String body() {
    return dates.stream().map(LocalDate::toString).collect(Collectors.joining("\n", "", "\n"));
  }

  private static List<String> fields(String line, String source, int lineNo) throws CliFailure {
    try {
      CsvTable t = CsvTable.parse(line);
      return t.header();
    } catch (IllegalArgumentException e) {
      String why = e.getMessage().replaceFirst("^line \\d+: ", "");
      throw new CliFailure(Cli.LOCAL, source + " line " + lineNo + " is not CSV (" + why + "); quote a field that holds a comma as \"...\"");
    }
  }

  private static int headerIndex(List<String> header, String column, String source, int lineNo) throws CliFailure {
    List<String> names = header.stream().map(String::strip).toList();
    int i = names.indexOf(column.strip());
    if (i < 0) {
      for (int j = 0; j < names.size(); j++) {
        if (names.get(j).equalsIgnoreCase(column.strip())) {
          return j;
        }
      }
      throw new CliFailure(Cli.LOCAL, source + " has no column '" + column + "' in its header (line " + lineNo + "); its columns are "
          + names.stream().map(n -> "'" + n + "'").collect(Collectors.joining(", ")));
    }
    return i;
  }

  private static Optional<LocalDate> parse(String cell) {
    if (!DATE_SHAPE.matcher(cell).matches()) {
      return Optional.empty();
    }
    try {
      return Optional.of(LocalDate.parse(cell));
    } catch (DateTimeParseException e) {
      return Optional.empty();
    }
  }

  private static String why(String cell) {
    if (cell.isEmpty()) {
      return "the date is empty";
    }
    if (DATE_SHAPE.matcher(cell).matches()) {
      return "'" + cell + "' is not a day of the calendar";
    }
    boolean dayAndMore = cell.length() > 10 && DATE_SHAPE.matcher(cell.substring(0, 10)).matches();
    return "'" + cell + "' is not a date" + (dayAndMore ? " (give the day only, without a time)" : "");
  }
}
