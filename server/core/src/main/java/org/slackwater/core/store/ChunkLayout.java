package org.slackwater.core.store;

/**
 * How a cube is cut into chunks: {@code steps} time steps by a {@code rows x columns} spatial
 * tile. A year of daily data by a 64 x 64 tile keeps a chunk near 6 MB of float32, large enough
 * for sequential reads and small enough to cache a few hundred.
 */
public record ChunkLayout(int steps, int rows, int columns) {
  public static final ChunkLayout DEFAULT = new ChunkLayout(366, 64, 64);

  public ChunkLayout {
    if (steps < 1 || rows < 1 || columns < 1) {
      throw new IllegalArgumentException("chunk sizes must be positive: " + steps + " x " + rows + " x " + columns);
    }
  }

  public int chunksAlong(int extent, int size) {
    return (extent + size - 1) / size;
  }
}
