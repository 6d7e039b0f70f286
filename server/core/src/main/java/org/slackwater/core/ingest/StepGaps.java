package org.slackwater.core.ingest;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.slackwater.core.cube.TimeAxis;

/**
 * Finds stretches without steps next to new steps. The usual spacing is the (lower) median difference of
 * the whole axis (robust to the gaps themselves and to month lengths); a spacing is a gap when it
 * exceeds 1.5 usual steps on a real calendar. Model calendars placed on real dates (noleap,
 * all_leap, 360_day, see {@link TimeAxis.Alignment}) have two-day spacings by construction (29
 * February of a noleap year, the days 360_day skips), so there only spacings above 2.5 usual steps
 * count: a single missing day there goes unreported, a longer gap does not.
 */
final class StepGaps {
  private static final double REAL_CALENDAR = 1.5;
  private static final double MODEL_CALENDAR = 2.5;

  private StepGaps() {}

  /**
   * Gaps of {@code axis} that border a step for which {@code isNew} is true.
   *
   * @param axis epoch seconds, strictly increasing
   */
  static List<StepGap> around(long[] axis, boolean[] isNew, TimeAxis.Alignment alignment) {
    List<StepGap> out = new ArrayList<>();
    if (axis.length < 2) {
      return out;
    }
    long[] diffs = new long[axis.length - 1];
    for (int i = 1; i < axis.length; i++) {
      diffs[i - 1] = axis[i] - axis[i - 1];
    }
    long[] sorted = diffs.clone();
    Arrays.sort(sorted);
    // The lower median: with few steps and one gap among them, the mean of the two middle
    // spacings would already be stretched by the gap.
    double usual = sorted[(sorted.length - 1) / 2];
    double factor = alignment == TimeAxis.Alignment.EXACT ? REAL_CALENDAR : MODEL_CALENDAR;
    for (int i = 1; i < axis.length; i++) {
      if ((isNew[i] || isNew[i - 1]) && diffs[i - 1] > factor * usual) {
        int missing = (int) Math.max(1, Math.round(diffs[i - 1] / usual) - 1);
        out.add(new StepGap(Instant.ofEpochSecond(axis[i - 1]), Instant.ofEpochSecond(axis[i]), missing));
      }
    }
    return out;
  }
}
