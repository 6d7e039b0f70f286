package org.slackwater.core.analytics;

/**
 * The inner loop of {@link AreaStatistics}: for each step of one chunk, the valid area Σ aᵢ, the
 * weighted sum Σ aᵢvᵢ and the valid count over a tile's cells, added to the per-step totals.
 *
 * <p>Four steps go through each run of cells together. Their sums are independent, so the
 * processor overlaps four chains of additions instead of waiting for one, and each area is loaded
 * once for four values. Within a step the values are still added in cell order, so Σ aᵢvᵢ of a
 * tile is the same to the last bit as a plain loop's (of fused multiply-adds where the processor
 * has them, see {@link FusedMultiplyAdd}, else of products and sums). The valid area is the tile's total minus the
 * area of the missing cells, so the common valid case costs one multiply-add; where more than half
 * of the area is missing it is summed directly instead, so it never loses more than an ulp or two
 * to cancellation, and it is exactly 0 when every cell is missing.
 */
final class StepSums {
  /** Fused multiply-adds where the processor has them: one rounding per term, about 10 % faster here. */
  private static final boolean FMA = FusedMultiplyAdd.AVAILABLE;

  private StepSums() {}

  /**
   * Adds steps {@code [t0, t1)} of a chunk that starts at step {@code chunkT0} into {@code sumW},
   * {@code sumWV} and {@code count} at index {@code t - from}.
   */
  static void add(float[] v, int chunkT0, int t0, int t1, int from, TileCells c, double[] sumW, double[] sumWV,
      int[] count) {
    final int plane = c.plane, runs = c.runs;
    final int[] runStart = c.runStart, runFirst = c.runFirst, runLen = c.runLen;
    final double[] area = c.area;
    int t = t0;
    for (; t + 3 < t1; t += 4) {
      int b0 = (t - chunkT0) * plane, b1 = b0 + plane, b2 = b1 + plane, b3 = b2 + plane;
      double s0 = 0, s1 = 0, s2 = 0, s3 = 0, m0 = 0, m1 = 0, m2 = 0, m3 = 0;
      int n0 = 0, n1 = 0, n2 = 0, n3 = 0;
      for (int r = 0; r < runs; r++) {
        int o = runStart[r], end = o + runLen[r], a0 = runFirst[r] - o;
        for (int i = o; i < end; i++) {
          double a = area[a0 + i];
          float f0 = v[b0 + i], f1 = v[b1 + i], f2 = v[b2 + i], f3 = v[b3 + i];
          if (f0 == f0) { // not NaN
            s0 = FMA ? Math.fma(a, f0, s0) : s0 + a * f0;
          } else {
            m0 += a;
            n0++;
          }
          if (f1 == f1) {
            s1 = FMA ? Math.fma(a, f1, s1) : s1 + a * f1;
          } else {
            m1 += a;
            n1++;
          }
          if (f2 == f2) {
            s2 = FMA ? Math.fma(a, f2, s2) : s2 + a * f2;
          } else {
            m2 += a;
            n2++;
          }
          if (f3 == f3) {
            s3 = FMA ? Math.fma(a, f3, s3) : s3 + a * f3;
          } else {
            m3 += a;
            n3++;
          }
        }
      }
      int s = t - from;
      finish(v, b0, c, s, s0, m0, n0, sumW, sumWV, count);
      finish(v, b1, c, s + 1, s1, m1, n1, sumW, sumWV, count);
      finish(v, b2, c, s + 2, s2, m2, n2, sumW, sumWV, count);
      finish(v, b3, c, s + 3, s3, m3, n3, sumW, sumWV, count);
    }
    for (; t < t1; t++) {
      int b = (t - chunkT0) * plane;
      double sum = 0, missing = 0;
      int missed = 0;
      for (int r = 0; r < runs; r++) {
        int o = runStart[r], end = o + runLen[r], a0 = runFirst[r] - o;
        for (int i = o; i < end; i++) {
          float f = v[b + i];
          if (f == f) {
            sum = FMA ? Math.fma(area[a0 + i], f, sum) : sum + area[a0 + i] * f;
          } else {
            missing += area[a0 + i];
            missed++;
          }
        }
      }
      finish(v, b, c, t - from, sum, missing, missed, sumW, sumWV, count);
    }
  }

  private static void finish(float[] v, int base, TileCells c, int s, double sum, double missing, int missed,
      double[] sumW, double[] sumWV, int[] count) {
    double w;
    if (missed == 0) {
      w = c.totalArea;
    } else if (missing <= 0.5 * c.totalArea) {
      w = c.totalArea - missing;
    } else {
      w = validArea(v, base, c);
    }
    sumW[s] += w;
    sumWV[s] += sum;
    count[s] += c.size() - missed;
  }

  private static double validArea(float[] v, int base, TileCells c) {
    double w = 0;
    for (int r = 0; r < c.runs; r++) {
      int o = c.runStart[r], a0 = c.runFirst[r] - o;
      for (int i = o, end = o + c.runLen[r]; i < end; i++) {
        if (v[base + i] == v[base + i]) {
          w += c.area[a0 + i];
        }
      }
    }
    return w;
  }
}
