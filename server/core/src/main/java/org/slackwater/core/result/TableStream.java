package org.slackwater.core.result;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

/**
 * A result too long to hold whole: a header (the columns, with no rows, and the metadata and
 * warnings) known before any row, then batches of rows read one after the other. Every batch has
 * the header's columns (names, units, types) and carries the header's title, metadata and
 * warnings. The writers ({@link CsvWriter}, {@link JsonWriter}, {@link ArrowResultWriter}) write a
 * stream as they read it, so memory is one batch, not the result.
 *
 * <p>Single use, not thread-safe. Closing releases what the producer holds (it may stop early).
 */
public interface TableStream extends AutoCloseable {
  /** Rows per batch the producers aim at: Arrow's record batches are this long too. */
  int BATCH_ROWS = ArrowResultWriter.BATCH_ROWS;

  /** The columns (zero rows), title, metadata and warnings of every batch. */
  ResultTable header();

  /**
   * The next batch, or null after the last.
   *
   * @throws IOException if reading the data fails part way; the rows already read stay valid
   */
  ResultTable next() throws IOException;

  @Override
  default void close() {}

  /** A whole table as a stream of one batch (a table with no rows: no batch). */
  static TableStream of(ResultTable table) {
    return new TableStream() {
      private boolean done = table.rowCount() == 0;

      @Override
      public ResultTable header() {
        return Batches.empty(table);
      }

      @Override
      public ResultTable next() {
        if (done) {
          return null;
        }
        done = true;
        return table;
      }
    };
  }

  /**
   * Reads the whole stream into one table, for callers that need every row at once and have
   * checked that the rows fit (e.g. {@code QueryEngine.run} against its row limit), and closes it.
   */
  static ResultTable collect(TableStream stream) throws IOException {
    try (stream) {
      List<ResultTable> parts = new ArrayList<>();
      for (ResultTable b = stream.next(); b != null; b = stream.next()) {
        parts.add(b);
      }
      return Batches.concat(stream.header(), parts);
    }
  }
}
