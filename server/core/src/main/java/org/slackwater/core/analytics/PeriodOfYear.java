package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.time.temporal.IsoFields;

/**
 * The period-of-year class of a date, 0-based, for climatologies.
 *
 * <ul>
 *   <li>MONTH: calendar month (12 classes);
 *   <li>WEEK: ISO 8601 week number, week 53 pooled with week 52 (52 classes), because week 53
 *       occurs in only about one year in six and would get a climatology from a handful of values;
 *   <li>DAY: day of year on a 365-day year, 29 February sharing 28 February's class, so 1 March is
 *       the same class in every year (365 classes);
 *   <li>SEASON: DJF, MAM, JJA, SON (4 classes);
 *   <li>YEAR, WATER_YEAR: one class (there is no cycle within the period to remove).
 * </ul>
 * These are the same classes as {@code org.slackwater.core.analytics.Climatology} uses.
 */
public final class PeriodOfYear {
  /** Day classes: a 365-day year. */
  public static final int DAYS = 365;
  private static final int FEB_29_DAY_OF_YEAR = 60;

  private PeriodOfYear() {}

  public static int classCount(TemporalStep step) {
    return switch (step) {
      case DAY -> DAYS;
      case WEEK -> 52;
      case MONTH -> 12;
      case SEASON -> 4;
      case YEAR, WATER_YEAR -> 1;
    };
  }

  public static int classOf(TemporalStep step, LocalDate date) {
    return switch (step) {
      case DAY -> {
        int doy = date.getDayOfYear();
        yield (date.isLeapYear() && doy >= FEB_29_DAY_OF_YEAR ? doy - 1 : doy) - 1;
      }
      case WEEK -> Math.min(date.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR), 52) - 1;
      case MONTH -> date.getMonthValue() - 1;
      case SEASON -> (date.getMonthValue() % 12) / 3; // Dec, Jan, Feb -> 0; Mar..May -> 1; ...
      case YEAR, WATER_YEAR -> 0;
    };
  }
}
