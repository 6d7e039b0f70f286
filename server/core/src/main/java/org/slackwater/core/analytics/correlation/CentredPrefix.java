package org.slackwater.core.analytics.correlation;

/**
 * Prefix sums of one series centred on its mean, so that the sums {@link PairSums} needs over any
 * window without a missing value cost O(1): index i of each array covers positions [0, i), a
 * missing value (NaN) counts as 0 and is counted in {@link #complete}. Shared by {@link
 * LagCorrelator} (target and driver, per call) and the correlation map (its driver, once per map)
 * so that both form these sums in the same order.
 *
 * <p>A reusable work buffer, not a value: {@link #fill} overwrites it (growing the arrays when
 * needed), and it is not thread-safe while being filled. Once filled it may be read concurrently.
 */
public final class CentredPrefix {
  private double[] sum = new double[1];
  private double[] squares = new double[1];
  private double[] lagged = new double[1];
  private int[] missing = new int[1];

  /**
   * {@code out[i] = values[i] - mean} for i in [0, len), the mean taken over the values that are
   * not NaN in index order (NaN stays NaN).
   *
   * @return the mean (NaN without values)
   */
  public static double centre(double[] values, double[] out, int len) {
    double s = 0;
    int n = 0;
    for (int i = 0; i < len; i++) {
      double v = values[i];
      if (v == v) {
        s += v;
        n++;
      }
    }
    double mean = s / n;
    for (int i = 0; i < len; i++) {
      out[i] = values[i] - mean;
    }
    return mean;
  }

  /** The prefix sums of the centred values {@code v[0, len)}. */
  public void fill(double[] v, int len) {
    if (sum.length < len + 1) {
      sum = new double[len + 1];
      squares = new double[len + 1];
      lagged = new double[len + 1];
      missing = new int[len + 1];
    }
    for (int i = 0; i < len; i++) {
      double x = v[i];
      boolean absent = Double.isNaN(x);
      double x0 = absent ? 0 : x;
      double next = i + 1 < len && !Double.isNaN(v[i + 1]) ? v[i + 1] : 0;
      sum[i + 1] = sum[i] + x0;
      squares[i + 1] = squares[i] + x0 * x0;
      lagged[i + 1] = lagged[i] + x0 * next;
      missing[i + 1] = missing[i] + (absent ? 1 : 0);
    }
  }

  /** Whether no value is missing in [from, to). */
  public boolean complete(int from, int to) {
    return missing[to] == missing[from];
  }

  /** Sum over [from, to). */
  public double sum(int from, int to) {
    return sum[to] - sum[from];
  }

  /** Sum of squares over [from, to). */
  public double squares(int from, int to) {
    return squares[to] - squares[from];
  }

  /** Sum of x_i x_{i+1} for i in [from, to - 1), i.e. over the lag-1 pairs inside [from, to). */
  public double lagged(int from, int to) {
    return lagged[to - 1] - lagged[from];
  }
}
