package org.slackwater.core.analytics;

import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.LagCorrelator;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.Significance;

/**
 * Pearson's r at one lag for one cell against a {@link MapDriver}, by the formulas of {@link
 * LagCorrelator} term for term and in the same order of operations (centring on the overall mean,
 * the gap-free prefix-sum path or the running-sum path, the lag-1 autocorrelations of the paired
 * samples, N_eff, t and p), so the row equals the one {@code LaggedCorrelation} gives for that
 * cell's series. The driver's share of the work is done once in MapDriver; per cell the cost is
 * one or two passes over the lag window (the target is centred on the fly) and nothing is
 * allocated but the row.
 *
 * <p>Only rows with a valid r and, with the correction on, both autocorrelations estimable are
 * produced here. Every other outcome (no value, span shorter than the lag, no or too few pairs,
 * a constant side, an uncorrectable p-value) returns null, and the caller asks the reference path
 * for the row or the failure message, so those words are written in one place only.
 */
final class MapLagKernel {
  /** LagCorrelator's tolerance for a constant sample (relative size of the centred sum of squares). */
  private static final double CONSTANT_TOLERANCE = 1e-12;

  private MapLagKernel() {}

  /**
   * @param target the cell on the driver's axis, NaN where missing; read, not modified
   * @return the row, or null where the reference path must decide
   */
  static LagRow pearson(double[] target, MapDriver d, CorrelationSettings settings) {
    int first = -1;
    int last = -1;
    int count = 0;
    double total = 0;
    for (int i = 0; i < target.length; i++) {
      double v = target[i];
      if (v == v) {
        if (first < 0) {
          first = i;
        }
        last = i;
        total += v;
        count++;
      }
    }
    return pearson(target, first, last, count, total, d, settings);
  }

  /**
   * As {@link #pearson(double[], MapDriver, CorrelationSettings)} with the target's first and last
   * valid position, number of values and their sum (in axis order) already known, as the worker
   * gathers them while laying the cell onto the axis.
   */
  static LagRow pearson(double[] target, int firstT, int lastT, int count, double total, MapDriver d,
      CorrelationSettings settings) {
    if (count == 0 || settings.maxAbsLag() >= lastT - firstT + 1) {
      return null;
    }
    int lag = d.lag();
    int lo = (int) Math.max(firstT, (long) d.first() + lag);
    int hi = (int) Math.min(lastT + 1L, d.last() + 1L + lag);
    if (hi - lo < LagCorrelator.MIN_PAIRS) {
      return null; // at most MIN_PAIRS - 1 pairs in the window, perhaps none
    }
    // LagCorrelator centres on the mean of all the target's values, computed in the same order.
    double mean = total / count;
    boolean complete = d.complete(lo - lag, hi - lag);
    if (complete && count < lastT - firstT + 1) { // some gap between the first and last value: is it in the window?
      for (int i = lo; i < hi && complete; i++) {
        complete = target[i] == target[i];
      }
    }
    return complete ? completeWindow(target, mean, firstT, d, lo, hi, settings)
        : accumulate(target, mean, d, lo, hi, settings);
  }

  /**
   * LagCorrelator's gap-free path. Its prefix sums of the centred target are run here exactly as
   * its Prefix.fill runs them, so that the differences round the same way, and read at lo, lo + 1,
   * hi - 1 and hi. Before the first value every term is 0, so the run starts there.
   */
  private static LagRow completeWindow(double[] t, double mean, int firstT, MapDriver d, int lo, int hi,
      CorrelationSettings settings) {
    double s = 0, q = 0, g = 0;
    double sLo = 0, sLo1 = 0, sHi1 = 0, qLo = 0, gLo = 0, gHi1 = 0;
    int len = t.length;
    for (int i = firstT; i < hi; i++) {
      if (i == lo) {
        sLo = s;
        qLo = q;
        gLo = g;
      }
      if (i == lo + 1) {
        sLo1 = s;
      }
      if (i == hi - 1) {
        sHi1 = s;
        gHi1 = g;
      }
      double x = t[i] - mean;
      double x0 = Double.isNaN(x) ? 0 : x;
      double next = i + 1 < len && !Double.isNaN(t[i + 1]) ? t[i + 1] - mean : 0;
      s = s + x0;
      q = q + x0 * x0;
      g = g + x0 * next;
    }
    int lag = d.lag();
    int n = hi - lo;
    int dlo = lo - lag;
    int dhi = hi - lag;
    return finish(lag, settings, n, n - 1, s - sLo, d.sum(dlo, dhi), q - qLo, d.squares(dlo, dhi),
        dot(t, mean, lo, d.centred(), dlo, n), sHi1 - sLo, s - sLo1, gHi1 - gLo,
        d.sum(dlo, dhi - 1), d.sum(dlo + 1, dhi), d.lagged(dlo, dhi));
  }

  /** LagCorrelator's four partial sums, in its order, of the centred target times the centred driver. */
  private static double dot(double[] a, double mean, int aFrom, double[] b, int bFrom, int n) {
    double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
    int q = 0;
    for (; q + 3 < n; q += 4) {
      s0 += (a[aFrom + q] - mean) * b[bFrom + q];
      s1 += (a[aFrom + q + 1] - mean) * b[bFrom + q + 1];
      s2 += (a[aFrom + q + 2] - mean) * b[bFrom + q + 2];
      s3 += (a[aFrom + q + 3] - mean) * b[bFrom + q + 3];
    }
    for (; q < n; q++) {
      s0 += (a[aFrom + q] - mean) * b[bFrom + q];
    }
    return (s0 + s1) + (s2 + s3);
  }

  /** LagCorrelator's running sums over the complete pairs of [lo, hi), for windows with gaps. */
  private static LagRow accumulate(double[] a, double mean, MapDriver d, int lo, int hi,
      CorrelationSettings settings) {
    double[] b = d.centred();
    int k = d.lag();
    int n = 0;
    int m = 0;
    double sa = 0, sb = 0, saa = 0, sbb = 0, sab = 0;
    double adjA0 = 0, adjA1 = 0, adjAA = 0, adjB0 = 0, adjB1 = 0, adjBB = 0;
    boolean previous = false;
    double pa = 0, pb = 0;
    for (int i = lo; i < hi; i++) {
      double va = a[i] - mean;
      double vb = b[i - k];
      if (va == va && vb == vb) {
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
    return finish(k, settings, n, m, sa, sb, saa, sbb, sab, adjA0, adjA1, adjAA, adjB0, adjB1, adjBB);
  }

  private static LagRow finish(int lag, CorrelationSettings settings, int n, int m, double sa, double sb,
      double saa, double sbb, double sab, double adjA0, double adjA1, double adjAA, double adjB0, double adjB1,
      double adjBB) {
    if (n < LagCorrelator.MIN_PAIRS) {
      return null;
    }
    double ma = sa / n;
    double mb = sb / n;
    double caa = saa - n * ma * ma;
    double cbb = sbb - n * mb * mb;
    double cab = sab - n * ma * mb;
    if (caa <= CONSTANT_TOLERANCE * saa || cbb <= CONSTANT_TOLERANCE * sbb) {
      return null;
    }
    double r = Math.max(-1, Math.min(1, cab / Math.sqrt(caa * cbb)));
    double r1Target = lagOne(n, m, adjAA - ma * (adjA0 + adjA1) + m * ma * ma, caa);
    double r1Driver = lagOne(n, m, adjBB - mb * (adjB0 + adjB1) + m * mb * mb, cbb);
    double nEff = n;
    if (settings.correctForAutocorrelation()) {
      if (Double.isNaN(r1Target) || Double.isNaN(r1Driver)) {
        return null;
      }
      nEff = Significance.effectiveSampleSize(n, r1Target, r1Driver);
    }
    double t = Significance.tStatistic(r, nEff);
    double p = Significance.twoSidedPValue(t, nEff - 2);
    return new LagRow(lag, n, r, r1Target, r1Driver, nEff, t, p, p <= settings.alpha(), "");
  }

  private static double lagOne(int n, int m, double lagged, double centredSquares) {
    if (m < LagCorrelator.MIN_ADJACENT_PAIRS) {
      return Double.NaN;
    }
    double r1 = (double) (n - 1) / m * lagged / centredSquares;
    return Math.max(-1, Math.min(1, r1));
  }
}
