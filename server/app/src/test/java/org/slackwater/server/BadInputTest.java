package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestReport;
import ucar.ma2.Array;
import ucar.ma2.DataType;
import ucar.ma2.InvalidRangeException;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFileWriter;
import ucar.nc2.Variable;

/**
 * Bad input end to end: a real {@link Workspace} (its ingestor finds the NetCDF plugin through
 * ServiceLoader) first ingests a good file, then is handed each kind of bad file the issue lists.
 * Every refusal must be an {@link IngestException} whose message names the file, the variable
 * where there is one, the problem and the fix, and must leave the catalog and the store exactly as
 * they were: same cube list, same version and chunk checksums of the good cube, same files on disk,
 * no staging directory. The same files posted to {@code POST /api/cubes} must give 422 problem
 * documents naming the file.
 *
 * <p>The files are written in the test by NetCDF-Java's own {@code NetcdfFileWriter} (NetCDF-3
 * classic, netCDF file format specification), except the one that is not NetCDF at all and the
 * truncated ones, which are cut from the good file. Each bad file changes one thing against the CF
 * conventions 1.8 (section named beside each case).
 */
class BadInputTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static final String TOKEN = "wrenmouth-admin";
  private static final int NT = 10, NY = 4, NX = 5;

  @TempDir static Path dir;
  private static Path incoming;
  private static Workspace ws;
  private static HttpServer server;
  private static StoreState afterGoodIngest;

  /** One bad file: how to make it and what its refusal must say, besides the file's name. */
  record BadFile(String fileName, Maker maker, List<String> expected) {
    @Override
    public String toString() {
      return fileName;
    }
  }

  @FunctionalInterface
  interface Maker {
    void write(Path file) throws IOException;
  }

  static List<BadFile> badFiles() {
    return List.of(
        // Not NetCDF at all: a CSV with a .nc name. The netCDF format specification's magic numbers
        // are 'CDF' + version byte, and HDF5's '\211HDF' for NetCDF-4.
        new BadFile("harle_gauge.nc", f -> Files.writeString(f, "date,flow\n2014-01-01,12.5\n"),
            List.of("is not in a format Slackwater reads", "CF-NetCDF files start with the bytes 'CDF' or '\\211HDF'")),
        // Truncated inside the header (100 of the good file's bytes).
        new BadFile("water_temp_cut_header.nc", f -> cut(f, 100),
            List.of("cannot be read as NetCDF", "truncated or corrupt", "write it again or fetch a fresh copy")),
        // Truncated inside the data: the header is whole, the last 40 bytes of values are missing.
        new BadFile("water_temp_cut_data.nc", f -> cut(f, Files.size(good()) - 40),
            List.of("cannot be read as NetCDF", "truncated or corrupt", "write it again or fetch a fresh copy")),
        // CF 4.4: a time coordinate is what makes a variable a cube; this one is (lat, lon) only.
        new BadFile("water_temp_no_time.nc", BadInputTest::writeNoTime,
            List.of("'water_temp': no time axis", "(lat, lon)", "add one with units such as 'days since 2000-01-01' (CF 4.4)")),
        // CF 4.4.1: the calendar attribute must be one of the CF calendars.
        new BadFile("water_temp_lunar.nc", f -> writeRegular(f, "water_temp", "K", "sea_water_temperature", "lunar_tidal"),
            List.of("variable water_temp", "time variable 'time'", "calendar 'lunar_tidal' is not a CF calendar",
                "use one of standard")),
        // CF 3.1 with the standard name table: sea_water_temperature's canonical unit is K, and a
        // mass concentration cannot be converted to a temperature.
        new BadFile("water_temp_mg.nc", f -> writeRegular(f, "water_temp", "mg m-3", "sea_water_temperature", "standard"),
            List.of("variable water_temp", "units 'mg m-3' do not fit standard_name 'sea_water_temperature'",
                "needs a temperature", "correct the units or the standard_name")),
        // CF 3.1: units must be a string udunits can read.
        new BadFile("water_temp_zz.nc", f -> writeRegular(f, "water_temp", "zz", "", "standard"),
            List.of("variable water_temp", "units 'zz' are not understood", "write a udunits string")),
        // CF 5.2 / 5.6: latitude and longitude as 2-D auxiliary coordinates (a curvilinear grid).
        new BadFile("water_temp_curvilinear.nc", BadInputTest::writeCurvilinear,
            List.of("'water_temp': curvilinear grids are not supported yet", "regrid to a regular lat/lon grid first",
                "'lat', 'lon' are 2-D")),
        // A good new variable before a bad one: the good one must not be published either.
        new BadFile("oxygen_and_bad_temp.nc", BadInputTest::writeGoodThenBad,
            List.of("variable water_temp", "units 'mg m-3' do not fit standard_name 'sea_water_temperature'")));
  }

  @BeforeAll
  static void setUp() throws Exception {
    incoming = Files.createDirectories(dir.resolve("incoming"));
    writeRegular(good(), "water_temp", "K", "sea_water_temperature", "standard");
    for (BadFile b : badFiles()) {
      b.maker().write(incoming.resolve(b.fileName()));
    }
    ws = Workspace.open(dir.resolve("store"));
    List<IngestReport> reports = ws.ingestor().ingest(good(), Optional.empty());
    assertEquals(List.of("water_temp"), reports.stream().map(IngestReport::cube).toList());
    afterGoodIngest = StoreState.of(ws);
    server = HttpServer.start(ws, new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.of(TOKEN), Optional.of(incoming)));
  }

  @AfterAll
  static void tearDown() {
    if (server != null) {
      server.close();
    }
    if (ws != null) {
      ws.close();
    }
  }

  private static Path good() {
    return incoming.resolve("water_temp_good.nc");
  }

  @Test
  void theGoodFileIsACubeInCanonicalUnits() {
    CubeEntry e = ws.catalog().cube("water_temp").orElseThrow();
    assertEquals(1, e.version());
    // Kelvin is delivered as degC (the canonical temperature unit of the README's ingest rules).
    assertEquals("degC", e.descriptor().units());
    assertEquals(NT, e.descriptor().time().size());
    assertEquals(NY, e.descriptor().grid().ny());
    assertEquals(NX, e.descriptor().grid().nx());
    assertFalse(e.chunks().isEmpty());
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("badFiles")
  void aBadFileIsRefusedWithAClearMessageAndChangesNothing(BadFile bad) throws IOException {
    Path file = incoming.resolve(bad.fileName());
    IngestException e = assertThrows(IngestException.class, () -> ws.ingestor().ingest(file, Optional.empty()));
    String m = e.getMessage();
    assertTrue(m.startsWith("file "), m);
    assertTrue(m.contains(bad.fileName()), "names the file: " + m);
    for (String part : bad.expected()) {
      assertTrue(m.contains(part), "expected '" + part + "' in: " + m);
    }
    assertFalse(m.contains("\n") || m.contains("\tat "), "one line, no stack trace: " + m);
    assertNothingChanged();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("badFiles")
  void overHttpABadFileIsA422ProblemNamingTheFile(BadFile bad) throws Exception {
    HttpResponse<String> r = HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/cubes"))
        .header("Authorization", "Bearer " + TOKEN)
        .header("Content-Type", "application/json")
        .POST(HttpRequest.BodyPublishers.ofString(JSON.createObjectNode().put("path", bad.fileName()).toString()))
        .build(), HttpResponse.BodyHandlers.ofString());
    // RFC 9457: problem details are application/problem+json with status, title and detail.
    assertEquals(422, r.statusCode(), r.body());
    assertEquals("application/problem+json", r.headers().firstValue("content-type").orElse(""));
    JsonNode p = JSON.readTree(r.body());
    assertEquals(422, p.get("status").asInt());
    String detail = p.get("detail").asText();
    assertTrue(detail.contains(bad.fileName()), "names the file: " + detail);
    assertTrue(detail.contains(bad.expected().get(0)), detail);
    assertNothingChanged();
  }

  private static void assertNothingChanged() throws IOException {
    StoreState now = StoreState.of(ws);
    assertEquals(afterGoodIngest.cubes(), now.cubes(), "the catalog's cube list");
    assertEquals(afterGoodIngest.goodVersion(), now.goodVersion(), "the good cube's version");
    assertEquals(afterGoodIngest.goodChunks(), now.goodChunks(), "the good cube's chunks and checksums");
    assertEquals(afterGoodIngest.files(), now.files(), "the files under cubes/");
    assertTrue(now.files().stream().noneMatch(f -> f.contains(".staging-")), "no staging directory left: " + now.files());
  }

  /** What must not change: cube names and versions, the good cube's chunk records, the files on disk. */
  record StoreState(List<String> cubes, int goodVersion, List<String> goodChunks, List<String> files) {
    static StoreState of(Workspace ws) throws IOException {
      List<String> cubes = ws.catalog().cubes().stream().map(c -> c.name() + "@v" + c.version()).toList();
      CubeEntry g = ws.catalog().cube("water_temp").orElseThrow();
      List<String> chunks = g.chunks().stream().map(c -> c.key() + " " + c.file() + " " + c.sha256() + " " + c.bytes()).toList();
      Path root = ws.root().resolve("cubes");
      List<String> files;
      try (Stream<Path> walk = Files.walk(root)) {
        files = walk.filter(p -> !p.equals(root)).map(p -> root.relativize(p).toString()).sorted().collect(Collectors.toList());
      }
      return new StoreState(cubes, g.version(), chunks, files);
    }
  }

  // ---- files -------------------------------------------------------------------------------

  private static void cut(Path target, long keep) throws IOException {
    byte[] whole = Files.readAllBytes(good());
    Files.write(target, Arrays.copyOf(whole, (int) keep));
  }

  /** (time, lat, lon) on 1-D coordinates near 44 N, 31 W (the invented Wrenmouth estuary). */
  static void writeRegular(Path file, String variable, String units, String standardName, String calendar) throws IOException {
    write(file, w -> {
      Variable[] axes = regularAxes(w, calendar);
      Variable v = dataVariable(w, variable, "time lat lon", units, standardName);
      return () -> {
        writeAxes(w, axes);
        w.write(v, temperatures(NT, NY, NX));
      };
    });
  }

  private static void writeNoTime(Path file) throws IOException {
    write(file, w -> {
      w.addDimension(null, "lat", NY);
      w.addDimension(null, "lon", NX);
      Variable lat = coordinate(w, "lat", "degrees_north", "latitude");
      Variable lon = coordinate(w, "lon", "degrees_east", "longitude");
      Variable v = dataVariable(w, "water_temp", "lat lon", "K", "sea_water_temperature");
      return () -> {
        w.write(lat, doubles(latitudes()));
        w.write(lon, doubles(longitudes()));
        w.write(v, Array.factory(DataType.FLOAT, new int[] {NY, NX}, temperatures(1, NY, NX).getStorage()));
      };
    });
  }

  private static void writeCurvilinear(Path file) throws IOException {
    write(file, w -> {
      w.addDimension(null, "time", NT);
      w.addDimension(null, "y", NY);
      w.addDimension(null, "x", NX);
      Variable time = w.addVariable(null, "time", DataType.DOUBLE, "time");
      w.addVariableAttribute(time, new Attribute("units", "days since 2014-01-01"));
      w.addVariableAttribute(time, new Attribute("calendar", "standard"));
      Variable lat = w.addVariable(null, "lat", DataType.DOUBLE, "y x");
      w.addVariableAttribute(lat, new Attribute("units", "degrees_north"));
      w.addVariableAttribute(lat, new Attribute("standard_name", "latitude"));
      Variable lon = w.addVariable(null, "lon", DataType.DOUBLE, "y x");
      w.addVariableAttribute(lon, new Attribute("units", "degrees_east"));
      w.addVariableAttribute(lon, new Attribute("standard_name", "longitude"));
      Variable v = dataVariable(w, "water_temp", "time y x", "K", "sea_water_temperature");
      w.addVariableAttribute(v, new Attribute("coordinates", "lat lon"));
      return () -> {
        w.write(time, doubles(days()));
        // A grid rotated by a small skew, so that neither 2-D coordinate is separable.
        double[] la = new double[NY * NX];
        double[] lo = new double[NY * NX];
        for (int y = 0; y < NY; y++) {
          for (int x = 0; x < NX; x++) {
            la[y * NX + x] = 44.0 + 0.1 * y + 0.01 * x;
            lo[y * NX + x] = -31.2 + 0.1 * x - 0.01 * y;
          }
        }
        w.write(lat, Array.factory(DataType.DOUBLE, new int[] {NY, NX}, la));
        w.write(lon, Array.factory(DataType.DOUBLE, new int[] {NY, NX}, lo));
        w.write(v, temperatures(NT, NY, NX));
      };
    });
  }

  private static void writeGoodThenBad(Path file) throws IOException {
    write(file, w -> {
      Variable[] axes = regularAxes(w, "standard");
      Variable oxygen = dataVariable(w, "oxygen", "time lat lon", "mg L-1", "");
      Variable temp = dataVariable(w, "water_temp", "time lat lon", "mg m-3", "sea_water_temperature");
      return () -> {
        writeAxes(w, axes);
        w.write(oxygen, temperatures(NT, NY, NX));
        w.write(temp, temperatures(NT, NY, NX));
      };
    });
  }

  /** Defines the file (returns what writes the data once the header is created). */
  @FunctionalInterface
  interface Definition {
    DataWriter define(NetcdfFileWriter w) throws IOException;
  }

  @FunctionalInterface
  interface DataWriter {
    void write() throws IOException, InvalidRangeException;
  }

  private static void write(Path file, Definition definition) throws IOException {
    NetcdfFileWriter w = NetcdfFileWriter.createNew(NetcdfFileWriter.Version.netcdf3, file.toString());
    try {
      w.addGroupAttribute(null, new Attribute("Conventions", "CF-1.8"));
      w.addGroupAttribute(null, new Attribute("title", "Wrenmouth estuary test file (invented data)"));
      DataWriter data = definition.define(w);
      w.create();
      data.write();
    } catch (InvalidRangeException e) {
      throw new IllegalStateException("test file " + file + " is inconsistent", e);
    } finally {
      w.close();
    }
  }

  private static Variable[] regularAxes(NetcdfFileWriter w, String calendar) {
    w.addDimension(null, "time", NT);
    w.addDimension(null, "lat", NY);
    w.addDimension(null, "lon", NX);
    Variable time = w.addVariable(null, "time", DataType.DOUBLE, "time");
    w.addVariableAttribute(time, new Attribute("standard_name", "time"));
    w.addVariableAttribute(time, new Attribute("units", "days since 2014-01-01"));
    w.addVariableAttribute(time, new Attribute("calendar", calendar));
    return new Variable[] {time, coordinate(w, "lat", "degrees_north", "latitude"), coordinate(w, "lon", "degrees_east", "longitude")};
  }

  private static void writeAxes(NetcdfFileWriter w, Variable[] axes) throws IOException, InvalidRangeException {
    w.write(axes[0], doubles(days()));
    w.write(axes[1], doubles(latitudes()));
    w.write(axes[2], doubles(longitudes()));
  }

  private static Variable coordinate(NetcdfFileWriter w, String name, String units, String standardName) {
    Variable c = w.addVariable(null, name, DataType.DOUBLE, name);
    w.addVariableAttribute(c, new Attribute("units", units));
    w.addVariableAttribute(c, new Attribute("standard_name", standardName));
    return c;
  }

  private static Variable dataVariable(NetcdfFileWriter w, String name, String dims, String units, String standardName) {
    Variable v = w.addVariable(null, name, DataType.FLOAT, dims);
    w.addVariableAttribute(v, new Attribute("units", units));
    if (!standardName.isEmpty()) {
      w.addVariableAttribute(v, new Attribute("standard_name", standardName));
    }
    w.addVariableAttribute(v, new Attribute("_FillValue", -999f));
    return v;
  }

  private static double[] days() {
    double[] d = new double[NT];
    for (int i = 0; i < NT; i++) {
      d[i] = i;
    }
    return d;
  }

  private static double[] latitudes() {
    return new double[] {44.0, 44.1, 44.2, 44.3};
  }

  private static double[] longitudes() {
    return new double[] {-31.2, -31.1, -31.0, -30.9, -30.8};
  }

  private static Array doubles(double[] values) {
    return Array.factory(DataType.DOUBLE, new int[] {values.length}, values);
  }

  /** Plausible late-winter water temperatures in kelvin, varying by step and cell. */
  private static Array temperatures(int nt, int ny, int nx) {
    float[] v = new float[nt * ny * nx];
    for (int i = 0; i < v.length; i++) {
      v[i] = 281.15f + 0.1f * (i / (ny * nx)) + 0.01f * (i % (ny * nx));
    }
    return Array.factory(DataType.FLOAT, new int[] {nt, ny, nx}, v);
  }
}
