package org.slackwater.render;

/**
 * Size of a rendered plot. {@code width} and {@code height} are layout pixels (what fonts and
 * line widths are designed for); {@code scale} multiplies both for print resolution, so the PNG
 * is {@code round(width * scale)} x {@code round(height * scale)} pixels and looks the same, only
 * sharper. The PNG records 96 x scale dots per inch, so it prints at the layout size.
 *
 * <p>Limits: width and height 200..4000, scale 1..4, and at most {@link #MAX_PIXELS} pixels in
 * the PNG (a 4000 x 4000 plot at scale 4 would need about 1 GB of memory on the server). A value
 * outside them is an {@link IllegalArgumentException} whose message names the parameter, the
 * value and the allowed range.
 */
public record PlotOptions(int width, int height, double scale) {
  public static final int MIN_SIZE = 200;
  public static final int MAX_SIZE = 4000;
  public static final double MIN_SCALE = 1;
  public static final double MAX_SCALE = 4;
  /** 36 megapixels: e.g. 3000 x 2000 at scale 2 or 1500 x 1000 at scale 4 (ours, from memory use). */
  public static final long MAX_PIXELS = 36_000_000L;

  public PlotOptions {
    if (width < MIN_SIZE || width > MAX_SIZE) {
      throw new IllegalArgumentException("width " + width + " is out of range: give " + MIN_SIZE + " to " + MAX_SIZE + " pixels");
    }
    if (height < MIN_SIZE || height > MAX_SIZE) {
      throw new IllegalArgumentException("height " + height + " is out of range: give " + MIN_SIZE + " to " + MAX_SIZE + " pixels");
    }
    if (!(scale >= MIN_SCALE && scale <= MAX_SCALE)) {
      throw new IllegalArgumentException("scale " + scale + " is out of range: give 1 to 4 (2 for print)");
    }
    long pixels = Math.round(width * scale) * Math.round(height * scale);
    if (pixels > MAX_PIXELS) {
      throw new IllegalArgumentException("width " + width + " x height " + height + " at scale " + scale + " makes " + pixels
          + " pixels, more than " + MAX_PIXELS + ": lower the scale or the size");
    }
  }

  /** 1000 x 600 at scale 1. */
  public static PlotOptions defaults() {
    return new PlotOptions(1000, 600, 1);
  }

  /** Width of the PNG in pixels. */
  public int pixelWidth() {
    return (int) Math.round(width * scale);
  }

  /** Height of the PNG in pixels. */
  public int pixelHeight() {
    return (int) Math.round(height * scale);
  }
}
