package org.slackwater.core.store;

/**
 * Where a chunk sits in its cube: its first step, row and column, and its extent (edge chunks are
 * smaller than the layout).
 */
public record ChunkKey(int t0, int y0, int x0, int nt, int ny, int nx) {
  public ChunkKey {
    if (t0 < 0 || y0 < 0 || x0 < 0 || nt < 1 || ny < 1 || nx < 1) {
      throw new IllegalArgumentException("invalid chunk " + t0 + "/" + y0 + "/" + x0 + " of " + nt + "x" + ny + "x" + nx);
    }
  }

  public int values() {
    return nt * ny * nx;
  }

  /** File name inside a version directory, e.g. {@code t000365_y0064_x0000.arrow}. */
  public String fileName() {
    // Same as String.format("t%06d_y%04d_x%04d.arrow", ...), without a Formatter per chunk.
    StringBuilder b = new StringBuilder(32).append('t');
    pad(b, t0, 6).append("_y");
    pad(b, y0, 4).append("_x");
    return pad(b, x0, 4).append(".arrow").toString();
  }

  private static StringBuilder pad(StringBuilder b, int value, int width) {
    String digits = Integer.toString(value); // never negative: checked above
    for (int i = digits.length(); i < width; i++) {
      b.append('0');
    }
    return b.append(digits);
  }
}
