package org.slackwater.core.analytics;

import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.Map;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * Decoded chunks kept on the heap as {@code float[]} (NaN = missing), least recently used first
 * out, within a byte budget. Queries over cubes larger than the budget stream through it: each
 * chunk is decoded when needed and may be evicted before the next.
 *
 * <p>Keys include the cube version, so a new version never sees an old version's values. Loading
 * happens outside the lock; two threads asking for the same cold chunk may both decode it, which
 * costs time, never correctness.
 */
public final class ChunkCache implements ChunkSource {

  private record Key(String cube, int version, String file) {}

  private final CubeStore store;
  private final long budgetBytes;
  private long usedBytes;
  private final LinkedHashMap<Key, float[]> map = new LinkedHashMap<>(64, 0.75f, true);

  public ChunkCache(CubeStore store, long budgetBytes) {
    this.store = store;
    this.budgetBytes = budgetBytes;
  }

  /** The chunk's values; the returned array is shared and must not be modified. */
  @Override
  public float[] get(CubeEntry cube, ChunkRecord chunk) throws IOException {
    Key key = new Key(cube.name(), cube.version(), chunk.file());
    synchronized (this) {
      float[] hit = map.get(key);
      if (hit != null) {
        return hit;
      }
    }
    float[] values = new float[chunk.key().values()];
    store.read(cube.name(), cube.version(), chunk, values);
    synchronized (this) {
      if (map.put(key, values) == null) {
        usedBytes += values.length * 4L;
      }
      var it = map.entrySet().iterator();
      while (usedBytes > budgetBytes && it.hasNext()) {
        Map.Entry<Key, float[]> e = it.next();
        if (e.getKey().equals(key)) {
          continue;
        }
        usedBytes -= e.getValue().length * 4L;
        it.remove();
      }
    }
    return values;
  }

  public synchronized long usedBytes() {
    return usedBytes;
  }
}
