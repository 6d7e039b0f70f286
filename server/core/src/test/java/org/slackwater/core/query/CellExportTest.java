package org.slackwater.core.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Optional;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.DateDayVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowStreamReader;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.ingest.FakeSource;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.region.Region;
import org.slackwater.core.region.RegionWeights;
import org.slackwater.core.result.ArrowResultWriter;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.CsvWriter;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.result.TableStream;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.query.QueryException;

/**
 * {@code cells of ...}: every row against the source's own values (FakeSource.value, read back
 * through the store's chunks of 40 days x 4 x 4 cells, so rows cross tiles and time chunks), in
 * the documented order; long exports in several batches, read back with Arrow's own stream reader;
 * the errors of requests that cannot be streamed or held.
 */
class CellExportTest {
  @TempDir
  Path dir;
  private Workspace ws;
  private Region box;

  @BeforeEach
  void setUp() throws Exception {
    ws = Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, new ChunkLayout(40, 4, 4));
    ws.ingestor().ingest(FakeSource.write(dir.resolve("t.fake"), "temp", 9, 7, 120, 0), Optional.empty());
    box = GeoJsonRegions.parseNamed("Test Box", """
        {"type":"Polygon","coordinates":[[[-31.93,43.56],[-31.41,43.61],[-31.48,44.27],[-31.87,44.2],[-31.93,43.56]]]}""");
    ws.catalog().putRegion(box);
  }

  @AfterEach
  void tearDown() {
    ws.close();
  }

  @Test
  void everyRowIsTheCubesValueOfItsCellAndDay() throws IOException {
    String q = "cells of temp over \"test box\" from 2014-02-01 to 2014-03-31";
    CellWeights w = RegionWeights.compute(FakeSource.grid(9, 7), box.geometry());
    LatLonGrid g = FakeSource.grid(9, 7);
    QueryEngine.Answer answer = ws.engine().open(q);
    TableStream stream = ((QueryEngine.Answer.Rows) answer).stream();
    ResultTable all = TableStream.collect(stream);
    int days = 59; // 2014-02-01 .. 2014-03-31
    assertEquals((long) days * w.size(), all.rowCount());
    assertEquals(Long.toString((long) days * w.size()), all.metadata().get("rows"));
    assertEquals("cells", all.metadata().get(ResultKind.KEY));
    Column.Dates time = (Column.Dates) all.column("time");
    Column.Longs row = (Column.Longs) all.column("row"), col = (Column.Longs) all.column("column");
    Column.Doubles value = (Column.Doubles) all.column("temp"), lat = (Column.Doubles) all.column("lat");
    Column.Doubles lon = (Column.Doubles) all.column("lon"), fraction = (Column.Doubles) all.column("fraction_inside");
    assertEquals("degC", value.unit());
    int r = 0, missing = 0;
    for (int d = 0; d < days; d++) {
      int t = 31 + d; // the cube starts on 2014-01-01
      for (int i = 0; i < w.size(); i++, r++) {
        assertEquals(LocalDate.of(2014, 2, 1).plusDays(d), time.get(r));
        assertEquals(w.row(i), row.get(r));
        assertEquals(w.column(i), col.get(r));
        assertEquals(g.latCenter(w.row(i)), lat.get(r), 0.0);
        assertEquals(g.lonCenter(w.column(i)), lon.get(r), 0.0);
        assertEquals(w.fraction(i), fraction.get(r), 0.0);
        float expected = FakeSource.value(t, w.row(i), w.column(i));
        if (Float.isNaN(expected)) {
          assertTrue(Double.isNaN(value.get(r)), "row " + r);
          missing++;
        } else {
          assertEquals(expected, value.get(r), 0.0, "row " + r);
        }
        if (i > 0) {
          // The documented order within a step: grid rows, then columns.
          assertTrue(w.index(i) > w.index(i - 1));
        }
      }
    }
    assertTrue(missing > 0, "FakeSource leaves every 7th cell-step empty: the export lists them as empty");
  }

  @Test
  void smallWindowsGiveTheSameRowsAsOne() throws IOException {
    // Windows of 1, 7 and 40 steps cut across the store's 40-day time chunks and 4 x 4 tiles.
    String q = "cells of temp over \"test box\" from 2014-01-03 to 2014-04-20 in degF";
    CellExportStatement.Plan plan = (CellExportStatement.Plan) ws.engine().analyze(q).get(0);
    int m = plan.weights().size();
    ResultTable whole = TableStream.collect(((QueryEngine.Answer.Rows) ws.engine().open(q)).stream());
    for (int steps : new int[] {1, 7, 40}) {
      ResultTable windowed = TableStream.collect(CellExportStatement.open(plan, new org.slackwater.core.analytics.ChunkCache(ws.store(), 64L << 20), q, steps * m));
      assertEquals(whole.rowCount(), windowed.rowCount());
      Column.Doubles a = (Column.Doubles) whole.column("temp"), b = (Column.Doubles) windowed.column("temp");
      Column.Dates ta = (Column.Dates) whole.column("time"), tb = (Column.Dates) windowed.column("time");
      for (int r = 0; r < whole.rowCount(); r++) {
        assertEquals(ta.get(r), tb.get(r), "window of " + steps + " steps, row " + r);
        assertEquals(Double.doubleToLongBits(a.get(r)), Double.doubleToLongBits(b.get(r)), "window of " + steps + " steps, row " + r);
      }
    }
  }

  @Test
  void theWindowShrinksWithTheHeap() {
    assertEquals(CellExportStatement.WINDOW_VALUES, CellExportStatement.windowValues(8L << 30));
    assertEquals(2 << 20, CellExportStatement.windowValues(128L << 20)); // 128 MB / 16 / 4 bytes
    assertEquals(1, CellExportStatement.windowValues(0));
  }

  @Test
  void unitsAreConvertedValueByValue() {
    ResultTable c = ws.engine().run("cells of temp over \"test box\" during 2014-01-05").get(0);
    ResultTable f = ws.engine().run("cells of temp over \"test box\" during 2014-01-05 in degF").get(0);
    Column.Doubles vc = (Column.Doubles) c.column("temp"), vf = (Column.Doubles) f.column("temp");
    assertEquals("degF", vf.unit());
    for (int r = 0; r < c.rowCount(); r++) {
      // NIST SP 811 (2008), B.8: t/°F = 1.8 t/°C + 32.
      assertEquals(Double.isNaN(vc.get(r)) ? Double.NaN : 1.8 * vc.get(r) + 32, vf.get(r), 1e-9, "row " + r);
    }
  }

  @Test
  void longExportComesInBatchesThatArrowsReaderReadsBack() throws Exception {
    ws.ingestor().ingest(FakeSource.write(dir.resolve("big.fake"), "big", 40, 45, 100, 0), Optional.empty());
    String q = "cells of big over box(43.5, -32, 47.5, -27.5) from 2014-01-01 to 2014-04-10";
    TableStream stream = ((QueryEngine.Answer.Rows) ws.engine().open(q)).stream();
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try (BufferAllocator a = new RootAllocator(64L << 20)) {
      ArrowResultWriter.write(stream, a, out);
    }
    long rows = 0;
    int batches = 0;
    try (BufferAllocator a = new RootAllocator(64L << 20);
        ArrowStreamReader reader = new ArrowStreamReader(new ByteArrayInputStream(out.toByteArray()), a)) {
      VectorSchemaRoot root = reader.getVectorSchemaRoot();
      assertEquals("degC", root.getSchema().findField("big").getMetadata().get("unit"));
      assertEquals("180000", root.getSchema().getCustomMetadata().get("rows"));
      while (reader.loadNextBatch()) {
        batches++;
        DateDayVector time = (DateDayVector) root.getVector("time");
        Float8Vector v = (Float8Vector) root.getVector("big");
        for (int i = 0; i < root.getRowCount(); i++, rows++) {
          int t = (int) (rows / 1800), cell = (int) (rows % 1800);
          assertEquals(LocalDate.of(2014, 1, 1).plusDays(t).toEpochDay(), time.get(i));
          float expected = FakeSource.value(t, cell / 45, cell % 45);
          if (Float.isNaN(expected)) {
            assertTrue(v.isNull(i));
          } else {
            assertEquals(expected, v.get(i), 0.0);
          }
        }
      }
    }
    assertEquals(180_000, rows);
    assertEquals(3, batches, "65,536 rows per batch");
  }

  @Test
  void csvOfAnExportHasAHeaderAndOneLinePerRow() throws IOException {
    TableStream stream = ((QueryEngine.Answer.Rows) ws.engine().open("cells of temp over \"test box\" during 2014-01")).stream();
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    CsvWriter.write(stream, new OutputStreamWriter(out, StandardCharsets.UTF_8));
    String[] lines = out.toString(StandardCharsets.UTF_8).split("\r\n");
    CellWeights w = RegionWeights.compute(FakeSource.grid(9, 7), box.geometry());
    assertEquals(1 + 31 * w.size(), lines.length);
    assertEquals("time,row,column,lat [degrees_north],lon [degrees_east],fraction_inside [1],temp [degC]", lines[0]);
  }

  @Test
  void anExportStreamsAloneAfterItsDefinitions() throws IOException {
    QueryException e = assertThrows(QueryException.class,
        () -> ws.engine().open("list variables; cells of temp over \"test box\" during 2014-01"));
    assertEquals(1, e.line());
    assertEquals(17, e.column());
    assertTrue(e.getMessage().contains("only statement"), e.getMessage());
    QueryEngine.Answer ok = ws.engine().open("let warm = temp * 2; cells of warm over \"test box\" during 2014-01-02");
    ResultTable t = TableStream.collect(((QueryEngine.Answer.Rows) ok).stream());
    Column.Doubles v = (Column.Doubles) t.column("warm");
    CellWeights w = RegionWeights.compute(FakeSource.grid(9, 7), box.geometry());
    for (int i = 0; i < w.size(); i++) {
      float base = FakeSource.value(1, w.row(i), w.column(i));
      assertEquals(Float.isNaN(base) ? Double.NaN : 2.0 * base, v.get(i), 1e-5);
    }
  }

  @Test
  void aNonExportRequestIsAnsweredWithTables() {
    QueryEngine.Answer a = ws.engine().open("list variables");
    assertEquals(1, ((QueryEngine.Answer.Tables) a).tables().size());
  }

  @Test
  void anExportTooLongToHoldIsRefusedByRunWithTheWayOut() throws Exception {
    ws.ingestor().ingest(FakeSource.write(dir.resolve("huge.fake"), "huge", 50, 50, 900, 0), Optional.empty());
    String q = "cells of huge over box(43.5, -32, 48.5, -27) from 2014-01-01 to 2016-06-18";
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().run(q));
    assertTrue(e.getMessage().contains("2250000 rows"), e.getMessage());
    assertTrue(e.hint().contains("/api/query"), e.hint());
    // The same request streams: count its rows without holding them.
    long rows = 0;
    try (TableStream s = ((QueryEngine.Answer.Rows) ws.engine().open(q)).stream()) {
      for (ResultTable b = s.next(); b != null; b = s.next()) {
        rows += b.rowCount();
      }
      assertNull(s.next());
    }
    assertEquals(2_250_000, rows);
  }

  @Test
  void unitMismatchIsReportedAtTheUnit() {
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().open("cells of temp over \"test box\" during 2014-01 in mg/m3"));
    assertEquals(46, e.column()); // the unit clause
  }
}
