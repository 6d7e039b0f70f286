package org.slackwater.core.time;

/**
 * Day counting for one calendar: converts a year-month-day label to a day number and back.
 *
 * <p>Day numbers of the real calendars (standard, proleptic_gregorian, julian) count real days
 * with day 0 = 1970-01-01 of the proleptic Gregorian calendar, so equal numbers are the same real
 * day. Model calendars (noleap, all_leap, 360_day) count from their own 1970-01-01 label. Years use
 * astronomical numbering (year 0 exists); CF leaves year 0 and negative years unstandardised.
 */
interface DayArithmetic {

  /** The day number of a label; the caller has checked {@link #isValid}. */
  long dayNumber(int year, int month, int day);

  /** The label {@code {year, month, day}} of a day number. */
  int[] label(long dayNumber);

  int daysInMonth(int year, int month);

  default boolean isValid(int year, int month, int day) {
    return month >= 1 && month <= 12 && day >= 1 && day <= daysInMonth(year, month);
  }

  /**
   * Proleptic Gregorian: the civil-from-days algorithm on 400-year eras of 146,097 days, with the
   * year starting on 1 March so that the leap day falls at its end.
   */
  final class Gregorian implements DayArithmetic {
    static final Gregorian INSTANCE = new Gregorian();
    // Day number of 0000-03-01 relative to 1970-01-01.
    private static final long SHIFT = 719_468;

    @Override
    public long dayNumber(int year, int month, int day) {
      long y = month <= 2 ? (long) year - 1 : year;
      long era = Math.floorDiv(y, 400);
      long yoe = y - era * 400;
      long doy = (153L * (month > 2 ? month - 3 : month + 9) + 2) / 5 + day - 1;
      long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
      return era * 146_097 + doe - SHIFT;
    }

    @Override
    public int[] label(long dayNumber) {
      long z = dayNumber + SHIFT;
      long era = Math.floorDiv(z, 146_097);
      long doe = z - era * 146_097;
      long yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
      long doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
      long mp = (5 * doy + 2) / 153;
      int d = (int) (doy - (153 * mp + 2) / 5 + 1);
      int m = (int) (mp < 10 ? mp + 3 : mp - 9);
      long y = yoe + era * 400 + (m <= 2 ? 1 : 0);
      return new int[] {Math.toIntExact(y), m, d};
    }

    @Override
    public int daysInMonth(int year, int month) {
      return month == 2 ? (isLeap(year) ? 29 : 28) : FixedYear.NOLEAP_MONTHS[month - 1];
    }

    static boolean isLeap(int year) {
      return (year % 4 == 0 && year % 100 != 0) || year % 400 == 0;
    }
  }

  /**
   * Julian: the same March-based scheme on 4-year cycles of 1,461 days, shifted so that day 0 is
   * the real day 1970-01-01 (Julian 1969-12-19).
   */
  final class Julian implements DayArithmetic {
    static final Julian INSTANCE = new Julian();
    private static final long SHIFT = rawDayNumber(1969, 12, 19);

    private static long rawDayNumber(int year, int month, int day) {
      long y = month <= 2 ? (long) year - 1 : year;
      long era = Math.floorDiv(y, 4);
      long yoe = y - era * 4;
      long doy = (153L * (month > 2 ? month - 3 : month + 9) + 2) / 5 + day - 1;
      return era * 1461 + yoe * 365 + doy;
    }

    @Override
    public long dayNumber(int year, int month, int day) {
      return rawDayNumber(year, month, day) - SHIFT;
    }

    @Override
    public int[] label(long dayNumber) {
      long z = dayNumber + SHIFT;
      long era = Math.floorDiv(z, 1461);
      long doe = z - era * 1461;
      long yoe = Math.min(doe / 365, 3);
      long doy = doe - 365 * yoe;
      long mp = (5 * doy + 2) / 153;
      int d = (int) (doy - (153 * mp + 2) / 5 + 1);
      int m = (int) (mp < 10 ? mp + 3 : mp - 9);
      long y = yoe + era * 4 + (m <= 2 ? 1 : 0);
      return new int[] {Math.toIntExact(y), m, d};
    }

    @Override
    public int daysInMonth(int year, int month) {
      return month == 2 ? (Math.floorMod(year, 4) == 0 ? 29 : 28) : FixedYear.NOLEAP_MONTHS[month - 1];
    }
  }

  /**
   * The CF standard calendar (CF 4.4.3): Julian up to 1582-10-04, Gregorian from 1582-10-15; the
   * ten labels in between do not exist. Julian 1582-10-04 is the real day before Gregorian
   * 1582-10-15, so the two counts join without a gap.
   */
  final class Mixed implements DayArithmetic {
    static final Mixed INSTANCE = new Mixed();
    private static final long FIRST_GREGORIAN_DAY = Gregorian.INSTANCE.dayNumber(1582, 10, 15);

    @Override
    public long dayNumber(int year, int month, int day) {
      return isGregorianLabel(year, month, day)
          ? Gregorian.INSTANCE.dayNumber(year, month, day)
          : Julian.INSTANCE.dayNumber(year, month, day);
    }

    @Override
    public int[] label(long dayNumber) {
      return dayNumber >= FIRST_GREGORIAN_DAY ? Gregorian.INSTANCE.label(dayNumber) : Julian.INSTANCE.label(dayNumber);
    }

    @Override
    public int daysInMonth(int year, int month) {
      return year > 1582 || (year == 1582 && month > 10)
          ? Gregorian.INSTANCE.daysInMonth(year, month)
          : Julian.INSTANCE.daysInMonth(year, month);
    }

    @Override
    public boolean isValid(int year, int month, int day) {
      if (year == 1582 && month == 10 && day > 4 && day < 15) {
        return false;
      }
      return DayArithmetic.super.isValid(year, month, day);
    }

    private static boolean isGregorianLabel(int year, int month, int day) {
      if (year != 1582) {
        return year > 1582;
      }
      return month > 10 || (month == 10 && day >= 15);
    }
  }

  /** Calendars whose years all have the same months: noleap, all_leap and 360_day. */
  final class FixedYear implements DayArithmetic {
    static final int[] NOLEAP_MONTHS = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    static final FixedYear NOLEAP = new FixedYear(NOLEAP_MONTHS);
    static final FixedYear ALL_LEAP = new FixedYear(new int[] {31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31});
    static final FixedYear DAY_360 = new FixedYear(new int[] {30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30, 30});

    private final int[] monthLengths;
    private final int[] monthStarts = new int[13];
    private final int yearLength;

    private FixedYear(int[] monthLengths) {
      this.monthLengths = monthLengths.clone();
      for (int m = 0; m < 12; m++) {
        monthStarts[m + 1] = monthStarts[m] + monthLengths[m];
      }
      this.yearLength = monthStarts[12];
    }

    @Override
    public long dayNumber(int year, int month, int day) {
      return ((long) year - 1970) * yearLength + monthStarts[month - 1] + day - 1;
    }

    @Override
    public int[] label(long dayNumber) {
      long year = 1970 + Math.floorDiv(dayNumber, yearLength);
      int doy = (int) Math.floorMod(dayNumber, (long) yearLength);
      int m = 0;
      while (doy >= monthStarts[m + 1]) {
        m++;
      }
      return new int[] {Math.toIntExact(year), m + 1, doy - monthStarts[m] + 1};
    }

    @Override
    public int daysInMonth(int year, int month) {
      return monthLengths[month - 1];
    }

    int yearLength() {
      return yearLength;
    }
  }
}
