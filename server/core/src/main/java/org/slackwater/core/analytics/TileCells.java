package org.slackwater.core.analytics;

import org.slackwater.core.region.CellWeights;
import org.slackwater.core.store.ChunkKey;

/**
 * A region's cells within one spatial tile of a cube, laid out for the per-step loops of {@link
 * StepSums}: offsets into the tile's (row, column) plane cut into runs of consecutive columns, each
 * cell's area in the same order, and the total area and count, so that a step with few missing
 * values needs no per-cell weight sum. Built once per statistic and tile, shared read-only by the
 * tasks that handle the tile's time chunks.
 */
final class TileCells {
  /** Indices into the {@link CellWeights} of the cells, row-major. */
  final int[] members;
  /** Offset of each member in the tile's plane. */
  final int[] offset;
  /** Area of each member inside the region, m². */
  final double[] area;
  /** Runs of consecutive offsets: first offset, index of the first member, length. */
  final int[] runStart, runFirst, runLen;
  final int runs;
  /** Σ area, added in member order. */
  final double totalArea;
  final int plane;

  private TileCells(int[] members, int[] offset, double[] area, int[] runStart, int[] runFirst, int[] runLen, int runs,
      double totalArea, int plane) {
    this.members = members;
    this.offset = offset;
    this.area = area;
    this.runStart = runStart;
    this.runFirst = runFirst;
    this.runLen = runLen;
    this.runs = runs;
    this.totalArea = totalArea;
    this.plane = plane;
  }

  /** The members (row-major indices into {@code weights}) as seen from a chunk of their tile. */
  static TileCells of(int[] members, CellWeights weights, ChunkKey tile) {
    int m = members.length;
    int[] offset = new int[m];
    double[] area = new double[m];
    double total = 0;
    for (int j = 0; j < m; j++) {
      int i = members[j];
      offset[j] = (weights.row(i) - tile.y0()) * tile.nx() + (weights.column(i) - tile.x0());
      area[j] = weights.area(i);
      total += area[j];
    }
    int[] runStart = new int[m], runFirst = new int[m], runLen = new int[m];
    int runs = OffsetRuns.cut(offset, m, runStart, runFirst, runLen);
    return new TileCells(members, offset, area, runStart, runFirst, runLen, runs, total, tile.ny() * tile.nx());
  }

  int size() {
    return members.length;
  }
}
