package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class UnitAlgebraTest {

  @Test
  void aSiteLineFromTurbidityToSuspendedSolidsComesOutInMilligramsPerLitre() {
    UnitAlgebra slope = UnitAlgebra.parse("mg/L/FNU");
    UnitAlgebra product = slope.multiply(UnitAlgebra.parse("FNU"));
    assertTrue(product.compatible(UnitAlgebra.parse("mg/L")));
    // 1 mg/L = 1 g/m3 = 1000 mg/m3 (SI prefixes; 1 L = 1e-3 m3).
    assertArrayEquals(new double[] {1000, 0}, product.conversionTo(UnitAlgebra.parse("mg m-3")), 1e-9);
  }

  @Test
  void opaqueSymbolsAreDifferentQuantities() {
    assertFalse(UnitAlgebra.parse("FNU").compatible(UnitAlgebra.parse("mg/L")));
    assertFalse(UnitAlgebra.parse("FNU").compatible(UnitAlgebra.parse("NTU")));
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> UnitAlgebra.parse("FNU").conversionTo(UnitAlgebra.parse("mg/L")));
    assertTrue(e.getMessage().contains("different quantities"), e.getMessage());
  }

  @Test
  void fluxIsDischargeTimesConcentration() {
    // m3 s-1 x mg/L = g/s (1 m3 x 1 mg/L = 1000 L x 1 mg/L = 1 g).
    UnitAlgebra flux = UnitAlgebra.parse("m3 s-1").multiply(UnitAlgebra.parse("mg/L"));
    assertArrayEquals(new double[] {1, 0}, flux.conversionTo(UnitAlgebra.parse("g/s")), 1e-9);
    assertEquals(UnitAlgebra.ONE, UnitAlgebra.parse("FNU").divide(UnitAlgebra.parse("FNU")));
  }

  @Test
  void aUnitAndItsReciprocalAreDifferentQuantities() {
    // ucar.units' isCompatible accepts m with m-1 (by identity); a length is not an attenuation.
    assertFalse(UnitAlgebra.parse("m").compatible(UnitAlgebra.parse("m-1")));
    assertFalse(UnitAlgebra.parse("s").compatible(UnitAlgebra.parse("Hz")));
    assertThrows(UnitConversion.UnitMismatchException.class, () -> UnitConversion.between("m", "m-1"));
    // 1/m and m-1 are one unit; km and m, degC and K, mg/L and g/m3 stay convertible (SI).
    assertEquals(1, UnitConversion.between("1/m", "m-1").scale(), 1e-12);
    assertEquals(1000, UnitConversion.between("km", "m").scale(), 1e-9);
    assertEquals(273.15, UnitConversion.between("degC", "K").offset(), 1e-9);
    assertEquals(1, UnitConversion.between("mg/L", "g/m3").scale(), 1e-12);
  }

  @Test
  void temperaturesConvertWithTheirOffset() {
    // degF = degC x 9/5 + 32.
    assertArrayEquals(new double[] {1.8, 32}, UnitAlgebra.parse("degC").conversionTo(UnitAlgebra.parse("degF")), 1e-9);
  }
}
