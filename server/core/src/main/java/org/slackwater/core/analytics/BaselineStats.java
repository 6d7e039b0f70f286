package org.slackwater.core.analytics;

import java.util.Arrays;

/**
 * A value compared with a baseline sample: the sample's mean, standard deviation (n − 1 in the
 * denominator) and count; the anomaly, standardized anomaly and mid-rank percentile of a value,
 * 100 (below + ½ equal) / n. Missing (NaN) baseline values are left out.
 */
public final class BaselineStats {
  private final double[] sorted;
  private final double mean;
  private final double sd;

  private BaselineStats(double[] sorted) {
    this.sorted = sorted;
    double m = 0;
    for (double x : sorted) {
      m += x;
    }
    m = sorted.length > 0 ? m / sorted.length : Double.NaN;
    double ss = 0;
    for (double x : sorted) {
      ss += (x - m) * (x - m);
    }
    this.mean = m;
    this.sd = sorted.length > 1 ? Math.sqrt(ss / (sorted.length - 1)) : Double.NaN;
  }

  public static BaselineStats of(double[] values) {
    return new BaselineStats(Arrays.stream(values).filter(v -> !Double.isNaN(v)).sorted().toArray());
  }

  public double mean() {
    return mean;
  }

  public double sd() {
    return sd;
  }

  public int n() {
    return sorted.length;
  }

  public double anomaly(double v) {
    return v - mean;
  }

  public double standardizedAnomaly(double v) {
    return sd > 0 ? (v - mean) / sd : Double.NaN;
  }

  public double percentileRank(double v) {
    if (sorted.length == 0 || Double.isNaN(v)) {
      return Double.NaN;
    }
    int below = 0, equal = 0;
    for (double x : sorted) {
      if (x < v) below++;
      else if (x == v) equal++;
    }
    return 100.0 * (below + 0.5 * equal) / sorted.length;
  }
}
