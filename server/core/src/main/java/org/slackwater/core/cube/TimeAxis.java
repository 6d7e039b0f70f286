package org.slackwater.core.cube;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.Objects;

/**
 * The time axis of a cube: one instant per step, strictly increasing, on the real (proleptic
 * Gregorian, UTC) time line, plus the CF calendar and units the source declared.
 *
 * <p>Model calendars such as {@code noleap} or {@code 360_day} have dates the real calendar lacks
 * (or lacks dates it has). Sources map them onto real instants by the rule named in {@code
 * alignment} (see {@link Alignment}), so that series from different calendars can be compared on
 * real dates. The calendar name is kept for provenance and for describing the cube.
 *
 * @param calendar the CF calendar name, normalised (e.g. {@code standard}, {@code noleap})
 * @param units the CF time units as written in the source (e.g. {@code days since 2006-01-01})
 * @param alignment how the calendar's dates were placed on real instants
 * @param epochSeconds seconds since 1970-01-01T00:00Z of each step; copied in and out
 */
public record TimeAxis(String calendar, String units, Alignment alignment, long[] epochSeconds) {

  /** How a calendar's dates were mapped onto real instants. */
  public enum Alignment {
    /** A real calendar (standard, proleptic_gregorian, julian): the instant is exact. */
    EXACT,
    /**
     * A model calendar whose date labels mostly exist in the real calendar (noleap, all_leap): a
     * step keeps its year-month-day label; labels the real calendar lacks (29 February of a
     * non-leap year in all_leap) are dropped by the source.
     */
    SAME_LABEL,
    /**
     * 360_day: day of year d (1..360) is placed at the real day of the same year whose fraction of
     * the year is closest, i.e. round((d - 0.5) * yearLength / 360 + 0.5).
     */
    DAY_OF_YEAR_FRACTION
  }

  public TimeAxis {
    Objects.requireNonNull(calendar, "calendar");
    Objects.requireNonNull(units, "units");
    Objects.requireNonNull(alignment, "alignment");
    Objects.requireNonNull(epochSeconds, "epochSeconds");
    epochSeconds = epochSeconds.clone();
    for (int i = 1; i < epochSeconds.length; i++) {
      if (epochSeconds[i] <= epochSeconds[i - 1]) {
        throw new IllegalArgumentException("time steps are not strictly increasing at step " + i);
      }
    }
  }

  public int size() {
    return epochSeconds.length;
  }

  @Override
  public long[] epochSeconds() {
    return epochSeconds.clone();
  }

  public long epochSecond(int i) {
    return epochSeconds[i];
  }

  public Instant instant(int i) {
    return Instant.ofEpochSecond(epochSeconds[i]);
  }

  /** The UTC date of step {@code i}. */
  public LocalDate date(int i) {
    return LocalDate.ofInstant(instant(i), ZoneOffset.UTC);
  }

  /** The first step at or after {@code epochSecond}, or {@link #size()} if none. */
  public int firstAtOrAfter(long epochSecond) {
    int i = Arrays.binarySearch(epochSeconds, epochSecond);
    return i >= 0 ? i : -i - 1;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof TimeAxis t
        && calendar.equals(t.calendar)
        && units.equals(t.units)
        && alignment == t.alignment
        && Arrays.equals(epochSeconds, t.epochSeconds);
  }

  @Override
  public int hashCode() {
    return Objects.hash(calendar, units, alignment, Arrays.hashCode(epochSeconds));
  }

  @Override
  public String toString() {
    return "TimeAxis[" + calendar + ", " + size() + " steps"
        + (size() > 0 ? ", " + instant(0) + ".." + instant(size() - 1) : "") + "]";
  }
}
