package org.slackwater.core.time;

import java.util.Locale;

/**
 * A date and time label in some CF calendar, e.g. {@code 2000-02-30T00:00:00} in {@code 360_day}.
 * The record only checks field ranges; whether the date exists is a question for the calendar
 * ({@link CfCalendar#isValid}).
 *
 * @param year astronomical year (year 0 exists)
 * @param month 1..12
 * @param day 1..31
 * @param hour 0..23
 * @param minute 0..59
 * @param second 0..59
 * @param nano 0..999,999,999
 */
public record CfDateTime(int year, int month, int day, int hour, int minute, int second, int nano) {

  public CfDateTime {
    check(month, 1, 12, "month");
    check(day, 1, 31, "day");
    check(hour, 0, 23, "hour");
    check(minute, 0, 59, "minute");
    check(second, 0, 59, "second");
    check(nano, 0, 999_999_999, "nano");
  }

  public static CfDateTime of(int year, int month, int day, int hour, int minute, int second) {
    return new CfDateTime(year, month, day, hour, minute, second, 0);
  }

  public static CfDateTime ofDate(int year, int month, int day) {
    return new CfDateTime(year, month, day, 0, 0, 0, 0);
  }

  /** Seconds since midnight, with the fraction. */
  public double secondOfDay() {
    return hour * 3600.0 + minute * 60.0 + second + nano / 1e9;
  }

  private static void check(int v, int lo, int hi, String what) {
    if (v < lo || v > hi) {
      throw new IllegalArgumentException(what + " " + v + " is not within " + lo + ".." + hi);
    }
  }

  /** ISO-8601 style, e.g. {@code 2000-02-30T00:00:00} or {@code 1992-10-08T21:15:42.5}. */
  @Override
  public String toString() {
    String s = String.format(Locale.ROOT, "%04d-%02d-%02dT%02d:%02d:%02d", year, month, day, hour, minute, second);
    if (nano == 0) {
      return s;
    }
    String frac = String.format(Locale.ROOT, "%09d", nano).replaceAll("0+$", "");
    return s + "." + frac;
  }
}
