package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Aggregates a {@link DailySeries} (native steps) into periods of a {@link TemporalStep}. The
 * aggregate follows the statistic, so that a statement reads the same in space and in time:
 *
 * <ul>
 *   <li>mean: mean of the native values with a value (at least one needed, unless the {@link
 *       GapRule} asks for more);
 *   <li>sum: total of the native values; by default every native step of the period must have a
 *       value, as a total over a period with gaps would be too low (a rule for totals such as
 *       rainfall); with a rule that allows gaps, the mean of the values times the period's steps;
 *   <li>min, max: the extreme of the native values;
 *   <li>percentile p: the p-th percentile of the period's native values, by the same
 *       inverse-distribution rule as in space (each native step weighted equally).
 * </ul>
 *
 * Periods are cut at the query's first and last date: a partial first or last period is
 * reported over the native steps it has, and {@code stepsExpected} says how many that is.
 */
public final class TemporalAggregation {

  private TemporalAggregation() {}

  /** With the statistic's default {@link GapRule}. */
  public static StepSeries aggregate(DailySeries daily, TemporalStep step, SpatialStatistic stat) {
    return aggregate(daily, step, stat, GapRule.defaultFor(stat));
  }

  /**
   * Periods that fail {@code gaps} are NaN; a sum over a period with allowed gaps is the mean of
   * its values times its native steps (see {@link GapRule}).
   */
  public static StepSeries aggregate(DailySeries daily, TemporalStep step, SpatialStatistic stat, GapRule gaps) {
    List<LocalDate> starts = new ArrayList<>();
    List<int[]> ranges = new ArrayList<>();
    int n = daily.size();
    int i = 0;
    while (i < n) {
      LocalDate s = step.start(date(daily.epochSeconds()[i]));
      int j = i + 1;
      while (j < n && step.start(date(daily.epochSeconds()[j])).equals(s)) {
        j++;
      }
      starts.add(s);
      ranges.add(new int[] {i, j});
      i = j;
    }
    int m = starts.size();
    double[] value = new double[m], frac = new double[m], cells = new double[m];
    int[] with = new int[m], expected = new int[m];
    for (int p = 0; p < m; p++) {
      int a = ranges.get(p)[0], b = ranges.get(p)[1];
      double[] vals = new double[b - a];
      int k = 0;
      double f = 0, c = 0;
      for (int t = a; t < b; t++) {
        f += daily.validFraction()[t];
        c += daily.validCells()[t];
        if (!Double.isNaN(daily.value()[t])) {
          vals[k++] = daily.value()[t];
        }
      }
      expected[p] = b - a;
      with[p] = k;
      frac[p] = f / (b - a);
      cells[p] = c / (b - a);
      value[p] = !gaps.accepts(daily.value(), a, b) ? Double.NaN : switch (stat.kind()) {
        case MEAN -> mean(vals, k);
        case SUM -> k == b - a ? sum(vals, k) : mean(vals, k) * (b - a);
        case MIN -> Arrays.stream(vals, 0, k).min().getAsDouble();
        case MAX -> Arrays.stream(vals, 0, k).max().getAsDouble();
        case PERCENTILE -> percentile(vals, k, stat.percentile());
      };
    }
    return new StepSeries(step, starts.toArray(LocalDate[]::new), value, frac, cells, with, expected);
  }

  static LocalDate date(long epochSecond) {
    return LocalDate.ofEpochDay(Math.floorDiv(epochSecond, 86_400L));
  }

  private static double mean(double[] v, int k) {
    return sum(v, k) / k;
  }

  private static double sum(double[] v, int k) {
    double s = 0;
    for (int i = 0; i < k; i++) {
      s += v[i];
    }
    return s;
  }

  private static double percentile(double[] v, int k, double p) {
    double[] s = Arrays.copyOf(v, k);
    Arrays.sort(s);
    int rank = (int) Math.ceil(p / 100.0 * k - 1e-9);
    return s[Math.max(0, Math.min(k - 1, rank - 1))];
  }

}
