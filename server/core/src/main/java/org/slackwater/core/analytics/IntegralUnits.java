package org.slackwater.core.analytics;

import java.util.List;

/**
 * Units of integrals: an area integral multiplies the unit by m², a time integral by the native
 * step (days). The product is re-expressed in the first of a few familiar units it converts to
 * (m³/day for rainfall or runoff rates over an area, m³ for their time integrals), so a total
 * reads "m3" rather than "day m2 mm/day". Units udunits does not know are written as products.
 *
 * @param unit the unit to report
 * @param factor multiply integral values by this to express them in {@code unit}
 */
public record IntegralUnits(String unit, double factor) {
  private static final List<String> FAMILIAR = List.of("m3/day", "m3", "mm", "kg/day", "kg", "m2", "m2 day");

  public static IntegralUnits times(String unit, String by) {
    if (!UnitConversion.known(unit)) {
      return new IntegralUnits(unit + " " + by, 1);
    }
    String product = by + " " + parenthesise(unit);
    for (String f : FAMILIAR) {
      try {
        UnitConversion c = UnitConversion.between(product, f);
        if (c.offset() == 0) {
          return new IntegralUnits(f, c.scale());
        }
      } catch (UnitConversion.UnitMismatchException e) {
        // Not this one; try the next familiar unit.
      }
    }
    return new IntegralUnits(product, 1);
  }

  private static String parenthesise(String u) {
    return u.contains(" ") || u.contains("/") ? "(" + u + ")" : u;
  }
}
