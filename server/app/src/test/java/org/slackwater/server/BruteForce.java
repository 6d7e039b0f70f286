package org.slackwater.server;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BiPredicate;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import ucar.ma2.Array;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;

/**
 * An independent computation of daily area means straight from a NetCDF file, for end-to-end
 * checks: values read with NetCDF-Java's raw reader and unpacked here by the CF formulas (8.1:
 * packed x scale_factor + add_offset; 2.5.1: _FillValue tested on the packed value), and weights
 * from sub-sampling each cell on a k x k lattice against the region (point-in-polygon, or
 * great-circle distance for a circle), each sample weighted by its spherical sub-cell area
 * R^2 dlon (sin lat2 - sin lat1). Shares no code with the server's weights or readers.
 */
final class BruteForce {
  static final double R = 6_371_000.0;
  private static final GeometryFactory GF = new GeometryFactory();

  record Daily(List<LocalDate> dates, double[] mean, double[] validFraction) {}

  /** Daily mean over cells inside {@code inside(lat, lon)}; days under {@code minCoverage} are NaN. */
  static Daily dailyMeans(Path nc, String variable, BiPredicate<Double, Double> inside, int k, double minCoverage,
      double offsetAfter, LocalDate from, LocalDate to) throws Exception {
    try (NetcdfFile f = NetcdfFile.open(nc.toString())) {
      Variable v = f.findVariable(variable);
      double[] lat = (double[]) f.findVariable("lat").read().get1DJavaArray(double.class);
      double[] lon = (double[]) f.findVariable("lon").read().get1DJavaArray(double.class);
      double[] latB = (double[]) f.findVariable("lat_bnds").read().get1DJavaArray(double.class);
      double[] lonB = (double[]) f.findVariable("lon_bnds").read().get1DJavaArray(double.class);
      Variable tv = f.findVariable("time");
      double[] time = (double[]) tv.read().get1DJavaArray(double.class);
      String units = tv.findAttribute("units").getStringValue();
      double scale = num(v, "scale_factor", 1), offset = num(v, "add_offset", 0);
      double fill = num(v, "_FillValue", Double.NaN);
      int ny = lat.length, nx = lon.length;
      // Coverage counts only cells that hold a value at some step (water, for a water variable).
      boolean[] ever = new boolean[ny * nx];
      for (int t = 0; t < time.length; t++) {
        Array all = v.read(new int[] {t, 0, 0}, new int[] {1, ny, nx});
        for (int c = 0; c < ny * nx; c++) {
          double raw = all.getDouble(c);
          ever[c] |= raw != fill && !Double.isNaN(raw);
        }
      }
      double[] w = new double[ny * nx];
      double total = 0;
      for (int y = 0; y < ny; y++) {
        double s = Math.min(latB[2 * y], latB[2 * y + 1]), n = Math.max(latB[2 * y], latB[2 * y + 1]);
        for (int x = 0; x < nx; x++) {
          double we = Math.min(lonB[2 * x], lonB[2 * x + 1]), ea = Math.max(lonB[2 * x], lonB[2 * x + 1]);
          double acc = 0;
          for (int i = 0; i < k; i++) {
            double a = s + (n - s) * i / k, b = s + (n - s) * (i + 1) / k;
            double sub = R * R * Math.toRadians((ea - we) / k) * (Math.sin(Math.toRadians(b)) - Math.sin(Math.toRadians(a)));
            for (int j = 0; j < k; j++) {
              double lo = we + (ea - we) * (j + 0.5) / k;
              if (lo >= 180) {
                lo -= 360;
              }
              if (inside.test(0.5 * (a + b), lo)) {
                acc += sub;
              }
            }
          }
          w[y * nx + x] = acc;
          if (ever[y * nx + x]) {
            total += acc;
          }
        }
      }
      List<LocalDate> dates = new ArrayList<>();
      List<double[]> out = new ArrayList<>();
      LocalDate ref = LocalDate.parse(units.replaceAll(".* since (\\d{4}-\\d{2}-\\d{2}).*", "$1"));
      double hoursRef = units.matches(".* since \\d{4}-\\d{2}-\\d{2} 12:.*") ? 12 : 0;
      boolean hours = units.startsWith("hours");
      for (int t = 0; t < time.length; t++) {
        double days = hours ? (time[t] + hoursRef) / 24.0 : time[t];
        LocalDate d = ref.plusDays((long) Math.floor(days + 1e-9));
        if (d.isBefore(from) || d.isAfter(to)) {
          continue;
        }
        Array slab = v.read(new int[] {t, 0, 0}, new int[] {1, ny, nx});
        double sw = 0, swv = 0;
        for (int c = 0; c < ny * nx; c++) {
          double raw = slab.getDouble(c);
          if (w[c] == 0 || raw == fill || Double.isNaN(raw)) {
            continue;
          }
          double value = raw * scale + offset + offsetAfter;
          sw += w[c];
          swv += w[c] * value;
        }
        dates.add(d);
        double frac = sw / total;
        out.add(new double[] {sw > 0 && frac >= minCoverage ? swv / sw : Double.NaN, frac});
      }
      double[] mean = out.stream().mapToDouble(a -> a[0]).toArray();
      double[] frac = out.stream().mapToDouble(a -> a[1]).toArray();
      return new Daily(dates, mean, frac);
    }
  }

  /** A named polygon of the demo's regions.geojson as a containment test, parsed here with Jackson. */
  static BiPredicate<Double, Double> polygon(Path geojson, String name) throws Exception {
    JsonNode fc = new ObjectMapper().readTree(Files.readString(geojson));
    for (JsonNode f : fc.get("features")) {
      if (f.get("properties").get("name").asText().equals(name)) {
        JsonNode ring = f.get("geometry").get("coordinates").get(0);
        Coordinate[] c = new Coordinate[ring.size()];
        for (int i = 0; i < c.length; i++) {
          c[i] = new Coordinate(ring.get(i).get(0).asDouble(), ring.get(i).get(1).asDouble());
        }
        Polygon p = GF.createPolygon(c);
        PreparedGeometry pg = PreparedGeometryFactory.prepare(p);
        return (lat, lon) -> pg.contains(GF.createPoint(new Coordinate(lon, lat)));
      }
    }
    throw new IllegalArgumentException("no region " + name);
  }

  /** Points within {@code radius} metres (great circle, haversine) of a centre. */
  static BiPredicate<Double, Double> circle(double lat0, double lon0, double radius) {
    return (lat, lon) -> {
      double p1 = Math.toRadians(lat0), p2 = Math.toRadians(lat);
      double dp = p2 - p1, dl = Math.toRadians(lon - lon0);
      double h = Math.sin(dp / 2) * Math.sin(dp / 2) + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) * Math.sin(dl / 2);
      return 2 * R * Math.asin(Math.sqrt(h)) <= radius;
    };
  }

  private static double num(Variable v, String name, double dflt) {
    Attribute a = v.findAttribute(name);
    return a == null ? dflt : a.getNumericValue().doubleValue();
  }
}
