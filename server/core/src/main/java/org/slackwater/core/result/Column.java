package org.slackwater.core.result;

import java.time.LocalDate;
import java.util.Objects;

/** One column of a {@link ResultTable}. Values are copied in; accessors by row avoid copying out. */
public sealed interface Column permits Column.Dates, Column.Doubles, Column.Longs, Column.Strings {

  String name();

  /** The unit of the values, or empty for unitless columns (dates, labels, counts). */
  String unit();

  int size();

  /** Dates (ISO 8601 calendar dates); null = missing. */
  record Dates(String name, LocalDate[] values) implements Column {
    public Dates {
      Objects.requireNonNull(name);
      values = values.clone();
    }

    public LocalDate get(int row) {
      return values[row];
    }

    @Override
    public String unit() {
      return "";
    }

    @Override
    public int size() {
      return values.length;
    }
  }

  /** Real numbers; NaN = missing. */
  record Doubles(String name, String unit, double[] values) implements Column {
    public Doubles {
      Objects.requireNonNull(name);
      Objects.requireNonNull(unit);
      values = values.clone();
    }

    public double get(int row) {
      return values[row];
    }

    @Override
    public int size() {
      return values.length;
    }
  }

  /** Counts and integers. */
  record Longs(String name, String unit, long[] values) implements Column {
    public Longs {
      Objects.requireNonNull(name);
      Objects.requireNonNull(unit);
      values = values.clone();
    }

    public long get(int row) {
      return values[row];
    }

    @Override
    public int size() {
      return values.length;
    }
  }

  /** Text; null = missing. */
  record Strings(String name, String[] values) implements Column {
    public Strings {
      Objects.requireNonNull(name);
      values = values.clone();
    }

    public String get(int row) {
      return values[row];
    }

    @Override
    public String unit() {
      return "";
    }

    @Override
    public int size() {
      return values.length;
    }
  }
}
