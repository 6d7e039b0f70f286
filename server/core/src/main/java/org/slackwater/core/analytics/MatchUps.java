package org.slackwater.core.analytics;

import java.io.IOException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;

/**
 * Match-ups of station grab samples with a cube: each sample is paired with the value of the grid
 * cell that contains the station on the sample's UTC date (or the mean of the cell's valid values
 * within ±{@code windowDays}). Per station and overall: n, bias = mean(cube − sample), RMSE =
 * √mean((cube − sample)²), and Pearson's r (Hipparchus). Samples whose cell has no value that day
 * are counted as unmatched.
 */
public final class MatchUps {

  /** One grab sample. */
  public record Sample(int line, String station, double lon, double lat, LocalDate date, double value) {}

  /** Statistics of one group of pairs. */
  public record Stats(String station, int samples, int n, double bias, double rmse, double r, double meanSample, double meanCube) {}

  private MatchUps() {}

  /**
   * Reads samples of {@code variable} from CSV with the header {@code station,lon,lat,time,variable,value,units};
   * values are converted from their units to {@code cubeUnit}.
   *
   * @throws IllegalArgumentException naming the line and column of the first bad row
   */
  public static List<Sample> parse(String csv, String variable, String cubeUnit) {
    String[] lines = csv.split("\r?\n");
    if (lines.length == 0 || !lines[0].trim().equals("station,lon,lat,time,variable,value,units")) {
      throw new IllegalArgumentException("line 1: the header must be station,lon,lat,time,variable,value,units");
    }
    List<Sample> out = new ArrayList<>();
    Map<String, UnitConversion> conversions = new LinkedHashMap<>();
    for (int i = 1; i < lines.length; i++) {
      if (lines[i].isBlank()) {
        continue;
      }
      String[] f = lines[i].split(",", -1);
      if (f.length != 7) {
        throw new IllegalArgumentException("line " + (i + 1) + ": expected 7 fields, found " + f.length);
      }
      if (!f[4].trim().equalsIgnoreCase(variable)) {
        continue;
      }
      try {
        double lon = Double.parseDouble(f[1]), lat = Double.parseDouble(f[2]), v = Double.parseDouble(f[5]);
        LocalDate d = f[3].length() > 10 ? LocalDate.ofInstant(Instant.parse(f[3].trim()), ZoneOffset.UTC) : LocalDate.parse(f[3].trim());
        String unit = f[6].trim();
        UnitConversion c = conversions.computeIfAbsent(unit, u -> UnitConversion.between(u, cubeUnit));
        out.add(new Sample(i + 1, f[0].trim(), lon, lat, d, c.apply(v)));
      } catch (NumberFormatException | DateTimeParseException e) {
        throw new IllegalArgumentException("line " + (i + 1) + ": " + e.getMessage() + "; lon, lat and value are numbers, time ISO 8601");
      } catch (UnitConversion.UnitMismatchException e) {
        throw new IllegalArgumentException("line " + (i + 1) + ": " + e.getMessage());
      }
    }
    return out;
  }

  /** Per-station statistics, then one row named "all". */
  public static List<Stats> compute(ChunkSource chunks, CubeEntry cube, List<Sample> samples, int windowDays) throws IOException {
    LatLonGrid g = cube.descriptor().grid();
    TimeAxis time = cube.descriptor().time();
    Map<String, List<double[]>> pairs = new LinkedHashMap<>();
    Map<String, Integer> counts = new LinkedHashMap<>();
    for (Sample s : samples) {
      counts.merge(s.station(), 1, Integer::sum);
      int y = index(g.latLower(), g.latUpper(), s.lat());
      double lon = g.lonUpper(g.nx() - 1) > 180 && s.lon() < 0 ? s.lon() + 360 : s.lon();
      int x = index(g.lonLower(), g.lonUpper(), lon);
      if (y < 0 || x < 0) {
        continue;
      }
      double sum = 0;
      int n = 0;
      for (int d = -windowDays; d <= windowDays; d++) {
        int t = time.firstAtOrAfter(s.date().plusDays(d).toEpochDay() * 86_400L);
        if (t >= time.size() || !time.date(t).equals(s.date().plusDays(d))) {
          continue;
        }
        float v = value(chunks, cube, t, y, x);
        if (!Float.isNaN(v)) {
          sum += v;
          n++;
        }
      }
      if (n > 0) {
        pairs.computeIfAbsent(s.station(), k -> new ArrayList<>()).add(new double[] {s.value(), sum / n});
      }
    }
    List<Stats> out = new ArrayList<>();
    List<double[]> all = new ArrayList<>();
    for (String station : counts.keySet()) {
      List<double[]> p = pairs.getOrDefault(station, List.of());
      all.addAll(p);
      out.add(stats(station, counts.get(station), p));
    }
    out.add(stats("all", samples.size(), all));
    return out;
  }

  private static Stats stats(String station, int samples, List<double[]> p) {
    int n = p.size();
    double bias = 0, sq = 0, ms = 0, mc = 0;
    double[] a = new double[n], b = new double[n];
    for (int i = 0; i < n; i++) {
      double d = p.get(i)[1] - p.get(i)[0];
      bias += d;
      sq += d * d;
      ms += p.get(i)[0];
      mc += p.get(i)[1];
      a[i] = p.get(i)[0];
      b[i] = p.get(i)[1];
    }
    double r = n > 2 ? new PearsonsCorrelation().correlation(a, b) : Double.NaN;
    return n == 0 ? new Stats(station, samples, 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN)
        : new Stats(station, samples, n, bias / n, Math.sqrt(sq / n), r, ms / n, mc / n);
  }

  private static float value(ChunkSource chunks, CubeEntry cube, int t, int y, int x) throws IOException {
    for (ChunkRecord c : cube.chunks()) {
      ChunkKey k = c.key();
      if (t >= k.t0() && t < k.t0() + k.nt() && y >= k.y0() && y < k.y0() + k.ny() && x >= k.x0() && x < k.x0() + k.nx()) {
        return chunks.get(cube, c)[((t - k.t0()) * k.ny() + (y - k.y0())) * k.nx() + (x - k.x0())];
      }
    }
    return Float.NaN;
  }

  /** The cell whose [lower, upper) holds v, or -1. */
  private static int index(double[] lo, double[] hi, double v) {
    for (int i = 0; i < lo.length; i++) {
      if (v >= lo[i] && v < hi[i]) {
        return i;
      }
    }
    return -1;
  }
}
