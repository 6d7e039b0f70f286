package org.slackwater.core.time;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The calendars of the CF conventions (section 4.4.3, table 4.1) with their day arithmetic.
 *
 * <p>Day numbers: for the real calendars ({@link #STANDARD}, {@link #PROLEPTIC_GREGORIAN}, {@link
 * #JULIAN}) day 0 is the real day 1970-01-01 (proleptic Gregorian), so the same number is the same
 * real day whatever the calendar; for the model calendars ({@link #NOLEAP}, {@link #ALL_LEAP},
 * {@link #DAY_360}) day 0 is that calendar's own 1970-01-01 label. Years are numbered
 * astronomically (year 0 exists); CF does not standardise year 0 or negative years.
 *
 * <p>Failure modes: {@link #parse} throws {@link IllegalArgumentException} for a name that is not
 * a CF calendar (the message lists the accepted names); {@link #dayNumber} throws it for a label
 * the calendar lacks (e.g. 2001-02-29 in {@code standard}, 1582-10-10 in {@code standard}).
 */
public enum CfCalendar {
  /** Julian before 1582-10-05, Gregorian from 1582-10-15 (CF 4.4.3); alias {@code gregorian}. */
  STANDARD("standard", DayArithmetic.Mixed.INSTANCE, "gregorian"),
  PROLEPTIC_GREGORIAN("proleptic_gregorian", DayArithmetic.Gregorian.INSTANCE),
  JULIAN("julian", DayArithmetic.Julian.INSTANCE),
  /** Every year has 365 days; alias {@code 365_day}. */
  NOLEAP("noleap", DayArithmetic.FixedYear.NOLEAP, "365_day"),
  /** Every year has 366 days; alias {@code 366_day}. */
  ALL_LEAP("all_leap", DayArithmetic.FixedYear.ALL_LEAP, "366_day"),
  /** Twelve months of 30 days. */
  DAY_360("360_day", DayArithmetic.FixedYear.DAY_360);

  private final String cfName;
  private final DayArithmetic days;
  private final List<String> aliases;

  CfCalendar(String cfName, DayArithmetic days, String... aliases) {
    this.cfName = cfName;
    this.days = days;
    this.aliases = List.of(aliases);
  }

  /** The CF name, e.g. {@code standard} or {@code 360_day}. */
  public String cfName() {
    return cfName;
  }

  /** Whether the calendar's instants are real ones (standard, proleptic_gregorian, julian). */
  public boolean isReal() {
    return this == STANDARD || this == PROLEPTIC_GREGORIAN || this == JULIAN;
  }

  /**
   * Reads a {@code calendar} attribute. {@code null} or blank means {@code standard}, the CF
   * default (4.4.3); names are case-insensitive and may carry surrounding spaces.
   *
   * @throws IllegalArgumentException for a name that is not a CF calendar
   */
  public static CfCalendar parse(String name) {
    if (name == null || name.isBlank()) {
      return STANDARD;
    }
    String n = name.trim().toLowerCase(Locale.ROOT);
    for (CfCalendar c : values()) {
      if (c.cfName.equals(n) || c.aliases.contains(n)) {
        return c;
      }
    }
    throw new IllegalArgumentException("calendar '" + name.trim() + "' is not a CF calendar; use one of "
        + String.join(", ", acceptedNames()) + " (CF section 4.4.3)");
  }

  /** Every name {@link #parse} accepts, canonical names first then aliases. */
  public static List<String> acceptedNames() {
    List<String> names = new ArrayList<>();
    for (CfCalendar c : values()) {
      names.add(c.cfName);
    }
    for (CfCalendar c : values()) {
      names.addAll(c.aliases);
    }
    return List.copyOf(names);
  }

  /** Whether the label exists in this calendar. */
  public boolean isValid(int year, int month, int day) {
    return days.isValid(year, month, day);
  }

  /**
   * The last day label of a month (31 for October 1582 in {@code standard}, although that month
   * lacks the labels 5 to 14).
   */
  public int daysInMonth(int year, int month) {
    if (month < 1 || month > 12) {
      throw new IllegalArgumentException("month " + month + " is not within 1..12");
    }
    return days.daysInMonth(year, month);
  }

  /** The number of days of {@code year} (355 for 1582 in {@code standard}). */
  public int lengthOfYear(int year) {
    int n = 0;
    for (int m = 1; m <= 12; m++) {
      n += days.daysInMonth(year, m);
    }
    return year == 1582 && this == STANDARD ? n - 10 : n;
  }

  /**
   * The day number of a label (see the class comment for the origin).
   *
   * @throws IllegalArgumentException if the calendar lacks the label
   */
  public long dayNumber(int year, int month, int day) {
    if (!days.isValid(year, month, day)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "%04d-%02d-%02d is not a date of the %s calendar", year, month, day, cfName));
    }
    return days.dayNumber(year, month, day);
  }

  /** The label {@code {year, month, day}} of a day number. */
  public int[] label(long dayNumber) {
    return days.label(dayNumber);
  }
}
