package org.slackwater.core.analytics.correlation;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.function.IntFunction;

/**
 * The lagged-correlation kernel on two arrays on one axis of consecutive calendar steps (index i
 * is the same period in both; NaN = missing), as built by {@link Alignment#align}. Lag k pairs {@code
 * target[i]} with {@code driver[i - k]}; positive k = driver leads.
 *
 * <p><b>Per lag.</b> The complete pairs (both values present) are the sample; fewer than {@value
 * #MIN_PAIRS} give a NaN row. r is Pearson's product moment, or for Spearman Pearson's r of the
 * ranks (ties averaged) taken over that lag's pairs only, as a rank correlation of those pairs
 * would be computed on its own. Each lag's sums ({@link PairSums}) become its row through {@link
 * LagStatistics}, the implementation the correlation map shares.
 *
 * <p><b>Lag-1 autocorrelation of a paired sample</b> (for N_eff). Over the N used positions, in
 * date order, with x̄ the sample mean: r1 = ((N - 1) / M) Σ (x_i - x̄)(x_{i+1} - x̄) / Σ (x_i - x̄)²,
 * where the first sum runs over the M positions whose next calendar step is also used. Without
 * gaps M = N - 1 and this is the usual estimator (e.g. Box and Jenkins); with gaps, two used
 * values separated by a gap are not one step apart and are not counted as a lag-1 pair, and
 * (N - 1) / M makes up for the lost pairs. The result is clamped to [-1, 1]. With fewer than
 * {@value #MIN_ADJACENT_PAIRS} adjacent pairs r1 is NaN, N_eff falls back to N and the row's note
 * says that the p-value is uncorrected. For Spearman r1 is computed on the ranks, the quantity
 * the test is about.
 *
 * <p><b>Failures</b> ({@link CorrelationInputException}): {@code EMPTY_SERIES} if a side has no
 * value; {@code LAG_RANGE_TOO_LONG} ("lag range too long for the series") if some |lag| is at
 * least the number of steps from the first to the last value of either series; {@code
 * NO_OVERLAP} if no lag of the range has a single complete pair.
 *
 * <p><b>Cost.</b> Pearson: O(L n) for L lags over an axis of n steps. Where neither window of a
 * lag has a missing value, prefix sums give every sum but the cross product, leaving one dot
 * product per lag; otherwise one pass with a dozen running sums. Spearman: O(n log n) once (sorting
 * each side) plus O(n) per lag (ranks are re-read from the sorted order, skipping values without a
 * partner). Memory O(n), held by the instance and reused across lags and calls; per lag only the
 * result row and the t distribution of its p-value are allocated. Nothing is boxed.
 *
 * <p>An instance keeps work arrays and is therefore not thread-safe: use one per thread (for a
 * correlation map, one per worker, fed cell after cell).
 */
public final class LagCorrelator {
  /** Fewest complete pairs for a row: with 3, N_eff - 2 could not exceed 1 and r is nearly arbitrary. */
  public static final int MIN_PAIRS = 4;
  /** Fewest lag-1 pairs for estimating an autocorrelation. */
  public static final int MIN_ADJACENT_PAIRS = 3;
  private final CorrelationSettings settings;
  private final int[] lags;

  private double[] targetWork = new double[0];
  private double[] driverWork = new double[0];
  private int[] targetOrder = new int[0];
  private int[] driverOrder = new int[0];
  private int[] included = new int[0];
  // Prefix sums over the centred values, for the gap-free fast path.
  private final CentredPrefix targetPrefix = new CentredPrefix();
  private final CentredPrefix driverPrefix = new CentredPrefix();

  public LagCorrelator(CorrelationSettings settings) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.lags = settings.lags();
  }

  public CorrelationSettings settings() {
    return settings;
  }

  /**
   * Correlates {@code target[i]} with {@code driver[i - lag]} for every lag of the settings. The
   * arrays are read, not modified, not kept.
   */
  public CorrelationResult compute(double[] target, double[] driver) {
    return compute(target, driver, i -> "step " + i, "steps");
  }

  /** As {@link #compute(double[], double[])}, naming axis positions and the step unit in messages. */
  CorrelationResult compute(double[] target, double[] driver, IntFunction<String> label, String units) {
    if (target.length != driver.length) {
      throw new CorrelationInputException(CorrelationInputException.Kind.BAD_SETTING,
          "target and driver arrays must share one step axis, but have " + target.length + " and "
              + driver.length + " steps; align them first");
    }
    int len = target.length;
    int firstT = firstValue(target);
    int firstD = firstValue(driver);
    if (firstT < 0 || firstD < 0) {
      throw new CorrelationInputException(CorrelationInputException.Kind.EMPTY_SERIES,
          "the " + (firstT < 0 ? "target" : "driver") + " has no values (every value is missing)");
    }
    int lastT = lastValue(target);
    int lastD = lastValue(driver);
    checkLagRange(lastT - firstT + 1, lastD - firstD + 1, label.apply(firstT), label.apply(lastT),
        label.apply(firstD), label.apply(lastD), units);

    ensureCapacity(len);
    boolean spearman = settings.method() == CorrelationMethod.SPEARMAN;
    int nT = 0;
    int nD = 0;
    if (spearman) {
      nT = sortedValid(target, targetOrder);
      nD = sortedValid(driver, driverOrder);
    } else {
      // Centring once on the overall means keeps the one-pass sums well conditioned.
      CentredPrefix.centre(target, targetWork, len);
      CentredPrefix.centre(driver, driverWork, len);
      targetPrefix.fill(targetWork, len);
      driverPrefix.fill(driverWork, len);
    }

    List<LagRow> rows = new ArrayList<>(lags.length);
    long totalPairs = 0;
    for (int lag : lags) {
      // Only where both series have values can there be pairs: i in the target's span and i - lag in the driver's.
      int lo = (int) Math.max(firstT, (long) firstD + lag);
      int hi = (int) Math.min(lastT + 1L, lastD + 1L + lag);
      PairSums sums;
      if (lo >= hi) {
        sums = PairSums.NONE;
      } else if (spearman) {
        rank(target, driver, nT, nD, lo, hi, lag);
        sums = accumulate(targetWork, driverWork, lo, hi, 0);
      } else if (targetPrefix.complete(lo, hi) && driverPrefix.complete(lo - lag, hi - lag)) {
        sums = completeWindow(lo, hi, lag);
      } else {
        sums = accumulate(targetWork, driverWork, lo, hi, lag);
      }
      totalPairs += sums.n();
      rows.add(LagStatistics.row(lag, sums, settings));
    }
    if (totalPairs == 0) {
      throw new CorrelationInputException(CorrelationInputException.Kind.NO_OVERLAP,
          "the series never overlap: no date has a value in both the target (values from " + label.apply(firstT)
              + " to " + label.apply(lastT) + ") and the driver (values from " + label.apply(firstD) + " to "
              + label.apply(lastD) + ") at any lag from " + settings.minLag() + " to " + settings.maxLag()
              + "; choose series that share dates or lags that bring them together");
    }
    return new CorrelationResult(settings, rows);
  }

  private void checkLagRange(int spanT, int spanD, String firstT, String lastT, String firstD, String lastD,
      String units) {
    int reach = settings.maxAbsLag();
    int shorter = Math.min(spanT, spanD);
    if (reach >= shorter) {
      String which = spanT <= spanD
          ? "the target has values over only " + spanT + " " + units + " (" + firstT + " to " + lastT + ")"
          : "the driver has values over only " + spanD + " " + units + " (" + firstD + " to " + lastD + ")";
      throw new CorrelationInputException(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG,
          "lag range too long for the series: lags " + settings.minLag() + " to " + settings.maxLag()
              + " reach " + reach + " " + units + ", but " + which + "; keep every |lag| below " + shorter);
    }
  }

  /**
   * Running sums over positions i in [lo, hi) where a[i] and b[i - k] are both present.
   */
  private static PairSums accumulate(double[] a, double[] b, int lo, int hi, int k) {
    int n = 0;
    int m = 0;
    double sa = 0, sb = 0, saa = 0, sbb = 0, sab = 0;
    double adjA0 = 0, adjA1 = 0, adjAA = 0, adjB0 = 0, adjB1 = 0, adjBB = 0;
    boolean previous = false;
    double pa = 0, pb = 0;
    for (int i = lo; i < hi; i++) {
      double va = a[i];
      double vb = b[i - k];
      if (va == va && vb == vb) { // neither is NaN
        n++;
        sa += va;
        sb += vb;
        saa += va * va;
        sbb += vb * vb;
        sab += va * vb;
        if (previous) {
          m++;
          adjA0 += pa;
          adjA1 += va;
          adjAA += pa * va;
          adjB0 += pb;
          adjB1 += vb;
          adjBB += pb * vb;
        }
        previous = true;
        pa = va;
        pb = vb;
      } else {
        previous = false;
      }
    }
    return new PairSums(n, m, sa, sb, saa, sbb, sab, adjA0, adjA1, adjAA, adjB0, adjB1, adjBB);
  }

  /**
   * The same sums as {@link #accumulate} when no value is missing in either window: everything but
   * the cross product comes from prefix sums in O(1), leaving one dot product per lag.
   */
  private PairSums completeWindow(int lo, int hi, int k) {
    CentredPrefix t = targetPrefix;
    CentredPrefix d = driverPrefix;
    int n = hi - lo;
    int dlo = lo - k;
    int dhi = hi - k;
    return new PairSums(n, n - 1, t.sum(lo, hi), d.sum(dlo, dhi), t.squares(lo, hi), d.squares(dlo, dhi),
        dot(targetWork, lo, driverWork, dlo, n),
        t.sum(lo, hi - 1), t.sum(lo + 1, hi), t.lagged(lo, hi),
        d.sum(dlo, dhi - 1), d.sum(dlo + 1, dhi), d.lagged(dlo, dhi));
  }

  /** Four partial sums break the add-latency chain, roughly doubling throughput. */
  private static double dot(double[] a, int aFrom, double[] b, int bFrom, int n) {
    double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
    int q = 0;
    for (; q + 3 < n; q += 4) {
      s0 += a[aFrom + q] * b[bFrom + q];
      s1 += a[aFrom + q + 1] * b[bFrom + q + 1];
      s2 += a[aFrom + q + 2] * b[bFrom + q + 2];
      s3 += a[aFrom + q + 3] * b[bFrom + q + 3];
    }
    for (; q < n; q++) {
      s0 += a[aFrom + q] * b[bFrom + q];
    }
    return (s0 + s1) + (s2 + s3);
  }

  /**
   * Ranks of the complete pairs at lag k, centred on their mean (m + 1) / 2, written to
   * targetWork[i] and driverWork[i] (the driver's rank at the target position it pairs with);
   * NaN elsewhere in [lo, hi).
   */
  private void rank(double[] target, double[] driver, int nT, int nD, int lo, int hi, int k) {
    Arrays.fill(targetWork, lo, hi, Double.NaN);
    Arrays.fill(driverWork, lo, hi, Double.NaN);
    int m = 0;
    for (int q = 0; q < nT; q++) {
      int i = targetOrder[q];
      if (i >= lo && i < hi && !Double.isNaN(driver[i - k])) {
        included[m++] = i;
      }
    }
    assignRanks(m, target, 0, targetWork);
    m = 0;
    for (int q = 0; q < nD; q++) {
      int i = driverOrder[q] + k;
      if (i >= lo && i < hi && !Double.isNaN(target[i])) {
        included[m++] = i;
      }
    }
    assignRanks(m, driver, -k, driverWork);
  }

  /** included[0, m) are positions in value order; ties share the average of their ranks. */
  private void assignRanks(int m, double[] values, int shift, double[] out) {
    double centre = (m + 1) / 2.0;
    int a = 0;
    while (a < m) {
      double v = values[included[a] + shift];
      int b = a + 1;
      while (b < m && values[included[b] + shift] == v) {
        b++;
      }
      double rank = (a + 1 + b) / 2.0 - centre; // average of ranks a + 1 .. b
      for (int q = a; q < b; q++) {
        out[included[q]] = rank;
      }
      a = b;
    }
  }

  /** Indices of the present values of {@code values}, sorted by value, into order; returns the count. */
  private int sortedValid(double[] values, int[] order) {
    int n = 0;
    for (int i = 0; i < values.length; i++) {
      if (!Double.isNaN(values[i])) {
        order[n++] = i;
      }
    }
    IndexSort.byValue(order, n, values, included);
    return n;
  }

  private void ensureCapacity(int len) {
    if (targetWork.length < len) {
      targetWork = new double[len];
      driverWork = new double[len];
      targetOrder = new int[len];
      driverOrder = new int[len];
      included = new int[len];
    }
  }

  private static int firstValue(double[] values) {
    for (int i = 0; i < values.length; i++) {
      if (!Double.isNaN(values[i])) {
        return i;
      }
    }
    return -1;
  }

  private static int lastValue(double[] values) {
    for (int i = values.length - 1; i >= 0; i--) {
      if (!Double.isNaN(values[i])) {
        return i;
      }
    }
    return -1;
  }
}
