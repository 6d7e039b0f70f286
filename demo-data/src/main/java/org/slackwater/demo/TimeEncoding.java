package org.slackwater.demo;

/**
 * How a file states its daily time axis (CF section 4.4). All three count from 2006-01-01 whatever
 * the generated years, so their values can be checked by hand. The bounds cover the whole day the
 * daily mean refers to.
 */
enum TimeEncoding {
  /** Start of each day, standard calendar. */
  STANDARD_DAYS("days since 2006-01-01 00:00:00", "standard"),
  /** Start of each day on the 365-day calendar; 29 February is dropped from the data. */
  NOLEAP_DAYS("days since 2006-01-01", "noleap"),
  /** Noon of each day in hours, counted from noon of the reference day, standard calendar. */
  NOON_HOURS("hours since 2006-01-01 12:00:00", "standard");

  private final String units;
  private final String calendar;

  TimeEncoding(String units, String calendar) {
    this.units = units;
    this.calendar = calendar;
  }

  String units() {
    return units;
  }

  String calendar() {
    return calendar;
  }

  /** The day indices this encoding carries. */
  int[] days(DayAxis axis) {
    return this == NOLEAP_DAYS ? axis.noleapDays() : axis.allDays();
  }

  double value(DayAxis axis, int day) {
    return switch (this) {
      case STANDARD_DAYS -> axis.standardDaysSinceReference(day);
      case NOLEAP_DAYS -> axis.noleapDaysSinceReference(day);
      case NOON_HOURS -> 24.0 * axis.standardDaysSinceReference(day);
    };
  }

  double[] bounds(DayAxis axis, int day) {
    double v = value(axis, day);
    return this == NOON_HOURS ? new double[] {v - 12, v + 12} : new double[] {v, v + 1};
  }
}
