package org.slackwater.demo;

/**
 * Deterministic random numbers for the generator: SplitMix64 (Steele, Lea and Flood 2014) with our
 * own normal (Marsaglia polar method) and gamma (Marsaglia and Tsang 2000) samplers.
 *
 * <p>Why not {@code java.util.Random} or {@code RandomGenerator.nextGaussian()}: the byte-identical
 * output promise must not depend on how a JDK release implements its samplers. Every algorithm here is
 * spelled out, so the stream is fixed by the seed alone.
 *
 * <p>Not thread-safe; each model owns its streams. Streams are derived by name so adding a stream does
 * not shift the numbers of another.
 */
final class Rng {

  private long state;
  private double spareNormal;
  private boolean hasSpare;

  Rng(long seed) {
    this.state = seed;
  }

  /** An independent stream for {@code name}, derived from the scenario seed. */
  static Rng stream(long seed, String name) {
    long h = 1125899906842597L;
    for (int i = 0; i < name.length(); i++) {
      h = 31 * h + name.charAt(i);
    }
    return new Rng(mix(seed ^ mix(h)));
  }

  /** An independent stream for {@code name} and an extra key such as a year. */
  static Rng stream(long seed, String name, long key) {
    return stream(mix(seed + 0x9E3779B97F4A7C15L * (key + 1)), name);
  }

  private static long mix(long z) {
    z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
    return z ^ (z >>> 31);
  }

  long nextLong() {
    state += 0x9E3779B97F4A7C15L;
    return mix(state);
  }

  /** Uniform in [0, 1). */
  double uniform() {
    return (nextLong() >>> 11) * 0x1.0p-53;
  }

  /** Uniform in [lo, hi). */
  double uniform(double lo, double hi) {
    return lo + (hi - lo) * uniform();
  }

  /** Uniform integer in [lo, hi] inclusive. */
  int between(int lo, int hi) {
    if (hi < lo) {
      throw new IllegalArgumentException("empty range " + lo + ".." + hi);
    }
    return lo + (int) Math.floor(uniform() * (hi - lo + 1));
  }

  boolean bernoulli(double p) {
    return uniform() < p;
  }

  /** Standard normal by the Marsaglia polar method. */
  double normal() {
    if (hasSpare) {
      hasSpare = false;
      return spareNormal;
    }
    double u;
    double v;
    double s;
    do {
      u = 2 * uniform() - 1;
      v = 2 * uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s == 0);
    double f = Math.sqrt(-2 * Math.log(s) / s);
    spareNormal = v * f;
    hasSpare = true;
    return u * f;
  }

  /**
   * Gamma(shape, scale) by Marsaglia and Tsang; for shape below 1 the usual boost
   * {@code G(a) = G(a+1) * U^(1/a)} is applied.
   */
  double gamma(double shape, double scale) {
    if (!(shape > 0) || !(scale > 0)) {
      throw new IllegalArgumentException("gamma needs positive shape and scale, got " + shape + ", " + scale);
    }
    if (shape < 1) {
      double u = uniform();
      return gamma(shape + 1, scale) * Math.pow(u == 0 ? Double.MIN_NORMAL : u, 1 / shape);
    }
    double d = shape - 1.0 / 3;
    double c = 1 / Math.sqrt(9 * d);
    while (true) {
      double x = normal();
      double v = 1 + c * x;
      if (v <= 0) {
        continue;
      }
      v = v * v * v;
      double u = uniform();
      if (u < 1 - 0.0331 * x * x * x * x || Math.log(u) < 0.5 * x * x + d * (1 - v + Math.log(v))) {
        return d * v * scale;
      }
    }
  }
}
