package org.slackwater.server;

import org.slackwater.render.PlotOptions;

/**
 * The {@code width}, {@code height} and {@code scale} parameters of a PNG request, as given (null
 * = the renderer's default). Checked when turned into {@link PlotOptions}, so that a bad value
 * becomes a 400 that names the parameter.
 */
record PlotSize(String width, String height, String scale) {
  static final PlotSize DEFAULT = new PlotSize(null, null, null);

  PlotOptions options() {
    PlotOptions d = PlotOptions.defaults();
    return new PlotOptions(whole("width", width, d.width()), whole("height", height, d.height()), number("scale", scale, d.scale()));
  }

  private static int whole(String name, String v, int fallback) {
    if (v == null || v.isBlank()) {
      return fallback;
    }
    try {
      return Integer.parseInt(v.trim());
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(name + " must be a whole number of pixels, found '" + v + "'");
    }
  }

  private static double number(String name, String v, double fallback) {
    if (v == null || v.isBlank()) {
      return fallback;
    }
    try {
      return Double.parseDouble(v.trim());
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(name + " must be a number, found '" + v + "'");
    }
  }
}
