package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Reading CSV by the rules of RFC 4180 section 2, and the aligned layout of {@code --table}. */
class CsvTableTest {

  @Test
  void rfc4180RecordsWithAndWithoutAFinalLineBreak() {
    // RFC 4180 section 2, rules 1 and 2: CRLF between records, the last line break optional.
    assertEquals(List.of(List.of("zzz", "yyy", "xxx")), CsvTable.parse("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n").rows());
    assertEquals(List.of(List.of("zzz", "yyy", "xxx")), CsvTable.parse("aaa,bbb,ccc\r\nzzz,yyy,xxx").rows());
    assertEquals(List.of("aaa", "bbb", "ccc"), CsvTable.parse("aaa,bbb,ccc\r\nzzz,yyy,xxx").header());
  }

  @Test
  void rfc4180QuotedFields() {
    // Rule 5: fields may be quoted; rule 6: quoted fields may hold line breaks and commas;
    // rule 7: a quote inside a quoted field is doubled.
    assertEquals(List.of("aaa", "bbb", "ccc"), CsvTable.parse("\"aaa\",\"bbb\",\"ccc\"\r\n").header());
    assertEquals(List.of("aaa", "b\r\nbb", "ccc"), CsvTable.parse("\"aaa\",\"b\r\nbb\",\"ccc\"\r\n").header());
    assertEquals(List.of("aaa", "b\"bb", "ccc"), CsvTable.parse("\"aaa\",\"b\"\"bb\",\"ccc\"\r\n").header());
    assertEquals(List.of("a,b", ""), CsvTable.parse("\"a,b\",\r\n").header());
  }

  @Test
  void malformedCsvIsRefusedWithTheLine() {
    assertEquals("line 2: a quoted field is not closed",
        assertThrows(IllegalArgumentException.class, () -> CsvTable.parse("a,b\r\n\"open,2\r\n")).getMessage());
    assertEquals("line 1: a quote inside an unquoted field",
        assertThrows(IllegalArgumentException.class, () -> CsvTable.parse("ab\"c\r\n")).getMessage());
  }

  @Test
  void numbersAreRightAlignedTextLeftAlignedMissingValuesBlank() {
    String csv = "date,value [mg m-3],note\r\n2014-01-01,3.5,clear\r\n2014-01-02,,cloud gap\r\n2014-01-03,12.25,\r\n";
    String expected = String.join("\n",
        "date        value [mg m-3]  note",
        "----------  --------------  ---------",
        "2014-01-01             3.5  clear",
        "2014-01-02                  cloud gap",
        "2014-01-03           12.25",
        "");
    assertEquals(expected, CsvTable.parse(csv).render());
  }

  @Test
  void widthCountsCodePointsAndLineBreaksInFieldsBecomeSpaces() {
    String csv = "station,T [\u00b0C]\r\n\"WM1\nnorth\",-1e-3\r\nWM2,7\r\n";
    String expected = String.join("\n",
        "station    T [\u00b0C]",
        "---------  ------",
        "WM1 north   -1e-3",
        "WM2             7",
        "");
    assertEquals(expected, CsvTable.parse(csv).render());
  }
}
