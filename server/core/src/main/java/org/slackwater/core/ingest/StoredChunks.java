package org.slackwater.core.ingest;

import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * The chunks of one published version, found by position, and read back a band at a time: the
 * existing values an append compares with or carries into rewritten chunks.
 */
final class StoredChunks {

  private record Origin(int t0, int y0, int x0) {}

  private final CubeStore store;
  private final CubeEntry entry;
  private final Map<Origin, ChunkRecord> byOrigin = new HashMap<>();
  private final Map<Integer, List<ChunkRecord>> byTime = new HashMap<>();

  StoredChunks(CubeStore store, CubeEntry entry) {
    this.store = store;
    this.entry = entry;
    for (ChunkRecord r : entry.chunks()) {
      byOrigin.put(new Origin(r.key().t0(), r.key().y0(), r.key().x0()), r);
      byTime.computeIfAbsent(r.key().t0(), k -> new ArrayList<>()).add(r);
    }
  }

  CubeEntry entry() {
    return entry;
  }

  /** The first step of the time chunk holding cube step {@code step}. */
  int timeChunkStart(int step) {
    return step / entry.layout().steps() * entry.layout().steps();
  }

  /** Steps in the time chunk starting at {@code t0}; 0 if there is none. */
  int stepsIn(int t0) {
    List<ChunkRecord> rs = byTime.get(t0);
    return rs == null ? 0 : rs.get(0).key().nt();
  }

  /** Every tile of the time chunk starting at {@code t0}. */
  List<ChunkRecord> timeChunk(int t0) {
    return byTime.getOrDefault(t0, List.of());
  }

  /**
   * Reads rows {@code [y0, y0 + cy)} of the time chunk starting at {@code t0} into {@code band}
   * ({@code stepsIn(t0) x cy x nx}); {@code tile} is scratch of at least one chunk.
   */
  void readBand(int t0, int y0, int cy, float[] band, float[] tile) throws IOException {
    readSteps(t0, y0, cy, t0, stepsIn(t0), band, 0, tile);
  }

  /**
   * Reads cube steps {@code [from, from + count)}, all inside the time chunk starting at {@code
   * t0}, rows {@code [y0, y0 + cy)}, into {@code band} (a {@code ? x cy x nx} band) from its step
   * {@code bandStep} on; {@code tile} is scratch of at least one chunk.
   */
  void readSteps(int t0, int y0, int cy, int from, int count, float[] band, int bandStep, float[] tile) throws IOException {
    int nx = entry.descriptor().grid().nx();
    int nt = stepsIn(t0);
    if (from < t0 || from + count > t0 + nt) {
      throw new IllegalArgumentException("steps " + from + "+" + count + " are not inside the time chunk at " + t0);
    }
    for (int x0 = 0; x0 < nx; x0 += entry.layout().columns()) {
      ChunkRecord r = byOrigin.get(new Origin(t0, y0, x0));
      if (r == null || r.key().ny() != cy || r.key().nt() != nt) {
        throw new IOException("cube '" + entry.name() + "' version " + entry.version() + " lacks chunk t" + t0 + " y" + y0 + " x" + x0
            + "; the catalog is damaged: re-ingest the cube");
      }
      store.read(entry.name(), entry.version(), r, tile);
      int cx = r.key().nx();
      for (int t = 0; t < count; t++) {
        int src = (from - t0 + t) * cy;
        int dst = (bandStep + t) * cy;
        for (int y = 0; y < cy; y++) {
          System.arraycopy(tile, (src + y) * cx, band, (dst + y) * nx + x0, cx);
        }
      }
    }
  }
}
