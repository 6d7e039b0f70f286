package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.Arrays;

/**
 * The periods of a {@link TemporalStep} over the native steps {@code [from, to)} of a cube, cut
 * exactly as {@link TemporalAggregation} cuts them (a run of consecutive native steps with the
 * same period start; partial periods at both ends), computed once per map so that the per-cell
 * loop only adds values into period slots. Immutable.
 */
final class MapPeriods {
  private final int from;
  /** First native step of each period, absolute; {@code first[size]} is {@code to}. */
  private final int[] first;
  private final LocalDate[] dates;
  /** Every period is one native step (a daily map of a daily cube): a mean is the value itself. */
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

  /**
   * The mean of each period's valid values (NaN if none) into {@code out[outStart + p]}, from the
   * native values {@code values[start + t - from()]}; summed from 0 in time order as
   * TemporalAggregation sums a mean, so the result is the same to the last bit.
   */
  void means(float[] values, int start, double[] out, int outStart) {
    int shift = start - from;
    int size = dates.length;
    if (singleSteps) {
      for (int p = 0; p < size; p++) {
        out[outStart + p] = 0.0 + values[start + p]; // 0 + v, as the sum from 0 rounds it (-0 -> +0)
      }
      return;
    }
    for (int p = 0; p < size; p++) {
      int a = first[p] + shift, b = first[p + 1] + shift;
      double s = 0;
      int k = 0;
      for (int i = a; i < b; i++) {
        float f = values[i];
        if (f == f) { // not NaN
          s += f;
          k++;
        }
      }
      out[outStart + p] = k == 0 ? Double.NaN : s / k;
    }
  }

  /** The first day of every period, a fresh copy. */
  LocalDate[] dates() {
    return dates.clone();
  }
}
