package org.slackwater.core.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CubeStoreTest {
  private BufferAllocator allocator;
  @TempDir Path dir;

  @BeforeEach
  void open() {
    allocator = new RootAllocator(64 << 20);
  }

  @AfterEach
  void close() {
    allocator.close(); // throws if a staging left an encoder's buffers behind
  }

  private static float value(int chunk, int i) {
    return i % 5 == 0 ? Float.NaN : chunk * 1000 + i * 0.25f;
  }

  @Test
  void chunksWrittenFromSeveralThreadsArePublishedWhole() throws Exception {
    CubeStore store = new CubeStore(dir, allocator);
    List<ChunkRecord> records = new ArrayList<>();
    ExecutorService pool = Executors.newFixedThreadPool(3);
    try (CubeStore.Staging staging = store.stage("temp")) {
      List<Future<ChunkRecord>> futures = new ArrayList<>();
      for (int c = 0; c < 24; c++) {
        int chunk = c;
        futures.add(pool.submit(() -> {
          ChunkKey key = new ChunkKey(chunk * 10, 0, 0, 10, 3 + chunk % 4, 5);
          float[] v = new float[key.values()];
          for (int i = 0; i < v.length; i++) {
            v[i] = value(chunk, i);
          }
          return staging.write(key, v);
        }));
      }
      for (Future<ChunkRecord> f : futures) {
        records.add(f.get());
      }
      staging.publish(1);
    } finally {
      pool.shutdown();
    }
    Path version = store.versionDir("temp", 1);
    try (Stream<Path> s = Files.list(dir.resolve("cubes/temp"))) {
      assertEquals(List.of("v1"), s.map(p -> p.getFileName().toString()).toList(), "no staging directory is left");
    }
    try (Stream<Path> s = Files.list(version)) {
      assertEquals(24, s.count());
    }
    for (int c = 0; c < records.size(); c++) {
      ChunkRecord rec = records.get(c);
      byte[] bytes = Files.readAllBytes(version.resolve(rec.file()));
      assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes)), rec.sha256(), rec.file());
      assertEquals(bytes.length, rec.bytes());
      float[] back = new float[rec.key().values()];
      store.read("temp", 1, rec, back);
      for (int i = 0; i < back.length; i++) {
        assertEquals(value(c, i), back[i], 0f, rec.file() + " value " + i);
      }
    }
  }

  @Test
  void aStagingClosedUnpublishedLeavesNothing() throws Exception {
    CubeStore store = new CubeStore(dir, allocator);
    Path staged;
    try (CubeStore.Staging staging = store.stage("temp")) {
      staging.write(new ChunkKey(0, 0, 0, 2, 2, 2), new float[8]);
      try (Stream<Path> s = Files.list(dir.resolve("cubes/temp"))) {
        staged = s.findFirst().orElseThrow();
      }
      assertTrue(Files.exists(staged.resolve(new ChunkKey(0, 0, 0, 2, 2, 2).fileName())));
    }
    assertFalse(Files.exists(staged));
    assertFalse(Files.exists(store.versionDir("temp", 1)));
  }
}
