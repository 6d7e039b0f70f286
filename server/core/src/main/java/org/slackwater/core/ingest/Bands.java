package org.slackwater.core.ingest;

import java.util.BitSet;

/**
 * Operations on a band: the values of some steps by some rows by all columns of a grid, in
 * (time, row, column) order, as read from a source and cut into chunks.
 */
final class Bands {
  private Bands() {}

  /** Copies columns {@code [x0, x0+cx)} of every step and row of the band into {@code tile}. */
  static float[] cut(float[] band, int ct, int cy, int nx, int x0, int cx, float[] tile) {
    for (int t = 0; t < ct; t++) {
      for (int y = 0; y < cy; y++) {
        System.arraycopy(band, (t * cy + y) * nx + x0, tile, (t * cy + y) * cx, cx);
      }
    }
    return tile;
  }

  /**
   * Sets the bit of every cell of the band that has a value at some step. Walks the band step by
   * step over a shrinking list of cells not yet seen with a value: a cell leaves the list at its
   * first value, so after a few steps only never-valid (land) cells are visited. Branch-free, as
   * the gaps of cloudy data are too irregular for branch prediction.
   *
   * @param todo scratch of at least {@code ny * nx} ints
   */
  static void markPresent(float[] band, int nt, int ny, int nx, int y0, int[] todo, BitSet present) {
    int cells = ny * nx;
    int left = cells;
    for (int c = 0; c < cells; c++) {
      todo[c] = c;
    }
    for (int t = 0; t < nt && left > 0; t++) {
      int base = t * cells;
      int kept = 0;
      for (int i = 0; i < left; i++) {
        int c = todo[i];
        todo[kept] = c;
        kept += 1 - presentBit(band[base + c]);
      }
      left = kept;
    }
    // The cells still listed (in ascending order: the compaction keeps order) never had a value.
    for (int c = 0, k = 0; c < cells; c++) {
      if (k < left && todo[k] == c) {
        k++;
      } else {
        present.set(y0 * nx + c);
      }
    }
  }

  /** 1 if {@code f} is a value, 0 if it is NaN (missing), without a branch. */
  private static int presentBit(float f) {
    // NaN is exactly the magnitudes above infinity's bit pattern 0x7f800000.
    return ((Float.floatToRawIntBits(f) & 0x7fffffff) - 0x7f800001) >>> 31;
  }
}
