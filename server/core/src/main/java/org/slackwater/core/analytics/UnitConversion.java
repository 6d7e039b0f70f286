package org.slackwater.core.analytics;

import java.util.Objects;
import ucar.units.ConversionException;
import ucar.units.Converter;
import ucar.units.Unit;
import ucar.units.UnitFormatManager;

/**
 * Converts values between units by udunits (the unit system CF names, section 3.1). Units udunits
 * does not know (turbidity's FNU or NTU) convert only to themselves.
 *
 * @param from the unit values are in
 * @param to the unit wanted
 */
public record UnitConversion(String from, String to, double scale, double offset) {

  public UnitConversion {
    Objects.requireNonNull(from);
    Objects.requireNonNull(to);
  }

  /** @throws UnitMismatchException if the units cannot be converted (with a message for people) */
  public static UnitConversion between(String from, String to) {
    if (from.equals(to)) {
      return new UnitConversion(from, to, 1, 0);
    }
    Unit a = parse(from), b = parse(to);
    if (a == null || b == null || !sameQuantity(a, b)) {
      throw new UnitMismatchException("values in '" + from + "' cannot be converted to '" + to + "'"
          + (a == null ? " ('" + from + "' is not a udunits unit)" : b == null ? " ('" + to + "' is not a unit udunits knows)" : ""));
    }
    try {
      Converter c = a.getConverterTo(b);
      // Every udunits conversion between compatible units is affine: y = scale x + offset.
      double offset = c.convert(0.0);
      return new UnitConversion(from, to, c.convert(1.0) - offset, offset);
    } catch (ConversionException e) {
      throw new UnitMismatchException("values in '" + from + "' cannot be converted to '" + to + "': " + e.getMessage());
    }
  }

  /** Whether {@code unit} parses as a udunits unit. */
  /**
   * Whether two units measure the same quantity: their derived (base SI) units are equal. Not
   * udunits' {@code isCompatible}, which in this version also accepts a unit and its reciprocal
   * (m and m-1) and converts between them by doing nothing.
   */
  static boolean sameQuantity(Unit a, Unit b) {
    try {
      return a.getDerivedUnit().equals(b.getDerivedUnit());
    } catch (RuntimeException e) {
      return false;
    }
  }

  public static boolean known(String unit) {
    return parse(unit) != null;
  }

  public double apply(double v) {
    return v * scale + offset;
  }

  /** A conversion of differences (anomalies, spreads): the offset does not apply. */
  public double applyToDifference(double v) {
    return v * scale;
  }

  public boolean identity() {
    return scale == 1 && offset == 0;
  }

  private static Unit parse(String s) {
    try {
      return UnitFormatManager.instance().parse(s);
    } catch (Exception e) {
      return null;
    }
  }

  /** Units that do not convert. */
  public static final class UnitMismatchException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public UnitMismatchException(String message) {
      super(message);
    }
  }
}
