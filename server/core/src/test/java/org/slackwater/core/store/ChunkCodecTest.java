package org.slackwater.core.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
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

  /**
   * Values around the encoder's block size and not a multiple of 8, with every kind of IEEE 754
   * special: a NaN is any pattern with all exponent bits set and a non-zero fraction (IEEE 754-2008
   * 3.4), so quiet, signalling and negative NaNs are all missing; infinities, signed zeros,
   * subnormals and the extremes are values and keep their exact bits.
   */
  @Test
  void everyNanPatternIsNullAndEveryOtherValueKeepsItsBits() throws Exception {
    ChunkKey key = new ChunkKey(0, 0, 0, 3, 7, 1561); // 32 781 values: two blocks of 16 384 and 13 more
    float[] specials = {
        Float.intBitsToFloat(0x7fc00000), Float.intBitsToFloat(0x7fc00001), Float.intBitsToFloat(0x7f800001),
        Float.intBitsToFloat(0xffc00000), Float.intBitsToFloat(0xffffffff), Float.POSITIVE_INFINITY,
        Float.NEGATIVE_INFINITY, -0.0f, 0.0f, Float.MIN_VALUE, -Float.MIN_VALUE, Float.MAX_VALUE, -Float.MAX_VALUE,
        Float.MIN_NORMAL, 12.625f};
    float[] v = new float[key.values()];
    for (int i = 0; i < v.length; i++) {
      // Irregular: a special every few values, runs of missing values across validity bytes and blocks.
      v[i] = i % 11 == 0 || (i >= 16_380 && i < 16_390) ? specials[(i / 11) % specials.length] : (float) Math.sin(i) * 40;
      if (i >= 32_770 && i < 32_777) {
        v[i] = Float.NaN;
      }
    }
    long nans = 0;
    for (float f : v) {
      nans += Float.isNaN(f) ? 1 : 0;
    }
    Path file = dir.resolve(key.fileName());
    ChunkRecord rec = ChunkCodec.write(allocator, file, key, v);
    assertEquals(v.length - nans, rec.validCount());
    assertEquals(Files.size(file), rec.bytes());

    try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ);
        ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
      assertTrue(reader.loadNextBatch());
      Float4Vector col = (Float4Vector) reader.getVectorSchemaRoot().getVector("value");
      assertEquals(nans, col.getNullCount());
      for (int i = 0; i < v.length; i++) {
        if (Float.isNaN(v[i])) {
          assertTrue(col.isNull(i), "value " + i + " is missing");
          // The documented format: a missing value's data slot holds 0.
          assertEquals(0, col.getDataBuffer().getInt((long) i * Float.BYTES), "data slot of missing value " + i);
        } else {
          assertFalse(col.isNull(i), "value " + i + " is present");
          assertEquals(Float.floatToRawIntBits(v[i]), Float.floatToRawIntBits(col.get(i)), "bits of value " + i);
        }
      }
    }
    float[] back = new float[v.length];
    ChunkCodec.read(allocator, file, key, back);
    for (int i = 0; i < v.length; i++) {
      if (Float.isNaN(v[i])) {
        assertTrue(Float.isNaN(back[i]), "value " + i);
      } else {
        assertEquals(Float.floatToRawIntBits(v[i]), Float.floatToRawIntBits(back[i]), "value " + i);
      }
    }
  }

  /**
   * An encoder reuses its Arrow buffers; nothing of a previous, larger chunk may reach the file of
   * the next one: its bytes equal those of a fresh encoder's file.
   */
  @Test
  void aReusedEncoderWritesTheBytesOfAFreshOne() throws Exception {
    ChunkKey big = new ChunkKey(0, 0, 0, 10, 40, 41);
    float[] full = new float[big.values()];
    for (int i = 0; i < full.length; i++) {
      full[i] = 1000 + i; // all present: every validity bit and data slot set
    }
    ChunkKey small = new ChunkKey(10, 0, 0, 3, 5, 7); // 105 values: the last validity byte is partial
    float[] gappy = new float[small.values() + 50]; // longer than the chunk: only the front is written
    for (int i = 0; i < gappy.length; i++) {
      gappy[i] = i % 3 == 0 ? Float.NaN : -i;
    }
    Path reused = dir.resolve("reused.arrow");
    try (ChunkEncoder encoder = new ChunkEncoder(allocator)) {
      try (FileChannel ch = FileChannel.open(dir.resolve("big.arrow"), StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
        encoder.write(ch, "big.arrow", big, full);
      }
      try (FileChannel ch = FileChannel.open(reused, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
        ChunkRecord rec = encoder.write(ch, "reused.arrow", small, gappy);
        assertEquals(70, rec.validCount());
      }
    }
    Path fresh = dir.resolve("fresh.arrow");
    ChunkRecord freshRecord = ChunkCodec.write(allocator, fresh, small, gappy);
    assertArrayEquals(Files.readAllBytes(fresh), Files.readAllBytes(reused));
    assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(fresh))),
        freshRecord.sha256());
    float[] back = new float[small.values()];
    ChunkCodec.read(allocator, reused, small, back);
    for (int i = 0; i < back.length; i++) {
      assertEquals(gappy[i], back[i], 0f, "value " + i);
    }
  }

  @Test
  void tooFewValuesAreRefusedBeforeAnythingIsWritten() {
    ChunkKey key = new ChunkKey(0, 0, 0, 2, 2, 2);
    Path file = dir.resolve(key.fileName());
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> ChunkCodec.write(allocator, file, key, new float[7]));
    assertTrue(e.getMessage().contains("needs 8 values, got 7"), e.getMessage());
  }

  @Test
  void fileNamesPadLikeTheDocumentedFormat() {
    // The format of ChunkKey.fileName's Javadoc, as java.util.Formatter writes it.
    for (int[] k : new int[][] {{0, 0, 0}, {365, 64, 0}, {1_234_567, 12_345, 7}}) {
      assertEquals(String.format("t%06d_y%04d_x%04d.arrow", k[0], k[1], k[2]), new ChunkKey(k[0], k[1], k[2], 1, 1, 1).fileName());
    }
  }
}
