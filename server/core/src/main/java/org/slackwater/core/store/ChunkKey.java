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
    return String.format("t%06d_y%04d_x%04d.arrow", t0, y0, x0);
  }
}
