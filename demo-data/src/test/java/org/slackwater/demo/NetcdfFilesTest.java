package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import ucar.ma2.Array;
import ucar.ma2.DataType;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;

/** The six files re-opened with NetCDF-Java and checked against CF-1.8 and the brief. */
class NetcdfFilesTest {

  /** Standard names as listed in the CF Standard Name Table (cfconventions.org). */
  private static final Map<String, String> STANDARD_NAMES = Map.of(
      "rainfall", "precipitation_flux",
      "runoff", "runoff_flux",
      "water_temperature", "sea_water_temperature",
      "cloud_fraction", "cloud_area_fraction",
      "turbidity", "sea_water_turbidity",
      "chlorophyll", "mass_concentration_of_chlorophyll_a_in_sea_water");

  private static final Map<String, String> UNITS = Map.of(
      "rainfall", "kg m-2 s-1", "runoff", "mm d-1", "water_temperature", "K", "cloud_fraction", "1",
      "turbidity", "FNU", "chlorophyll", "mg m-3");

  @ParameterizedTest
  @ValueSource(strings = {"rainfall", "runoff", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll"})
  void headerFollowsCf(String name) throws IOException {
    Path file = SmallScenario.file(name + ".nc");
    try (InputStream in = Files.newInputStream(file)) {
      // NetCDF classic format specification: files start with 'C' 'D' 'F' and version byte 1.
      assertArrayEquals(new byte[] {'C', 'D', 'F', 1}, in.readNBytes(4), name + " is not NetCDF-3 classic");
    }
    try (NetcdfFile nc = NcFile.raw(file)) {
      assertEquals("CF-1.8", text(nc.findGlobalAttribute("Conventions")));
      assertEquals("Slackwater demo generator (invented data)", text(nc.findGlobalAttribute("source")));
      assertEquals("Invented data for the fictional Wrenmouth estuary; not a real place.",
          text(nc.findGlobalAttribute("comment")));
      assertFalse(text(nc.findGlobalAttribute("title")).isBlank());
      String history = text(nc.findGlobalAttribute("history"));
      assertFalse(history.matches(".*\\d{4}-\\d{2}-\\d{2}.*|.*\\d{1,2}:\\d{2}.*"), "history has a timestamp: " + history);

      Variable v = nc.findVariable(name);
      assertNotNull(v, "data variable " + name);
      assertEquals(List.of("time", "lat", "lon"), v.getDimensions().stream().map(d -> d.getShortName()).toList());
      assertEquals(STANDARD_NAMES.get(name), text(v.findAttribute("standard_name")));
      assertEquals(UNITS.get(name), text(v.findAttribute("units")));
      assertNotNull(text(v.findAttribute("long_name")));
      assertNotNull(v.findAttribute("_FillValue"));
      assertEquals("time: mean", text(v.findAttribute("cell_methods")));

      String[][] axes = {{"time", "time", "T"}, {"lat", "latitude", "Y"}, {"lon", "longitude", "X"}};
      for (String[] axis : axes) {
        Variable c = nc.findVariable(axis[0]);
        assertEquals(1, c.getRank(), axis[0] + " is a coordinate variable");
        assertEquals(axis[1], text(c.findAttribute("standard_name")));
        assertEquals(axis[2], text(c.findAttribute("axis")));
        assertNotNull(text(c.findAttribute("units")));
        Variable b = nc.findVariable(text(c.findAttribute("bounds")));
        assertNotNull(b, "bounds of " + axis[0]);
        assertArrayEquals(new int[] {c.getShape(0), 2}, b.getShape());
        assertContiguous(b.read(), axis[0] + " in " + name);
      }
      assertNotNull(text(nc.findVariable("time").findAttribute("calendar")));
    }
  }

  /** CF 7.1: adjacent cells share their bound exactly, and each cell's bounds enclose its coordinate. */
  private static void assertContiguous(Array bounds, String what) {
    int n = bounds.getShape()[0];
    for (int i = 0; i + 1 < n; i++) {
      assertEquals(bounds.getDouble(2 * i + 1), bounds.getDouble(2 * (i + 1)), 1e-9, "bounds of " + what);
    }
  }

  private static String text(Attribute a) {
    return NcFile.text(a);
  }

  @Test
  void dailyAxesCoverTheYearsAndDecodeWithNetcdfJava() throws IOException {
    for (String name : List.of("rainfall", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll")) {
      NcFile f = new NcFile(SmallScenario.file(name + ".nc"), name);
      assertEquals(LocalDate.of(2013, 1, 1), f.dates[0], name);
      assertEquals(LocalDate.of(2014, 12, 31), f.dates[f.dates.length - 1], name);
      for (int i = 1; i < f.dates.length; i++) {
        assertEquals(f.dates[i - 1].plusDays(1), f.dates[i], name + " is daily without gaps");
      }
    }
  }

  @Test
  void chlorophyllTimesAreAtNoonInHours() throws IOException {
    try (NetcdfFile nc = NcFile.raw(SmallScenario.file("chlorophyll.nc"))) {
      assertEquals("hours since 2006-01-01 12:00:00", text(nc.findVariable("time").findAttribute("units")));
      // 2013-01-01 noon is 2557 days after 2006-01-01 noon (7 years, 2008 and 2012 leap): 61368 h.
      assertEquals(24.0 * (7 * 365 + 2), nc.findVariable("time").read().getDouble(0), 0);
    }
    NcFile f = new NcFile(SmallScenario.file("chlorophyll.nc"), "chlorophyll");
    for (int h : f.hours) {
      assertEquals(12, h);
    }
  }

  @Test
  void waterTemperatureLatitudeDescends() throws IOException {
    try (NetcdfFile nc = NcFile.raw(SmallScenario.file("water_temperature.nc"))) {
      double[] lat = (double[]) nc.findVariable("lat").read().get1DJavaArray(double.class);
      Array b = nc.findVariable("lat_bnds").read();
      for (int i = 1; i < lat.length; i++) {
        assertTrue(lat[i] < lat[i - 1], "latitude descends");
      }
      assertTrue(b.getDouble(0) > b.getDouble(1), "bounds ordered like the descending coordinate");
    }
  }

  @Test
  void cloudFractionUsesZeroTo360LongitudesAndStaysInRange() throws IOException {
    NcFile f = new NcFile(SmallScenario.file("cloud_fraction.nc"), "cloud_fraction");
    for (double lon : f.lon) {
      assertTrue(lon > 180 && lon < 360, "longitude " + lon + " in 0-360 convention west of Greenwich");
    }
    for (double[][] day : f.values) {
      for (double[] row : day) {
        for (double v : row) {
          assertTrue(v >= 0 && v <= 1, "cloud fraction " + v);
        }
      }
    }
  }

  @Test
  void turbidityIsPackedInt16AndUnpacksWithNetcdfJava() throws IOException {
    double[][][] unpacked = new NcFile(SmallScenario.file("turbidity.nc"), "turbidity").values;
    try (NetcdfFile nc = NcFile.raw(SmallScenario.file("turbidity.nc"))) {
      Variable v = nc.findVariable("turbidity");
      assertEquals(DataType.SHORT, v.getDataType());
      assertEquals(DataType.FLOAT, v.findAttribute("scale_factor").getDataType());
      assertEquals(0.01f, v.findAttribute("scale_factor").getNumericValue().floatValue());
      assertEquals(0.0, v.findAttribute("add_offset").getNumericValue().doubleValue());
      assertEquals(DataType.SHORT, v.findAttribute("_FillValue").getDataType());
      assertEquals(-32768, v.findAttribute("_FillValue").getNumericValue().intValue());
      Array raw = v.read();
      int[] shape = raw.getShape();
      ucar.ma2.Index idx = raw.getIndex();
      int fills = 0;
      int seen = 0;
      for (int t = 0; t < shape[0]; t += 17) {
        for (int i = 0; i < shape[1]; i++) {
          for (int j = 0; j < shape[2]; j++) {
            short s = raw.getShort(idx.set(t, i, j));
            if (s == -32768) {
              fills++;
              assertTrue(Double.isNaN(unpacked[t][i][j]), "fill must read as missing");
            } else {
              seen++;
              // CF 8.1: unpacked = packed * scale_factor + add_offset.
              assertEquals(s * 0.01f, unpacked[t][i][j], 1e-6);
            }
          }
        }
      }
      assertTrue(fills > 0 && seen > 0, "both land/gap fills and values are present");
    }
  }

  @Test
  void runoffUsesNoleapCalendarWith365DaysPerYear(@TempDir Path dir) throws IOException {
    // 2016 is a leap year: the standard files carry 731 days, the noleap runoff 2 x 365.
    DemoScenario.generate(dir, new DemoOptions(2015, 2016, 4, DemoOptions.DEFAULT_SEED));
    NcFile runoff = new NcFile(dir.resolve("runoff.nc"), "runoff");
    NcFile rain = new NcFile(dir.resolve("rainfall.nc"), "rainfall");
    assertEquals(365 * 2, runoff.dates.length);
    assertEquals(731, rain.dates.length);
    try (NetcdfFile nc = NcFile.raw(dir.resolve("runoff.nc"))) {
      Variable t = nc.findVariable("time");
      assertEquals("noleap", text(t.findAttribute("calendar")));
      // 9 noleap years of 365 days from 2006-01-01 to 2015-01-01.
      assertEquals(9 * 365.0, t.read().getDouble(0), 0);
      assertEquals(9 * 365.0 + 729, t.read().getDouble(729), 0);
    }
    for (int i = 0; i < runoff.dates.length; i++) {
      assertFalse(runoff.dates[i].getMonthValue() == 2 && runoff.dates[i].getDayOfMonth() == 29);
    }
    assertEquals(LocalDate.of(2016, 3, 1), runoff.dates[365 + 59], "1 March follows 28 February in 2016");
    assertEquals(LocalDate.of(2016, 12, 31), runoff.dates[729]);
  }

  @Test
  void waterVariablesAreFillOnLandAndOnlyThere() throws IOException {
    RegionsFile regions = new RegionsFile(SmallScenario.get().regions());
    org.locationtech.jts.geom.Geometry union = regions.water();
    for (String name : List.of("water_temperature", "turbidity", "chlorophyll")) {
      NcFile f = new NcFile(SmallScenario.file(name + ".nc"), name);
      int water = 0;
      for (int i = 0; i < f.lat.length; i++) {
        for (int j = 0; j < f.lon.length; j++) {
          boolean any = false;
          for (double[][] day : f.values) {
            any |= !Double.isNaN(day[i][j]);
          }
          boolean isWater = union.covers(regions.point(f.lon180(j), f.lat[i]));
          assertEquals(isWater, any, name + " cell (" + f.lat[i] + ", " + f.lon[j] + ")");
          water += isWater ? 1 : 0;
        }
      }
      assertTrue(water > 0, name + " has water cells");
    }
  }
}
