package org.slackwater.core.time;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class CfTimeUnitsTest {

  @ParameterizedTest
  @CsvSource({
    // udunits spellings of the CF time units (CF 4.4.1 refers to udunits for them).
    "s, SECOND", "sec, SECOND", "second, SECOND", "seconds, SECOND",
    "min, MINUTE", "minute, MINUTE", "minutes, MINUTE",
    "h, HOUR", "hr, HOUR", "hour, HOUR", "hours, HOUR",
    "d, DAY", "day, DAY", "days, DAY", "Days, DAY"
  })
  void acceptsUdunitsSpellings(String unit, CfTimeUnits.Unit expected) {
    CfTimeUnits u = CfTimeUnits.parse(unit + " since 2000-01-01");
    assertEquals(expected, u.unit());
  }

  @Test
  void unitLengthsAreSiSeconds() {
    // CF 4.4.1: a day is 86400 s, an hour 3600 s, a minute 60 s.
    assertEquals(86_400, CfTimeUnits.Unit.DAY.seconds());
    assertEquals(3_600, CfTimeUnits.Unit.HOUR.seconds());
    assertEquals(60, CfTimeUnits.Unit.MINUTE.seconds());
  }

  @Test
  void dateOnlyMeansMidnight() {
    // CF 4.4.1: "days since 1990-1-1" means "days since 1990-1-1 0:0:0".
    CfTimeUnits u = CfTimeUnits.parse("days since 1990-1-1");
    assertEquals(CfDateTime.of(1990, 1, 1, 0, 0, 0), u.reference());
    assertEquals(0, u.zoneOffsetMinutes());
  }

  @Test
  void readsTimeZoneAndFraction() {
    // Brief example and CF 4.4.1 forms.
    CfTimeUnits a = CfTimeUnits.parse("days since 2006-01-01 00:00:00 -6:00");
    assertEquals(CfDateTime.ofDate(2006, 1, 1), a.reference());
    assertEquals(-360, a.zoneOffsetMinutes());
    assertEquals("days since 2006-01-01 00:00:00 -6:00", a.text());

    CfTimeUnits b = CfTimeUnits.parse("seconds since 1992-10-8 15:15:42.5 -6:00");
    assertEquals(new CfDateTime(1992, 10, 8, 15, 15, 42, 500_000_000), b.reference());
    assertEquals(-360, b.zoneOffsetMinutes());

    assertEquals(-360, CfTimeUnits.parse("hours since 1989-12-31 18:00:00 -6").zoneOffsetMinutes());
    assertEquals(330, CfTimeUnits.parse("hours since 2000-01-01 00:00 +0530").zoneOffsetMinutes());
    assertEquals(330, CfTimeUnits.parse("hours since 2000-01-01 00:00 +05:30").zoneOffsetMinutes());
    assertEquals(0, CfTimeUnits.parse("hours since 2000-01-01 00:00:00 UTC").zoneOffsetMinutes());
    assertEquals(CfDateTime.of(2020, 2, 28, 23, 10, 0), CfTimeUnits.parse("days since 2020-02-28 23:10").reference());
  }

  @Test
  void acceptsIsoSeparatorAndZulu() {
    CfTimeUnits u = CfTimeUnits.parse("hours since 2001-03-04T05:06:07Z");
    assertEquals(CfDateTime.of(2001, 3, 4, 5, 6, 7), u.reference());
    assertEquals(0, u.zoneOffsetMinutes());
    assertEquals(CfTimeUnits.Unit.HOUR, u.unit());
  }

  @ParameterizedTest
  @ValueSource(strings = {"months since 2000-01-01", "years since 2000-01-01", "year since 1850-1-1"})
  void refusesMonthAndYear(String units) {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> CfTimeUnits.parse(units));
    String token = units.substring(0, units.indexOf(' '));
    // CF 4.4.1: month and year are udunits fractions of a tropical year, not calendar units.
    assertEquals("time units '" + units + "' use '" + token + "', which is not a calendar unit: udunits defines month"
        + " and year as fixed fractions of a tropical year (CF section 4.4.1); store the times in days (or hours,"
        + " minutes, seconds) since a reference date", e.getMessage());
  }

  @Test
  void errorMessagesArePinned() {
    assertEquals("time units 'weeks since 2000-01-01' use 'weeks', which is not a time unit; use one of s, sec,"
        + " second(s), min, minute(s), h, hr, hour(s), d, day(s); write e.g. 'days since 2000-01-01 00:00:00'"
        + " (CF section 4.4.1)", message("weeks since 2000-01-01"));
    assertEquals("time units 'days' lack the form '<unit> since <reference date>'; write e.g. 'days since"
        + " 2000-01-01 00:00:00' (CF section 4.4.1)", message("days"));
    assertEquals("time units 'days since 1st of May': reference '1st of May' is not 'y-m-d [H:M[:S[.fraction]]"
        + " [zone]]'; write e.g. 'days since 2000-01-01 00:00:00' (CF section 4.4.1)", message("days since 1st of May"));
    assertEquals("time units 'days since 2000-13-01': reference '2000-13-01': month 13 is not within 1..12; write e.g."
        + " 'days since 2000-01-01 00:00:00' (CF section 4.4.1)", message("days since 2000-13-01"));
    assertEquals("time units 'hours since 2000-01-01 00:00 +15': zone offset '+15' is not within -14:00..+14:00;"
        + " write e.g. 'days since 2000-01-01 00:00:00' (CF section 4.4.1)", message("hours since 2000-01-01 00:00 +15"));
    assertEquals("time units are missing; write e.g. 'days since 2000-01-01 00:00:00' (CF section 4.4.1)", message(" "));
  }

  @Test
  void refusesZoneGluedToBareDate() {
    assertThrows(IllegalArgumentException.class, () -> CfTimeUnits.parse("days since 2000-01-01-6"));
  }

  private static String message(String units) {
    return assertThrows(IllegalArgumentException.class, () -> CfTimeUnits.parse(units)).getMessage();
  }
}
