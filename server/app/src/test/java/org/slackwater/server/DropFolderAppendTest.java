package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.slackwater.server.DropFolderFiles.assertSameDays;
import static org.slackwater.server.DropFolderFiles.days;
import static org.slackwater.server.DropFolderFiles.nc;
import static org.slackwater.server.DropFolderFiles.snapshot;
import static org.slackwater.server.DropFolderFiles.stored;

import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestOptions;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.ingest.StepGap;
import org.slackwater.core.store.ChunkLayout;

/**
 * Cubes growing with daily CF-NetCDF files written by the netCDF C library's ncgen (the drop
 * folder's files, through the Java API): the expected values are the CDL's numbers as ncgen
 * stored them. Chunks of 4 steps x 2 rows x 2 columns, so appends cross chunk boundaries.
 */
class DropFolderAppendTest {
  private static final String FIRST = "wrenmouth_temp_20240101_20240110";
  private static final String NEXT = "wrenmouth_temp_20240111_20240115";
  private static final String V2 = "wrenmouth_temp_20240103_20240105_v2";

  @TempDir Path dir;
  private Workspace ws;

  @BeforeEach
  void open() throws Exception {
    ws = Workspace.open(dir.resolve("data"), 256L << 20, 16L << 20, new ChunkLayout(4, 2, 2));
  }

  @AfterEach
  void close() {
    ws.close();
  }

  private IngestReport ingest(String name, IngestOptions o) throws Exception {
    List<IngestReport> r = ws.ingestor().ingest(nc(name), o);
    assertEquals(1, r.size());
    return r.get(0);
  }

  private static Map<LocalDate, float[]> merged(Map<LocalDate, float[]> base, Map<LocalDate, float[]> over) {
    Map<LocalDate, float[]> m = new TreeMap<>(base);
    m.putAll(over);
    return m;
  }

  @Test
  void aTenDayFileThenAFiveDayContinuationHoldFifteenDaysOfBoth() throws Exception {
    assertEquals(IngestReport.Change.CREATED, ingest(FIRST, IngestOptions.defaults()).change());
    IngestReport r = ingest(NEXT, IngestOptions.defaults());
    assertEquals(IngestReport.Change.APPENDED, r.change());
    assertEquals("cube water_temp: appended 5 steps, 2024-01-11..2024-01-15 (version 1 -> 2, 15 steps)", r.summary());
    Map<LocalDate, float[]> want = merged(days(FIRST, "water_temp"), days(NEXT, "water_temp"));
    assertEquals(15, want.size());
    assertSameDays(want, stored(ws, "water_temp"), 0f);
    // The land cell (row 2, column 3) never holds a value, so it stays out of the footprint.
    assertEquals(11, ws.catalog().cube("water_temp").orElseThrow().footprint().count());
    assertEquals(List.of("wrenmouth_temp_20240101_20240110.nc", "wrenmouth_temp_20240111_20240115.nc"),
        ws.catalog().history("water_temp").stream().map(h -> h.provenance().sourceFile()).toList());
  }

  @Test
  void aReprocessedFileReplacesDaysThreeToFiveAndTheNewValuesReadBack() throws Exception {
    ingest(FIRST, IngestOptions.defaults());
    ingest(NEXT, IngestOptions.defaults());
    DropFolderFiles.Snapshot before = snapshot(ws);
    IngestException e = assertThrows(IngestException.class, () -> ingest(V2, IngestOptions.defaults()));
    LocalDate jan3 = LocalDate.of(2024, 1, 3);
    assertTrue(e.getMessage().startsWith("file wrenmouth_temp_20240103_20240105_v2.nc, variable water_temp: 3 of the 3 step(s)"
        + " it shares with cube 'water_temp' hold different values (2024-01-03, 2024-01-04, 2024-01-05; first difference at"
        + " 2024-01-03, row 0 column 0 (latitude 43.7500, longitude -31.2500): cube " + days(FIRST, "water_temp").get(jan3)[0]
        + ", file " + days(V2, "water_temp").get(jan3)[0] + "). Nothing was changed. If the file is a reprocessed version"),
        e.getMessage());
    assertEquals(before, snapshot(ws));

    IngestReport r = ingest(V2, IngestOptions.defaults().asReprocessed());
    assertEquals(IngestReport.Change.REPROCESSED, r.change());
    assertEquals(List.of(2, 3), List.of(r.previousVersion(), r.version()));
    assertEquals("2024-01-03..2024-01-05", r.replaced().get().firstDate() + ".." + r.replaced().get().lastDate());
    assertSameDays(merged(merged(days(FIRST, "water_temp"), days(NEXT, "water_temp")), days(V2, "water_temp")),
        stored(ws, "water_temp"), 0f);
  }

  @Test
  void anotherGridUnitOrCalendarIsRefusedAndChangesNeitherCatalogNorFiles() throws Exception {
    ingest(FIRST, IngestOptions.defaults());
    ingest("wrenmouth_chl_20240101_20240102", IngestOptions.defaults());
    DropFolderFiles.Snapshot before = snapshot(ws);
    Map<String, String> refusals = Map.of(
        "wrenmouth_temp_20240116_shifted_grid", "file wrenmouth_temp_20240116_shifted_grid.nc, variable water_temp: its grid does"
            + " not match cube 'water_temp': column 0 spans longitudes -31.375..-31.125 in the cube but -31.625..-31.375 in the file.",
        "wrenmouth_chl_20240103_areal", "file wrenmouth_chl_20240103_areal.nc, variable chl: its values are in 'mg m-2' (declared"
            + " 'mg m-2') but cube 'chl' holds 'mg m-3', which is not the same quantity.",
        "wrenmouth_temp_20240116_noleap", "file wrenmouth_temp_20240116_noleap.nc, variable water_temp: its time axis uses the"
            + " calendar 'noleap' but cube 'water_temp' uses 'standard'; steps of different calendars cannot share one axis.");
    for (Map.Entry<String, String> c : refusals.entrySet()) {
      IngestException e = assertThrows(IngestException.class, () -> ingest(c.getKey(), IngestOptions.defaults()));
      assertTrue(e.getMessage().startsWith(c.getValue() + " Nothing was changed. Regrid the file onto the cube's grid and units,"), e.getMessage());
      assertEquals(before, snapshot(ws), c.getKey());
    }
  }

  @Test
  void aFileInKelvinAddsToTheCubeInDegreesCelsiusAndTheGapBeforeItIsReported() throws Exception {
    ingest(FIRST, IngestOptions.defaults());
    IngestReport r = ingest("wrenmouth_temp_20240116_kelvin", IngestOptions.defaults());
    assertEquals(IngestReport.Change.APPENDED, r.change());
    assertEquals(List.of(new StepGap(Instant.parse("2024-01-10T00:00:00Z"), Instant.parse("2024-01-16T00:00:00Z"), 5)), r.gaps());
    Map<LocalDate, float[]> want = new TreeMap<>(days(FIRST, "water_temp"));
    for (Map.Entry<LocalDate, float[]> e : days("wrenmouth_temp_20240116_kelvin", "water_temp").entrySet()) {
      float[] c = new float[e.getValue().length];
      for (int i = 0; i < c.length; i++) {
        c[i] = (float) (e.getValue()[i] - 273.15); // t/degC = T/K - 273.15 (SI Brochure, 9th ed., 2.3.1)
      }
      want.put(e.getKey(), c);
    }
    // float32 kelvin carries about 3e-5 K of rounding near 283 K (a 24-bit significand).
    assertSameDays(want, stored(ws, "water_temp"), 5e-5f);
  }

  @Test
  void theSameFileTwiceIsANoOp() throws Exception {
    ingest(FIRST, IngestOptions.defaults());
    DropFolderFiles.Snapshot before = snapshot(ws);
    IngestReport again = ingest(FIRST, IngestOptions.defaults());
    assertEquals(IngestReport.Change.UNCHANGED, again.change());
    assertTrue(again.summary().startsWith("cube water_temp: unchanged (version 1): already ingested: version 1 of cube 'water_temp'"
        + " came from wrenmouth_temp_20240101_20240110.nc (the same SHA-256) at "), again.summary());
    assertEquals(before, snapshot(ws));
  }
}
