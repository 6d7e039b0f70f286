package org.slackwater.core.result;

import java.time.LocalDate;

/** Text form of one cell, shared by the writers: ISO dates, shortest round-trip doubles, empty for missing. */
final class Cells {
  private Cells() {}

  static String text(Column col, int row) {
    if (col instanceof Column.Dates d) {
      LocalDate v = d.get(row);
      return v == null ? "" : v.toString();
    }
    if (col instanceof Column.Doubles d) {
      double v = d.get(row);
      return Double.isNaN(v) ? "" : number(v);
    }
    if (col instanceof Column.Longs l) {
      return Long.toString(l.get(row));
    }
    String v = ((Column.Strings) col).get(row);
    return v == null ? "" : v;
  }

  static String type(Column c) {
    if (c instanceof Column.Dates) return "date";
    if (c instanceof Column.Doubles) return "number";
    if (c instanceof Column.Longs) return "integer";
    return "string";
  }

  static String number(double v) {
    if (v == Math.rint(v) && Math.abs(v) < 1e15) {
      return Long.toString((long) v);
    }
    return Double.toString(v);
  }
}
