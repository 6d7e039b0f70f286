package org.slackwater.render;

import java.time.LocalDate;
import java.util.Locale;
import java.util.Optional;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * Reading the columns a plot needs out of a {@link ResultTable}, with a {@link PlotException}
 * naming the result and the column when one is missing or of the wrong type (a table the server
 * did not make, or an older server).
 */
final class Tables {
  private Tables() {}

  static ResultKind kind(ResultTable t) {
    String label = t.metadata().get(ResultKind.KEY);
    if (label == null) {
      throw new PlotException("the result '" + t.title() + "' does not say what kind of result it is (metadata " + ResultKind.KEY
          + " is missing), so no plot can be chosen; ask for format=json or csv");
    }
    for (ResultKind k : ResultKind.values()) {
      if (k.label().equals(label)) {
        return k;
      }
    }
    throw new PlotException("the result '" + t.title() + "' is of an unknown kind '" + label + "' (metadata " + ResultKind.KEY
        + "); no plot exists for it; ask for format=json or csv");
  }

  static Optional<Column> find(ResultTable t, String name) {
    return t.columns().stream().filter(c -> c.name().equals(name)).findFirst();
  }

  /** A numeric column (real or integer) as doubles; NaN = missing. */
  static double[] numbers(ResultTable t, String name) {
    Column c = find(t, name).orElseThrow(() -> missing(t, name));
    return numbers(t, c);
  }

  static double[] numbers(ResultTable t, Column c) {
    if (c instanceof Column.Doubles d) {
      return d.values().clone();
    }
    if (c instanceof Column.Longs l) {
      double[] out = new double[l.size()];
      for (int i = 0; i < out.length; i++) {
        out[i] = l.get(i);
      }
      return out;
    }
    throw new PlotException("the column '" + c.name() + "' of the result '" + t.title() + "' holds no numbers; a plot needs numbers there");
  }

  static Optional<double[]> optionalNumbers(ResultTable t, String name) {
    return find(t, name).map(c -> numbers(t, c));
  }

  static String[] strings(ResultTable t, String name) {
    Column c = find(t, name).orElseThrow(() -> missing(t, name));
    String[] out = new String[c.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = c instanceof Column.Strings s ? s.get(i) : c instanceof Column.Dates d ? (d.get(i) == null ? null : d.get(i).toString())
          : c instanceof Column.Longs l ? Long.toString(l.get(i)) : Double.toString(((Column.Doubles) c).get(i));
    }
    return out;
  }

  static Optional<String[]> optionalStrings(ResultTable t, String name) {
    return find(t, name).map(c -> strings(t, name));
  }

  static LocalDate[] dates(ResultTable t, String name) {
    Column c = find(t, name).orElseThrow(() -> missing(t, name));
    if (!(c instanceof Column.Dates d)) {
      throw new PlotException("the column '" + name + "' of the result '" + t.title() + "' holds no dates; a time axis needs dates");
    }
    return d.values().clone();
  }

  static String unit(ResultTable t, String name) {
    return find(t, name).map(Column::unit).orElse("");
  }

  /** "mean chlorophyll [mg m-3]": the column name in words, with its unit unless dimensionless. */
  static String label(Column c) {
    return label(c.name(), c.unit());
  }

  static String label(String name, String unit) {
    String words = name.replace('_', ' ');
    return unit.isEmpty() || unit.equals("1") ? words : words + " [" + unit + "]";
  }

  static String meta(ResultTable t, String key, String fallback) {
    String v = t.metadata().get(key);
    return v == null || v.isBlank() ? fallback : v;
  }

  static String kindName(ResultKind k) {
    return k.label().replace('_', ' ').toLowerCase(Locale.ROOT);
  }

  private static PlotException missing(ResultTable t, String name) {
    return new PlotException("the result '" + t.title() + "' has no column '" + name + "', which its plot needs; ask for format=json or csv");
  }
}
