package org.slackwater.render;

import java.awt.Color;

/**
 * A colour map: a fraction 0..1 of the colour scale to a colour.
 *
 * <ul>
 *   <li>{@link #viridis()}: sequential, for plain values. The published 256-entry table
 *       ({@link ViridisTable}); fraction f takes entry min(255, floor(256 f)), the lookup of a
 *       listed colour map of N entries, so the low end is #440154 and the high end #fde725.</li>
 *   <li>{@link #diverging()}: for differences, anomalies and correlations, centred at 0.5. The
 *       ColorBrewer 11-class diverging scheme RdBu (C. A. Brewer, colorbrewer2.org, 2002; described
 *       in Harrower and Brewer 2003, The Cartographic Journal 40(1), reference from memory), reversed so that negative values are blue and
 *       positive red, interpolated linearly in sRGB between the 11 published colours at fractions
 *       0, 0.1, ..., 1. The centre (value 0) is exactly the scheme's middle class #f7f7f7.
 *       Colours: the scheme's published hex values, as also listed in matplotlib's
 *       {@code _cm.py} ({@code _RdBu_data}). This product includes color specifications and designs
 *       developed by Cynthia Brewer (http://colorbrewer.org/), used under its Apache-style licence.</li>
 * </ul>
 *
 * Fractions outside 0..1 are clamped; NaN has no colour (the map draws it as missing).
 */
final class ColourMap {
  /** ColorBrewer RdBu, 11 classes, from blue (low) to red (high): the published list reversed. */
  private static final int[] RDBU_11_REVERSED = {
      0x053061, 0x2166ac, 0x4393c3, 0x92c5de, 0xd1e5f0, 0xf7f7f7, 0xfddbc7, 0xf4a582, 0xd6604d, 0xb2182b, 0x67001f};

  private static final ColourMap VIRIDIS = new ColourMap("viridis", true);
  private static final ColourMap DIVERGING = new ColourMap("RdBu (reversed)", false);

  private final String name;
  private final boolean listed;

  private ColourMap(String name, boolean listed) {
    this.name = name;
    this.listed = listed;
  }

  static ColourMap viridis() {
    return VIRIDIS;
  }

  static ColourMap diverging() {
    return DIVERGING;
  }

  String name() {
    return name;
  }

  boolean isDiverging() {
    return !listed;
  }

  /** The colour at fraction {@code f} of the scale. */
  Color at(double f) {
    if (Double.isNaN(f)) {
      throw new IllegalArgumentException("a missing value has no colour");
    }
    double x = Math.max(0, Math.min(1, f));
    return listed ? viridisEntry(Math.min(255, (int) Math.floor(x * 256))) : interpolated(x);
  }

  /** Entry {@code i} of the published viridis table, rounded to 8 bits. */
  static Color viridisEntry(int i) {
    double[] c = ViridisTable.RGB[i];
    return new Color(eight(c[0]), eight(c[1]), eight(c[2]));
  }

  private static Color interpolated(double x) {
    double pos = x * (RDBU_11_REVERSED.length - 1);
    int i = Math.min(RDBU_11_REVERSED.length - 2, (int) Math.floor(pos));
    double t = pos - i;
    int a = RDBU_11_REVERSED[i], b = RDBU_11_REVERSED[i + 1];
    return new Color(mix(a >> 16, b >> 16, t), mix(a >> 8, b >> 8, t), mix(a, b, t));
  }

  private static int mix(int a, int b, double t) {
    return (int) Math.round((a & 0xff) * (1 - t) + (b & 0xff) * t);
  }

  private static int eight(double v) {
    return (int) Math.round(v * 255);
  }
}
