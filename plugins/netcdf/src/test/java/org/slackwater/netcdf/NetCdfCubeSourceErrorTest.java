package org.slackwater.netcdf;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.slackwater.netcdf.ReferenceFiles.nc;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/** Bad input: each failure is a SourceException naming file, variable, problem and fix. */
class NetCdfCubeSourceErrorTest {

  private final NetCdfCubeSource source = new NetCdfCubeSource();

  private SourceException openFails(Path file, String variable) {
    return assertThrows(SourceException.class, () -> source.open(file, variable).close());
  }

  @Test
  void acceptsTheFourNetCdfMagicNumbers(@TempDir Path dir) throws IOException {
    // NetCDF format signatures: CDF\001 classic, CDF\002 64-bit offset, CDF\005 CDF-5 (netCDF
    // file format specification), \211HDF for NetCDF-4/HDF5 (HDF5 format specification).
    assertTrue(source.accepts(nc("packed")));
    assertTrue(source.accepts(nc("packed_nc4")));
    for (byte[] magic : new byte[][] {{'C', 'D', 'F', 1}, {'C', 'D', 'F', 2}, {'C', 'D', 'F', 5}, {(byte) 0x89, 'H', 'D', 'F'}}) {
      Path f = Files.write(dir.resolve("m" + magic[3] + ".bin"), Arrays.copyOf(magic, 16));
      assertTrue(source.accepts(f), Arrays.toString(magic));
    }
    assertFalse(source.accepts(Files.write(dir.resolve("cdf3.bin"), new byte[] {'C', 'D', 'F', 3, 0, 0})));
    assertFalse(source.accepts(Files.writeString(dir.resolve("notes.txt"), "Wrenmouth tide table")));
    assertFalse(source.accepts(Files.write(dir.resolve("empty.nc"), new byte[0])));
    assertFalse(source.accepts(dir.resolve("absent.nc")));
  }

  @Test
  void notANetCdfFile(@TempDir Path dir) throws IOException {
    Path csv = Files.writeString(dir.resolve("harle_flow.nc"), "date,flow\n2020-01-01,12.5\n");
    SourceException e = openFails(csv, "flow");
    assertEquals("file " + csv.getFileName() + ": not a NetCDF file (it starts with 'date', not 'CDF' or '\\211HDF'); give a"
        + " NetCDF-3 or NetCDF-4 file", e.getMessage());
    assertThrows(SourceException.class, () -> source.variables(csv));
  }

  @Test
  void missingFile(@TempDir Path dir) {
    Path absent = dir.resolve("absent.nc");
    SourceException e = openFails(absent, "temp");
    assertEquals("file " + absent.getFileName() + ": does not exist or is not a regular file; check the path", e.getMessage());
  }

  @ParameterizedTest
  @ValueSource(ints = {30, 600, 1000, 1080})
  void truncatedClassicFile(int keep, @TempDir Path dir) throws IOException {
    byte[] whole = Files.readAllBytes(nc("packed"));
    Path cut = Files.write(dir.resolve("packed_cut.nc"), Arrays.copyOf(whole, keep));
    SourceException e = openFails(cut, "temp");
    assertTrue(e.getMessage().startsWith("file " + cut.getFileName() + ": cannot be read as NetCDF ("), e.getMessage());
    assertTrue(e.getMessage().endsWith("the file may be truncated or corrupt; write it again or fetch a fresh copy"),
        e.getMessage());
    assertThrows(SourceException.class, () -> source.variables(cut));
  }

  @Test
  void aClassicFileCutShortWhileOpenIsAClearErrorNotAHang(@TempDir Path dir) throws Exception {
    // The classic reader copies a block's raw bytes until it has them all; a file that shrank after
    // it was opened must fail with the usual message instead of waiting for bytes that never come.
    Path copy = Files.copy(nc("packed"), dir.resolve("packed.nc"));
    try (SourceCube cube = source.open(copy, "temp")) {
      try (FileChannel ch = FileChannel.open(copy, StandardOpenOption.WRITE)) {
        ch.truncate(Files.size(copy) / 2);
      }
      SourceException e = assertTimeoutPreemptively(Duration.ofSeconds(30),
          () -> assertThrows(SourceException.class, () -> ReferenceFiles.readAll(cube)));
      assertTrue(e.getMessage().startsWith("file " + copy.getFileName() + ", variable temp: reading time steps 0..2 failed"), e.getMessage());
      assertTrue(e.getMessage().contains("shrank"), e.getMessage());
      assertTrue(e.getMessage().endsWith("the file may be truncated or corrupt; write it again or fetch a fresh copy"),
          e.getMessage());
    }
  }

  @Test
  void truncatedNetCdf4File(@TempDir Path dir) throws IOException {
    byte[] whole = Files.readAllBytes(nc("packed_nc4"));
    Path cut = Files.write(dir.resolve("packed4_cut.nc"), Arrays.copyOf(whole, whole.length - 2000));
    SourceException e = openFails(cut, "temp");
    assertTrue(e.getMessage().contains("truncated or corrupt"), e.getMessage());
  }

  @Test
  void variableNotFoundListsTheAvailableOnes() {
    SourceException e = openFails(nc("missing_value"), "oxygen");
    assertEquals("file " + nc("missing_value").getFileName() + ", variable oxygen: no such variable; the file holds these gridded"
        + " variables: chl, cover, turb", e.getMessage());
  }

  @Test
  void noTimeAxis() {
    SourceException e = openFails(nc("no_time"), "depth");
    assertEquals("file " + nc("no_time").getFileName() + ", variable depth: no time axis: none of its dimensions (lat, lon) has a time"
        + " coordinate variable; add one with units such as 'days since 2000-01-01' (CF 4.4)", e.getMessage());
    SourceException list = assertThrows(SourceException.class, () -> source.variables(nc("no_time")));
    assertTrue(list.getMessage().contains("holds no variable that can be read as a cube (a grid on 1-D latitude and longitude with a time axis) ('depth': no time axis"),
        list.getMessage());
  }

  @Test
  void unknownCalendar() {
    SourceException e = openFails(nc("unknown_calendar"), "temp");
    assertEquals("file " + nc("unknown_calendar").getFileName() + ", variable temp: time variable 'time': calendar 'tidal_lunar' is not"
        + " a CF calendar; use one of standard, proleptic_gregorian, julian, noleap, all_leap, 360_day, gregorian,"
        + " 365_day, 366_day (CF section 4.4.3)", e.getMessage());
  }

  @Test
  void timeInMonthsIsRefused() {
    SourceException e = openFails(nc("bad_time_units"), "temp");
    assertTrue(e.getMessage().startsWith("file " + nc("bad_time_units").getFileName() + ", variable temp: time variable 'time': time"
        + " units 'months since 2010-01-01' use 'months', which is not a calendar unit"), e.getMessage());
  }

  @Test
  void unitsUdunitsCannotRead() {
    SourceException e = openFails(nc("bad_units"), "zz_var");
    assertEquals("file " + nc("bad_units").getFileName() + ", variable zz_var: units 'zz' are not understood; write a udunits string"
        + " such as 'K' or 'mg m-3'", e.getMessage());
  }

  @Test
  void unitsThatDoNotFitTheStandardName() {
    SourceException e = openFails(nc("bad_units"), "temp_mg");
    assertEquals("file " + nc("bad_units").getFileName() + ", variable temp_mg: units 'mg m-3' do not fit standard_name"
        + " 'sea_water_temperature', which needs a temperature such as 'K' or 'degC'; correct the units or the"
        + " standard_name", e.getMessage());
  }

  @Test
  void curvilinearGrid() {
    SourceException e = openFails(nc("curvilinear"), "temp");
    assertEquals("file " + nc("curvilinear").getFileName() + ", variable temp: curvilinear grids are not supported yet; regrid to a"
        + " regular lat/lon grid first (its coordinates 'lat', 'lon' are 2-D)", e.getMessage());
    SourceException list = assertThrows(SourceException.class, () -> source.variables(nc("curvilinear")));
    assertEquals("file " + nc("curvilinear").getFileName() + ": holds no variable that can be read as a cube (a grid on 1-D latitude and longitude with a time axis) ('temp': curvilinear grids"
        + " are not supported yet; regrid to a regular lat/lon grid first (its coordinates 'lat', 'lon' are 2-D))",
        list.getMessage());
  }

  @Test
  void wrongDimensionOrder() {
    SourceException e = openFails(nc("dim_order"), "temp");
    assertEquals("file " + nc("dim_order").getFileName() + ", variable temp: its dimensions are (time, lon, lat); only the order"
        + " (time, latitude, longitude) is supported, here (time, lat, lon); rewrite the variable with its dimensions"
        + " in that order", e.getMessage());
  }

  @Test
  void coordinateVariablesAreNotCubes() {
    SourceException e = openFails(nc("bounds"), "lat_bnds");
    assertTrue(e.getMessage().endsWith("variable lat_bnds: it is a bounds variable (CF 7.1)"), e.getMessage());
    SourceException c = openFails(nc("bounds"), "time");
    assertTrue(c.getMessage().endsWith("variable time: it is a coordinate variable"), c.getMessage());
  }

  @Test
  void blockOutsideTheCubeIsAProgrammingError() throws SourceException {
    try (var cube = source.open(nc("noleap"), "temp")) {
      assertThrows(IndexOutOfBoundsException.class, () -> cube.read(2, 2, 0, 1, 0, 1, new float[2]));
      assertThrows(IndexOutOfBoundsException.class, () -> cube.read(0, 1, 0, 3, 0, 4, new float[11]));
    }
  }
}
