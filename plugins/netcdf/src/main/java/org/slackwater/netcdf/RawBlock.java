package org.slackwater.netcdf;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.WritableByteChannel;
import ucar.ma2.DataType;
import ucar.ma2.InvalidRangeException;
import ucar.ma2.Section;
import ucar.nc2.Variable;

/**
 * Reads a block of a netCDF-3 variable as raw bytes and converts them to a primitive array in bulk.
 *
 * <p>The netCDF classic and 64-bit offset formats store every value big-endian, and a block comes
 * out of {@code Variable.readToByteChannel} in row-major order of the requested section, exactly
 * what {@code Variable.read(section)} would deliver after converting value by value. Here the
 * conversion is one {@code ByteBuffer} view copy per block ({@code asShortBuffer().get(...)} and
 * so on), which the JDK does as a byte-swapping memory copy.
 *
 * <p>Buffers are kept between reads and grow to the largest block; the array returned by {@link
 * #read} is overwritten by the next call and may be longer than the block. Not thread-safe.
 *
 * <p>Failure modes: {@link IOException} when NetCDF-Java delivers a different number of bytes
 * than the section needs (a corrupt file); NetCDF-Java's own exceptions otherwise.
 */
final class RawBlock {

  private final DataType type;
  private final int width;
  private final Sink sink = new Sink();
  private Object values;

  private RawBlock(DataType type, int width) {
    this.type = type;
    this.width = width;
  }

  /** A reader for values of {@code type}, or null for a type it does not convert (use {@code Variable.read}). */
  static RawBlock of(DataType type) {
    if (type == DataType.BYTE || type == DataType.SHORT || type == DataType.INT || type == DataType.LONG
        || type == DataType.FLOAT || type == DataType.DOUBLE) {
      return new RawBlock(type, type.getSize());
    }
    return null;
  }

  /** The section's values as a {@code byte[]}, {@code short[]}, {@code int[]}, {@code long[]}, {@code float[]} or {@code double[]}. */
  Object read(Variable v, Section section) throws IOException, InvalidRangeException {
    long count = section.computeSize();
    long need = count * width;
    if (need > Integer.MAX_VALUE) {
      throw new IllegalArgumentException("a block of " + count + " values is too large for one read");
    }
    int n = (int) count;
    ByteBuffer bytes = sink.reset((int) need);
    long got = v.readToByteChannel(section, sink);
    if (got != need || bytes.position() != need) {
      throw new IOException("NetCDF-Java delivered " + bytes.position() + " bytes for " + count + " values of "
          + type + ", not " + need);
    }
    bytes.flip();
    if (type == DataType.BYTE) {
      return bytes.array(); // heap buffer, offset 0: the bytes are the values
    } else if (type == DataType.SHORT) {
      short[] a = values instanceof short[] s && s.length >= n ? s : new short[n];
      bytes.asShortBuffer().get(a, 0, n);
      values = a;
    } else if (type == DataType.INT) {
      int[] a = values instanceof int[] s && s.length >= n ? s : new int[n];
      bytes.asIntBuffer().get(a, 0, n);
      values = a;
    } else if (type == DataType.LONG) {
      long[] a = values instanceof long[] s && s.length >= n ? s : new long[n];
      bytes.asLongBuffer().get(a, 0, n);
      values = a;
    } else if (type == DataType.FLOAT) {
      float[] a = values instanceof float[] s && s.length >= n ? s : new float[n];
      bytes.asFloatBuffer().get(a, 0, n);
      values = a;
    } else {
      double[] a = values instanceof double[] s && s.length >= n ? s : new double[n];
      bytes.asDoubleBuffer().get(a, 0, n);
      values = a;
    }
    return values;
  }

  /** Collects what NetCDF-Java writes into one reusable big-endian heap buffer. */
  private static final class Sink implements WritableByteChannel {
    private ByteBuffer buffer = ByteBuffer.allocate(0);

    ByteBuffer reset(int capacity) {
      if (buffer.capacity() < capacity) {
        buffer = ByteBuffer.allocate(capacity);
      }
      buffer.clear().limit(capacity);
      buffer.order(ByteOrder.BIG_ENDIAN);
      return buffer;
    }

    @Override
    public int write(ByteBuffer src) {
      int n = src.remaining();
      buffer.put(src); // BufferOverflowException if NetCDF-Java sends more than the section holds
      return n;
    }

    @Override
    public boolean isOpen() {
      return true;
    }

    @Override
    public void close() {}
  }
}
