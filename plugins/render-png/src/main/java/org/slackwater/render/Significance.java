package org.slackwater.render;

import org.hipparchus.distribution.continuous.TDistribution;

/**
 * The smallest |r| that is significant in a two-sided test of zero correlation: with
 * df = n_eff − 2 degrees of freedom and t the (1 − alpha/2) quantile of Student's t,
 * r_crit = t / sqrt(df + t²), the inverse of t = r sqrt(df / (1 − r²)). n_eff is the effective
 * sample size the server reports (autocorrelation lowers it), so the threshold differs by lag.
 * NaN when df is not positive (too few independent values for any test).
 */
final class Significance {
  private Significance() {}

  static double criticalR(double nEffective, double alpha) {
    if (!(alpha > 0 && alpha < 1)) {
      throw new IllegalArgumentException("alpha must lie between 0 and 1, got " + alpha);
    }
    double df = nEffective - 2;
    if (!(df > 0)) {
      return Double.NaN;
    }
    double t = new TDistribution(df).inverseCumulativeProbability(1 - alpha / 2);
    return t / Math.sqrt(df + t * t);
  }

  /** The metadata alpha of a correlation result; 0.05 (the server's level) when the result does not say. */
  static double alpha(String title, String text) {
    if (text == null || text.isBlank()) {
      return 0.05;
    }
    try {
      double a = Double.parseDouble(text.trim());
      if (a > 0 && a < 1) {
        return a;
      }
    } catch (NumberFormatException e) {
      // reported below
    }
    throw new PlotException("the result '" + title + "' gives the significance level alpha as '" + text
        + "', not a number between 0 and 1; ask for format=json or csv");
  }
}
