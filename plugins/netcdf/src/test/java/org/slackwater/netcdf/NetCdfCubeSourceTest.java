package org.slackwater.netcdf;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.slackwater.netcdf.ReferenceFiles.assertValue;
import static org.slackwater.netcdf.ReferenceFiles.cdl;
import static org.slackwater.netcdf.ReferenceFiles.expected;
import static org.slackwater.netcdf.ReferenceFiles.midpointBounds;
import static org.slackwater.netcdf.ReferenceFiles.nc;
import static org.slackwater.netcdf.ReferenceFiles.readAll;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.List;
import java.util.ServiceLoader;
import java.util.function.DoubleUnaryOperator;
import java.util.function.IntBinaryOperator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis.Alignment;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/**
 * Reads every reference file written by ncgen and compares each value and coordinate with the
 * numbers of its CDL, transformed by the CF rules named at each check.
 */
class NetCdfCubeSourceTest {

  private final NetCdfCubeSource source = new NetCdfCubeSource();
  private static final DoubleUnaryOperator SAME = x -> x;
  private static final IntBinaryOperator NO_FLIP = (y, ny) -> y;

  /** Compares all values: normalised (t, y, x) holds CDL value (t, fileRow(y), fileCol(x)). */
  private static void assertValues(Cdl.Var v, float[] actual, int nt, int ny, int nx, int[] sourceSteps,
      IntBinaryOperator fileRow, IntBinaryOperator fileCol, DoubleUnaryOperator toCanonical) {
    assertEquals(nt * ny * nx, actual.length);
    for (int t = 0; t < nt; t++) {
      for (int y = 0; y < ny; y++) {
        for (int x = 0; x < nx; x++) {
          int src = (sourceSteps[t] * ny + fileRow.applyAsInt(y, ny)) * nx + fileCol.applyAsInt(x, nx);
          assertValue(expected(v, src, toCanonical), actual[(t * ny + y) * nx + x], "t=" + t + " y=" + y + " x=" + x);
        }
      }
    }
  }

  private static int[] steps(int n) {
    int[] s = new int[n];
    for (int i = 0; i < n; i++) {
      s[i] = i;
    }
    return s;
  }

  private static void assertGrid(double[] latLo, double[] latHi, double[] lonLo, double[] lonHi, LatLonGrid g) {
    assertArrayEquals(latLo, g.latLower(), 1e-9, "latitude lower bounds");
    assertArrayEquals(latHi, g.latUpper(), 1e-9, "latitude upper bounds");
    assertArrayEquals(lonLo, g.lonLower(), 1e-9, "longitude lower bounds");
    assertArrayEquals(lonHi, g.lonUpper(), 1e-9, "longitude upper bounds");
  }

  /** Grid of a file whose CDL centres are already ascending and within -180..180. */
  private static void assertMidpointGrid(Cdl cdl, LatLonGrid g) {
    double[][] lat = midpointBounds(cdl.var("lat").data());
    double[][] lon = midpointBounds(cdl.var("lon").data());
    assertGrid(lat[0], lat[1], lon[0], lon[1], g);
  }

  private static long epoch(LocalDateTime t) {
    return t.toEpochSecond(ZoneOffset.UTC);
  }

  @ParameterizedTest
  @ValueSource(strings = {"packed", "packed_nc4"})
  void packedShortsWithFillValue(String file) throws Exception {
    Cdl cdl = cdl("packed");
    assertEquals(List.of("temp"), source.variables(nc(file)));
    try (SourceCube cube = source.open(nc(file), "temp")) {
      CubeDescriptor d = cube.descriptor();
      assertEquals("temp", d.variable());
      assertEquals("sea_water_temperature", d.standardName());
      assertEquals("Wrenmouth surface water temperature", d.longName());
      assertEquals("degC", d.units());
      assertEquals("degC", d.sourceUnits());
      assertMidpointGrid(cdl, d.grid());
      // Standard calendar after 1582 is the proleptic Gregorian calendar of java.time (CF 4.4.3);
      // "days since 2020-02-28" crosses the leap day 2020-02-29.
      double[] days = cdl.var("time").data();
      for (int t = 0; t < days.length; t++) {
        assertEquals(LocalDate.of(2020, 2, 28).plusDays((long) days[t]), d.time().date(t));
        assertEquals(0, d.time().epochSecond(t) % 86_400, "daily data on whole days");
      }
      assertEquals(Alignment.EXACT, d.time().alignment());
      assertEquals("standard", d.time().calendar());
      assertEquals("days since 2020-02-28 00:00:00", d.time().units());
      // CF 8.1 and 2.5.1, applied by ReferenceFiles.expected to the CDL's packed shorts.
      assertValues(cdl.var("temp"), readAll(cube), 3, 3, 4, steps(3), NO_FLIP, NO_FLIP, SAME);
      assertEquals("Wrenmouth estuary synthetic water temperature", d.attributes().get(":title"));
      assertEquals("time: mean", d.attributes().get("temp:cell_methods"));
      assertTrue(d.attributes().get("slackwater.packing").contains("0.01"), d.attributes().toString());
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {"temp_b", "temp_i"})
  void byteAndIntStorageIsUnpackedAsTheCdlSays(String variable) throws Exception {
    // CF 8.1 unpacking and CF 2.5.1 validity (_FillValue, valid_min), applied by
    // ReferenceFiles.expected to the values ncgen stored from storage_types.cdl.
    Cdl cdl = cdl("storage_types");
    try (SourceCube cube = source.open(nc("storage_types"), variable)) {
      assertValues(cdl.var(variable), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
    }
  }

  @Test
  void byteAndIntExtremesByHand() throws Exception {
    // From storage_types.cdl by hand, CF 8.1: -127 * 0.25 + 12 = -19.75; 127 * 0.25 + 12 = 43.75;
    // 2147483647 * 1e-6 = 2147.483647; CF 2.5.1: -128 is the byte _FillValue, and -2000000001 lies
    // below valid_min while -2000000000 does not.
    try (SourceCube b = source.open(nc("storage_types"), "temp_b"); SourceCube i = source.open(nc("storage_types"), "temp_i")) {
      float[] vb = readAll(b);
      float[] vi = readAll(i);
      assertEquals(-19.75f, vb[0], 0f);
      assertEquals(43.75f, vb[4], 0f);
      assertTrue(Float.isNaN(vb[5]));
      assertEquals(2147.483647f, vi[4], 1e-4f);
      assertEquals(-2000f, vi[6], 1e-4f);
      assertTrue(Float.isNaN(vi[7]));
      assertTrue(Float.isNaN(vi[12]), "-2147483648 is below valid_min");
    }
  }

  @Test
  void packedFillAndExtremesAreWhereTheCdlPutThem() throws Exception {
    // Spot checks by hand from packed.cdl, CF 8.1: 150 * 0.01 + 10 = 11.5; 32767 * 0.01 + 10 =
    // 337.67; -32767 is valid because _FillValue is -32768 (CF 2.5.1).
    try (SourceCube cube = source.open(nc("packed"), "temp")) {
      float[] v = readAll(cube);
      assertEquals(11.5f, v[0], 1e-5f);
      assertTrue(Float.isNaN(v[3]));
      assertEquals(337.67f, v[7], 1e-4f);
      assertEquals(-317.67f, v[9], 1e-4f);
    }
  }

  @Test
  void missingValueNanAndValidMinMax() throws Exception {
    Cdl cdl = cdl("missing_value");
    assertEquals(List.of("chl", "cover", "turb"), source.variables(nc("missing_value")));
    try (SourceCube chl = source.open(nc("missing_value"), "chl")) {
      assertEquals("mg m-3", chl.descriptor().units());
      assertEquals("ug L-1", chl.descriptor().sourceUnits());
      assertMidpointGrid(cdl, chl.descriptor().grid());
      // 1 ug L-1 = 1e-6 g / 1e-3 m3 = 1 mg m-3 (SI prefixes); missing_value and NaN (CF 2.5.1).
      assertValues(cdl.var("chl"), readAll(chl), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
      // "hours since 2021-06-01 00:00:00": 0 and 6 hours (CF 4.4.1).
      assertEquals(epoch(LocalDateTime.of(2021, 6, 1, 0, 0)), chl.descriptor().time().epochSecond(0));
      assertEquals(epoch(LocalDateTime.of(2021, 6, 1, 6, 0)), chl.descriptor().time().epochSecond(1));
    }
    try (SourceCube cover = source.open(nc("missing_value"), "cover")) {
      assertEquals("1", cover.descriptor().units());
      assertEquals("%", cover.descriptor().sourceUnits());
      // 1 % = 0.01 (SI brochure, unit one); 100.5 and -0.5 lie outside valid_min/valid_max.
      assertValues(cdl.var("cover"), readAll(cover), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, x -> x * 0.01);
    }
    try (SourceCube turb = source.open(nc("missing_value"), "turb")) {
      // Turbidity units are not udunits units; kept as declared. Both missing_value values count.
      assertEquals("FNU", turb.descriptor().units());
      assertValues(cdl.var("turb"), readAll(turb), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
      assertEquals("two missing values", turb.descriptor().attributes().get("turb:comment"));
    }
  }

  @Test
  void validRangeIsTestedOnPackedValues() throws Exception {
    Cdl cdl = cdl("valid_range");
    try (SourceCube cube = source.open(nc("valid_range"), "turb")) {
      assertEquals("NTU", cube.descriptor().units());
      // Coordinates recognised by axis Y/X with degree_north/degree_east spellings (CF 4.1, 4.2).
      assertMidpointGrid(cdl, cube.descriptor().grid());
      float[] v = readAll(cube);
      assertValues(cdl.var("turb"), v, 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
      // By hand, CF 2.5.1: packed 50 lies in valid_range 0..1000 although its unpacked value
      // 50 * 0.5 - 100 = -75 is negative; packed 1001 is outside although 400.5 would look fine.
      assertEquals(-75f, v[16], 1e-6f);
      assertTrue(Float.isNaN(v[6]));
      assertTrue(Float.isNaN(v[8]), "packed -5 is below valid_range");
    }
  }

  @Test
  void descendingLatitudeIsFlipped() throws Exception {
    Cdl cdl = cdl("descending_lat");
    try (SourceCube cube = source.open(nc("descending_lat"), "salt")) {
      double[] fileLat = cdl.var("lat").data();
      double[] ascending = {fileLat[2], fileLat[1], fileLat[0]};
      double[][] lat = midpointBounds(ascending);
      double[][] lon = midpointBounds(cdl.var("lon").data());
      assertGrid(lat[0], lat[1], lon[0], lon[1], cube.descriptor().grid());
      assertEquals(43.75, cube.descriptor().grid().latCenter(0), 1e-9);
      // Row y of the cube is file row ny - 1 - y. Units '1e-3' are read by udunits and not in
      // the table, so kept as declared.
      assertEquals("1e-3", cube.descriptor().units());
      assertValues(cdl.var("salt"), readAll(cube), 2, 3, 4, steps(2), (y, ny) -> ny - 1 - y, NO_FLIP, SAME);
      assertEquals("flipped from descending to ascending", cube.descriptor().attributes().get("slackwater.latitude"));
    }
  }

  @Test
  void globalZeroTo360GridIsRotated() throws Exception {
    Cdl cdl = cdl("lon360_global");
    try (SourceCube cube = source.open(nc("lon360_global"), "sst")) {
      LatLonGrid g = cube.descriptor().grid();
      // Centres 45, 135, 225, 315 with midpoint bounds 0..360; 225 and 315 become -135 and -45
      // and lead. Latitude -60 extended by half a spacing reaches -90 exactly.
      double[][] lat = midpointBounds(cdl.var("lat").data());
      assertGrid(lat[0], lat[1], new double[] {-180, -90, 0, 90}, new double[] {-90, 0, 90, 180}, g);
      assertArrayEquals(new double[] {-135, -45, 45, 135},
          new double[] {g.lonCenter(0), g.lonCenter(1), g.lonCenter(2), g.lonCenter(3)}, 1e-9);
      assertValues(cdl.var("sst"), readAll(cube), 1, 3, 4, steps(1), NO_FLIP, (x, nx) -> (x + 2) % nx, SAME);
    }
  }

  @Test
  void westernZeroTo360GridIsShifted() throws Exception {
    Cdl cdl = cdl("lon360_west");
    try (SourceCube cube = source.open(nc("lon360_west"), "sst")) {
      double[] c = cdl.var("lon").data();
      double[] west = new double[c.length];
      for (int i = 0; i < c.length; i++) {
        west[i] = c[i] - 360; // 328.75 E is 31.25 W
      }
      double[][] lon = midpointBounds(west);
      double[][] lat = midpointBounds(cdl.var("lat").data());
      assertGrid(lat[0], lat[1], lon[0], lon[1], cube.descriptor().grid());
      assertEquals(-31.25, cube.descriptor().grid().lonCenter(0), 1e-9);
      assertValues(cdl.var("sst"), readAll(cube), 1, 3, 4, steps(1), NO_FLIP, NO_FLIP, SAME);
    }
  }

  @Test
  void regionalGridAcross180StaysIn0To360() throws Exception {
    Cdl cdl = cdl("lon360_dateline");
    try (SourceCube cube = source.open(nc("lon360_dateline"), "sst")) {
      assertMidpointGrid(cdl, cube.descriptor().grid());
      assertValues(cdl.var("sst"), readAll(cube), 1, 3, 4, steps(1), NO_FLIP, NO_FLIP, SAME);
      assertTrue(cube.descriptor().attributes().get("slackwater.longitude").contains("0..360"));
    }
  }

  @Test
  void explicitBoundsVariables() throws Exception {
    Cdl cdl = cdl("bounds");
    // time_bnds, lat_bnds, lon_bnds are bounds variables (CF 7.1), depth has no time axis.
    assertEquals(List.of("chl"), source.variables(nc("bounds")));
    try (SourceCube cube = source.open(nc("bounds"), "chl")) {
      double[] lb = cdl.var("lat_bnds").data();
      double[] ob = cdl.var("lon_bnds").data();
      assertGrid(new double[] {lb[0], lb[2], lb[4]}, new double[] {lb[1], lb[3], lb[5]},
          new double[] {ob[0], ob[2], ob[4], ob[6]}, new double[] {ob[1], ob[3], ob[5], ob[7]}, cube.descriptor().grid());
      assertValues(cdl.var("chl"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
      // 0.5 and 1.5 days since 2023-07-01: noon of the first two days.
      assertEquals(epoch(LocalDateTime.of(2023, 7, 1, 12, 0)), cube.descriptor().time().epochSecond(0));
      assertEquals(epoch(LocalDateTime.of(2023, 7, 2, 12, 0)), cube.descriptor().time().epochSecond(1));
      assertEquals("time: mean area: mean", cube.descriptor().attributes().get("chl:cell_methods"));
    }
  }

  @Test
  void noleapKeepsItsLabels() throws Exception {
    Cdl cdl = cdl("noleap");
    try (SourceCube cube = source.open(nc("noleap"), "temp")) {
      // CF 4.4.3: 2001 has no 29 February in noleap either; labels 02-27, 02-28, 03-01 are kept
      // on the same real dates (TimeAxis.Alignment.SAME_LABEL).
      assertEquals("noleap", cube.descriptor().time().calendar());
      assertEquals(Alignment.SAME_LABEL, cube.descriptor().time().alignment());
      assertEquals(LocalDate.of(2001, 2, 27), cube.descriptor().time().date(0));
      assertEquals(LocalDate.of(2001, 2, 28), cube.descriptor().time().date(1));
      assertEquals(LocalDate.of(2001, 3, 1), cube.descriptor().time().date(2));
      assertValues(cdl.var("temp"), readAll(cube), 3, 3, 4, steps(3), NO_FLIP, NO_FLIP, SAME);
    }
  }

  @Test
  void day360UsesTheDayOfYearFraction() throws Exception {
    Cdl cdl = cdl("day360");
    try (SourceCube cube = source.open(nc("day360"), "temp")) {
      assertEquals("360_day", cube.descriptor().time().calendar());
      assertEquals(Alignment.DAY_OF_YEAR_FRACTION, cube.descriptor().time().alignment());
      double[] days = cdl.var("time").data();
      for (int t = 0; t < days.length; t++) {
        // 360_day day of year d = value + 1 (reference 2000-01-01); real day of the leap year
        // 2000 by the rule in TimeAxis.Alignment: round((d - 0.5) * 366 / 360 + 0.5).
        int d = (int) days[t] + 1;
        long realDoy = Math.round((d - 0.5) * 366 / 360 + 0.5);
        assertEquals(LocalDate.ofYearDay(2000, (int) realDoy), cube.descriptor().time().date(t), "step " + t);
      }
      // By hand: label 2000-02-30 (d = 60) -> round(60.99) = day 61 = 2000-03-01.
      assertEquals(LocalDate.of(2000, 3, 1), cube.descriptor().time().date(1));
      assertValues(cdl.var("temp"), readAll(cube), 3, 3, 4, steps(3), NO_FLIP, NO_FLIP, SAME);
    }
  }

  @Test
  void allLeapDropsFebruary29OfNonLeapYears() throws Exception {
    Cdl cdl = cdl("all_leap");
    try (SourceCube cube = source.open(nc("all_leap"), "temp")) {
      // CF 4.4.3: 366_day is all_leap; 58, 59, 60 days after 2001-01-01 are 02-28, 02-29, 03-01.
      // 2001-02-29 has no real day and is dropped (TimeAxis.Alignment.SAME_LABEL).
      assertEquals("all_leap", cube.descriptor().time().calendar());
      assertEquals(2, cube.descriptor().time().size());
      assertEquals(LocalDate.of(2001, 2, 28), cube.descriptor().time().date(0));
      assertEquals(LocalDate.of(2001, 3, 1), cube.descriptor().time().date(1));
      assertValues(cdl.var("temp"), readAll(cube), 2, 3, 4, new int[] {0, 2}, NO_FLIP, NO_FLIP, SAME);
      assertTrue(cube.descriptor().attributes().get("slackwater.time").contains("1 step(s)"));
    }
  }

  @Test
  void temperaturesToDegreesCelsius() throws Exception {
    Cdl cdl = cdl("kelvin");
    try (SourceCube cube = source.open(nc("kelvin"), "sst")) {
      assertEquals("degC", cube.descriptor().units());
      assertEquals("K", cube.descriptor().sourceUnits());
      // SI brochure (9th ed., 2.3.4): t/degC = T/K - 273.15.
      assertValues(cdl.var("sst"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, k -> k - 273.15);
      // CF 4.4.1: "hours since 1989-12-31 18:00:00 -6" starts at 1990-01-01 00:00 UTC.
      assertEquals(Instant.parse("1990-01-01T00:00:00Z"), cube.descriptor().time().instant(0));
      assertEquals(Instant.parse("1990-01-02T00:00:00Z"), cube.descriptor().time().instant(1));
    }
    try (SourceCube cube = source.open(nc("kelvin"), "sst_anom")) {
      // A temperature difference of 1 K is 1 degC (SI brochure 2.3.4): no offset for anomalies.
      assertEquals("degC", cube.descriptor().units());
      assertValues(cdl.var("sst_anom"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
    }
    try (SourceCube cube = source.open(nc("kelvin"), "air")) {
      // NIST SP 811 (appendix B.8, from memory): t/degC = (t/degF - 32) / 1.8.
      assertValues(cdl.var("air"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, f -> (f - 32) / 1.8);
      float[] v = readAll(cube);
      assertEquals(-40f, v[5], 1e-5f); // -40 degF = -40 degC
      assertEquals(100f, v[23], 1e-5f); // 212 degF = 100 degC
    }
  }

  @Test
  void waterFluxesToMillimetresPerDay() throws Exception {
    Cdl cdl = cdl("precip");
    try (SourceCube cube = source.open(nc("precip"), "pr")) {
      assertEquals("mm/day", cube.descriptor().units());
      assertEquals("kg m-2 s-1", cube.descriptor().sourceUnits());
      // 1 kg m-2 of fresh water (1000 kg m-3) is a 1 mm layer; 86400 s per day (common practice).
      assertValues(cdl.var("pr"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, x -> x * 86_400);
      assertEquals("proleptic_gregorian", cube.descriptor().time().calendar());
    }
    try (SourceCube cube = source.open(nc("precip"), "rain")) {
      assertEquals("mm/day", cube.descriptor().units());
      assertValues(cdl.var("rain"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, x -> x * 24);
    }
    try (SourceCube cube = source.open(nc("precip"), "flow")) {
      // A speed without a precipitation name is not a water flux: kept as declared.
      assertEquals("m s-1", cube.descriptor().units());
      assertValues(cdl.var("flow"), readAll(cube), 2, 3, 4, steps(2), NO_FLIP, NO_FLIP, SAME);
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {"packed:temp", "lon360_global:sst", "descending_lat:salt", "all_leap:temp"})
  void everySubBlockMatchesTheWholeRead(String fileAndVariable) throws Exception {
    String[] fv = fileAndVariable.split(":");
    try (SourceCube cube = source.open(nc(fv[0]), fv[1])) {
      float[] all = readAll(cube);
      int nt = cube.descriptor().time().size();
      int ny = cube.descriptor().grid().ny();
      int nx = cube.descriptor().grid().nx();
      for (int t0 = 0; t0 < nt; t0++) {
        for (int kt = 1; t0 + kt <= nt; kt++) {
          for (int y0 = 0; y0 < ny; y0++) {
            for (int ky = 1; y0 + ky <= ny; ky++) {
              for (int x0 = 0; x0 < nx; x0++) {
                for (int kx = 1; x0 + kx <= nx; kx++) {
                  float[] block = new float[kt * ky * kx + 3];
                  cube.read(t0, kt, y0, ky, x0, kx, block);
                  for (int t = 0; t < kt; t++) {
                    for (int y = 0; y < ky; y++) {
                      for (int x = 0; x < kx; x++) {
                        float want = all[((t0 + t) * ny + y0 + y) * nx + x0 + x];
                        float got = block[(t * ky + y) * kx + x];
                        assertEquals(Float.floatToIntBits(want), Float.floatToIntBits(got),
                            fileAndVariable + " block " + t0 + "," + kt + "," + y0 + "," + ky + "," + x0 + "," + kx);
                      }
                    }
                  }
                }
              }
            }
          }
        }
      }
    }
  }

  @Test
  void registeredAsAService() {
    boolean found = false;
    for (CubeSource s : ServiceLoader.load(CubeSource.class)) {
      found |= s instanceof NetCdfCubeSource && s.name().equals("netcdf");
    }
    assertTrue(found, "META-INF/services/org.slackwater.core.spi.CubeSource lists NetCdfCubeSource");
  }

  @Test
  void closeIsIdempotentAndReadAfterCloseFails() throws SourceException {
    SourceCube cube = source.open(nc("noleap"), "temp");
    cube.close();
    cube.close();
    org.junit.jupiter.api.Assertions.assertThrows(IllegalStateException.class,
        () -> cube.read(0, 1, 0, 1, 0, 1, new float[1]));
  }
}
