package org.slackwater.netcdf;

import java.util.Locale;
import java.util.regex.Pattern;

/**
 * The quantities Slackwater delivers in one canonical unit, and how a CF standard_name names
 * them. A standard_name outside these patterns names no quantity here; the variable's units then
 * decide on their own (see {@link CanonicalUnits}).
 */
enum Quantity {
  /** Absolute temperature, delivered in degC. */
  TEMPERATURE("degC"),
  /** A temperature difference (anomaly): degC too, but converted by the scale alone. */
  TEMPERATURE_DIFFERENCE("degC"),
  /** Precipitation, runoff, evaporation as water depth per time, delivered in mm/day. */
  WATER_FLUX("mm/day"),
  /** Mass per volume, delivered in mg m-3 (equal to ug L-1). */
  MASS_CONCENTRATION("mg m-3"),
  /** A dimensionless fraction, delivered as a plain number in unit 1. */
  FRACTION("1");

  private static final Pattern WATER_FLUX_NAME =
      Pattern.compile(".*(precipitation|rainfall|snowfall|runoff|evaporation).*_(flux|rate)");

  private final String canonicalUnit;

  Quantity(String canonicalUnit) {
    this.canonicalUnit = canonicalUnit;
  }

  String canonicalUnit() {
    return canonicalUnit;
  }

  /** The quantity a CF standard_name names, or null if it is not one of ours. */
  static Quantity ofStandardName(String standardName) {
    if (standardName == null || standardName.isBlank()) {
      return null;
    }
    String s = standardName.trim().toLowerCase(Locale.ROOT);
    if (s.contains("temperature") && (s.endsWith("_anomaly") || s.contains("_difference"))) {
      return TEMPERATURE_DIFFERENCE;
    }
    if (s.endsWith("temperature")) {
      return TEMPERATURE;
    }
    if (!s.contains("heat") && WATER_FLUX_NAME.matcher(s).matches()) {
      return WATER_FLUX;
    }
    if (s.startsWith("mass_concentration_of_")) {
      return MASS_CONCENTRATION;
    }
    if (s.endsWith("_fraction")) {
      return FRACTION;
    }
    return null;
  }

  /** What the units must express, for messages. */
  String expected() {
    return switch (this) {
      case TEMPERATURE, TEMPERATURE_DIFFERENCE -> "a temperature such as 'K' or 'degC'";
      case WATER_FLUX -> "a mass flux such as 'kg m-2 s-1' or a rate such as 'mm/day'";
      case MASS_CONCENTRATION -> "a mass concentration such as 'mg m-3' or 'ug L-1'";
      case FRACTION -> "a dimensionless fraction such as '1' or '%'";
    };
  }
}
