package org.slackwater.core.analytics;

import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import ucar.units.Unit;
import ucar.units.UnitFormatManager;

/**
 * Units of derived variables: products and quotients of udunits units and of symbols udunits does
 * not know (turbidity's FNU, NTU), which are carried as opaque base symbols with exponents. So a
 * site-specific line {@code 1.3 mg/L/FNU * turbidity + 2.1 mg/L} has the unit mg/L, and adding FNU
 * to mg/L is refused.
 *
 * <p>A unit is {@code scale x known x Π opaque^exponent}, where {@code known} is a udunits unit
 * (null for none). Parsing accepts factors separated by spaces, '.' or '*', each optionally
 * preceded by '/', with exponents written {@code m-3}, {@code m^-3} or {@code m3}.
 *
 * @param known the udunits part, or null if dimensionless
 * @param opaque symbols udunits does not know, with their exponents
 */
public record UnitAlgebra(Unit known, Map<String, Integer> opaque) {

  public UnitAlgebra {
    opaque = Map.copyOf(new TreeMap<>(opaque));
  }

  public static final UnitAlgebra ONE = new UnitAlgebra(null, Map.of());

  /** @throws IllegalArgumentException with a message for people if a factor cannot be read */
  public static UnitAlgebra parse(String text) {
    String s = text.trim();
    if (s.isEmpty() || s.equals("1")) {
      return ONE;
    }
    if (UnitConversion.known(s) && !s.contains("FNU") && !s.contains("NTU") && !s.contains("FTU")) {
      return new UnitAlgebra(udunits(s), Map.of());
    }
    UnitAlgebra acc = ONE;
    boolean divide = false;
    StringBuilder tok = new StringBuilder();
    for (int i = 0; i <= s.length(); i++) {
      char c = i < s.length() ? s.charAt(i) : ' ';
      if (c == ' ' || c == '*' || c == '/' || (c == '.' && !Character.isDigit(peek(s, i + 1)))) {
        if (tok.length() > 0) {
          UnitAlgebra f = factor(tok.toString(), text);
          acc = divide ? acc.divide(f) : acc.multiply(f);
          tok.setLength(0);
          divide = false;
        }
        if (c == '/') {
          divide = true;
        }
      } else {
        tok.append(c);
      }
    }
    return acc;
  }

  private static char peek(String s, int i) {
    return i < s.length() ? s.charAt(i) : ' ';
  }

  private static UnitAlgebra factor(String f, String whole) {
    int i = f.length();
    while (i > 0 && (Character.isDigit(f.charAt(i - 1)) || f.charAt(i - 1) == '-' || f.charAt(i - 1) == '^' || f.charAt(i - 1) == '+')) {
      i--;
    }
    String symbol = f.substring(0, i);
    String exp = f.substring(i).replace("^", "");
    if (symbol.isEmpty()) {
      throw new IllegalArgumentException("cannot read the unit factor '" + f + "' in '" + whole + "'");
    }
    int e = exp.isEmpty() ? 1 : Integer.parseInt(exp);
    UnitAlgebra base = UnitConversion.known(symbol) && !isTurbidity(symbol) ? new UnitAlgebra(udunits(symbol), Map.of()) : opaque(symbol);
    return base.power(e);
  }

  private static boolean isTurbidity(String s) {
    return s.equals("FNU") || s.equals("NTU") || s.equals("FTU");
  }

  private static UnitAlgebra opaque(String symbol) {
    if (!symbol.matches("[A-Za-z_]+")) {
      throw new IllegalArgumentException("'" + symbol + "' is not a unit");
    }
    return new UnitAlgebra(null, Map.of(symbol, 1));
  }

  public UnitAlgebra multiply(UnitAlgebra o) {
    Unit k;
    try {
      k = known == null ? o.known : o.known == null ? known : known.multiplyBy(o.known);
    } catch (Exception e) {
      throw new IllegalArgumentException("cannot multiply " + this + " by " + o + ": " + e.getMessage());
    }
    Map<String, Integer> m = new TreeMap<>(opaque);
    o.opaque.forEach((s, e) -> m.merge(s, e, Integer::sum));
    m.values().removeIf(v -> v == 0);
    return new UnitAlgebra(k, m);
  }

  public UnitAlgebra divide(UnitAlgebra o) {
    return multiply(o.power(-1));
  }

  public UnitAlgebra power(int e) {
    if (e == 1) {
      return this;
    }
    Unit k = null;
    try {
      if (known != null) {
        k = known.raiseTo(e);
      }
    } catch (Exception ex) {
      throw new IllegalArgumentException("cannot raise " + this + " to " + e + ": " + ex.getMessage());
    }
    Map<String, Integer> m = new TreeMap<>();
    opaque.forEach((s, x) -> m.put(s, x * e));
    return new UnitAlgebra(k, m);
  }

  /**
   * Scale and offset that convert values in this unit to {@code target} (y = scale x + offset).
   *
   * @throws IllegalArgumentException if the units are not compatible
   */
  public double[] conversionTo(UnitAlgebra target) {
    if (!opaque.equals(target.opaque)) {
      throw new IllegalArgumentException("'" + this + "' and '" + target + "' are different quantities");
    }
    if (known == null && target.known == null) {
      return new double[] {1, 0};
    }
    Unit a = known != null ? known : udunits("1"), b = target.known != null ? target.known : udunits("1");
    if (!UnitConversion.sameQuantity(a, b)) {
      throw new IllegalArgumentException("'" + this + "' and '" + target + "' are different quantities");
    }
    try {
      double off = a.convertTo(0.0, b);
      return new double[] {a.convertTo(1.0, b) - off, off};
    } catch (Exception e) {
      throw new IllegalArgumentException("'" + this + "' cannot be converted to '" + target + "': " + e.getMessage());
    }
  }

  public boolean compatible(UnitAlgebra o) {
    try {
      conversionTo(o);
      return true;
    } catch (IllegalArgumentException e) {
      return false;
    }
  }

  @Override
  public String toString() {
    StringBuilder b = new StringBuilder(known == null ? "" : known.toString());
    opaque.forEach((s, e) -> b.append(b.length() > 0 ? " " : "").append(s).append(e == 1 ? "" : Integer.toString(e)));
    return b.length() == 0 ? "1" : b.toString();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof UnitAlgebra u && Objects.equals(toString(), u.toString());
  }

  @Override
  public int hashCode() {
    return toString().hashCode();
  }

  private static Unit udunits(String s) {
    try {
      return UnitFormatManager.instance().parse(s);
    } catch (Exception e) {
      throw new IllegalArgumentException("'" + s + "' is not a unit udunits knows");
    }
  }
}
