package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.VersionRecord;
import org.slackwater.core.ingest.FileDigest;
import org.slackwater.core.store.ChunkRecord;

/**
 * The ncgen-written files of src/test/resources/dropfolder (see its regenerate.sh) and what the
 * tests expect of them, taken from the same CDL text ncgen read: each day's values (CDL {@code _}
 * is the fill value, delivered as missing) and dates (from the time variable's "days since"
 * units). Also reads a stored cube back whole and snapshots what an ingest could change.
 */
final class DropFolderFiles {
  private DropFolderFiles() {}

  static Path nc(String name) {
    return resource("dropfolder/nc/" + name + ".nc");
  }

  private static Path resource(String name) {
    try {
      return Path.of(DropFolderFiles.class.getResource("/" + name).toURI());
    } catch (URISyntaxException | NullPointerException e) {
      throw new IllegalStateException("test resource " + name + " is missing; run src/test/resources/dropfolder/regenerate.sh", e);
    }
  }

  private static final Pattern UNITS = Pattern.compile("time:units = \"days since (\\d{4}-\\d{2}-\\d{2})\"");

  /**
   * The values of {@code variable} in CDL file {@code name} by date, each a row-major lat x lon
   * array as ncgen stores it (float32; {@code _} is NaN).
   */
  static Map<LocalDate, float[]> days(String name, String variable) {
    String text;
    try {
      text = Files.readString(resource("dropfolder/cdl/" + name + ".cdl"));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    Matcher u = UNITS.matcher(text);
    assertTrue(u.find(), "time units in " + name);
    LocalDate ref = LocalDate.parse(u.group(1));
    double[] time = numbers(data(text, "time"));
    double[] lat = numbers(data(text, "lat"));
    double[] lon = numbers(data(text, "lon"));
    double[] v = numbers(data(text, variable));
    int cells = lat.length * lon.length;
    assertEquals(time.length * cells, v.length, "values in " + name);
    Map<LocalDate, float[]> out = new TreeMap<>();
    for (int t = 0; t < time.length; t++) {
      float[] day = new float[cells];
      for (int c = 0; c < cells; c++) {
        day[c] = (float) v[t * cells + c];
      }
      out.put(ref.plusDays((long) time[t]), day);
    }
    return out;
  }

  private static String data(String text, String variable) {
    Matcher m = Pattern.compile("\\n " + variable + " =([^;]*);").matcher(text.substring(text.indexOf("\ndata:")));
    assertTrue(m.find(), "data of " + variable);
    return m.group(1);
  }

  private static double[] numbers(String list) {
    List<Double> out = new ArrayList<>();
    for (String s : list.trim().split("\\s*,\\s*")) {
      out.add(s.equals("_") ? Double.NaN : Double.parseDouble(s));
    }
    return out.stream().mapToDouble(Double::doubleValue).toArray();
  }

  /** The current version of {@code cube}: values by date, row-major cells. */
  static Map<LocalDate, float[]> stored(Workspace ws, String cube) throws IOException {
    CubeEntry c = ws.catalog().cube(cube).orElseThrow();
    int nt = c.descriptor().time().size();
    int nx = c.descriptor().grid().nx();
    float[][] all = new float[nt][c.descriptor().grid().cells()];
    for (ChunkRecord r : c.chunks()) {
      float[] v = new float[r.key().values()];
      ws.store().read(c.name(), c.version(), r, v);
      int i = 0;
      for (int t = 0; t < r.key().nt(); t++) {
        for (int y = 0; y < r.key().ny(); y++) {
          for (int x = 0; x < r.key().nx(); x++) {
            all[r.key().t0() + t][(r.key().y0() + y) * nx + r.key().x0() + x] = v[i++];
          }
        }
      }
    }
    Map<LocalDate, float[]> out = new TreeMap<>();
    for (int t = 0; t < nt; t++) {
      out.put(c.descriptor().time().date(t), all[t]);
    }
    return out;
  }

  /** Asserts the stored days are exactly {@code expected}'s, value for value (NaN for missing). */
  static void assertSameDays(Map<LocalDate, float[]> expected, Map<LocalDate, float[]> stored, float tolerance) {
    assertEquals(List.copyOf(expected.keySet()), List.copyOf(stored.keySet()), "dates");
    for (Map.Entry<LocalDate, float[]> e : expected.entrySet()) {
      float[] want = e.getValue();
      float[] got = stored.get(e.getKey());
      for (int c = 0; c < want.length; c++) {
        if (Float.isNaN(want[c])) {
          assertTrue(Float.isNaN(got[c]), e.getKey() + " cell " + c + " should be missing but is " + got[c]);
        } else {
          assertEquals(want[c], got[c], tolerance, e.getKey() + " cell " + c);
        }
      }
    }
  }

  /** What an ingest could change: the catalog's cube rows and histories, and every stored file's SHA-256. */
  record Snapshot(List<CubeEntry> cubes, Map<String, List<VersionRecord>> history, Map<String, String> files) {}

  static Snapshot snapshot(Workspace ws) throws IOException {
    Map<String, List<VersionRecord>> h = new TreeMap<>();
    for (CubeEntry c : ws.catalog().cubes()) {
      h.put(c.name(), ws.catalog().history(c.name()));
    }
    Map<String, String> files = new TreeMap<>();
    Path cubes = ws.root().resolve("cubes");
    try (Stream<Path> s = Files.walk(cubes)) {
      for (Path p : (Iterable<Path>) s::iterator) {
        files.put(cubes.relativize(p).toString(), Files.isRegularFile(p) ? FileDigest.sha256(p) : "dir");
      }
    }
    return new Snapshot(ws.catalog().cubes(), h, files);
  }
}
