package org.slackwater.demo;

import java.util.List;

/** The metadata of the six data files, in manifest order. */
final class ScenarioVariables {

  static final VariableSpec RAINFALL = new VariableSpec("rainfall.nc", "rainfall", "precipitation_flux",
      "daily mean rainfall rate", "kg m-2 s-1", false, TimeEncoding.STANDARD_DAYS,
      "Wrenmouth demo: daily rainfall over the Harle watershed and estuary", 0, Double.NaN);
  static final VariableSpec RUNOFF = new VariableSpec("runoff.nc", "runoff", "runoff_flux",
      "daily runoff from the Harle watershed (conceptual model)", "mm d-1", false, TimeEncoding.NOLEAP_DAYS,
      "Wrenmouth demo: daily modelled runoff of the Harle watershed (365-day calendar)", 0, Double.NaN);
  static final VariableSpec WATER_TEMPERATURE = new VariableSpec("water_temperature.nc", "water_temperature",
      "sea_water_temperature", "daily mean water temperature", "K", false, TimeEncoding.STANDARD_DAYS,
      "Wrenmouth demo: daily water temperature of the estuary", Double.NaN, Double.NaN);
  static final VariableSpec CLOUD_FRACTION = new VariableSpec("cloud_fraction.nc", "cloud_fraction",
      "cloud_area_fraction", "daily mean cloud area fraction", "1", false, TimeEncoding.STANDARD_DAYS,
      "Wrenmouth demo: daily cloud fraction (longitudes 0-360)", 0, 1);
  static final VariableSpec TURBIDITY = new VariableSpec("turbidity.nc", "turbidity", "sea_water_turbidity",
      "daily turbidity seen from space (gaps under cloud)", "FNU", true, TimeEncoding.STANDARD_DAYS,
      "Wrenmouth demo: daily satellite-like turbidity of the estuary", 0, TurbidityModel.MAX_FNU);
  static final VariableSpec CHLOROPHYLL = new VariableSpec("chlorophyll.nc", "chlorophyll",
      "mass_concentration_of_chlorophyll_a_in_sea_water", "daily chlorophyll-a seen from space (gaps under cloud)",
      "mg m-3", false, TimeEncoding.NOON_HOURS,
      "Wrenmouth demo: daily satellite-like chlorophyll-a of the estuary", 0, Double.NaN);

  static final List<VariableSpec> ALL = List.of(RAINFALL, RUNOFF, WATER_TEMPERATURE, CLOUD_FRACTION, TURBIDITY,
      CHLOROPHYLL);

  private ScenarioVariables() {
  }
}
