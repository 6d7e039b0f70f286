package org.slackwater.render;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * Round tick values for an axis: a step of 1, 2, 2.5 or 5 times a power of ten, the one nearest
 * to giving {@code target} ticks in the range (the usual "nice numbers" of axis labelling,
 * common practice), kept as decimals so that labels print without binary noise.
 */
final class Ticks {
  private Ticks() {}

  private static final double[] MANTISSAS = {1, 2, 2.5, 5, 10};

  /** The ticks within [lo, hi]; none when the range is empty or not finite. */
  static List<BigDecimal> between(double lo, double hi, int target) {
    List<BigDecimal> out = new ArrayList<>();
    if (!(hi > lo) || Double.isInfinite(hi - lo)) {
      return out;
    }
    BigDecimal step = step(hi - lo, target);
    BigDecimal first = BigDecimal.valueOf(Math.ceil(lo / step.doubleValue() - 1e-9)).multiply(step);
    for (BigDecimal v = first; v.doubleValue() <= hi + 1e-9 * step.doubleValue(); v = v.add(step)) {
      out.add(v.stripTrailingZeros());
    }
    return out;
  }

  /** The candidate step nearest (by ratio) to span / target. */
  static BigDecimal step(double span, int target) {
    double raw = span / Math.max(1, target);
    int exp = (int) Math.floor(Math.log10(raw));
    double base = Math.pow(10, exp), best = MANTISSAS[0], bestRatio = Double.POSITIVE_INFINITY;
    for (double m : MANTISSAS) {
      double ratio = Math.max(m * base / raw, raw / (m * base));
      if (ratio < bestRatio) {
        bestRatio = ratio;
        best = m;
      }
    }
    return BigDecimal.valueOf(best).scaleByPowerOfTen(exp).stripTrailingZeros();
  }

  /** A plain decimal label: "0.25", "-3", "1200". */
  static String label(BigDecimal v) {
    BigDecimal s = v.stripTrailingZeros();
    return (s.signum() == 0 ? BigDecimal.ZERO : s).toPlainString();
  }

  /** Latitude in degrees north or south: "43.85°N", "0°". */
  static String latitude(BigDecimal v) {
    return degrees(v, "N", "S");
  }

  /** Longitude in degrees east or west: "30.9°W", "0°". */
  static String longitude(BigDecimal v) {
    return degrees(v, "E", "W");
  }

  private static String degrees(BigDecimal v, String positive, String negative) {
    int sign = v.signum();
    String abs = label(v.abs());
    return sign == 0 ? "0°" : abs + "°" + (sign > 0 ? positive : negative);
  }
}
