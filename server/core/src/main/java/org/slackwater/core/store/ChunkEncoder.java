package org.slackwater.core.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.WritableByteChannel;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.ArrowBuf;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;

/**
 * Encodes chunks into Arrow IPC files in the format {@link ChunkCodec} documents, reusing one
 * Arrow vector from chunk to chunk: a fresh vector per chunk costs an allocation and the zeroing
 * of both buffers, and every byte that reaches a file is overwritten anyway (the data slots and
 * validity bytes of the chunk's {@code n} values; Arrow writes the padding itself). The vector
 * grows to the largest chunk seen.
 *
 * <p>Not thread-safe: one encoder per writing thread. {@link #close} releases the Arrow memory.
 */
final class ChunkEncoder implements AutoCloseable {

  private static final Field FIELD =
      new Field(ChunkCodec.COLUMN, FieldType.nullable(new ArrowType.FloatingPoint(FloatingPointPrecision.SINGLE)), null);

  private final Float4Vector vector;
  private final float[] clean = new float[ChunkCodec.BLOCK];
  private final byte[] bits = new byte[ChunkCodec.BLOCK / 8];
  private int capacity;

  ChunkEncoder(BufferAllocator allocator) {
    this.vector = (Float4Vector) FIELD.createVector(allocator);
  }

  /**
   * Writes the chunk into {@code channel} (a new, empty file named {@code fileName}) without
   * forcing it to disk: the caller owns the channel and must force it before the file counts as
   * written. The SHA-256 is taken from the bytes on their way to the file.
   */
  ChunkRecord write(FileChannel channel, String fileName, ChunkKey key, float[] values) throws IOException {
    int n = key.values();
    if (values.length < n) {
      throw new IllegalArgumentException("chunk " + key + " needs " + n + " values, got " + values.length);
    }
    if (capacity < n) {
      vector.allocateNew(n);
      capacity = vector.getValueCapacity();
    }
    long valid = encode(values, n, vector.getDataBuffer(), vector.getValidityBuffer());
    vector.setValueCount(n);
    Map<String, String> meta = Map.of(
        "slackwater.chunk", key.t0() + "," + key.y0() + "," + key.x0() + "," + key.nt() + "," + key.ny() + "," + key.nx(),
        "slackwater.order", "time,row,column");
    // A root per chunk for the chunk's schema metadata; it is not closed, since that would close the vector.
    VectorSchemaRoot root = new VectorSchemaRoot(new Schema(List.of(FIELD), meta), List.of(vector), n);
    DigestingChannel out = new DigestingChannel(channel, ChunkCodec.sha256());
    try (ArrowFileWriter writer = new ArrowFileWriter(root, null, out)) {
      writer.start();
      writer.writeBatch();
      writer.end();
    }
    return new ChunkRecord(key, fileName, HexFormat.of().formatHex(out.digest()), out.written(), valid);
  }

  /**
   * Fills the data buffer (0 where missing) and the validity bitmap (LSB first, Arrow's bit order)
   * from the first {@code n} values, one block at a time; returns how many values are present.
   */
  private long encode(float[] values, int n, ArrowBuf data, ArrowBuf validity) {
    long valid = 0;
    for (int start = 0; start < n; start += ChunkCodec.BLOCK) {
      int len = Math.min(ChunkCodec.BLOCK, n - start);
      for (int i = 0; i < len; i += 8) {
        int b = 0;
        for (int k = 0; k < 8 && i + k < len; k++) {
          // Branch-free: cloud gaps make missing values too irregular for branch prediction.
          int x = Float.floatToRawIntBits(values[start + i + k]);
          int present = ((x & 0x7fffffff) - 0x7f800001) >>> 31; // 1 unless NaN (magnitude above infinity)
          clean[i + k] = Float.intBitsToFloat(x & -present); // the value, or +0 for missing
          b |= present << k;
        }
        bits[i >> 3] = (byte) b; // bits past the last value stay 0
        valid += Integer.bitCount(b);
      }
      ChunkCodec.floats(data, start, len).put(clean, 0, len);
      validity.setBytes(start / 8, bits, 0, (len + 7) / 8);
    }
    return valid;
  }

  @Override
  public void close() {
    vector.close();
  }

  /**
   * Passes every byte to the file channel and to the digest, and counts them. Closing it leaves the
   * file channel open: its owner still has to force and close it.
   */
  private static final class DigestingChannel implements WritableByteChannel {
    private final FileChannel file;
    private final MessageDigest digest;
    private long written;
    private boolean open = true;

    DigestingChannel(FileChannel file, MessageDigest digest) {
      this.file = file;
      this.digest = digest;
    }

    @Override
    public int write(ByteBuffer src) throws IOException {
      int n = src.remaining();
      digest.update(src.duplicate());
      while (src.hasRemaining()) {
        file.write(src);
      }
      written += n;
      return n;
    }

    long written() {
      return written;
    }

    byte[] digest() {
      return digest.digest();
    }

    @Override
    public boolean isOpen() {
      return open;
    }

    @Override
    public void close() {
      open = false;
    }
  }
}
