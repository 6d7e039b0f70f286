package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.store.ChunkKey;

/**
 * The native values of a band of cells of one spatial tile over the steps of a {@link MapPeriods},
 * copied out of the tile's time chunks cell-major, so that each cell's series lies contiguous for
 * the per-cell work that follows.
 *
 * <p>Why a copy: read cell by cell, a chunk is visited with the stride of a whole tile plane (16 KB
 * for 64 x 64 cells) from step to step, a new memory page every step, and the reads wait on memory
 * rather than compute. The copy is a blocked transpose: small blocks of steps by cells, read as runs
 * of consecutive cells (a tile row is contiguous in a chunk) and written as runs of consecutive
 * steps, so both sides stay in cache. A native step without a chunk (none stored, or every value
 * missing) is NaN. Immutable once built; {@link #copy} may run concurrently for different bands.
 */
final class TileBand {
  /** Steps and cells per block of the copy: 16 float32 values fill a 64-byte cache line. */
  private static final int BLOCK = 16;

  private final float[][] chunks;
  /** Per native step (from periods.from()): index into chunks, or -1, and the step's offset in it. */
  private final int[] chunkOf;
  private final int[] base;
  private final int y0;
  private final int x0;
  private final int nx;

  /**
   * @param keys the tile's chunks (all of one tile: {@code y0, x0, ny, nx} equal)
   * @param values each key's values, or null for a chunk known to hold no value
   */
  TileBand(MapPeriods periods, ChunkKey[] keys, float[][] values) {
    this.chunks = values;
    int from = periods.from(), n = periods.to() - from;
    chunkOf = new int[n];
    base = new int[n];
    Arrays.fill(chunkOf, -1);
    for (int c = 0; c < keys.length; c++) {
      ChunkKey k = keys[c];
      int plane = k.ny() * k.nx();
      int t0 = Math.max(from, k.t0()), t1 = Math.min(from + n, k.t0() + k.nt());
      for (int t = t0; t < t1; t++) {
        chunkOf[t - from] = values[c] == null ? -1 : c;
        base[t - from] = (t - k.t0()) * plane;
      }
    }
    y0 = keys[0].y0();
    x0 = keys[0].x0();
    nx = keys[0].nx();
  }

  /** Number of native steps per cell. */
  int steps() {
    return chunkOf.length;
  }

  /** Offset of grid cell (row, column) within this tile's plane. */
  int offset(int row, int column) {
    return (row - y0) * nx + (column - x0);
  }

  /**
   * The values of {@code count} cells at ascending tile offsets {@code offset[0, count)} into
   * {@code out[j * steps() + s]} for native step {@code periods.from() + s}. {@code runStart},
   * {@code runFirst} and {@code runLen} are scratch of at least count.
   */
  void copy(int[] offset, int count, float[] out, int[] runStart, int[] runFirst, int[] runLen) {
    int runs = OffsetRuns.cut(offset, count, runStart, runFirst, runLen);
    int steps = chunkOf.length;
    // Blocks of BLOCK steps x BLOCK cells: each block reads BLOCK cache lines and writes BLOCK, on
    // at most 2 x BLOCK memory pages, so neither the cache nor the address translation thrashes.
    for (int s0 = 0; s0 < steps; s0 += BLOCK) {
      int s1 = Math.min(steps, s0 + BLOCK);
      for (int r = 0; r < runs; r++) {
        int j0 = runFirst[r], len = runLen[r];
        for (int i0 = 0; i0 < len; i0 += BLOCK) {
          int i1 = Math.min(len, i0 + BLOCK);
          for (int s = s0; s < s1; s++) {
            int c = chunkOf[s];
            int dst = (j0 + i0) * steps + s;
            if (c < 0) {
              for (int i = i0; i < i1; i++, dst += steps) {
                out[dst] = Float.NaN;
              }
              continue;
            }
            float[] v = chunks[c];
            for (int i = i0, src = base[s] + runStart[r] + i0; i < i1; i++, src++, dst += steps) {
              out[dst] = v[src];
            }
          }
        }
      }
    }
  }
}
