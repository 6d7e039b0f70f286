package org.slackwater.netcdf;

import java.util.Arrays;
import java.util.Locale;
import ucar.ma2.DataType;
import ucar.nc2.Variable;

/**
 * Turns stored values into delivered floats: validity on the stored (packed) value first, then
 * unpacking and unit conversion in one multiply-add.
 *
 * <ul>
 *   <li>Missing (CF 2.5.1; the netCDF User Guide, appendix A): NaN; a value equal to
 *       {@code _FillValue}, or, without that attribute, to the netCDF default fill value of the
 *       type (not for bytes, whose default the guide advises against relying on); a value equal to
 *       one of the {@code missing_value} values; a value outside {@code valid_range} or below
 *       {@code valid_min} / above {@code valid_max}. All these are compared in the packed domain,
 *       exactly, in the variable's own type.
 *   <li>Unpacking (CF 8.1): {@code packed * scale_factor + add_offset}, scale first.
 *   <li>Unit conversion: {@code unpacked * a + b}; combined with unpacking into {@code packed *
 *       (scale_factor * a) + (add_offset * a + b)}, computed in double and rounded to float once.
 * </ul>
 *
 * <p>The loops are written per storage type, without boxing or allocation, because every value of
 * an ingest passes through them. Bytes and shorts, whose every possible value fits a small table,
 * are decoded by lookup in a table filled at construction with the per-value rule above (so the
 * result is the same to the bit); the other types test the first two missing values from fields, not a loop,
 * so the common case (a fill value, maybe one missing_value) stays a few compares.
 */
final class ValueDecoder {

  // netCDF default fill values (netcdf.h NC_FILL_SHORT, NC_FILL_INT, NC_FILL_INT64, NC_FILL_FLOAT,
  // NC_FILL_DOUBLE; recalled from memory of the C header).
  private static final double FILL_SHORT = -32767;
  private static final double FILL_INT = -2147483647;
  private static final double FILL_LONG = -9223372036854775806.0;
  private static final double FILL_FLOAT = (float) 9.9692099683868690e+36;
  private static final double FILL_DOUBLE = 9.9692099683868690e+36;

  private final double multiplier;
  private final double addend;
  private final double validMin;
  private final double validMax;
  /** The first two missing values, NaN where absent (NaN equals nothing); the rest in {@link #moreMissing}. */
  private final double missing0;
  private final double missing1;
  private final double[] moreMissing;
  private final boolean unsigned;
  private final String description;
  /** Decoded value of every raw short (index: its 16 bits) for a short variable, else null. */
  private final float[] shortTable;
  /** Decoded value of every raw byte (index: its 8 bits) for a byte variable, else null. */
  private final float[] byteTable;

  private ValueDecoder(DataType type, double multiplier, double addend, double validMin, double validMax,
      double[] missing, boolean unsigned, String description) {
    this.multiplier = multiplier;
    this.addend = addend;
    this.validMin = validMin;
    this.validMax = validMax;
    this.missing0 = missing.length > 0 ? missing[0] : Double.NaN;
    this.missing1 = missing.length > 1 ? missing[1] : Double.NaN;
    this.moreMissing = missing.length > 2 ? Arrays.copyOfRange(missing, 2, missing.length) : new double[0];
    this.unsigned = unsigned;
    this.description = description;
    this.shortTable = type == DataType.SHORT ? table(1 << 16) : null;
    this.byteTable = type == DataType.BYTE ? table(1 << 8) : null;
  }

  /** The decoded value of each raw pattern of a {@code size}-valued integer type (2^8 or 2^16). */
  private float[] table(int size) {
    float[] t = new float[size];
    for (int raw = 0; raw < size; raw++) {
      // Signed: the pattern's two's-complement value; unsigned: the pattern itself.
      double p = unsigned ? raw : size == 1 << 16 ? (short) raw : (byte) raw;
      t[raw] = decodeOne(p);
    }
    return t;
  }

  /**
   * The decoder for a variable's attributes and a unit conversion of its unpacked values.
   *
   * @throws Problem for a malformed packing or validity attribute
   */
  static ValueDecoder of(Variable v, LinearConversion units) throws Problem {
    DataType type = v.getDataType();
    double scale = Attributes.number(v, "scale_factor", 1);
    double offset = Attributes.number(v, "add_offset", 0);
    if (!Double.isFinite(scale) || scale == 0 || !Double.isFinite(offset)) {
      throw new Problem("scale_factor " + scale + " and add_offset " + offset
          + " cannot unpack values; scale_factor must be finite and non-zero (CF 8.1)");
    }
    double[] range = Attributes.exactValues(v, "valid_range", false);
    double[] vmin = Attributes.exactValues(v, "valid_min", false);
    double[] vmax = Attributes.exactValues(v, "valid_max", false);
    if (range.length != 0 && range.length != 2) {
      throw new Problem("valid_range has " + range.length + " values; it needs two, the smallest and largest valid"
          + " packed values (CF 2.5.1)");
    }
    double lo = range.length == 2 ? range[0] : vmin.length > 0 ? vmin[0] : Double.NEGATIVE_INFINITY;
    double hi = range.length == 2 ? range[1] : vmax.length > 0 ? vmax[0] : Double.POSITIVE_INFINITY;
    if (lo > hi) {
      throw new Problem(String.format(Locale.ROOT,
          "the valid range %s..%s is empty; give the smallest valid packed value first (CF 2.5.1)", lo, hi));
    }
    double[] fill = Attributes.exactValues(v, "_FillValue", true);
    double[] missingValues = Attributes.exactValues(v, "missing_value", true);
    double[] listed;
    if (fill.length > 0) {
      listed = concat(new double[] {fill[0]}, missingValues);
    } else {
      double def = defaultFill(type, v.isUnsigned());
      listed = Double.isNaN(def) ? missingValues : concat(new double[] {def}, missingValues);
    }
    listed = Arrays.stream(listed).filter(d -> !Double.isNaN(d)).distinct().toArray();
    StringBuilder desc = new StringBuilder();
    if (scale != 1 || offset != 0) {
      desc.append(String.format(Locale.ROOT, "unpacked as packed * %s + %s (CF 8.1)", scale, offset));
    }
    return new ValueDecoder(type, scale * units.scale(), offset * units.scale() + units.offset(), lo, hi, listed,
        v.isUnsigned(), desc.toString());
  }

  private static double defaultFill(DataType type, boolean unsigned) {
    if (unsigned) {
      return Double.NaN; // unsigned types have other defaults, and classic files have none
    }
    if (type == DataType.SHORT) {
      return FILL_SHORT;
    } else if (type == DataType.INT) {
      return FILL_INT;
    } else if (type == DataType.LONG) {
      return FILL_LONG;
    } else if (type == DataType.FLOAT) {
      return FILL_FLOAT;
    } else if (type == DataType.DOUBLE) {
      return FILL_DOUBLE;
    }
    return Double.NaN;
  }

  private static double[] concat(double[] a, double[] b) {
    double[] out = Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }

  /** How values are unpacked, for provenance (empty if they are not packed). */
  String description() {
    return description;
  }

  /**
   * Decodes {@code n} values of {@code storage} (a primitive array) from {@code from}, stepping
   * by {@code step} (+1 or -1), into {@code dest} from {@code at}.
   */
  void decode(Object storage, int from, int step, int n, float[] dest, int at) {
    if (storage instanceof float[] s) {
      floats(s, from, step, n, dest, at);
    } else if (storage instanceof short[] s) {
      shorts(s, from, step, n, dest, at);
    } else if (storage instanceof double[] s) {
      doubles(s, from, step, n, dest, at);
    } else if (storage instanceof int[] s) {
      ints(s, from, step, n, dest, at);
    } else if (storage instanceof byte[] s) {
      bytes(s, from, step, n, dest, at);
    } else if (storage instanceof long[] s) {
      longs(s, from, step, n, dest, at);
    } else {
      throw new IllegalStateException("unexpected storage " + storage.getClass().getSimpleName());
    }
  }

  private boolean invalid(double p) {
    if (p != p || p < validMin || p > validMax || p == missing0 || p == missing1) {
      return true;
    }
    for (double m : moreMissing) {
      if (p == m) {
        return true;
      }
    }
    return false;
  }

  /** The delivered value of one stored value (already widened, unsigned applied): the rule of this class. */
  private float decodeOne(double p) {
    return invalid(p) ? Float.NaN : (float) (p * multiplier + addend);
  }

  private void floats(float[] s, int from, int step, int n, float[] dest, int at) {
    for (int i = 0, j = from; i < n; i++, j += step) {
      dest[at + i] = decodeOne(s[j]);
    }
  }

  private void doubles(double[] s, int from, int step, int n, float[] dest, int at) {
    for (int i = 0, j = from; i < n; i++, j += step) {
      dest[at + i] = decodeOne(s[j]);
    }
  }

  private void shorts(short[] s, int from, int step, int n, float[] dest, int at) {
    float[] table = shortTable != null ? shortTable : table(1 << 16);
    for (int i = 0, j = from; i < n; i++, j += step) {
      dest[at + i] = table[s[j] & 0xFFFF];
    }
  }

  private void ints(int[] s, int from, int step, int n, float[] dest, int at) {
    for (int i = 0, j = from; i < n; i++, j += step) {
      dest[at + i] = decodeOne(unsigned ? (s[j] & 0xFFFF_FFFFL) : s[j]);
    }
  }

  private void bytes(byte[] s, int from, int step, int n, float[] dest, int at) {
    float[] table = byteTable != null ? byteTable : table(1 << 8);
    for (int i = 0, j = from; i < n; i++, j += step) {
      dest[at + i] = table[s[j] & 0xFF];
    }
  }

  private void longs(long[] s, int from, int step, int n, float[] dest, int at) {
    for (int i = 0, j = from; i < n; i++, j += step) {
      long raw = s[j];
      dest[at + i] = decodeOne(unsigned && raw < 0 ? raw + 0x1p64 : raw);
    }
  }
}
