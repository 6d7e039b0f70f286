package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Numbers the periods of a {@link TemporalStep} consecutively on the calendar, so that "k steps
 * earlier" is plain subtraction: day = epoch day, week = ISO weeks since the Monday 1970-01-05,
 * month = 12 x year + month - 1, season = quarters starting in December, year and water year =
 * the year the period starts in. A gap in a series (a missing month) therefore stays a gap
 * instead of silently shifting the following values by one step.
 */
final class StepOrdinal {
  /** Epoch day of Monday 1970-01-05, the first ISO week start on or after the epoch. */
  private static final long FIRST_MONDAY = 4;

  private StepOrdinal() {}

  static long of(TemporalStep step, LocalDate periodStart) {
    long month = 12L * periodStart.getYear() + periodStart.getMonthValue() - 1;
    return switch (step) {
      case DAY -> periodStart.toEpochDay();
      case WEEK -> Math.floorDiv(periodStart.toEpochDay() - FIRST_MONDAY, 7);
      case MONTH -> month;
      // December of year y - 1 opens season 4y; March of y opens 4y + 1.
      case SEASON -> Math.floorDiv(month + 1, 3);
      case YEAR, WATER_YEAR -> periodStart.getYear();
    };
  }

  static LocalDate date(TemporalStep step, long ordinal) {
    return switch (step) {
      case DAY -> LocalDate.ofEpochDay(ordinal);
      case WEEK -> LocalDate.ofEpochDay(ordinal * 7 + FIRST_MONDAY);
      case MONTH -> monthStart(ordinal);
      case SEASON -> monthStart(3 * ordinal - 1);
      case YEAR -> LocalDate.of(Math.toIntExact(ordinal), 1, 1);
      case WATER_YEAR -> LocalDate.of(Math.toIntExact(ordinal), TemporalStep.WATER_YEAR_START_MONTH, 1);
    };
  }

  private static LocalDate monthStart(long month) {
    return LocalDate.of(Math.toIntExact(Math.floorDiv(month, 12)), (int) Math.floorMod(month, 12) + 1, 1);
  }

  /** Lower-case adjective for messages: "monthly", "daily". */
  static String adjective(TemporalStep step) {
    return switch (step) {
      case DAY -> "daily";
      case WEEK -> "weekly";
      case MONTH -> "monthly";
      case SEASON -> "seasonal";
      case YEAR -> "yearly";
      case WATER_YEAR -> "water-year";
    };
  }

  /** Singular step noun for messages: "month", "day". */
  static String noun(TemporalStep step) {
    return switch (step) {
      case DAY -> "day";
      case WEEK -> "week";
      case MONTH -> "month";
      case SEASON -> "season";
      case YEAR -> "year";
      case WATER_YEAR -> "water year";
    };
  }
}
