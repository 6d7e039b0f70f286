package org.slackwater.core.analytics;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.IsoFields;
import java.time.temporal.TemporalAdjusters;

/**
 * The periods a series is reported at. Every period is a run of calendar dates with a first day
 * ({@link #start}) and a label.
 *
 * <ul>
 *   <li>{@code WEEK}: ISO 8601 weeks, Monday to Sunday, labelled {@code 2014-W27};
 *   <li>{@code SEASON}: DJF, MAM, JJA, SON; December counts with the <em>following</em> year's
 *       winter, so {@code 2014-DJF} is 2013-12-01 to 2014-02-28;
 *   <li>{@code WATER_YEAR}: 1 October to 30 September, named after the year it ends in
 *       ({@code WY2014} starts 2013-10-01), a common hydrological convention.
 * </ul>
 */
public enum TemporalStep {
  DAY, WEEK, MONTH, SEASON, YEAR, WATER_YEAR;

  /** The water year's first month. */
  public static final int WATER_YEAR_START_MONTH = 10;

  public LocalDate start(LocalDate d) {
    return switch (this) {
      case DAY -> d;
      case WEEK -> d.with(TemporalAdjusters.previousOrSame(DayOfWeek.MONDAY));
      case MONTH -> d.withDayOfMonth(1);
      case SEASON -> {
        int m = d.getMonthValue();
        int first = m == 12 ? 12 : m <= 2 ? 12 : (m - 3) / 3 * 3 + 3;
        int year = m <= 2 ? d.getYear() - 1 : d.getYear();
        yield LocalDate.of(year, first, 1);
      }
      case YEAR -> d.withDayOfYear(1);
      case WATER_YEAR -> {
        int year = d.getMonthValue() >= WATER_YEAR_START_MONTH ? d.getYear() : d.getYear() - 1;
        yield LocalDate.of(year, WATER_YEAR_START_MONTH, 1);
      }
    };
  }

  /** The last day of the period that starts on {@code start}. */
  public LocalDate end(LocalDate start) {
    return switch (this) {
      case DAY -> start;
      case WEEK -> start.plusDays(6);
      case MONTH -> start.plusMonths(1).minusDays(1);
      case SEASON -> start.plusMonths(3).minusDays(1);
      case YEAR, WATER_YEAR -> start.plusYears(1).minusDays(1);
    };
  }

  public String label(LocalDate start) {
    return switch (this) {
      case DAY -> start.toString();
      case WEEK -> String.format("%d-W%02d", start.get(IsoFields.WEEK_BASED_YEAR), start.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR));
      case MONTH -> String.format("%d-%02d", start.getYear(), start.getMonthValue());
      case SEASON -> {
        int m = start.getMonthValue();
        String name = m == 12 ? "DJF" : m == 3 ? "MAM" : m == 6 ? "JJA" : "SON";
        yield (m == 12 ? start.getYear() + 1 : start.getYear()) + "-" + name;
      }
      case YEAR -> Integer.toString(start.getYear());
      case WATER_YEAR -> "WY" + (start.getYear() + 1);
    };
  }
}
