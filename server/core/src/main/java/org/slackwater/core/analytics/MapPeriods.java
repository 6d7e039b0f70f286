package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.Arrays;

/**
 * The periods of a {@link TemporalStep} over the native steps {@code [from, to)} of a cube, cut
 * exactly as {@link TemporalAggregation} cuts them (a run of consecutive native steps with the
 * same period start; partial periods at both ends), computed once per map so that the gathering of
 * cell values ({@link TileBand}) only adds values into period slots. Immutable.
 */
final class MapPeriods {
  private final int from;
  /** First native step of each period, absolute; {@code first[size]} is {@code to}. */
  private final int[] first;
  private final LocalDate[] dates;
  private final boolean singleSteps;

  private MapPeriods(int from, int[] first, LocalDate[] dates) {
    this.from = from;
    this.first = first;
    this.dates = dates;
    this.singleSteps = first[dates.length] - from == dates.length;
  }

  /** @param epochSeconds the cube's time axis; {@code 0 <= from < to <= epochSeconds.length} */
  static MapPeriods of(long[] epochSeconds, int from, int to, TemporalStep step) {
    int[] first = new int[to - from + 1];
    LocalDate[] dates = new LocalDate[to - from];
    int p = 0;
    LocalDate current = null;
    for (int t = from; t < to; t++) {
      LocalDate s = step.start(TemporalAggregation.date(epochSeconds[t]));
      if (!s.equals(current)) {
        first[p] = t;
        dates[p++] = s;
        current = s;
      }
    }
    first[p] = to;
    return new MapPeriods(from, Arrays.copyOf(first, p + 1), Arrays.copyOf(dates, p));
  }

  int size() {
    return dates.length;
  }

  int from() {
    return from;
  }

  int to() {
    return first[dates.length];
  }

  /** First native step (absolute index) of period p. */
  int firstStep(int p) {
    return first[p];
  }

  /** One past the last native step of period p. */
  int endStep(int p) {
    return first[p + 1];
  }

  /** Whether every period is one native step (a daily map of a daily cube): a mean is the value itself. */
  boolean singleSteps() {
    return singleSteps;
  }

  /** The first day of every period, a fresh copy. */
  LocalDate[] dates() {
    return dates.clone();
  }
}
