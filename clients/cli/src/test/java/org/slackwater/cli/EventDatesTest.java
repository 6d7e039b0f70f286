package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Reading backtest event dates: ISO 8601 calendar dates (YYYY-MM-DD), plain or in RFC 4180 CSV. */
class EventDatesTest {
  private static final String SRC = "events file 'e.csv'";

  private static List<LocalDate> read(String text, String column) throws CliFailure {
    return EventDates.read(text, SRC, Optional.ofNullable(column)).dates();
  }

  private static String error(String text, String column) {
    CliFailure f = assertThrows(CliFailure.class, () -> read(text, column));
    assertEquals(Cli.LOCAL, f.exitCode());
    return f.getMessage();
  }

  @Test
  void plainDatesWithHeaderCommentsBlankLinesAndByteOrderMark() throws CliFailure {
    assertEquals(List.of(LocalDate.of(2009, 7, 4), LocalDate.of(2014, 6, 20)),
        read("\uFEFFdate\r\n# planted\r\n\r\n2009-07-04\r\n  2014-06-20 ,bloom\r\n", null));
    assertEquals("2009-07-04\n2014-06-20\n", EventDates.read("2009-07-04\n2014-06-20", SRC, Optional.empty()).body());
  }

  @Test
  void aNamedColumnIsFoundInTheHeaderIgnoringCase() throws CliFailure {
    String csv = "event_id,region,Onset\n\"bloom, early\",\"Outer Bay\",2018-06-28\n";
    assertEquals(List.of(LocalDate.of(2018, 6, 28)), read(csv, "onset"));
  }

  @Test
  void leapDaysFollowTheGregorianRules() throws CliFailure {
    // ISO 8601 uses the Gregorian calendar: leap years are divisible by 4, except centuries not divisible by 400.
    assertEquals(List.of(LocalDate.of(2016, 2, 29), LocalDate.of(2000, 2, 29)), read("2016-02-29\n2000-02-29\n", null));
    assertEquals(SRC + " line 2: '1900-02-29' is not a day of the calendar; write event dates as YYYY-MM-DD, one per line"
        + " or as the first CSV column (or name the column with --date-column)", error("2016-02-29\n1900-02-29\n", null));
    assertEquals(SRC + " line 1: '2014-02-29' is not a day of the calendar; write event dates as YYYY-MM-DD, one per line in the 'onset' column"
        .replace("line 1", "line 2"), error("onset\n2014-02-29\n", "onset"));
  }

  @Test
  void aFirstLineIsAHeaderOnlyOnce() {
    assertEquals(SRC + " line 2: 'onset' is not a date; write event dates as YYYY-MM-DD, one per line or as the first CSV column"
        + " (or name the column with --date-column)", error("date\nonset\n2014-06-20\n", null));
    assertEquals(SRC + " line 2: '2014-06-20T08:00Z' is not a date (give the day only, without a time); write event dates as YYYY-MM-DD,"
        + " one per line or as the first CSV column (or name the column with --date-column)", error("2014-06-19\n2014-06-20T08:00Z\n", null));
  }

  @Test
  void columnProblemsNameTheColumnAndTheLine() {
    assertEquals(SRC + " has no column 'start' in its header (line 2); its columns are 'event_id', 'onset'",
        error("# ground truth\nevent_id,onset\nb,2014-06-20\n", "start"));
    assertEquals(SRC + " line 3 has 1 field(s), no 'onset' column (column 2); give every row a value there",
        error("event_id,onset\nb,2014-06-20\nc\n", "onset"));
    assertEquals(SRC + " line 2: the date is empty; write event dates as YYYY-MM-DD, one per line in the 'onset' column",
        error("event_id,onset\nb,\n", "onset"));
    assertEquals(SRC + " line 2 is not CSV (a quoted field is not closed); quote a field that holds a comma as \"...\"",
        error("event_id,onset\n\"b,2014-06-20\n", "onset"));
  }

  @Test
  void aFileWithoutDatesIsRefused() {
    assertEquals(SRC + " holds no event dates; give one YYYY-MM-DD per line", error("# nothing yet\n\n", null));
    assertEquals(SRC + " holds no event dates; give one YYYY-MM-DD per line under the 'onset' header", error("event_id,onset\n", "onset"));
  }
}
