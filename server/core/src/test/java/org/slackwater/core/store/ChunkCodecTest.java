package org.slackwater.core.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.util.HexFormat;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ChunkCodecTest {
  private BufferAllocator allocator;
  @TempDir Path dir;

  @BeforeEach
  void open() {
    allocator = new RootAllocator(64 << 20);
  }

  @AfterEach
  void close() {
    allocator.close(); // throws if any buffer leaked
  }

  @Test
  void roundTripKeepsValuesAndMissingAndIsReadableByArrowsOwnReader() throws Exception {
    ChunkKey key = new ChunkKey(365, 64, 0, 3, 2, 5);
    float[] v = new float[key.values()];
    for (int i = 0; i < v.length; i++) {
      v[i] = i % 4 == 1 ? Float.NaN : i * 0.5f - 3;
    }
    Path file = dir.resolve(key.fileName());
    ChunkRecord rec = ChunkCodec.write(allocator, file, key, v);
    assertEquals(v.length - (v.length + 2) / 4, rec.validCount());
    assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file))), rec.sha256());

    float[] back = new float[v.length];
    ChunkCodec.read(allocator, file, key, back);
    for (int i = 0; i < v.length; i++) {
      assertEquals(v[i], back[i], 0.0f, "value " + i);
    }

    // Arrow's own IPC file reader sees one nullable float32 column with nulls where values are missing.
    try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ);
        ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
      assertTrue(reader.loadNextBatch());
      VectorSchemaRoot root = reader.getVectorSchemaRoot();
      assertEquals("365,64,0,3,2,5", root.getSchema().getCustomMetadata().get("slackwater.chunk"));
      Float4Vector col = (Float4Vector) root.getVector("value");
      assertEquals(v.length, col.getValueCount());
      assertEquals((v.length + 2) / 4, col.getNullCount());
      for (int i = 0; i < v.length; i++) {
        if (Float.isNaN(v[i])) {
          assertTrue(col.isNull(i));
        } else {
          assertEquals(v[i], col.get(i), 0.0f);
        }
      }
    }
  }
}
