package org.slackwater.core.store;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.ArrowBuf;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.vector.BitVectorHelper;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;

/**
 * Writes and reads one chunk as an Arrow IPC file: a single record batch with one nullable
 * float32 column {@code value} holding the chunk's values in (time, row, column) order; a missing
 * value is a null (validity bit 0). The chunk's key is in the schema metadata, so a chunk file is
 * self-describing and can be opened with any Arrow reader.
 *
 * <p>In memory the server works on {@code float[]} with {@link Float#NaN} for missing; this class
 * is the one place that converts between the two. Arrow buffers are allocated from the caller's
 * allocator and released before each method returns.
 */
public final class ChunkCodec {

  public static final String COLUMN = "value";

  private ChunkCodec() {}

  /** Writes {@code values} (NaN = missing) to {@code file}, fsyncs it, and returns its record. */
  public static ChunkRecord write(BufferAllocator allocator, Path file, ChunkKey key, float[] values) throws IOException {
    int n = key.values();
    Map<String, String> meta = Map.of(
        "slackwater.chunk", key.t0() + "," + key.y0() + "," + key.x0() + "," + key.nt() + "," + key.ny() + "," + key.nx(),
        "slackwater.order", "time,row,column");
    Field field = new Field(COLUMN, FieldType.nullable(new ArrowType.FloatingPoint(FloatingPointPrecision.SINGLE)), null);
    Schema schema = new Schema(List.of(field), meta);
    MessageDigest sha = sha256();
    long valid = 0;
    try (VectorSchemaRoot root = VectorSchemaRoot.create(schema, allocator)) {
      Float4Vector v = (Float4Vector) root.getVector(COLUMN);
      v.allocateNew(n);
      ArrowBuf data = v.getDataBuffer();
      ArrowBuf validity = v.getValidityBuffer();
      validity.setZero(0, validity.capacity());
      for (int i = 0; i < n; i++) {
        float f = values[i];
        if (!Float.isNaN(f)) {
          data.setFloat((long) i * Float.BYTES, f);
          BitVectorHelper.setBit(validity, i);
          valid++;
        }
      }
      v.setValueCount(n);
      root.setRowCount(n);
      try (FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
          OutputStream out = new DigestOutputStream(Channels.newOutputStream(ch), sha);
          ArrowFileWriter writer = new ArrowFileWriter(root, null, Channels.newChannel(out))) {
        writer.start();
        writer.writeBatch();
        writer.end();
        out.flush();
        ch.force(true);
      }
    }
    return new ChunkRecord(key, file.getFileName().toString(), HexFormat.of().formatHex(sha.digest()), Files.size(file), valid);
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
      ArrowBuf data = v.getDataBuffer();
      ArrowBuf validity = v.getValidityBuffer();
      for (int i = 0; i < n; i++) {
        dest[i] = BitVectorHelper.get(validity, i) != 0 ? data.getFloat((long) i * Float.BYTES) : Float.NaN;
      }
    }
  }

  static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("the JDK lacks SHA-256", e);
    }
  }
}
