package org.slackwater.demo;

import java.time.LocalDate;
import java.time.Month;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;

/**
 * The daily time line of the scenario: every calendar day from 1 January of the first year to
 * 31 December of the last, on the proleptic Gregorian calendar that CF calls "standard" for these
 * years. Models index days 0..size()-1; the time encodings of the files are derived from here.
 *
 * <p>Immutable.
 */
final class DayAxis {

  /** Every file counts time from this date, whatever years are generated. */
  static final LocalDate REFERENCE = LocalDate.of(2006, 1, 1);

  private final LocalDate first;
  private final int size;

  DayAxis(int firstYear, int lastYear) {
    this.first = LocalDate.of(firstYear, 1, 1);
    this.size = (int) ChronoUnit.DAYS.between(first, LocalDate.of(lastYear + 1, 1, 1));
  }

  int size() {
    return size;
  }

  LocalDate date(int day) {
    return first.plusDays(day);
  }

  /** Index of {@code date}, or -1 when it is outside the axis. */
  int indexOf(LocalDate date) {
    long i = ChronoUnit.DAYS.between(first, date);
    return i < 0 || i >= size ? -1 : (int) i;
  }

  /** Day of year, 1..366. */
  int dayOfYear(int day) {
    return date(day).getDayOfYear();
  }

  /** Whole days from {@link #REFERENCE} to the start of {@code day} on the standard calendar. */
  long standardDaysSinceReference(int day) {
    return ChronoUnit.DAYS.between(REFERENCE, date(day));
  }

  /**
   * Whole days from {@link #REFERENCE} on the CF "noleap" calendar, in which every year has 365 days.
   * Undefined for 29 February, which that calendar does not have.
   */
  long noleapDaysSinceReference(int day) {
    LocalDate d = date(day);
    int doy = d.getDayOfYear();
    if (d.isLeapYear() && d.getMonthValue() > 2) {
      doy -= 1;
    }
    return 365L * (d.getYear() - REFERENCE.getYear()) + (doy - 1);
  }

  static boolean isLeapDay(LocalDate d) {
    return d.getMonth() == Month.FEBRUARY && d.getDayOfMonth() == 29;
  }

  /** All day indices, in order. */
  int[] allDays() {
    int[] all = new int[size];
    for (int i = 0; i < size; i++) {
      all[i] = i;
    }
    return all;
  }

  /** Day indices without 29 February: the days a noleap file carries. */
  int[] noleapDays() {
    List<Integer> kept = new ArrayList<>();
    for (int i = 0; i < size; i++) {
      if (!isLeapDay(date(i))) {
        kept.add(i);
      }
    }
    return kept.stream().mapToInt(Integer::intValue).toArray();
  }
}
