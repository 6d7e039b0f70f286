package org.slackwater.render;

import java.awt.Color;

/**
 * Published colour formulas for checking palettes: sRGB linearisation and the sRGB to CIE XYZ
 * matrix (IEC 61966-2-1), CIE 1976 L*a*b* and its colour difference ΔE*ab (CIE 15, D65 white),
 * relative luminance and contrast ratio (W3C WCAG 2.1, definitions "relative luminance" and
 * "contrast ratio"; WCAG writes the linearisation threshold as 0.03928 instead of 0.04045, which
 * changes no 8-bit value: 10/255 = 0.0392 lies below both, 11/255 = 0.0431 above both), and
 * simulated dichromacy with the severity-1.0 matrices of Machado, Oliveira and Fernandes (2009),
 * "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15(6),
 * applied to linear RGB (recalled from memory, then compared digit for digit with several public
 * simulators that reproduce the paper's table).
 */
final class ColourScience {
  private ColourScience() {}

  enum Vision {
    NORMAL(null),
    PROTANOPIA(new double[][] {{0.152286, 1.052583, -0.204868}, {0.114503, 0.786281, 0.099216}, {-0.003882, -0.048116, 1.051998}}),
    DEUTERANOPIA(new double[][] {{0.367322, 0.860646, -0.227968}, {0.280085, 0.672501, 0.047413}, {-0.011820, 0.042940, 0.968881}}),
    TRITANOPIA(new double[][] {{1.255528, -0.076749, -0.178779}, {-0.078411, 0.930809, 0.147602}, {0.004733, 0.691367, 0.303900}});

    final double[][] m;

    Vision(double[][] m) {
      this.m = m;
    }
  }

  /** IEC 61966-2-1: the sRGB transfer function undone. */
  static double linear(int channel) {
    double c = channel / 255.0;
    return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  }

  static double[] linear(Color c) {
    return new double[] {linear(c.getRed()), linear(c.getGreen()), linear(c.getBlue())};
  }

  /** Linear RGB as seen with the given vision, clamped to the display gamut. */
  static double[] seen(Color c, Vision v) {
    double[] rgb = linear(c);
    if (v.m == null) {
      return rgb;
    }
    double[] out = new double[3];
    for (int i = 0; i < 3; i++) {
      out[i] = Math.max(0, Math.min(1, v.m[i][0] * rgb[0] + v.m[i][1] * rgb[1] + v.m[i][2] * rgb[2]));
    }
    return out;
  }

  /** CIE L*a*b* (D65) of linear sRGB. */
  static double[] lab(double[] rgb) {
    double x = 0.4124 * rgb[0] + 0.3576 * rgb[1] + 0.1805 * rgb[2];
    double y = 0.2126 * rgb[0] + 0.7152 * rgb[1] + 0.0722 * rgb[2];
    double z = 0.0193 * rgb[0] + 0.1192 * rgb[1] + 0.9505 * rgb[2];
    double fx = f(x / 0.95047), fy = f(y), fz = f(z / 1.08883);
    return new double[] {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
  }

  private static double f(double t) {
    double d = 6.0 / 29;
    return t > d * d * d ? Math.cbrt(t) : t / (3 * d * d) + 4.0 / 29;
  }

  /** ΔE*ab (CIE 1976) between two colours as seen with the given vision. */
  static double deltaE(Color a, Color b, Vision v) {
    double[] p = lab(seen(a, v)), q = lab(seen(b, v));
    return Math.sqrt(Math.pow(p[0] - q[0], 2) + Math.pow(p[1] - q[1], 2) + Math.pow(p[2] - q[2], 2));
  }

  static double lightness(Color c) {
    return lab(linear(c))[0];
  }

  /** WCAG 2.1 relative luminance. */
  static double luminance(Color c) {
    double[] l = linear(c);
    return 0.2126 * l[0] + 0.7152 * l[1] + 0.0722 * l[2];
  }

  /** WCAG 2.1 contrast ratio, (L1 + 0.05) / (L2 + 0.05) with L1 the lighter. */
  static double contrast(Color a, Color b) {
    double x = luminance(a), y = luminance(b);
    return (Math.max(x, y) + 0.05) / (Math.min(x, y) + 0.05);
  }
}
