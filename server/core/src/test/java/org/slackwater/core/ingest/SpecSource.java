package org.slackwater.core.ingest;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/**
 * A source for the append tests: a text file {@code SPEC key=value ...} describes one daily cube
 * whose value at a date and cell is {@link #value}, a formula of the date, the cell and the file's
 * {@code seed}, so a test computes what any step must hold from the date and the seed of the file
 * that delivered it. Keys: variable, units, calendar, grid (south,west,cell,ny,nx), start (date),
 * days, every (days between steps, default 1), seed, and attr.NAME for descriptor attributes.
 */
final class SpecSource implements CubeSource {

  /** A file's spec, for writing. */
  record Spec(String variable, String units, String calendar, double west, int ny, int nx, LocalDate start, int days, int every,
      int seed, Map<String, String> attrs) {
    static Spec daily(LocalDate start, int days, int seed) {
      return new Spec("temp", "degC", "standard", -32, 5, 7, start, days, 1, seed, Map.of());
    }

    Spec withSeed(int s) {
      return new Spec(variable, units, calendar, west, ny, nx, start, days, every, s, attrs);
    }

    Spec withUnits(String u) {
      return new Spec(variable, u, calendar, west, ny, nx, start, days, every, seed, attrs);
    }

    Spec withCalendar(String c) {
      return new Spec(variable, units, c, west, ny, nx, start, days, every, seed, attrs);
    }

    Spec withWest(double w) {
      return new Spec(variable, units, calendar, w, ny, nx, start, days, every, seed, attrs);
    }

    Spec withEvery(int e) {
      return new Spec(variable, units, calendar, west, ny, nx, start, days, e, seed, attrs);
    }

    Spec withAttribute(String k, String v) {
      Map<String, String> a = new LinkedHashMap<>(attrs);
      a.put(k, v);
      return new Spec(variable, units, calendar, west, ny, nx, start, days, every, seed, a);
    }

    LocalDate day(int t) {
      return start.plusDays((long) t * every);
    }

    Path write(Path file) throws IOException {
      StringBuilder b = new StringBuilder("SPEC variable=" + variable + " units=" + units + " calendar=" + calendar
          + " grid=43.5," + west + ",0.1," + ny + "," + nx + " start=" + start + " days=" + days + " every=" + every + " seed=" + seed);
      attrs.forEach((k, v) -> b.append(" attr.").append(k).append('=').append(v));
      return Files.writeString(file, b.append('\n'));
    }
  }

  /** The value of a file with {@code seed} at {@code day}, cell (y, x); NaN (missing) on a scattered eleventh of cell-days. */
  static float value(int seed, LocalDate day, int y, int x) {
    long d = day.toEpochDay();
    if ((d * 5 + y * 3 + x) % 11 == 0) {
      return Float.NaN;
    }
    return (float) (seed * 100 + (d % 1000) * 0.5 + 0.1 * y + 0.01 * x);
  }

  @Override
  public String name() {
    return "spec";
  }

  @Override
  public boolean accepts(Path file) {
    try (var in = Files.newInputStream(file)) {
      return new String(in.readNBytes(5), StandardCharsets.US_ASCII).equals("SPEC ");
    } catch (IOException e) {
      return false;
    }
  }

  @Override
  public List<String> variables(Path file) throws SourceException {
    return List.of(parse(file).get("variable"));
  }

  @Override
  public SourceCube open(Path file, String variable) throws SourceException {
    Map<String, String> p = parse(file);
    String[] g = p.get("grid").split(",");
    int ny = Integer.parseInt(g[3]);
    int nx = Integer.parseInt(g[4]);
    LatLonGrid grid = LatLonGrid.regular(Double.parseDouble(g[0]), Double.parseDouble(g[1]), Double.parseDouble(g[2]), Double.parseDouble(g[2]), ny, nx);
    LocalDate start = LocalDate.parse(p.get("start"));
    int days = Integer.parseInt(p.get("days"));
    int every = Integer.parseInt(p.get("every"));
    int seed = Integer.parseInt(p.get("seed"));
    long[] secs = new long[days];
    for (int t = 0; t < days; t++) {
      secs[t] = start.plusDays((long) t * every).toEpochDay() * 86_400L;
    }
    Map<String, String> attrs = new LinkedHashMap<>();
    p.forEach((k, v) -> {
      if (k.startsWith("attr.")) {
        attrs.put(k.substring(5), v);
      }
    });
    String calendar = p.get("calendar");
    TimeAxis.Alignment alignment = calendar.equals("standard") ? TimeAxis.Alignment.EXACT : TimeAxis.Alignment.SAME_LABEL;
    CubeDescriptor d = new CubeDescriptor(variable, "sea_water_temperature", "test temperature", p.get("units"), p.get("units"), grid,
        new TimeAxis(calendar, "days since " + start, alignment, secs), attrs);
    return new SourceCube() {
      @Override
      public CubeDescriptor descriptor() {
        return d;
      }

      @Override
      public void read(int t0, int nt, int y0, int nyr, int x0, int nxr, float[] dest) {
        int i = 0;
        for (int t = t0; t < t0 + nt; t++) {
          LocalDate day = start.plusDays((long) t * every);
          for (int y = y0; y < y0 + nyr; y++) {
            for (int x = x0; x < x0 + nxr; x++) {
              dest[i++] = value(seed, day, y, x);
            }
          }
        }
      }

      @Override
      public void close() {}
    };
  }

  private static Map<String, String> parse(Path file) throws SourceException {
    try {
      Map<String, String> out = new LinkedHashMap<>();
      for (String kv : Files.readString(file).trim().substring(5).split(" ")) {
        int eq = kv.indexOf('=');
        out.put(kv.substring(0, eq), kv.substring(eq + 1));
      }
      return out;
    } catch (IOException e) {
      throw new SourceException("file " + file.getFileName() + " cannot be read: " + e.getMessage());
    }
  }
}
