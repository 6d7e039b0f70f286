package org.slackwater.core.time;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;

class CfCalendarTest {

  @ParameterizedTest
  @CsvSource({
    // CF 4.4.3, table 4.1: names and aliases.
    "standard, STANDARD", "gregorian, STANDARD", "GREGORIAN, STANDARD", " Standard , STANDARD",
    "proleptic_gregorian, PROLEPTIC_GREGORIAN", "julian, JULIAN",
    "noleap, NOLEAP", "365_day, NOLEAP", "all_leap, ALL_LEAP", "366_day, ALL_LEAP", "360_day, DAY_360"
  })
  void parsesCfNamesAndAliases(String name, CfCalendar expected) {
    assertEquals(expected, CfCalendar.parse(name));
  }

  @Test
  void missingCalendarIsStandard() {
    // CF 4.4.3: "standard" is the default when the calendar attribute is absent.
    assertEquals(CfCalendar.STANDARD, CfCalendar.parse(null));
    assertEquals(CfCalendar.STANDARD, CfCalendar.parse("  "));
  }

  @Test
  void unknownCalendarListsAcceptedNames() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> CfCalendar.parse("tidal_13"));
    assertEquals("calendar 'tidal_13' is not a CF calendar; use one of standard, proleptic_gregorian, julian, noleap,"
        + " all_leap, 360_day, gregorian, 365_day, 366_day (CF section 4.4.3)", e.getMessage());
  }

  @Test
  void prolepticGregorianMatchesJavaTimeForRandomDates() {
    // Reference library: java.time.LocalDate (ISO-8601 proleptic Gregorian, astronomical years).
    SplittableRandom rnd = new SplittableRandom(20240611L);
    for (int i = 0; i < 20_000; i++) {
      long epochDay = rnd.nextLong(LocalDate.of(-4000, 1, 1).toEpochDay(), LocalDate.of(9999, 12, 31).toEpochDay());
      LocalDate d = LocalDate.ofEpochDay(epochDay);
      assertEquals(epochDay, CfCalendar.PROLEPTIC_GREGORIAN.dayNumber(d.getYear(), d.getMonthValue(), d.getDayOfMonth()), d::toString);
      assertArrayEquals(new int[] {d.getYear(), d.getMonthValue(), d.getDayOfMonth()},
          CfCalendar.PROLEPTIC_GREGORIAN.label(epochDay), d::toString);
      assertEquals(d.lengthOfMonth(), CfCalendar.PROLEPTIC_GREGORIAN.daysInMonth(d.getYear(), d.getMonthValue()));
    }
  }

  @Test
  void standardMatchesJavaTimeFromTheGregorianSwitch() {
    // CF 4.4.3: standard is Gregorian from 1582-10-15, so it agrees with java.time from then on.
    SplittableRandom rnd = new SplittableRandom(7L);
    for (int i = 0; i < 5_000; i++) {
      long epochDay = rnd.nextLong(LocalDate.of(1582, 10, 15).toEpochDay(), LocalDate.of(3000, 1, 1).toEpochDay());
      LocalDate d = LocalDate.ofEpochDay(epochDay);
      assertEquals(epochDay, CfCalendar.STANDARD.dayNumber(d.getYear(), d.getMonthValue(), d.getDayOfMonth()), d::toString);
    }
  }

  /** Julian Day Number by the Meeus formula (Astronomical Algorithms, ch. 7; recalled from memory). */
  private static long meeusJdnAtNoon(int y, int m, int d, boolean gregorian) {
    if (m <= 2) {
      y -= 1;
      m += 12;
    }
    long b = 0;
    if (gregorian) {
      long a = Math.floorDiv(y, 100);
      b = 2 - a + Math.floorDiv(a, 4);
    }
    // JD at 0h = INT(365.25 (Y + 4716)) + INT(30.6001 (M + 1)) + D + B - 1524.5; +0.5 gives the noon JDN.
    return (long) Math.floor(365.25 * (y + 4716)) + (long) Math.floor(30.6001 * (m + 1)) + d + b - 1524;
  }

  @Test
  void julianMatchesTheMeeusJulianDayFormula() {
    // JDN 2440588 is 1970-01-01 (Gregorian), the Unix epoch (from memory, widely published).
    long epochJdn = 2_440_588;
    assertEquals(epochJdn, meeusJdnAtNoon(1970, 1, 1, true));
    SplittableRandom rnd = new SplittableRandom(99L);
    for (int i = 0; i < 5_000; i++) {
      int y = rnd.nextInt(-4000, 4000) ;
      int m = rnd.nextInt(1, 13);
      int d = rnd.nextInt(1, CfCalendar.JULIAN.daysInMonth(y, m) + 1);
      if (y + 4716 < 0) {
        continue; // the formula's INT() truncation is only valid for JD >= 0
      }
      long expected = meeusJdnAtNoon(y, m, d, false) - epochJdn;
      assertEquals(expected, CfCalendar.JULIAN.dayNumber(y, m, d), y + "-" + m + "-" + d);
      assertArrayEquals(new int[] {y, m, d}, CfCalendar.JULIAN.label(expected));
    }
    // Meeus example 7.b (from memory): 333 January 27 at noon (Julian calendar) is JD 1842713.0.
    assertEquals(1_842_713 - epochJdn, CfCalendar.JULIAN.dayNumber(333, 1, 27));
  }

  @Test
  void standardSwitchesFromJulianToGregorianIn1582() {
    // CF 4.4.3: Julian before 1582-10-05, Gregorian from 1582-10-15; the days between do not exist.
    CfCalendar std = CfCalendar.STANDARD;
    assertEquals(std.dayNumber(1582, 10, 4) + 1, std.dayNumber(1582, 10, 15));
    assertEquals(CfCalendar.JULIAN.dayNumber(1582, 10, 4), std.dayNumber(1582, 10, 4));
    assertEquals(CfCalendar.PROLEPTIC_GREGORIAN.dayNumber(1582, 10, 15), std.dayNumber(1582, 10, 15));
    for (int d = 5; d <= 14; d++) {
      assertFalse(std.isValid(1582, 10, d), "1582-10-" + d);
    }
    int day = 10;
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> std.dayNumber(1582, 10, day));
    assertEquals("1582-10-10 is not a date of the standard calendar", e.getMessage());
    assertEquals(355, std.lengthOfYear(1582));
    assertArrayEquals(new int[] {1582, 10, 15}, std.label(std.dayNumber(1582, 10, 4) + 1));
    // Julian leap rule before the switch: 1500 is a leap year in standard, not in proleptic_gregorian.
    assertTrue(std.isValid(1500, 2, 29));
    assertFalse(CfCalendar.PROLEPTIC_GREGORIAN.isValid(1500, 2, 29));
  }

  @Test
  void modelCalendarsHaveFixedYears() {
    // CF 4.4.3 table 4.1: noleap 365 days, all_leap 366 days, 360_day twelve months of 30 days.
    for (int y : new int[] {1900, 2000, 2001, 2004}) {
      assertEquals(365, CfCalendar.NOLEAP.lengthOfYear(y));
      assertEquals(366, CfCalendar.ALL_LEAP.lengthOfYear(y));
      assertEquals(360, CfCalendar.DAY_360.lengthOfYear(y));
      assertFalse(CfCalendar.NOLEAP.isValid(y, 2, 29));
      assertTrue(CfCalendar.ALL_LEAP.isValid(y, 2, 29));
      assertTrue(CfCalendar.DAY_360.isValid(y, 2, 30));
      assertFalse(CfCalendar.DAY_360.isValid(y, 1, 31));
    }
    assertEquals(365 * 30, CfCalendar.NOLEAP.dayNumber(2000, 1, 1));
    assertEquals(0, CfCalendar.DAY_360.dayNumber(1970, 1, 1));
  }

  @ParameterizedTest
  @EnumSource(CfCalendar.class)
  void labelIsTheInverseOfDayNumber(CfCalendar cal) {
    long from = cal.dayNumber(1500, 1, 1);
    long to = cal.dayNumber(2100, 1, 1);
    long previous = from - 1;
    for (long n = from; n < to; n += 7) {
      int[] ymd = cal.label(n);
      assertTrue(cal.isValid(ymd[0], ymd[1], ymd[2]), cal + " " + n);
      assertEquals(n, cal.dayNumber(ymd[0], ymd[1], ymd[2]), cal + " " + ymd[0] + "-" + ymd[1] + "-" + ymd[2]);
      assertTrue(n > previous);
      previous = n;
    }
    // Negative years stay consistent too (astronomical numbering).
    int[] ymd = cal.label(cal.dayNumber(-44, 3, 15));
    assertArrayEquals(new int[] {-44, 3, 15}, ymd);
  }
}
