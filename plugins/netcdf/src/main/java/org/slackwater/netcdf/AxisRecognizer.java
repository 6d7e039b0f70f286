package org.slackwater.netcdf;

import java.util.Locale;
import java.util.Set;
import ucar.nc2.Variable;

/**
 * Recognises coordinate variables by their CF attributes: latitude and longitude by units
 * (CF 4.1, 4.2), standard_name or axis; time by units of the form {@code <unit> since <date>},
 * standard_name {@code time} or axis {@code T} (CF 4.4).
 */
final class AxisRecognizer {

  // CF 4.1 and 4.2 list these spellings of the latitude and longitude units.
  private static final Set<String> NORTH = Set.of("degrees_north", "degree_north", "degree_n", "degrees_n", "degreen", "degreesn");
  private static final Set<String> EAST = Set.of("degrees_east", "degree_east", "degree_e", "degrees_e", "degreee", "degreese");
  private static final Set<String> PLAIN_DEGREES = Set.of("degrees", "degree", "deg");

  private AxisRecognizer() {}

  static boolean isLatitude(Variable v) {
    return isGeographic(v, NORTH, "latitude", "Y");
  }

  static boolean isLongitude(Variable v) {
    return isGeographic(v, EAST, "longitude", "X");
  }

  static boolean isTime(Variable v) {
    String units = lower(Attributes.text(v, "units"));
    return (units != null && units.contains(" since "))
        || "time".equals(lower(Attributes.text(v, "standard_name")))
        || "t".equals(lower(Attributes.text(v, "axis")));
  }

  /** Whether {@code v} is a bounds (or climatology) variable named by another variable (CF 7.1, 7.4). */
  static boolean isBoundsOf(Variable candidate, Iterable<Variable> all) {
    for (Variable v : all) {
      if (v == candidate) {
        continue;
      }
      for (String attr : new String[] {"bounds", "climatology"}) {
        String name = Attributes.text(v, attr);
        if (name != null && name.equals(candidate.getShortName())) {
          return true;
        }
      }
    }
    return false;
  }

  private static boolean isGeographic(Variable v, Set<String> unitSpellings, String standardName, String axis) {
    String units = lower(Attributes.text(v, "units"));
    if (units != null && unitSpellings.contains(units)) {
      return true;
    }
    if (standardName.equals(lower(Attributes.text(v, "standard_name")))) {
      return true;
    }
    // An axis attribute alone also marks projection coordinates in metres; only degrees count.
    return axis.equalsIgnoreCase(Attributes.textOrEmpty(v, "axis"))
        && (units == null || PLAIN_DEGREES.contains(units) || unitSpellings.contains(units));
  }

  private static String lower(String s) {
    return s == null ? null : s.toLowerCase(Locale.ROOT);
  }
}
