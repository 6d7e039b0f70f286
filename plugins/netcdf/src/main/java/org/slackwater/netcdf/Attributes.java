package org.slackwater.netcdf;

import java.util.Locale;
import ucar.ma2.DataType;
import ucar.nc2.Attribute;
import ucar.nc2.Variable;

/**
 * Reading attributes of a variable as Java values. Float attributes are widened to the decimal
 * they print as (0.01f becomes 0.01, not 0.009999999776...), which is what the writer meant; the
 * exact widening is kept for comparisons against stored values ({@link #exactValues}).
 */
final class Attributes {

  private Attributes() {}

  /** The trimmed text of a string attribute, or null if absent or not text. */
  static String text(Variable v, String name) {
    Attribute a = v.findAttribute(name);
    if (a == null || !a.isString() || a.getStringValue() == null) {
      return null;
    }
    String s = a.getStringValue().trim();
    return s.isEmpty() ? null : s;
  }

  static String textOrEmpty(Variable v, String name) {
    String s = text(v, name);
    return s == null ? "" : s;
  }

  /** A numeric attribute's first value, decimal-widened, or {@code fallback} if absent. */
  static double number(Variable v, String name, double fallback) {
    Attribute a = v.findAttribute(name);
    if (a == null || a.isString() || a.getLength() == 0) {
      return fallback;
    }
    return widen(a.getNumericValue(0), a.getDataType());
  }

  /** Whether a numeric attribute is present. */
  static boolean hasNumber(Variable v, String name) {
    Attribute a = v.findAttribute(name);
    return a != null && !a.isString() && a.getLength() > 0;
  }

  /**
   * An attribute's values converted to the variable's own type and widened exactly, so that
   * they compare equal to the stored values they describe (for _FillValue, missing_value and the
   * valid range). Unsigned variables read their attributes as unsigned too. Integer values of a
   * wider attribute type are narrowed to the variable's width only if {@code narrow}; the valid
   * range of byte data may be given in a wider type on purpose (netCDF User Guide, appendix A).
   */
  static double[] exactValues(Variable v, String name, boolean narrow) {
    Attribute a = v.findAttribute(name);
    if (a == null || a.isString() || a.getLength() == 0) {
      return new double[0];
    }
    double[] out = new double[a.getLength()];
    for (int i = 0; i < out.length; i++) {
      out[i] = inVariableType(a.getNumericValue(i), v.getDataType(), v.isUnsigned(), narrow);
    }
    return out;
  }

  static double inVariableType(Number n, DataType type, boolean unsigned, boolean narrow) {
    if (type == DataType.FLOAT) {
      return n.floatValue();
    }
    if (type == DataType.DOUBLE) {
      return n.doubleValue();
    }
    if (n instanceof Float || n instanceof Double) {
      return n.doubleValue(); // a floating attribute on integer data: compare as written
    }
    long x = n.longValue();
    if (!narrow) {
      return x;
    }
    if (unsigned && x < 0) {
      int bits = type.getSize() * 8;
      x = bits >= 64 ? x : x & ((1L << bits) - 1);
    } else if (!unsigned) {
      x = switch (type.getSize()) {
        case 1 -> (byte) x;
        case 2 -> (short) x;
        case 4 -> (int) x;
        default -> x;
      };
    }
    return x;
  }

  static double widen(Number n, DataType type) {
    if (type == DataType.FLOAT || n instanceof Float) {
      return Double.parseDouble(Float.toString(n.floatValue()));
    }
    return n.doubleValue();
  }

  /** For provenance, e.g. {@code "0.01"} or {@code "0, 1000"}. */
  static String describe(Attribute a) {
    if (a.isString()) {
      return a.getStringValue();
    }
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < a.getLength(); i++) {
      if (i > 0) {
        sb.append(", ");
      }
      double d = widen(a.getNumericValue(i), a.getDataType());
      sb.append(d == Math.rint(d) && Math.abs(d) < 1e15 ? String.format(Locale.ROOT, "%d", (long) d) : Double.toString(d));
    }
    return sb.toString();
  }
}
