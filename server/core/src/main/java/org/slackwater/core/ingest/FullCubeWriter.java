package org.slackwater.core.ingest;

import java.io.IOException;
import java.util.BitSet;
import java.util.List;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * Writes a whole cube from one file into a staging directory: reads each band (a chunk's worth
 * of steps by a tile's worth of rows, all columns), records the footprint, and cuts the band into
 * chunks for the {@link ChunkWriter}'s threads, so that reading and writing overlap.
 */
final class FullCubeWriter {
  private FullCubeWriter() {}

  static WrittenVersion write(CubeStore.Staging staging, SourceCube cube, ChunkLayout layout, String name) throws IOException, SourceException {
    CubeDescriptor d = cube.descriptor();
    LatLonGrid grid = d.grid();
    int nt = d.time().size();
    int ny = grid.ny();
    int nx = grid.nx();
    BitSet present = new BitSet(ny * nx);
    int steps = Math.min(layout.steps(), nt);
    int rows = Math.min(layout.rows(), ny);
    // When a tile spans all columns the band already is the chunk, in the same (time, row, column)
    // order, and is read straight into a writer buffer; otherwise tiles are cut from the band.
    boolean tiled = nx > layout.columns();
    long bytes = 0;
    List<ChunkRecord> chunks;
    try (ChunkWriter writer = new ChunkWriter(staging, steps * rows * (tiled ? layout.columns() : nx), name)) {
      float[] band = tiled ? new float[steps * rows * nx] : null;
      int[] todo = new int[rows * nx];
      for (int t0 = 0; t0 < nt; t0 += layout.steps()) {
        int ct = Math.min(layout.steps(), nt - t0);
        for (int y0 = 0; y0 < ny; y0 += layout.rows()) {
          int cy = Math.min(layout.rows(), ny - y0);
          float[] target = tiled ? band : writer.buffer();
          cube.read(t0, ct, y0, cy, 0, nx, target);
          Bands.markPresent(target, ct, cy, nx, y0, todo, present);
          if (!tiled) {
            writer.write(new ChunkKey(t0, y0, 0, ct, cy, nx), target);
            continue;
          }
          for (int x0 = 0; x0 < nx; x0 += layout.columns()) {
            int cx = Math.min(layout.columns(), nx - x0);
            writer.write(new ChunkKey(t0, y0, x0, ct, cy, cx), Bands.cut(band, ct, cy, nx, x0, cx, writer.buffer()));
          }
        }
      }
      chunks = writer.finish();
    }
    for (ChunkRecord rec : chunks) {
      bytes += rec.bytes();
    }
    return new WrittenVersion(chunks, new Footprint(ny * nx, present), bytes, (long) nt * ny * nx);
  }
}
