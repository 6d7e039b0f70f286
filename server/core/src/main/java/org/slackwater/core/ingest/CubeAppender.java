package org.slackwater.core.ingest;

import java.io.IOException;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.Comparator;
import java.util.List;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * Writes the next version of a cube from its current version and a file, following an {@link
 * AppendPlan}, into a staging directory.
 *
 * <p>Time chunks keep their positions (multiples of the layout's steps from step 0), so a time
 * chunk wholly before the first changed step, or wholly after the last one when no step was added
 * before it, holds the same values under the same key as before: its files are reused (hard
 * links, see {@link CubeStore.Staging#reuse}). Only the other time chunks are rewritten, band by
 * band: the cube's values read back from the current version, the file's read from the file. A
 * daily append therefore rewrites the last time chunk and links the rest. The footprint is the
 * current one plus every cell with a value in the rewritten chunks (a cell that held values only
 * in replaced steps stays in it: it is water, or the product's coverage).
 */
final class CubeAppender {
  private CubeAppender() {}

  static WrittenVersion write(CubeStore.Staging staging, StoredChunks stored, SourceCube file, AppendPlan plan, String name)
      throws IOException, SourceException {
    CubeEntry current = stored.entry();
    ChunkLayout layout = current.layout();
    int ny = current.descriptor().grid().ny();
    int nx = current.descriptor().grid().nx();
    int steps = layout.steps();
    int rows = Math.min(layout.rows(), ny);
    int columns = Math.min(layout.columns(), nx);
    int total = plan.combinedSize();
    BitSet present = current.footprint().present();
    List<ChunkRecord> chunks = new ArrayList<>();
    long bytes = 0;
    long valuesRead = 0;
    float[] band = new float[steps * rows * nx];
    // A file run inside one time chunk is at most a chunk's steps, and at most the file's steps
    // (one for a daily append), so this buffer is often far smaller than the band.
    float[] fromFile = new float[Math.min(steps, file.descriptor().time().size()) * rows * nx];
    float[] tile = new float[steps * rows * columns];
    int[] todo = new int[rows * nx];
    try (ChunkWriter writer = new ChunkWriter(staging, steps * rows * columns, name)) {
      for (int t0 = 0; t0 < total; t0 += steps) {
        int ct = Math.min(steps, total - t0);
        if (reusable(stored, plan, t0, ct)) {
          for (ChunkRecord r : stored.timeChunk(t0)) {
            chunks.add(staging.reuse(current.version(), r));
          }
          continue;
        }
        for (int y0 = 0; y0 < ny; y0 += layout.rows()) {
          int cy = Math.min(layout.rows(), ny - y0);
          valuesRead += fill(band, fromFile, tile, stored, file, plan, t0, ct, y0, cy, nx);
          Bands.markPresent(band, ct, cy, nx, y0, todo, present);
          for (int x0 = 0; x0 < nx; x0 += layout.columns()) {
            int cx = Math.min(layout.columns(), nx - x0);
            writer.write(new ChunkKey(t0, y0, x0, ct, cy, cx), Bands.cut(band, ct, cy, nx, x0, cx, writer.buffer()));
          }
        }
      }
      for (ChunkRecord r : writer.finish()) {
        bytes += r.bytes();
        chunks.add(r);
      }
    }
    chunks.sort(Comparator.comparingInt((ChunkRecord r) -> r.key().t0()).thenComparingInt(r -> r.key().y0()).thenComparingInt(r -> r.key().x0()));
    return new WrittenVersion(chunks, new Footprint(ny * nx, present), bytes, valuesRead);
  }

  /** Whether combined time chunk {@code [t0, t0 + ct)} equals the current version's chunk at {@code t0}. */
  private static boolean reusable(StoredChunks stored, AppendPlan plan, int t0, int ct) {
    if (stored.stepsIn(t0) != ct) {
      return false;
    }
    int last = t0 + ct - 1;
    return last < plan.firstChanged() || (t0 > plan.lastChanged() && plan.shift() == 0);
  }

  /**
   * Fills {@code band} with combined steps {@code [t0, t0 + ct)}, rows {@code [y0, y0 + cy)}.
   *
   * @return the number of values read from the file
   */
  private static long fill(float[] band, float[] fromFile, float[] tile, StoredChunks stored, SourceCube file, AppendPlan plan,
      int t0, int ct, int y0, int cy, int nx) throws IOException, SourceException {
    long read = 0;
    int stepValues = cy * nx;
    int k = t0;
    while (k < t0 + ct) {
      int end = k;
      boolean fromTheFile = plan.fromFile(k);
      while (end < t0 + ct && plan.fromFile(end) == fromTheFile) {
        end++;
      }
      if (fromTheFile) {
        file.read(plan.fileStep(k), end - k, y0, cy, 0, nx, fromFile);
        System.arraycopy(fromFile, 0, band, (k - t0) * stepValues, (end - k) * stepValues);
        read += (long) (end - k) * stepValues;
      } else {
        // Consecutive combined steps outside the file's block are consecutive cube steps, which
        // may straddle two stored time chunks (when steps were added before them).
        int i = plan.cubeStep(k);
        int last = plan.cubeStep(end - 1);
        int at = k - t0;
        while (i <= last) {
          int oc = stored.timeChunkStart(i);
          int count = Math.min(last + 1, oc + stored.stepsIn(oc)) - i;
          stored.readSteps(oc, y0, cy, i, count, band, at, tile);
          i += count;
          at += count;
        }
      }
      k = end;
    }
    return read;
  }
}
