package org.slackwater.netcdf;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The canonical unit table, checked against the physical definitions named per case. */
class CanonicalUnitsTest {

  private static LinearConversion resolve(String units, String standardName) throws Problem {
    return CanonicalUnits.resolve(units, standardName, "");
  }

  @ParameterizedTest(name = "{0} ({1}) -> {2}")
  @CsvSource({
    // SI brochure 2.3.4: t/degC = T/K - 273.15.
    "K, sea_water_temperature, degC, 1, -273.15",
    "degC, , degC, 1, 0",
    "celsius, , degC, 1, 0",
    // (t/degF - 32) / 1.8 (NIST SP 811, from memory): scale 5/9, offset -160/9.
    "degF, air_temperature, degC, 0.5555555555555556, -17.77777777777778",
    // Anomalies: a difference of 1 K is 1 degC.
    "K, surface_temperature_anomaly, degC, 1, 0",
    // Fresh water 1000 kg m-3: 1 kg m-2 = 1 mm; 86400 s per day (common practice).
    "kg m-2 s-1, precipitation_flux, mm/day, 86400, 0",
    "kg m-2 s-1, , mm/day, 86400, 0",
    "g m-2 s-1, runoff_flux, mm/day, 86.4, 0",
    "mm h-1, lwe_precipitation_rate, mm/day, 24, 0",
    "m s-1, lwe_precipitation_rate, mm/day, 86400000, 0",
    "mm/day, precipitation_flux, mm/day, 1, 0",
    // SI prefixes: 1 ug L-1 = 1e-9 kg / 1e-3 m3 = 1 mg m-3; 1 g m-3 = 1000 mg m-3.
    "ug L-1, mass_concentration_of_chlorophyll_a_in_sea_water, mg m-3, 1, 0",
    "g m-3, , mg m-3, 1000, 0",
    "\u00b5g/L, , mg m-3, 1, 0",
    "%, , 1, 0.01, 0",
    "percent, , 1, 0.01, 0",
    "1, , 1, 1, 0",
    "%, sea_ice_area_fraction, 1, 0.01, 0",
  })
  void convertsToTheCanonicalUnit(String units, String standardName, String canonical, double scale, double offset)
      throws Problem {
    LinearConversion c = resolve(units, standardName);
    assertEquals(canonical, c.unit());
    assertEquals(scale, c.scale(), 1e-12 * Math.abs(scale));
    assertEquals(offset, c.offset(), 1e-9);
  }

  @ParameterizedTest
  @CsvSource({
    "FNU, ", "NTU, ", "FTU, ", "ntu, ",
    // Known to udunits but not in the table.
    "1e-3, sea_water_salinity", "m, sea_floor_depth_below_sea_surface", "kg m-3, sea_water_density",
    "m s-1, sea_water_speed", "mol m-3, ", "kg m-2 s-1, surface_downward_mass_flux_of_carbon_dioxide_expressed_as_carbon",
  })
  void keptAsDeclared(String units, String standardName) throws Problem {
    LinearConversion c = resolve(units, standardName);
    assertEquals(units, c.unit());
    assertTrue(c.isIdentity());
  }

  @Test
  void lengthPerTimeIsRainOnlyWhenNamedSo() throws Problem {
    assertEquals("m s-1", CanonicalUnits.resolve("m s-1", null, "tidal current speed").unit());
    LinearConversion rain = CanonicalUnits.resolve("mm h-1", null, "Harle catchment rainfall");
    assertEquals("mm/day", rain.unit());
    assertEquals(24, rain.scale(), 1e-12);
  }

  @Test
  void refusals() {
    Problem zz = assertThrows(Problem.class, () -> resolve("zz", null));
    assertEquals("units 'zz' are not understood; write a udunits string such as 'K' or 'mg m-3'", zz.getMessage());
    assertThrows(Problem.class, () -> resolve("furlongs per fortnightz", null));
    Problem fit = assertThrows(Problem.class, () -> resolve("mg m-3", "sea_water_temperature"));
    assertEquals("units 'mg m-3' do not fit standard_name 'sea_water_temperature', which needs a temperature such as"
        + " 'K' or 'degC'; correct the units or the standard_name", fit.getMessage());
    assertThrows(Problem.class, () -> resolve("NTU", "sea_water_temperature"));
    assertThrows(Problem.class, () -> resolve("K", "precipitation_flux"));
    Problem none = assertThrows(Problem.class, () -> resolve(" ", "precipitation_flux"));
    assertEquals("units are missing, but standard_name 'precipitation_flux' needs a mass flux such as 'kg m-2 s-1' or a"
        + " rate such as 'mm/day'; add a units attribute", none.getMessage());
  }
}
