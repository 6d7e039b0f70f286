package org.slackwater.render;

import java.awt.Color;

/**
 * Values to colours: a colour map stretched over limits. Sequential data use their own minimum
 * and maximum; diverging data (differences, anomalies, correlations) use symmetric limits ± the
 * largest magnitude, so that zero sits at the map's neutral centre. A single value (or none) is
 * given a unit-wide range around it so that it still gets a colour.
 */
record ColourScale(ColourMap map, double low, double high) {

  static ColourScale of(double[] values, boolean diverging) {
    double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
    for (double v : values) {
      if (Double.isFinite(v)) {
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    if (diverging) {
      double m = lo > hi ? 0 : Math.max(Math.abs(lo), Math.abs(hi));
      m = m > 0 ? m : 1;
      return new ColourScale(ColourMap.diverging(), -m, m);
    }
    if (lo > hi) {
      return new ColourScale(ColourMap.viridis(), 0, 1);
    }
    if (lo == hi) {
      double half = lo == 0 ? 0.5 : Math.abs(lo) * 0.05;
      return new ColourScale(ColourMap.viridis(), lo - half, hi + half);
    }
    return new ColourScale(ColourMap.viridis(), lo, hi);
  }

  /** The position of {@code v} on the scale, 0 at the low limit and 1 at the high one. */
  double fraction(double v) {
    return (v - low) / (high - low);
  }

  Color colour(double v) {
    return map.at(fraction(v));
  }
}
