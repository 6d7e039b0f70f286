package org.slackwater.core.result;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import java.io.IOException;
import java.io.OutputStream;
import java.util.List;

/**
 * Writes results as JSON: {@code {"results": [ {title, columns: [{name, unit, type}], rows: [[...]],
 * metadata: {...}, warnings: [...]} ]}}. Rows are arrays in column order; missing values are null;
 * dates are ISO 8601 strings. Streamed with Jackson's generator, so a long table is not built as a
 * tree in memory.
 */
public final class JsonWriter {
  private static final JsonFactory FACTORY = new JsonFactory();

  private JsonWriter() {}

  public static void write(List<ResultTable> tables, List<String> cautions, OutputStream out) throws IOException {
    List<TableStream> streams = new java.util.ArrayList<>();
    for (ResultTable t : tables) {
      streams.add(TableStream.of(t));
    }
    document(streams, cautions, out);
  }

  /** One streamed result in the same document shape, its rows written batch by batch. */
  public static void write(TableStream stream, List<String> cautions, OutputStream out) throws IOException {
    document(List.of(stream), cautions, out);
  }

  private static void document(List<TableStream> results, List<String> cautions, OutputStream out) throws IOException {
    try (JsonGenerator g = FACTORY.createGenerator(out, JsonEncoding.UTF8)) {
      g.writeStartObject();
      g.writeArrayFieldStart("results");
      for (TableStream t : results) {
        table(g, t);
      }
      g.writeEndArray();
      if (!cautions.isEmpty()) {
        g.writeArrayFieldStart("cautions");
        for (String c : cautions) {
          g.writeString(c);
        }
        g.writeEndArray();
      }
      g.writeEndObject();
    }
  }

  private static void table(JsonGenerator g, TableStream stream) throws IOException {
    ResultTable t = stream.header();
    g.writeStartObject();
    g.writeStringField("title", t.title());
    g.writeArrayFieldStart("columns");
    for (Column c : t.columns()) {
      g.writeStartObject();
      g.writeStringField("name", c.name());
      g.writeStringField("unit", c.unit());
      g.writeStringField("type", Cells.type(c));
      g.writeEndObject();
    }
    g.writeEndArray();
    g.writeArrayFieldStart("rows");
    for (ResultTable b = stream.next(); b != null; b = stream.next()) {
      rows(g, b);
    }
    g.writeEndArray();
    g.writeObjectFieldStart("metadata");
    for (var e : t.metadata().entrySet()) {
      g.writeStringField(e.getKey(), e.getValue());
    }
    g.writeEndObject();
    g.writeArrayFieldStart("warnings");
    for (String w : t.warnings()) {
      g.writeString(w);
    }
    g.writeEndArray();
    g.writeEndObject();
  }

  private static void rows(JsonGenerator g, ResultTable t) throws IOException {
    for (int r = 0; r < t.rowCount(); r++) {
      g.writeStartArray();
      for (Column c : t.columns()) {
        if (c instanceof Column.Doubles d) {
          double v = d.get(r);
          if (Double.isNaN(v) || Double.isInfinite(v)) g.writeNull(); else g.writeNumber(v);
        } else if (c instanceof Column.Longs l) {
          g.writeNumber(l.get(r));
        } else {
          String text = Cells.text(c, r);
          if (text.isEmpty()) g.writeNull(); else g.writeString(text);
        }
      }
      g.writeEndArray();
    }
  }
}
