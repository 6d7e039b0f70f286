package org.slackwater.core.store;

import java.io.IOException;
import java.nio.ByteOrder;
import java.nio.FloatBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import org.apache.arrow.memory.ArrowBuf;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;

/**
 * Writes and reads one chunk as an Arrow IPC file: a single record batch with one nullable
 * float32 column {@code value} holding the chunk's values in (time, row, column) order; a missing
 * value is a null (validity bit 0) whose data slot holds 0. The chunk's key is in the schema
 * metadata, so a chunk file is self-describing and can be opened with any Arrow reader.
 *
 * <p>In memory the server works on {@code float[]} with {@link Float#NaN} for missing; this class
 * (with {@link ChunkEncoder}, which does its writing) is the one place that converts between the
 * two. Arrow buffers are allocated from the caller's allocator and released before each method
 * returns.
 *
 * <p>Values move between {@code float[]} and Arrow memory in bulk, through native-order
 * {@link FloatBuffer} views of the Arrow buffers, and the validity bitmap is built a byte (eight
 * values) at a time: a per-value {@code ArrowBuf.setFloat} pays a bounds and reference-count check
 * on every value, which made encoding one of the two largest costs of an ingest. The SHA-256 of
 * the file is computed from the bytes on their way to the file, so the file is never read back.
 *
 * <p>Failure modes: {@link IOException} when the file cannot be created (it exists already: chunk
 * files are never overwritten), written or read, or when a file does not hold the expected chunk;
 * {@link IllegalArgumentException} for a value array shorter than the key's extent.
 */
public final class ChunkCodec {

  public static final String COLUMN = "value";

  /** Values converted per bulk step: a multiple of 8 (one validity byte) that keeps the scratch in cache. */
  static final int BLOCK = 1 << 14;

  private ChunkCodec() {}

  /** Writes {@code values} (NaN = missing) to {@code file}, fsyncs it, and returns its record. */
  public static ChunkRecord write(BufferAllocator allocator, Path file, ChunkKey key, float[] values) throws IOException {
    try (ChunkEncoder encoder = new ChunkEncoder(allocator);
        FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
      ChunkRecord rec = encoder.write(ch, file.getFileName().toString(), key, values);
      ch.force(true);
      return rec;
    }
  }

  /** Reads a chunk file into {@code dest} (NaN for nulls); checks the stored key against {@code key}. */
  public static void read(BufferAllocator allocator, Path file, ChunkKey key, float[] dest) throws IOException {
    try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ);
        ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
      VectorSchemaRoot root = reader.getVectorSchemaRoot();
      if (!reader.loadNextBatch()) {
        throw new IOException("chunk file " + file + " holds no record batch");
      }
      Float4Vector v = (Float4Vector) root.getVector(COLUMN);
      int n = key.values();
      if (v == null || v.getValueCount() != n) {
        throw new IOException("chunk file " + file + " does not hold " + n + " values");
      }
      decode(v.getDataBuffer(), v.getValidityBuffer(), v.getNullCount() > 0, n, dest);
    }
  }

  /** Copies the values in bulk, then writes NaN over the slots whose validity bit is 0. */
  private static void decode(ArrowBuf data, ArrowBuf validity, boolean hasNulls, int n, float[] dest) {
    byte[] bits = new byte[(Math.min(BLOCK, n) + 7) / 8];
    for (int start = 0; start < n; start += BLOCK) {
      int len = Math.min(BLOCK, n - start);
      floats(data, start, len).get(dest, start, len);
      if (!hasNulls) {
        continue;
      }
      // A file written without a validity buffer (no nulls) has none to read; hasNulls guards that.
      validity.getBytes(start / 8, bits, 0, (len + 7) / 8);
      for (int i = 0; i < len; i += 8) {
        int b = bits[i >> 3] & 0xFF;
        if (b == 0xFF) {
          continue;
        }
        for (int k = 0; k < 8 && i + k < len; k++) {
          if ((b & (1 << k)) == 0) {
            dest[start + i + k] = Float.NaN;
          }
        }
      }
    }
  }

  /** A native-order float view of values {@code [start, start+len)} of an Arrow float32 data buffer. */
  static FloatBuffer floats(ArrowBuf data, int start, int len) {
    return data.nioBuffer((long) start * Float.BYTES, len * Float.BYTES).order(ByteOrder.nativeOrder()).asFloatBuffer();
  }

  static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("the JDK lacks SHA-256", e);
    }
  }
}
