package org.slackwater.netcdf;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Objects;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import ucar.ma2.Array;
import ucar.ma2.InvalidRangeException;
import ucar.ma2.Section;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;
import ucar.nc2.iosp.netcdf3.N3iosp;

/**
 * One (time, lat, lon) variable of an open NetCDF file, delivered in the normalised orientation
 * and canonical unit of its descriptor.
 *
 * <p>Each {@link #read} fetches the file's bounding block of the request once per run of
 * consecutive source time steps (chunked to bound memory), then maps rows (latitude flip) and
 * columns (longitude rotation) while decoding. Not thread-safe.
 *
 * <p>How a block is fetched depends on the format. A netCDF-3 file (classic, 64-bit offset) stores
 * values as big-endian bytes in row-major order, so the block's raw bytes are copied with {@code
 * Variable.readToByteChannel} and converted with bulk {@code ByteBuffer} views ({@link RawBlock});
 * NetCDF-Java's own {@code Variable.read} turns every value through a per-value
 * {@code readShort()}/{@code readFloat()} call, which was a quarter of the ingest's CPU time. Any
 * other format (netCDF-4/HDF5: chunked, maybe compressed) goes through {@code Variable.read}.
 * NetCDF-Java's byte copy waits for every byte of the block, so on a file cut short after it was
 * opened it would never return; each raw read therefore first checks that the file is still as
 * long as when it was opened (a file cut between that check and the copy would still stall: input
 * files are not expected to change while they are ingested).
 *
 * <p>Failure modes: a {@link SourceException} naming file and variable if the file cannot be read
 * (truncated, corrupt, gone, or shorter than when it was opened); {@link IndexOutOfBoundsException}
 * for a request outside the cube or a {@code dest} that is too small.
 */
final class NetCdfSourceCube implements SourceCube {

  /** Upper bound on the values fetched by one NetCDF-Java read (4 MB of floats: stays in cache). */
  private static final int CHUNK_VALUES = 1 << 20;

  private final NetcdfFile file;
  private final Path path;
  /** The file's size when opened: NetCDF-Java checked then that it holds every value. */
  private final long openedSize;
  /** Non-null for a netCDF-3 file, whose raw bytes are read directly. */
  private final RawBlock raw;
  private final Variable variable;
  private final String where;
  private final CubeDescriptor descriptor;
  private final int[] timeIndex;
  private final int[] latIndex;
  private final int[] lonIndex;
  private final ValueDecoder decoder;
  private boolean closed;

  NetCdfSourceCube(NetcdfFile file, Path path, Variable variable, String where, CubeDescriptor descriptor,
      int[] timeIndex, int[] latIndex, int[] lonIndex, ValueDecoder decoder) throws IOException {
    this.file = Objects.requireNonNull(file);
    this.path = Objects.requireNonNull(path);
    this.openedSize = Files.size(path);
    this.raw = file.getIosp() instanceof N3iosp ? RawBlock.of(variable.getDataType()) : null;
    this.variable = Objects.requireNonNull(variable);
    this.where = where;
    this.descriptor = descriptor;
    this.timeIndex = timeIndex.clone();
    this.latIndex = latIndex.clone();
    this.lonIndex = lonIndex.clone();
    this.decoder = decoder;
    variable.setCaching(false); // values are read once per block; a cached copy would double the work
  }

  @Override
  public CubeDescriptor descriptor() {
    return descriptor;
  }

  @Override
  public void read(int t0, int nt, int y0, int ny, int x0, int nx, float[] dest) throws SourceException {
    if (closed) {
      throw new IllegalStateException(where + ": the cube is closed");
    }
    Objects.checkFromIndexSize(t0, nt, timeIndex.length);
    Objects.checkFromIndexSize(y0, ny, latIndex.length);
    Objects.checkFromIndexSize(x0, nx, lonIndex.length);
    long total = (long) nt * ny * nx;
    if (total == 0) {
      return;
    }
    if (dest.length < total) {
      throw new IndexOutOfBoundsException("dest holds " + dest.length + " values, the block needs " + total);
    }
    // Latitude maps a contiguous range to a contiguous range (identity or flip).
    int fy0 = Math.min(latIndex[y0], latIndex[y0 + ny - 1]);
    int fx0 = Integer.MAX_VALUE;
    int fx1 = Integer.MIN_VALUE;
    for (int x = x0; x < x0 + nx; x++) {
      fx0 = Math.min(fx0, lonIndex[x]);
      fx1 = Math.max(fx1, lonIndex[x]);
    }
    int fnx = fx1 - fx0 + 1;
    int[][] segments = segments(x0, nx, fx0);
    long stepValues = (long) ny * fnx;
    int maxSteps = (int) Math.max(1, Math.min(Integer.MAX_VALUE, CHUNK_VALUES / stepValues));
    int t = t0;
    while (t < t0 + nt) {
      int src = timeIndex[t];
      int k = 1;
      while (t + k < t0 + nt && k < maxSteps && timeIndex[t + k] == src + k) {
        k++;
      }
      Object storage = fetch(src, k, fy0, ny, fx0, fnx);
      for (int tt = 0; tt < k; tt++) {
        for (int y = 0; y < ny; y++) {
          int rowBase = (tt * ny + (latIndex[y0 + y] - fy0)) * fnx;
          int destBase = ((t - t0 + tt) * ny + y) * nx;
          for (int[] s : segments) {
            decoder.decode(storage, rowBase + s[1], s[2], s[3], dest, destBase + s[0]);
          }
        }
      }
      t += k;
    }
  }

  /** Runs of requested columns whose file columns step by +1 or -1: {destX, fileX - fx0, step, length}. */
  private int[][] segments(int x0, int nx, int fx0) {
    java.util.List<int[]> out = new java.util.ArrayList<>();
    int x = x0;
    while (x < x0 + nx) {
      int len = 1;
      int step = x + 1 < x0 + nx ? lonIndex[x + 1] - lonIndex[x] : 1;
      if (step == 1 || step == -1) {
        while (x + len < x0 + nx && lonIndex[x + len] - lonIndex[x + len - 1] == step) {
          len++;
        }
      } else {
        step = 1;
      }
      out.add(new int[] {x - x0, lonIndex[x] - fx0, step, len});
      x += len;
    }
    return out.toArray(new int[0][]);
  }

  private Object fetch(int t, int nt, int y, int ny, int x, int nx) throws SourceException {
    try {
      if (raw != null) {
        // See the class comment: NetCDF-Java's copy would spin forever on bytes a shrunk file lacks.
        if (Files.size(path) < openedSize) {
          throw new IOException("the file shrank from " + openedSize + " to " + Files.size(path) + " bytes while being read");
        }
        return raw.read(variable, new Section(new int[] {t, y, x}, new int[] {nt, ny, nx}));
      }
      Array a = variable.read(new int[] {t, y, x}, new int[] {nt, ny, nx});
      return a.get1DJavaArray(a.getElementType());
    } catch (IOException | InvalidRangeException | RuntimeException e) {
      throw new SourceException(where + ": reading time steps " + t + ".." + (t + nt - 1) + " failed ("
          + NetCdfCubeSource.describe(e, path)
          + "); the file may be truncated or corrupt; write it again or fetch a fresh copy", e);
    }
  }

  @Override
  public void close() throws SourceException {
    if (closed) {
      return;
    }
    closed = true;
    try {
      file.close();
    } catch (IOException | RuntimeException e) {
      throw new SourceException(where + ": closing the file failed (" + e.getMessage() + ")", e);
    }
  }
}
