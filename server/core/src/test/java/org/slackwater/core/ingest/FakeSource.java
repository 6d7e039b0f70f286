package org.slackwater.core.ingest;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/**
 * A source for tests: any file whose first line is {@code FAKE <variable> <ny> <nx> <nt> [fail-after-reads] [land]}
 * is a cube with value(t, y, x) = {@link #value}; every 7th cell-step is missing. With a
 * fail-after count the source throws on that read, to test that a failed ingest changes nothing;
 * with {@code land}, the cells {@link #isLand} never hold a value.
 */
public final class FakeSource implements CubeSource {
  public static final LatLonGrid GRID_ORIGIN = LatLonGrid.regular(43.5, -32, 0.1, 0.1, 1, 1);

  public static float value(int t, int y, int x) {
    if ((t * 31 + y * 7 + x) % 7 == 3) {
      return Float.NaN;
    }
    return (float) (10 + Math.sin(t / 10.0) + 0.1 * y - 0.05 * x);
  }

  /** Land cells of a {@code land} file: about one in five, scattered, never a value. */
  public static boolean isLand(int y, int x) {
    return (y * 3 + x) % 5 == 2;
  }

  public static LatLonGrid grid(int ny, int nx) {
    return LatLonGrid.regular(43.5, -32, 0.1, 0.1, ny, nx);
  }

  public static Path write(Path file, String variable, int ny, int nx, int nt, int failAfter) throws java.io.IOException {
    Files.writeString(file, "FAKE " + variable + " " + ny + " " + nx + " " + nt + " " + failAfter + "\n");
    return file;
  }

  /**
   * A file on a grid of {@code cellDegrees} cells from the same origin, whose days start at
   * {@code firstDay} (the values follow {@link #value} with t counted from that day).
   */
  public static Path writeOnGrid(Path file, String variable, int ny, int nx, int nt, double cellDegrees, java.time.LocalDate firstDay)
      throws java.io.IOException {
    Files.writeString(file, "FAKE " + variable + " " + ny + " " + nx + " " + nt + " 0 cell=" + cellDegrees + " start=" + firstDay + "\n");
    return file;
  }

  /** A file whose {@link #isLand} cells never hold a value. */
  public static Path writeWithLand(Path file, String variable, int ny, int nx, int nt) throws java.io.IOException {
    Files.writeString(file, "FAKE " + variable + " " + ny + " " + nx + " " + nt + " 0 land\n");
    return file;
  }

  @Override
  public String name() {
    return "fake";
  }

  @Override
  public boolean accepts(Path file) {
    try (java.io.InputStream in = Files.newInputStream(file)) {
      return new String(in.readNBytes(5), java.nio.charset.StandardCharsets.US_ASCII).equals("FAKE ");
    } catch (java.io.IOException e) {
      return false;
    }
  }

  @Override
  public List<String> variables(Path file) throws SourceException {
    return List.of(header(file)[1]);
  }

  @Override
  public SourceCube open(Path file, String variable) throws SourceException {
    String[] h = header(file);
    if (!h[1].equals(variable)) {
      throw new SourceException("file " + file.getFileName() + ": no variable '" + variable + "'");
    }
    int ny = Integer.parseInt(h[2]), nx = Integer.parseInt(h[3]), nt = Integer.parseInt(h[4]);
    int failAfter = Integer.parseInt(h[5]);
    boolean land = h.length > 6 && h[6].equals("land");
    double cell = 0.1;
    java.time.LocalDate first = java.time.LocalDate.of(2014, 1, 1);
    for (int k = 6; k < h.length; k++) {
      if (h[k].startsWith("cell=")) {
        cell = Double.parseDouble(h[k].substring(5));
      } else if (h[k].startsWith("start=")) {
        first = java.time.LocalDate.parse(h[k].substring(6));
      }
    }
    long[] secs = new long[nt];
    long start = first.toEpochDay() * 86400L;
    for (int t = 0; t < nt; t++) {
      secs[t] = start + t * 86400L;
    }
    CubeDescriptor d = new CubeDescriptor(variable, "sea_water_temperature", "test field", "degC", "K",
        LatLonGrid.regular(43.5, -32, cell, cell, ny, nx),
        new TimeAxis("standard", "days since 2014-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
    return new SourceCube() {
      int reads;

      @Override
      public CubeDescriptor descriptor() {
        return d;
      }

      @Override
      public void read(int t0, int ntr, int y0, int nyr, int x0, int nxr, float[] dest) throws SourceException {
        if (failAfter > 0 && ++reads >= failAfter) {
          throw new SourceException("file " + file.getFileName() + ", variable " + variable + ": the file is truncated");
        }
        int i = 0;
        for (int t = t0; t < t0 + ntr; t++) {
          for (int y = y0; y < y0 + nyr; y++) {
            for (int x = x0; x < x0 + nxr; x++) {
              dest[i++] = land && isLand(y, x) ? Float.NaN : value(t, y, x);
            }
          }
        }
      }

      @Override
      public void close() {}
    };
  }

  private static String[] header(Path file) throws SourceException {
    try {
      return Files.readString(file).trim().split(" ");
    } catch (java.io.IOException e) {
      throw new SourceException("cannot read " + file.getFileName());
    }
  }
}
