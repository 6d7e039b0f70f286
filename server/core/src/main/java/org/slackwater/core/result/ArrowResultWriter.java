package org.slackwater.core.result;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.vector.BigIntVector;
import org.apache.arrow.vector.DateDayVector;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VarCharVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowStreamWriter;
import org.apache.arrow.vector.types.DateUnit;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;

/**
 * Writes a {@link ResultTable} or a {@link TableStream} as an Arrow IPC stream: one schema, then record batches of at most
 * {@link #BATCH_ROWS} rows. Dates are {@code date32} (days since 1970-01-01), numbers float64
 * (missing = null), counts int64, text utf8. Each field's metadata carries its {@code unit}; the
 * schema metadata carries the table's title, metadata and warnings ({@code warning.1}, ...), so
 * units and provenance travel with the numbers into any Arrow reader.
 *
 * <p>Buffers come from the caller's allocator and are released before returning.
 */
public final class ArrowResultWriter {
  public static final int BATCH_ROWS = 65_536;

  private ArrowResultWriter() {}

  public static void write(ResultTable table, BufferAllocator allocator, OutputStream out) throws IOException {
    write(TableStream.of(table), allocator, out);
  }

  /**
   * Writes the stream batch by batch as it reads it (a batch longer than {@link #BATCH_ROWS} is cut
   * into several), so memory is one batch's vectors; a stream without rows gets one empty batch.
   * If the stream fails part way, the exception propagates with the batches written so far already
   * in {@code out} and no end-of-stream marker, so a reader sees a truncated stream, not a short
   * result.
   */
  public static void write(TableStream stream, BufferAllocator allocator, OutputStream out) throws IOException {
    ResultTable header = stream.header();
    List<Field> fields = new ArrayList<>();
    for (Column c : header.columns()) {
      Map<String, String> meta = c.unit().isEmpty() ? Map.of() : Map.of("unit", c.unit());
      fields.add(new Field(c.name(), new FieldType(true, type(c), null, meta), null));
    }
    Map<String, String> schemaMeta = new LinkedHashMap<>();
    schemaMeta.put("title", header.title());
    header.metadata().forEach(schemaMeta::put);
    for (int i = 0; i < header.warnings().size(); i++) {
      schemaMeta.put("warning." + (i + 1), header.warnings().get(i));
    }
    Schema schema = new Schema(fields, schemaMeta);
    try (VectorSchemaRoot root = VectorSchemaRoot.create(schema, allocator);
        ArrowStreamWriter writer = new ArrowStreamWriter(root, null, Channels.newChannel(out))) {
      writer.start();
      boolean any = false;
      for (ResultTable table = stream.next(); table != null; table = stream.next()) {
        int rows = table.rowCount();
        for (int start = 0; start < rows; start += BATCH_ROWS) {
          int n = Math.min(BATCH_ROWS, rows - start);
          root.allocateNew();
          for (int c = 0; c < table.columns().size(); c++) {
            fill(root.getVector(c), table.columns().get(c), start, n);
          }
          root.setRowCount(n);
          writer.writeBatch();
          any = true;
        }
      }
      if (!any) {
        root.allocateNew();
        for (FieldVector v : root.getFieldVectors()) {
          v.setValueCount(0);
        }
        root.setRowCount(0);
        writer.writeBatch();
      }
      writer.end();
    }
    out.flush();
  }

  private static ArrowType type(Column c) {
    if (c instanceof Column.Dates) {
      return new ArrowType.Date(DateUnit.DAY);
    }
    if (c instanceof Column.Doubles) {
      return new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE);
    }
    if (c instanceof Column.Longs) {
      return new ArrowType.Int(64, true);
    }
    return ArrowType.Utf8.INSTANCE;
  }

  private static void fill(FieldVector v, Column c, int start, int n) {
    for (int i = 0; i < n; i++) {
      int r = start + i;
      if (c instanceof Column.Dates d) {
        if (d.get(r) == null) ((DateDayVector) v).setNull(i); else ((DateDayVector) v).setSafe(i, (int) d.get(r).toEpochDay());
      } else if (c instanceof Column.Doubles d) {
        if (Double.isNaN(d.get(r))) ((Float8Vector) v).setNull(i); else ((Float8Vector) v).setSafe(i, d.get(r));
      } else if (c instanceof Column.Longs l) {
        ((BigIntVector) v).setSafe(i, l.get(r));
      } else {
        String s = ((Column.Strings) c).get(r);
        if (s == null) ((VarCharVector) v).setNull(i); else ((VarCharVector) v).setSafe(i, s.getBytes(StandardCharsets.UTF_8));
      }
    }
    v.setValueCount(n);
  }
}
