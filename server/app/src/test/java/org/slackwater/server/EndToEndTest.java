package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.BiPredicate;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.slackwater.core.Workspace;

/**
 * The server on an ephemeral port over the small generated scenario, asked over HTTP, every value
 * compared with {@link BruteForce}: raw NetCDF values unpacked by the CF rules and weights from a
 * sub-sampled lattice. The lattice's boundary error is about 1/k of the boundary cells' area; with
 * k = 60 on these coarse grids the means agree to 2e-3 relative. Days whose brute-force coverage
 * is within 0.02 of the 50 % threshold are skipped, because the two weightings may fall on
 * different sides of it.
 */
class EndToEndTest {
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static DemoFixture demo;
  private static Workspace ws;
  private static HttpServer server;

  @BeforeAll
  static void start() throws Exception {
    demo = DemoFixture.small();
    ws = demo.open();
    server = HttpServer.start(ws, ServerConfig.local(0));
  }

  @AfterAll
  static void stop() {
    server.close();
    ws.close();
  }

  static HttpResponse<String> post(String body, String query) throws Exception {
    return HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/query" + query))
        .POST(HttpRequest.BodyPublishers.ofString(body)).build(), HttpResponse.BodyHandlers.ofString());
  }

  static HttpResponse<String> get(String path) throws Exception {
    return HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + path)).GET().build(), HttpResponse.BodyHandlers.ofString());
  }

  /** CSV rows keyed by the first column (the date), value from the column headed {@code header}. */
  static Map<LocalDate, Double> column(String csv, String header) {
    String[] lines = csv.split("\r\n");
    List<String> head = List.of(lines[0].split(","));
    int c = head.indexOf(header);
    assertTrue(c >= 0, "no column " + header + " in " + head);
    Map<LocalDate, Double> out = new HashMap<>();
    for (int i = 1; i < lines.length; i++) {
      String[] f = lines[i].split(",", -1);
      out.put(LocalDate.parse(f[0]), f[c].isEmpty() ? Double.NaN : Double.parseDouble(f[c]));
    }
    return out;
  }

  private void compare(String query, String header, String file, String variable, BiPredicate<Double, Double> region,
      double offsetAfter, LocalDate from, LocalDate to) throws Exception {
    HttpResponse<String> r = post(query, "");
    assertEquals(200, r.statusCode(), r.body());
    assertTrue(r.headers().firstValue("content-type").orElse("").startsWith("text/csv"));
    Map<LocalDate, Double> got = column(r.body(), header);
    BruteForce.Daily want = BruteForce.dailyMeans(demo.manifest.dir().resolve(file), variable, region, 60, 0.5, offsetAfter, from, to);
    assertEquals(want.dates().size(), got.size(), "days");
    int compared = 0;
    for (int i = 0; i < want.dates().size(); i++) {
      LocalDate d = want.dates().get(i);
      if (Math.abs(want.validFraction()[i] - 0.5) < 0.02) {
        continue;
      }
      double w = want.mean()[i], g = got.get(d);
      if (Double.isNaN(w)) {
        assertTrue(Double.isNaN(g), d + ": expected missing, got " + g);
      } else {
        assertEquals(w, g, 2e-3 * Math.abs(w) + 1e-6, d.toString());
        compared++;
      }
    }
    assertTrue(compared > 20, "only " + compared + " days compared");
  }

  @Test
  void chlorophyllOverAPolygonMatchesTheBruteForceMean() throws Exception {
    compare("mean chlorophyll over \"Outer Bay\" from 2014-05-01 to 2014-08-31 by day", "mean_chlorophyll [mg m-3]",
        "chlorophyll.nc", "chlorophyll", BruteForce.polygon(demo.manifest.regions(), "Outer Bay"), 0,
        LocalDate.of(2014, 5, 1), LocalDate.of(2014, 8, 31));
  }

  @Test
  void packedTurbidityOverAnIntakeCircleMatches() throws Exception {
    JsonNode regions = new ObjectMapper().readTree(get("/api/regions").body());
    JsonNode intake = null;
    for (JsonNode f : regions.get("features")) {
      if (f.get("properties").get("name").asText().equals("North Intake")) {
        intake = f;
      }
    }
    double lon = intake.get("geometry").get("coordinates").get(0).asDouble();
    double lat = intake.get("geometry").get("coordinates").get(1).asDouble();
    double radius = intake.get("properties").get("radius_m").asDouble();
    compare(String.format(java.util.Locale.ROOT, "mean turbidity over circle(%.6f, %.6f, %.1f m) during 2014 by day", lat, lon, radius),
        "mean_turbidity [FNU]", "turbidity.nc", "turbidity", BruteForce.circle(lat, lon, radius), 0,
        LocalDate.of(2014, 1, 1), LocalDate.of(2014, 12, 31));
  }

  @Test
  void descendingLatitudeKelvinTemperatureComesOutInCelsius() throws Exception {
    // degC = K - 273.15 (the definition of the Celsius scale).
    // On the small scenario's coarse temperature grid only the Outer Bay holds water cells.
    compare("mean water_temperature over \"Outer Bay\" from 2013-06-01 to 2013-09-30 by day", "mean_water_temperature [degC]",
        "water_temperature.nc", "water_temperature", BruteForce.polygon(demo.manifest.regions(), "Outer Bay"), -273.15,
        LocalDate.of(2013, 6, 1), LocalDate.of(2013, 9, 30));
  }

  @Test
  void zeroTo360CloudFractionOverTheWatershedMatches() throws Exception {
    compare("mean cloud_fraction over \"Harle Watershed\" during 2014-03 by day", "mean_cloud_fraction [1]",
        "cloud_fraction.nc", "cloud_fraction", BruteForce.polygon(demo.manifest.regions(), "Harle Watershed"), 0,
        LocalDate.of(2014, 3, 1), LocalDate.of(2014, 3, 31));
  }

  @Test
  void aRegionWithoutDataCellsIsAClearError() throws Exception {
    HttpResponse<String> r = post("mean water_temperature over \"Mid Reach\" during 2013 by month", "");
    assertEquals(400, r.statusCode(), r.body());
    JsonNode p = new ObjectMapper().readTree(r.body());
    assertEquals("no cell of water_temperature inside Mid Reach ever holds a value (all are fill values, e.g. land)", p.get("detail").asText());
    assertEquals(29, p.get("column").asInt());
  }

  @Test
  void catalogAndRegionsAreJson() throws Exception {
    JsonNode cubes = new ObjectMapper().readTree(get("/api/cubes").body());
    assertEquals(6, cubes.size());
    JsonNode runoff = null;
    for (JsonNode c : cubes) {
      if (c.get("name").asText().equals("runoff")) {
        runoff = c;
      }
    }
    assertEquals("noleap", runoff.get("calendar").asText());
    assertEquals("mm/day", runoff.get("units").asText());
    assertEquals(64, runoff.get("provenance").get("source_sha256").asText().length());
    JsonNode regions = new ObjectMapper().readTree(get("/api/regions").body());
    assertEquals("FeatureCollection", regions.get("type").asText());
    java.util.Set<String> names = new java.util.HashSet<>();
    regions.get("features").forEach(f -> names.add(f.get("properties").get("name").asText()));
    assertTrue(names.containsAll(List.of("Upper Reach", "Mid Reach", "Outer Bay", "Harle Watershed", "North Intake", "Harle Intake")), names.toString());
    JsonNode health = new ObjectMapper().readTree(get("/api/health").body());
    assertEquals("ok", health.get("status").asText());
  }

  @Test
  void arrowStreamsCarryTheSameValuesAsCsv() throws Exception {
    String q = "mean chlorophyll over \"Outer Bay\" from 2014-05-01 to 2014-08-31 by day";
    Map<LocalDate, Double> csv = column(post(q, "").body(), "mean_chlorophyll [mg m-3]");
    HttpResponse<byte[]> r = HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/query"))
        .header("Accept", "application/vnd.apache.arrow.stream").POST(HttpRequest.BodyPublishers.ofString(q)).build(),
        HttpResponse.BodyHandlers.ofByteArray());
    assertEquals(200, r.statusCode());
    assertEquals("application/vnd.apache.arrow.stream", r.headers().firstValue("content-type").orElse(""));
    // Arrow's own stream reader is the reference for the format.
    try (org.apache.arrow.memory.RootAllocator a = new org.apache.arrow.memory.RootAllocator();
        org.apache.arrow.vector.ipc.ArrowStreamReader reader = new org.apache.arrow.vector.ipc.ArrowStreamReader(
            new java.io.ByteArrayInputStream(r.body()), a)) {
      var root = reader.getVectorSchemaRoot();
      assertEquals("mg m-3", root.getSchema().findField("mean_chlorophyll").getMetadata().get("unit"));
      int rows = 0;
      while (reader.loadNextBatch()) {
        var time = (org.apache.arrow.vector.DateDayVector) root.getVector("time");
        var value = (org.apache.arrow.vector.Float8Vector) root.getVector("mean_chlorophyll");
        for (int i = 0; i < root.getRowCount(); i++, rows++) {
          double want = csv.get(LocalDate.ofEpochDay(time.get(i)));
          assertEquals(want, value.isNull(i) ? Double.NaN : value.get(i), 0.0);
        }
      }
      assertEquals(csv.size(), rows);
    }
  }

  /**
   * Match-ups against an independent pairing: each sample's cell found from the file's own bounds
   * variables, the value read with NetCDF-Java on the sample's date, bias and RMSE by their
   * definitions, r by Hipparchus' PearsonsCorrelation.
   */
  @Test
  void matchUpsOfStationSamplesAgreeWithAnIndependentPairing() throws Exception {
    String csv = java.nio.file.Files.readString(demo.manifest.stations());
    HttpResponse<String> r = HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/matchups?variable=chlorophyll&format=json"))
        .POST(HttpRequest.BodyPublishers.ofString(csv)).build(), HttpResponse.BodyHandlers.ofString());
    assertEquals(200, r.statusCode(), r.body());
    JsonNode rows = new ObjectMapper().readTree(r.body()).get("results").get(0).get("rows");
    JsonNode all = rows.get(rows.size() - 1);
    assertEquals("all", all.get(0).asText());

    java.util.List<double[]> pairs = new java.util.ArrayList<>();
    try (ucar.nc2.NetcdfFile f = ucar.nc2.NetcdfFile.open(demo.manifest.dir().resolve("chlorophyll.nc").toString())) {
      double[] latB = (double[]) f.findVariable("lat_bnds").read().get1DJavaArray(double.class);
      double[] lonB = (double[]) f.findVariable("lon_bnds").read().get1DJavaArray(double.class);
      double[] time = (double[]) f.findVariable("time").read().get1DJavaArray(double.class);
      ucar.nc2.Variable v = f.findVariable("chlorophyll");
      double fill = v.findAttribute("_FillValue").getNumericValue().doubleValue();
      LocalDate ref = LocalDate.of(2006, 1, 1); // "hours since 2006-01-01 12:00:00"
      for (String line : csv.split("\n")) {
        String[] p = line.split(",");
        if (p.length < 7 || !p[4].equals("chlorophyll")) {
          continue;
        }
        double lon = Double.parseDouble(p[1]), lat = Double.parseDouble(p[2]);
        LocalDate d = LocalDate.parse(p[3].substring(0, 10));
        int y = -1, x = -1;
        for (int i = 0; i < latB.length / 2; i++) {
          if (lat >= Math.min(latB[2 * i], latB[2 * i + 1]) && lat < Math.max(latB[2 * i], latB[2 * i + 1])) y = i;
        }
        for (int i = 0; i < lonB.length / 2; i++) {
          if (lon >= Math.min(lonB[2 * i], lonB[2 * i + 1]) && lon < Math.max(lonB[2 * i], lonB[2 * i + 1])) x = i;
        }
        int t = -1;
        for (int i = 0; i < time.length; i++) {
          if (ref.plusDays((long) Math.floor((time[i] + 12) / 24.0)).equals(d)) t = i;
        }
        if (y < 0 || x < 0 || t < 0) {
          continue;
        }
        double c = v.read(new int[] {t, y, x}, new int[] {1, 1, 1}).getDouble(0);
        if (c != fill && !Double.isNaN(c)) {
          pairs.add(new double[] {Double.parseDouble(p[5]), c});
        }
      }
    }
    double bias = 0, sq = 0;
    double[] a = new double[pairs.size()], b = new double[pairs.size()];
    for (int i = 0; i < pairs.size(); i++) {
      double diff = pairs.get(i)[1] - pairs.get(i)[0];
      bias += diff;
      sq += diff * diff;
      a[i] = pairs.get(i)[0];
      b[i] = pairs.get(i)[1];
    }
    int n = pairs.size();
    assertTrue(n > 50, "pairs " + n);
    assertEquals(n, all.get(2).asInt());
    assertEquals(bias / n, all.get(3).asDouble(), 1e-6);
    assertEquals(Math.sqrt(sq / n), all.get(4).asDouble(), 1e-6);
    assertEquals(new org.hipparchus.stat.correlation.PearsonsCorrelation().correlation(a, b), all.get(5).asDouble(), 1e-9);
  }

  @Test
  void jsonResultsCarryUnitsAndMetadata() throws Exception {
    HttpResponse<String> r = post("mean rainfall over \"Harle Watershed\" during 2014 by month", "?format=json");
    assertEquals(200, r.statusCode(), r.body());
    JsonNode res = new ObjectMapper().readTree(r.body()).get("results").get(0);
    assertEquals("mm/day", res.get("columns").get(3).get("unit").asText());
    assertEquals(12, res.get("rows").size());
    assertEquals("rainfall", res.get("metadata").get("variable").asText());
  }
}
