package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The distribution of a series' values in each period-of-year class over a baseline, and the
 * comparisons against it: anomaly (value − class mean), standardized anomaly (anomaly / class
 * standard deviation, n − 1 in the denominator) and percentile rank within the baseline.
 *
 * <p>Classes follow the step: calendar month for monthly values, the season for seasonal, the
 * ISO week (week 53 pooled with week 52) for weekly, one class for yearly and water-year values.
 * Daily values are classed by day of year on a 365-day year (29 February shares 28 February's
 * class) and pooled over a centred window of ±{@code dayWindow} days, so a 20-year baseline gives
 * each day about 20 x (2 x 15 + 1) values rather than 20.
 *
 * <p>Percentile rank is the mid-rank definition: 100 x (count below + ½ count equal) / n, so the
 * baseline median has rank 50 and a value above every baseline value approaches but never
 * reaches 100.
 */
public final class Climatology {
  /** The default half-width of the daily pooling window, in days. */
  public static final int DEFAULT_DAY_WINDOW = 15;

  private final TemporalStep step;
  private final double[][] sorted;
  private final double[] mean;
  private final double[] sd;

  private Climatology(TemporalStep step, double[][] sorted) {
    this.step = step;
    this.sorted = sorted;
    this.mean = new double[sorted.length];
    this.sd = new double[sorted.length];
    for (int c = 0; c < sorted.length; c++) {
      double[] v = sorted[c];
      double m = 0;
      for (double x : v) {
        m += x;
      }
      m = v.length > 0 ? m / v.length : Double.NaN;
      double ss = 0;
      for (double x : v) {
        ss += (x - m) * (x - m);
      }
      mean[c] = m;
      sd[c] = v.length > 1 ? Math.sqrt(ss / (v.length - 1)) : Double.NaN;
    }
  }

  public static Climatology of(StepSeries baseline, int dayWindow) {
    TemporalStep step = baseline.step();
    int classes = PeriodOfYear.classCount(step);
    List<List<Double>> pools = new ArrayList<>();
    for (int c = 0; c < classes; c++) {
      pools.add(new ArrayList<>());
    }
    for (int i = 0; i < baseline.size(); i++) {
      double v = baseline.value()[i];
      if (Double.isNaN(v)) {
        continue;
      }
      int c = classOf(step, baseline.start()[i]);
      if (step == TemporalStep.DAY) {
        for (int d = -dayWindow; d <= dayWindow; d++) {
          pools.get(Math.floorMod(c + d, 365)).add(v);
        }
      } else {
        pools.get(c).add(v);
      }
    }
    double[][] sorted = new double[classes][];
    for (int c = 0; c < classes; c++) {
      sorted[c] = pools.get(c).stream().mapToDouble(Double::doubleValue).sorted().toArray();
    }
    return new Climatology(step, sorted);
  }

  /** The class of the period starting on {@code start}: 0-based (see {@link PeriodOfYear}). */
  public static int classOf(TemporalStep step, LocalDate start) {
    return PeriodOfYear.classOf(step, start);
  }

  public TemporalStep step() {
    return step;
  }

  public double mean(LocalDate start) {
    return mean[classOf(step, start)];
  }

  public double sd(LocalDate start) {
    return sd[classOf(step, start)];
  }

  public int n(LocalDate start) {
    return sorted[classOf(step, start)].length;
  }

  public double anomaly(LocalDate start, double v) {
    return v - mean(start);
  }

  public double standardizedAnomaly(LocalDate start, double v) {
    double s = sd(start);
    return s > 0 ? (v - mean(start)) / s : Double.NaN;
  }

  public double percentileRank(LocalDate start, double v) {
    double[] s = sorted[classOf(step, start)];
    if (s.length == 0 || Double.isNaN(v)) {
      return Double.NaN;
    }
    int below = lowerBound(s, v), upTo = upperBound(s, v);
    return 100.0 * (below + 0.5 * (upTo - below)) / s.length;
  }

  private static int lowerBound(double[] s, double v) {
    int i = Arrays.binarySearch(s, v);
    if (i < 0) {
      return -i - 1;
    }
    while (i > 0 && s[i - 1] == v) {
      i--;
    }
    return i;
  }

  private static int upperBound(double[] s, double v) {
    int i = Arrays.binarySearch(s, v);
    if (i < 0) {
      return -i - 1;
    }
    while (i < s.length && s[i] == v) {
      i++;
    }
    return i;
  }
}
