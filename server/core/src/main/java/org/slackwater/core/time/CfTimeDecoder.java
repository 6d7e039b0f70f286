package org.slackwater.core.time;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.cube.TimeAxis.Alignment;

/**
 * Turns CF time coordinate values into calendar labels and into a {@link TimeAxis} on real
 * instants.
 *
 * <p>A value {@code v} means the reference instant plus {@code v} units, counted in the calendar
 * (CF 4.4.1, 4.4.3). Labels carry microsecond precision: the sum is rounded to the nearest
 * microsecond, which removes the binary noise of values such as 0.1 days without hiding real
 * sub-second steps. On the {@link TimeAxis} instants are whole epoch seconds, rounded to the
 * nearest second; whole-day values with a midnight reference give midnight instants.
 *
 * <p>Placement on real instants follows {@link Alignment}: exact for standard,
 * proleptic_gregorian and julian; the same label for noleap and all_leap (all_leap's 29 February
 * of non-leap years has no real day and is dropped); day-of-year fraction for 360_day.
 *
 * <p>Failure modes ({@link IllegalArgumentException}, message naming the value's index): a
 * reference date the calendar lacks; a value that is NaN or infinite (time coordinates must not
 * be missing); a result outside the supported years; instants that do not strictly increase.
 */
public final class CfTimeDecoder {

  private static final double SECONDS_PER_DAY = 86_400.0;
  private static final long MICROS_PER_DAY = 86_400_000_000L;

  private CfTimeDecoder() {}

  /** The calendar label of one value. */
  public static CfDateTime decode(double value, CfTimeUnits units, CfCalendar calendar) {
    return decode(new double[] {value}, units, calendar).get(0);
  }

  /** The calendar labels of {@code values}, in order. */
  public static List<CfDateTime> decode(double[] values, CfTimeUnits units, CfCalendar calendar) {
    long[] dayAndMicros = new long[2];
    List<CfDateTime> out = new ArrayList<>(values.length);
    Origin origin = Origin.of(units, calendar);
    for (int i = 0; i < values.length; i++) {
      origin.offset(values[i], i, dayAndMicros);
      out.add(label(calendar, dayAndMicros[0], dayAndMicros[1]));
    }
    return List.copyOf(out);
  }

  /**
   * The time axis of {@code values} on real instants, with the source positions kept.
   *
   * @throws IllegalArgumentException as described in the class comment
   */
  public static AlignedTimeAxis toTimeAxis(double[] values, CfTimeUnits units, CfCalendar calendar) {
    Origin origin = Origin.of(units, calendar);
    long[] dayAndMicros = new long[2];
    long[] epoch = new long[values.length];
    int[] kept = new int[values.length];
    int n = 0;
    for (int i = 0; i < values.length; i++) {
      origin.offset(values[i], i, dayAndMicros);
      long realDay = realDay(calendar, dayAndMicros[0]);
      if (realDay == Long.MIN_VALUE) {
        continue; // all_leap 29 February of a non-leap year
      }
      long second = Math.floorDiv(dayAndMicros[1] + 500_000, 1_000_000);
      long instant = realDay * 86_400 + second;
      if (n > 0 && instant <= epoch[n - 1]) {
        throw new IllegalArgumentException(String.format(Locale.ROOT,
            "time values must increase strictly: value %s at index %d (%s) is not after the one at index %d",
            values[i], i, label(calendar, dayAndMicros[0], dayAndMicros[1]), kept[n - 1]));
      }
      epoch[n] = instant;
      kept[n] = i;
      n++;
    }
    TimeAxis axis = new TimeAxis(calendar.cfName(), units.text(), alignment(calendar), Arrays.copyOf(epoch, n));
    return new AlignedTimeAxis(axis, Arrays.copyOf(kept, n));
  }

  /** The alignment rule of {@link TimeAxis} that applies to a calendar. */
  public static Alignment alignment(CfCalendar calendar) {
    return switch (calendar) {
      case STANDARD, PROLEPTIC_GREGORIAN, JULIAN -> Alignment.EXACT;
      case NOLEAP, ALL_LEAP -> Alignment.SAME_LABEL;
      case DAY_360 -> Alignment.DAY_OF_YEAR_FRACTION;
    };
  }

  /** The real (proleptic Gregorian) day number of a calendar day, or Long.MIN_VALUE to drop it. */
  private static long realDay(CfCalendar calendar, long dayNumber) {
    if (calendar.isReal()) {
      return dayNumber;
    }
    int[] ymd = calendar.label(dayNumber);
    CfCalendar real = CfCalendar.PROLEPTIC_GREGORIAN;
    if (calendar == CfCalendar.DAY_360) {
      // TimeAxis.Alignment.DAY_OF_YEAR_FRACTION: round((d - 0.5) * yearLength / 360 + 0.5); no ties
      // occur because (2d - 1) is odd and 720 / gcd(720, 365 or 366) is even.
      int d = (ymd[1] - 1) * 30 + ymd[2];
      int yearLength = real.lengthOfYear(ymd[0]);
      long realDoy = Math.round((d - 0.5) * yearLength / 360.0 + 0.5);
      return real.dayNumber(ymd[0], 1, 1) + realDoy - 1;
    }
    if (!real.isValid(ymd[0], ymd[1], ymd[2])) {
      return Long.MIN_VALUE;
    }
    return real.dayNumber(ymd[0], ymd[1], ymd[2]);
  }

  private static CfDateTime label(CfCalendar calendar, long day, long microsOfDay) {
    int[] ymd = calendar.label(day);
    long secs = microsOfDay / 1_000_000;
    int nano = (int) (microsOfDay % 1_000_000) * 1000;
    return new CfDateTime(ymd[0], ymd[1], ymd[2], (int) (secs / 3600), (int) (secs / 60 % 60), (int) (secs % 60), nano);
  }

  /** The reference instant of some units in some calendar, as a day number and a UTC second of day. */
  private record Origin(long day, double secondOfDay, double unitSeconds, String units) {

    static Origin of(CfTimeUnits units, CfCalendar calendar) {
      CfDateTime r = units.reference();
      if (!calendar.isValid(r.year(), r.month(), r.day())) {
        throw new IllegalArgumentException(String.format(Locale.ROOT,
            "time units '%s': reference date %04d-%02d-%02d does not exist in the %s calendar (CF section 4.4.3)",
            units.text(), r.year(), r.month(), r.day(), calendar.cfName()));
      }
      return new Origin(calendar.dayNumber(r.year(), r.month(), r.day()), units.referenceSecondOfDayUtc(),
          units.unit().seconds(), units.text());
    }

    /** Writes {day number, microsecond of day} of {@code value} into {@code out}. */
    void offset(double value, int index, long[] out) {
      if (!Double.isFinite(value)) {
        throw new IllegalArgumentException("time value at index " + index + " is " + value
            + "; time coordinates must not be missing (CF section 4.4)");
      }
      double seconds = secondOfDay + value * unitSeconds;
      double days = Math.floor(seconds / SECONDS_PER_DAY);
      // Keeps the year of every label within int range.
      if (Math.abs(days) > 1e9) {
        throw new IllegalArgumentException("time value at index " + index + " (" + value + " with units '" + units
            + "') lies more than a billion days from 1970");
      }
      long micros = Math.round((seconds - days * SECONDS_PER_DAY) * 1e6);
      long day = day() + (long) days;
      if (micros >= MICROS_PER_DAY) {
        micros -= MICROS_PER_DAY;
        day++;
      } else if (micros < 0) {
        micros += MICROS_PER_DAY;
        day--;
      }
      out[0] = day;
      out[1] = micros;
    }
  }
}
