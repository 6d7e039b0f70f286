package org.slackwater.core.result;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.DateDayVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VarCharVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowStreamReader;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

class ArrowResultWriterTest {
  private BufferAllocator allocator;

  @BeforeEach
  void open() {
    allocator = new RootAllocator(256 << 20);
  }

  @AfterEach
  void close() {
    allocator.close(); // fails on a leaked buffer
  }

  /** Arrow's own stream reader is the reference: values, nulls, units and metadata across two batches. */
  @Test
  void arrowsOwnStreamReaderSeesValuesNullsUnitsAndMetadataAcrossBatches() throws Exception {
    int n = ArrowResultWriter.BATCH_ROWS + 10;
    LocalDate[] dates = new LocalDate[n];
    double[] v = new double[n];
    String[] s = new String[n];
    for (int i = 0; i < n; i++) {
      dates[i] = LocalDate.of(2006, 1, 1).plusDays(i % 7000);
      v[i] = i % 5 == 0 ? Double.NaN : i * 0.25;
      s[i] = i % 3 == 0 ? null : "p" + i;
    }
    ResultTable t = new ResultTable("test table", List.of(new Column.Dates("time", dates), new Column.Doubles("mean_chlorophyll", "mg m-3", v),
        new Column.Strings("label", s)), Map.of("variable", "chlorophyll"), List.of("a warning"));
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ArrowResultWriter.write(t, allocator, out);
    int row = 0;
    try (ArrowStreamReader reader = new ArrowStreamReader(new ByteArrayInputStream(out.toByteArray()), allocator)) {
      VectorSchemaRoot root = reader.getVectorSchemaRoot();
      assertEquals("mg m-3", root.getSchema().findField("mean_chlorophyll").getMetadata().get("unit"));
      assertEquals("chlorophyll", root.getSchema().getCustomMetadata().get("variable"));
      assertEquals("a warning", root.getSchema().getCustomMetadata().get("warning.1"));
      int batches = 0;
      while (reader.loadNextBatch()) {
        batches++;
        DateDayVector d = (DateDayVector) root.getVector("time");
        Float8Vector f = (Float8Vector) root.getVector("mean_chlorophyll");
        VarCharVector l = (VarCharVector) root.getVector("label");
        for (int i = 0; i < root.getRowCount(); i++, row++) {
          assertEquals(dates[row].toEpochDay(), d.get(i));
          if (Double.isNaN(v[row])) {
            assertTrue(f.isNull(i));
          } else {
            assertEquals(v[row], f.get(i), 0.0);
          }
          assertEquals(s[row], l.isNull(i) ? null : new String(l.get(i), java.nio.charset.StandardCharsets.UTF_8));
        }
      }
      assertEquals(2, batches);
    }
    assertEquals(n, row);
  }
}
