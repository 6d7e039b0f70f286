package org.slackwater.core.result;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

/** Empty copies and concatenations of tables with the same columns, for {@link TableStream}. */
final class Batches {
  private Batches() {}

  /** The table's columns with no rows, with its title, metadata and warnings. */
  static ResultTable empty(ResultTable t) {
    List<Column> cols = new ArrayList<>();
    for (Column c : t.columns()) {
      cols.add(emptyLike(c));
    }
    return new ResultTable(t.title(), cols, t.metadata(), t.warnings());
  }

  private static Column emptyLike(Column c) {
    if (c instanceof Column.Dates) {
      return new Column.Dates(c.name(), new LocalDate[0]);
    }
    if (c instanceof Column.Doubles) {
      return new Column.Doubles(c.name(), c.unit(), new double[0]);
    }
    if (c instanceof Column.Longs) {
      return new Column.Longs(c.name(), c.unit(), new long[0]);
    }
    return new Column.Strings(c.name(), new String[0]);
  }

  /** The parts' rows one after the other under the header's columns, title, metadata and warnings. */
  static ResultTable concat(ResultTable header, List<ResultTable> parts) {
    int n = parts.stream().mapToInt(ResultTable::rowCount).sum();
    List<Column> cols = new ArrayList<>();
    for (int c = 0; c < header.columns().size(); c++) {
      Column h = header.columns().get(c);
      int at = 0;
      if (h instanceof Column.Dates) {
        LocalDate[] v = new LocalDate[n];
        for (ResultTable p : parts) {
          Column.Dates d = (Column.Dates) p.columns().get(c);
          for (int r = 0; r < d.size(); r++) {
            v[at++] = d.get(r);
          }
        }
        cols.add(new Column.Dates(h.name(), v));
      } else if (h instanceof Column.Doubles) {
        double[] v = new double[n];
        for (ResultTable p : parts) {
          Column.Doubles d = (Column.Doubles) p.columns().get(c);
          for (int r = 0; r < d.size(); r++) {
            v[at++] = d.get(r);
          }
        }
        cols.add(new Column.Doubles(h.name(), h.unit(), v));
      } else if (h instanceof Column.Longs) {
        long[] v = new long[n];
        for (ResultTable p : parts) {
          Column.Longs d = (Column.Longs) p.columns().get(c);
          for (int r = 0; r < d.size(); r++) {
            v[at++] = d.get(r);
          }
        }
        cols.add(new Column.Longs(h.name(), h.unit(), v));
      } else {
        String[] v = new String[n];
        for (ResultTable p : parts) {
          Column.Strings d = (Column.Strings) p.columns().get(c);
          for (int r = 0; r < d.size(); r++) {
            v[at++] = d.get(r);
          }
        }
        cols.add(new Column.Strings(h.name(), v));
      }
    }
    return new ResultTable(header.title(), cols, header.metadata(), header.warnings());
  }
}
