package org.slackwater.core.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Set;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Replaced versions are deleted only when no reader can still use them; chunks are reused by hard link. */
class CubeStoreRetirementTest {
  private BufferAllocator allocator;
  @TempDir Path dir;

  @BeforeEach
  void open() {
    allocator = new RootAllocator(16 << 20);
  }

  @AfterEach
  void close() {
    allocator.close();
  }

  private static final ChunkKey KEY = new ChunkKey(0, 0, 0, 2, 2, 2);

  private static float[] values(float base) {
    return new float[] {base, base + 1, Float.NaN, base + 3, base + 4, base + 5, base + 6, Float.NaN};
  }

  private ChunkRecord publish(CubeStore store, int version, float base) throws IOException {
    try (CubeStore.Staging s = store.stage("temp")) {
      ChunkRecord r = s.write(KEY, values(base));
      s.publish(version);
      return r;
    }
  }

  @Test
  void aRetiredVersionStaysThroughTheGracePeriod() throws Exception {
    CubeStore store = new CubeStore(dir, allocator, Duration.ofMinutes(10));
    ChunkRecord r = publish(store, 1, 10);
    assertEquals(List.of(), store.retire("temp", 1));
    assertEquals(Set.of("temp/v1"), store.retiredVersions());
    float[] back = new float[8];
    store.read("temp", 1, r, back);
    assertEquals(values(10)[0], back[0]);
  }

  @Test
  void aPinnedVersionIsDeletedOnlyAfterThePinIsReleasedAndLaterReadsSaySo() throws Exception {
    CubeStore store = new CubeStore(dir, allocator, Duration.ZERO);
    ChunkRecord r = publish(store, 1, 10);
    try (CubeStore.Pin pin = store.pin("temp", 1)) {
      assertEquals(List.of(), store.retire("temp", 1), "a pinned version is not deleted");
      assertTrue(Files.exists(store.versionDir("temp", 1)));
    }
    assertEquals(List.of("temp/v1"), store.sweepRetired());
    assertFalse(Files.exists(store.versionDir("temp", 1)));
    IOException e = assertThrows(IOException.class, () -> store.read("temp", 1, r, new float[8]));
    assertEquals("version 1 of cube 'temp' was replaced by a newer version and its files were removed while this query ran"
        + " (it ran longer than the 0 s the store keeps replaced versions); run the query again to read the current version", e.getMessage());
    assertThrows(IOException.class, () -> store.pin("temp", 1));
  }

  @Test
  void aReusedChunkIsTheSameFileAndOutlivesTheVersionItCameFrom() throws Exception {
    CubeStore store = new CubeStore(dir, allocator, Duration.ZERO);
    ChunkRecord r = publish(store, 1, 10);
    try (CubeStore.Staging s = store.stage("temp")) {
      assertEquals(r, s.reuse(1, r));
      s.publish(2);
    }
    Path one = store.versionDir("temp", 1).resolve(r.file());
    Path two = store.versionDir("temp", 2).resolve(r.file());
    assertTrue(Files.isSameFile(one, two));
    store.retire("temp", 1);
    assertFalse(Files.exists(one));
    float[] back = new float[8];
    store.read("temp", 2, r, back);
    float[] want = values(10);
    for (int i = 0; i < 8; i++) {
      assertEquals(want[i], back[i], 0f, "value " + i);
    }
  }

  @Test
  void reusingAChunkWhoseFileIsNotTheRecordedSizeFails() throws Exception {
    CubeStore store = new CubeStore(dir, allocator, Duration.ZERO);
    ChunkRecord r = publish(store, 1, 10);
    ChunkRecord wrong = new ChunkRecord(r.key(), r.file(), r.sha256(), r.bytes() + 1, r.validCount());
    try (CubeStore.Staging s = store.stage("temp")) {
      IOException e = assertThrows(IOException.class, () -> s.reuse(1, wrong));
      assertTrue(e.getMessage().endsWith("bytes but the catalog records " + (r.bytes() + 1)
          + "; the store is damaged: restore the data directory from a backup or re-ingest the cube"), e.getMessage());
    }
  }
}
