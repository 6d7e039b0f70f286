package org.slackwater.core.analytics;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * {@link MapLagKernel}'s cross products with the JDK's vector API: four lanes side by side in one
 * 256-bit register, so a row's four (or eight) cells times four lags take four (or eight) vector
 * multiply-adds instead of sixteen (or thirty-two) scalar ones. JDK 17 does not vectorise the
 * scalar loops itself (each sum is a chain the compiler keeps in order), and the scalar 4 x 4 block
 * needs more registers than x86-64 has.
 *
 * <p>Each lane's sum is formed exactly as the fused scalar loop forms it, one fused multiply-add
 * per row in row order, so the results equal {@code MapLagKernel}'s fused ones bit for bit.
 *
 * <p>The vector API is an incubator module in JDK 17: this class links only when the JVM runs with
 * {@code --add-modules jdk.incubator.vector}: nothing may load it before {@link
 * MapLagKernel.Arithmetic} has found the module present (its static fields are vectors).
 */
final class VectorCross {
  private static final VectorSpecies<Double> S = DoubleVector.SPECIES_256;
  private static final int LG = MapLagKernel.LAG_GROUP;

  private VectorCross() {}

  /**
   * Whether the module is there and the processor has 256-bit vectors with fused multiply-adds
   * (otherwise the JDK emulates the vectors, slower than the scalar loops). Call only through
   * {@link MapLagKernel.Arithmetic}, which asks whether the module is present before this class
   * is loaded: loading it without the module fails.
   */
  static boolean hardware() {
    return DoubleVector.SPECIES_PREFERRED.vectorBitSize() >= 256 && MapLagKernel.FUSED;
  }

  /**
   * Σ x[a * width + lane + i] d[j0 + a - k s] over rows [a0, a1) for lanes i in 0..7 and lags k in
   * 0..3, added to {@code c[off + i * LAG_GROUP + k]}.
   */
  static void cross8x4(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, int s,
      double[] c, int off) {
    DoubleVector p0 = DoubleVector.zero(S), p1 = p0, p2 = p0, p3 = p0;
    DoubleVector q0 = p0, q1 = p0, q2 = p0, q3 = p0;
    int s2 = 2 * s, s3 = 3 * s;
    for (int a = a0; a < a1; a++) {
      int i = a * width + lane;
      DoubleVector u = DoubleVector.fromArray(S, x, i);
      DoubleVector v = DoubleVector.fromArray(S, x, i + 4);
      int k = j0 + a;
      DoubleVector d0 = DoubleVector.broadcast(S, d[k]);
      DoubleVector d1 = DoubleVector.broadcast(S, d[k - s]);
      DoubleVector d2 = DoubleVector.broadcast(S, d[k - s2]);
      DoubleVector d3 = DoubleVector.broadcast(S, d[k - s3]);
      p0 = u.fma(d0, p0);
      p1 = u.fma(d1, p1);
      p2 = u.fma(d2, p2);
      p3 = u.fma(d3, p3);
      q0 = v.fma(d0, q0);
      q1 = v.fma(d1, q1);
      q2 = v.fma(d2, q2);
      q3 = v.fma(d3, q3);
    }
    add(c, off, p0, p1, p2, p3);
    add(c, off + 4 * LG, q0, q1, q2, q3);
  }

  /** {@link #cross8x4} for four lanes. */
  static void cross4x4(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, int s,
      double[] c, int off) {
    DoubleVector p0 = DoubleVector.zero(S), p1 = p0, p2 = p0, p3 = p0;
    int s2 = 2 * s, s3 = 3 * s;
    for (int a = a0; a < a1; a++) {
      DoubleVector u = DoubleVector.fromArray(S, x, a * width + lane);
      int k = j0 + a;
      p0 = u.fma(DoubleVector.broadcast(S, d[k]), p0);
      p1 = u.fma(DoubleVector.broadcast(S, d[k - s]), p1);
      p2 = u.fma(DoubleVector.broadcast(S, d[k - s2]), p2);
      p3 = u.fma(DoubleVector.broadcast(S, d[k - s3]), p3);
    }
    add(c, off, p0, p1, p2, p3);
  }

  /**
   * Σ x[a * width + lane + i] d[j0 + a] over rows [a0, a1) for lanes i in 0..3 (one lag), added to
   * {@code c[off + i * LAG_GROUP]}.
   */
  static void cross4x1(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, double[] c, int off) {
    DoubleVector p = DoubleVector.zero(S);
    for (int a = a0; a < a1; a++) {
      p = DoubleVector.fromArray(S, x, a * width + lane).fma(DoubleVector.broadcast(S, d[j0 + a]), p);
    }
    for (int i = 0; i < 4; i++) {
      c[off + i * LG] += p.lane(i);
    }
  }

  /** Lag k's vector of four lanes into {@code c[off + i * LAG_GROUP + k]}. */
  private static void add(double[] c, int off, DoubleVector k0, DoubleVector k1, DoubleVector k2, DoubleVector k3) {
    for (int i = 0; i < 4; i++) {
      int o = off + i * LG;
      c[o] += k0.lane(i);
      c[o + 1] += k1.lane(i);
      c[o + 2] += k2.lane(i);
      c[o + 3] += k3.lane(i);
    }
  }
}
