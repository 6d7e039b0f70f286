package org.slackwater.netcdf;

import java.util.Locale;
import java.util.Objects;

/**
 * A unit conversion {@code canonical = declared * scale + offset} and the unit it leads to.
 *
 * @param unit the canonical unit the values end up in (may equal the declared unit)
 * @param scale multiplier, finite and non-zero
 * @param offset added after scaling, finite
 * @param note why this conversion was chosen, for provenance (empty for none)
 */
record LinearConversion(String unit, double scale, double offset, String note) {

  LinearConversion {
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(note, "note");
    if (!Double.isFinite(scale) || scale == 0 || !Double.isFinite(offset)) {
      throw new IllegalArgumentException("scale must be finite and non-zero, offset finite");
    }
  }

  /** Values kept as declared. */
  static LinearConversion identity(String unit) {
    return new LinearConversion(unit, 1, 0, "");
  }

  boolean isIdentity() {
    return scale == 1 && offset == 0;
  }

  /** For provenance, e.g. {@code K -> degC: x * 1 + -273.15}. */
  String describe(String declared) {
    if (isIdentity()) {
      return declared.equals(unit) ? "kept as declared" : declared + " -> " + unit;
    }
    return String.format(Locale.ROOT, "%s -> %s: x * %s + %s%s", declared, unit, scale, offset,
        note.isEmpty() ? "" : " (" + note + ")");
  }
}
