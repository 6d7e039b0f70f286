package org.slackwater.core.time;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.cube.TimeAxis.Alignment;

class CfTimeDecoderTest {

  private static CfDateTime decode(double v, String units, String calendar) {
    return CfTimeDecoder.decode(v, CfTimeUnits.parse(units), CfCalendar.parse(calendar));
  }

  private static long epoch(int y, int mo, int d, int h, int mi, int s) {
    return LocalDateTime.of(y, mo, d, h, mi, s).toEpochSecond(ZoneOffset.UTC);
  }

  @Test
  void leapDayDependsOnCalendar() {
    // CF 4.4.3 worked example: value 1 of "days since 2020-02-28 23:10" is 2020-02-29 23:10 in
    // standard and 2020-03-01 23:10 in noleap.
    assertEquals(CfDateTime.of(2020, 2, 29, 23, 10, 0), decode(1, "days since 2020-02-28 23:10", "standard"));
    assertEquals(CfDateTime.of(2020, 3, 1, 23, 10, 0), decode(1, "days since 2020-02-28 23:10", "noleap"));
  }

  @Test
  void gregorianSwitchOf1582() {
    // Derived from CF 4.4.3: the day after 1582-10-04 is 1582-10-15 in standard, 1582-10-05 in
    // proleptic_gregorian.
    assertEquals(CfDateTime.ofDate(1582, 10, 15), decode(1, "days since 1582-10-04", "standard"));
    assertEquals(CfDateTime.ofDate(1582, 10, 5), decode(1, "days since 1582-10-04", "proleptic_gregorian"));
  }

  @Test
  void standardAndJulianNameTheSameInstantDifferently() {
    // CF 4.4.3: 1917-11-07 12:00 standard is the same instant as 1917-10-25 12:00 julian.
    AlignedTimeAxis std = CfTimeDecoder.toTimeAxis(new double[] {0}, CfTimeUnits.parse("hours since 1917-11-07 12:00"), CfCalendar.STANDARD);
    AlignedTimeAxis jul = CfTimeDecoder.toTimeAxis(new double[] {0}, CfTimeUnits.parse("hours since 1917-10-25 12:00"), CfCalendar.JULIAN);
    assertEquals(std.axis().epochSecond(0), jul.axis().epochSecond(0));
    assertEquals(epoch(1917, 11, 7, 12, 0, 0), std.axis().epochSecond(0));
    assertEquals(Alignment.EXACT, jul.axis().alignment());
    // And decoding a value across the difference: 13 days after julian 1917-10-25 is julian 1917-11-07.
    assertEquals(CfDateTime.of(1917, 11, 7, 12, 0, 0), decode(13, "days since 1917-10-25 12:00", "julian"));
  }

  @Test
  void day360() {
    // Derived from CF 4.4.3 (twelve 30-day months): 59 -> 2000-02-30, 360 -> 2001-01-01.
    assertEquals(CfDateTime.ofDate(2000, 2, 30), decode(59, "days since 2000-01-01", "360_day"));
    assertEquals(CfDateTime.ofDate(2001, 1, 1), decode(360, "days since 2000-01-01", "360_day"));
  }

  @Test
  void allLeapAndJulianLeapDays() {
    // Derived from CF 4.4.3: all_leap 59 days after 2001-01-01 is 2001-02-29; julian 59 days after
    // 1900-01-01 is 1900-02-29, standard gives 1900-03-01 (1900 is not a Gregorian leap year).
    assertEquals(CfDateTime.ofDate(2001, 2, 29), decode(59, "days since 2001-01-01", "all_leap"));
    assertEquals(CfDateTime.ofDate(2001, 2, 29), decode(59, "days since 2001-01-01", "366_day"));
    assertEquals(CfDateTime.ofDate(1900, 2, 29), decode(59, "days since 1900-01-01", "julian"));
    assertEquals(CfDateTime.ofDate(1900, 3, 1), decode(59, "days since 1900-01-01", "standard"));
  }

  @Test
  void zoneOffsetIsSubtracted() {
    // CF 4.4.1: "1989-12-31 18:00:00 -6" is the instant 1990-01-01 00:00 UTC.
    assertEquals(CfDateTime.ofDate(1990, 1, 1), decode(0, "hours since 1989-12-31 18:00:00 -6", null));
    // Derived from CF 4.4.1: "seconds since 1992-10-8 15:15:42.5 -6:00" refers to 21:15:42.5 UTC.
    assertEquals(new CfDateTime(1992, 10, 8, 21, 15, 42, 500_000_000),
        decode(0, "seconds since 1992-10-8 15:15:42.5 -6:00", "standard"));
    AlignedTimeAxis a = CfTimeDecoder.toTimeAxis(new double[] {0, 1},
        CfTimeUnits.parse("days since 1989-12-31 18:00:00 -6"), CfCalendar.STANDARD);
    assertEquals(epoch(1990, 1, 1, 0, 0, 0), a.axis().epochSecond(0));
    assertEquals(epoch(1990, 1, 2, 0, 0, 0), a.axis().epochSecond(1));
  }

  @Test
  void fractionsAndNegativeValues() {
    assertEquals(CfDateTime.of(2000, 1, 1, 12, 0, 0), decode(0.5, "days since 2000-01-01", "standard"));
    assertEquals(CfDateTime.of(1999, 12, 31, 18, 0, 0), decode(-0.25, "days since 2000-01-01", "standard"));
    // 0.1 day is 8640 s; binary noise in 0.1 * 86400 must not show up as a nanosecond remainder.
    assertEquals(CfDateTime.of(2000, 1, 1, 2, 24, 0), decode(0.1, "days since 2000-01-01", "standard"));
    assertEquals(CfDateTime.of(2000, 1, 2, 0, 1, 30), decode(1441.5, "minutes since 2000-01-01", "standard"));
  }

  @Test
  void prolepticGregorianAgreesWithJavaTimeOnEpochSeconds() {
    // Reference library: java.time. Whole hours over 30 years from a 1970 reference.
    double[] hours = new double[400];
    for (int i = 0; i < hours.length; i++) {
      hours[i] = i * 661.0 + 0.25 * (i % 4);
    }
    TimeAxis axis = CfTimeDecoder.toTimeAxis(hours, CfTimeUnits.parse("hours since 1970-01-01 00:00:00"),
        CfCalendar.PROLEPTIC_GREGORIAN).axis();
    for (int i = 0; i < hours.length; i++) {
      Instant expected = Instant.EPOCH.plusSeconds(Math.round(hours[i] * 3600));
      assertEquals(expected, axis.instant(i));
    }
  }

  @Test
  void dailyDataGivesWholeDayInstants() {
    double[] days = {0, 1, 2, 3};
    TimeAxis axis = CfTimeDecoder.toTimeAxis(days, CfTimeUnits.parse("days since 2006-01-01"), CfCalendar.STANDARD).axis();
    for (int i = 0; i < days.length; i++) {
      assertEquals(0, axis.epochSecond(i) % 86_400);
      assertEquals(LocalDate.of(2006, 1, 1 + i), axis.date(i));
    }
    assertEquals("standard", axis.calendar());
    assertEquals("days since 2006-01-01", axis.units());
  }

  @Test
  void noleapKeepsLabels() {
    // TimeAxis.Alignment.SAME_LABEL: each step keeps its y-m-d label on the real time line.
    double[] days = {57, 58, 59, 364, 365};
    AlignedTimeAxis a = CfTimeDecoder.toTimeAxis(days, CfTimeUnits.parse("days since 2004-01-01"), CfCalendar.NOLEAP);
    assertEquals(Alignment.SAME_LABEL, a.axis().alignment());
    List<LocalDate> dates = List.of(LocalDate.of(2004, 2, 27), LocalDate.of(2004, 2, 28), LocalDate.of(2004, 3, 1),
        LocalDate.of(2004, 12, 31), LocalDate.of(2005, 1, 1));
    for (int i = 0; i < days.length; i++) {
      assertEquals(dates.get(i), a.axis().date(i));
    }
    assertArrayEquals(new int[] {0, 1, 2, 3, 4}, a.sourceIndices());
  }

  @Test
  void allLeapDropsFebruary29OfNonLeapYears() {
    // TimeAxis.Alignment.SAME_LABEL: 29 February of a non-leap year has no real day and is dropped.
    double[] days = {58, 59, 60, 366 + 59, 366 + 60};
    AlignedTimeAxis a = CfTimeDecoder.toTimeAxis(days, CfTimeUnits.parse("days since 2003-01-01"), CfCalendar.ALL_LEAP);
    // 2003-02-28, (2003-02-29 dropped), 2003-03-01, 2004-02-29 (a real leap day, kept), 2004-03-01.
    assertArrayEquals(new int[] {0, 2, 3, 4}, a.sourceIndices());
    assertEquals(LocalDate.of(2003, 2, 28), a.axis().date(0));
    assertEquals(LocalDate.of(2003, 3, 1), a.axis().date(1));
    assertEquals(LocalDate.of(2004, 2, 29), a.axis().date(2));
    assertEquals(LocalDate.of(2004, 3, 1), a.axis().date(3));
    assertEquals(1, a.droppedCount(days.length));
  }

  @Test
  void day360UsesDayOfYearFraction() {
    double[] days = new double[720];
    for (int i = 0; i < days.length; i++) {
      days[i] = i + 0.5; // noon of each 360_day day over 2000 (leap) and 2001 (not leap)
    }
    AlignedTimeAxis a = CfTimeDecoder.toTimeAxis(days, CfTimeUnits.parse("days since 2000-01-01"), CfCalendar.DAY_360);
    assertEquals(Alignment.DAY_OF_YEAR_FRACTION, a.axis().alignment());
    for (int i = 0; i < days.length; i++) {
      int year = 2000 + i / 360;
      int d = i % 360 + 1;
      int yearLength = LocalDate.of(year, 1, 1).lengthOfYear();
      // Rule documented in TimeAxis.Alignment.DAY_OF_YEAR_FRACTION.
      long realDoy = Math.round((d - 0.5) * yearLength / 360 + 0.5);
      LocalDate expected = LocalDate.ofYearDay(year, (int) realDoy);
      assertEquals(expected, a.axis().date(i), "360_day day " + d + " of " + year);
      assertEquals(12 * 3600, a.axis().epochSecond(i) % 86_400, "time of day is kept");
    }
    // Spot values worked by hand from that rule: 2000-02-30 (d = 60) -> real doy round(60.99) = 61,
    // which is 2000-03-01; 2001-12-30 (d = 360) -> round(365.49) = 365 = 2001-12-31.
    assertEquals(LocalDate.of(2000, 3, 1), a.axis().date(59));
    assertEquals(LocalDate.of(2001, 12, 31), a.axis().date(719));
    assertEquals(LocalDate.of(2000, 1, 1), a.axis().date(0));
  }

  @Test
  void referenceDateMustExistInTheCalendar() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> decode(0, "days since 2001-02-29", "standard"));
    assertEquals("time units 'days since 2001-02-29': reference date 2001-02-29 does not exist in the standard"
        + " calendar (CF section 4.4.3)", e.getMessage());
    assertEquals(CfDateTime.ofDate(2001, 3, 1), decode(1, "days since 2001-02-29", "all_leap"));
  }

  @Test
  void refusesMissingAndNonIncreasingValues() {
    CfTimeUnits u = CfTimeUnits.parse("days since 2000-01-01");
    IllegalArgumentException nan = assertThrows(IllegalArgumentException.class,
        () -> CfTimeDecoder.toTimeAxis(new double[] {0, Double.NaN}, u, CfCalendar.STANDARD));
    assertEquals("time value at index 1 is NaN; time coordinates must not be missing (CF section 4.4)", nan.getMessage());
    IllegalArgumentException dec = assertThrows(IllegalArgumentException.class,
        () -> CfTimeDecoder.toTimeAxis(new double[] {0, 2, 1}, u, CfCalendar.STANDARD));
    assertEquals("time values must increase strictly: value 1.0 at index 2 (2000-01-02T00:00:00) is not after the one"
        + " at index 1", dec.getMessage());
  }
}
