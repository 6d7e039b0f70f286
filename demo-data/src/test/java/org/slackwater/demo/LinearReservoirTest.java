package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/**
 * The linear reservoir (storage S, outflow Q = S / k; Chow, Maidment and Mays, Applied Hydrology,
 * 1988, ch. 8, from memory) in its explicit daily form: the unit impulse response is
 * Q(t) = (1/k)(1 - 1/k)^(t-1) for t >= 1, and mass is conserved.
 */
class LinearReservoirTest {

  @Test
  void impulseResponseIsTheDiscreteExponential() {
    double k = 5;
    LinearReservoir r = new LinearReservoir(k, 0);
    assertEquals(0, r.step(1), 0, "same-day outflow is zero: the lag");
    for (int t = 1; t <= 30; t++) {
      assertEquals(1 / k * Math.pow(1 - 1 / k, t - 1), r.step(0), 1e-15, "day " + t);
    }
  }

  @Test
  void massIsConserved() {
    LinearReservoir r = new LinearReservoir(25, 10);
    double in = 0;
    double out = 0;
    for (int t = 0; t < 400; t++) {
      double rain = (t % 7 == 0) ? 12 : 0;
      in += rain;
      out += r.step(rain);
    }
    assertEquals(10 + in, out + r.storage(), 1e-9);
  }

  @Test
  void steadyInflowGivesEqualOutflow() {
    LinearReservoir r = new LinearReservoir(25, 0);
    double q = 0;
    for (int t = 0; t < 2000; t++) {
      q = r.step(3);
    }
    assertEquals(3, q, 1e-9);
  }

  @Test
  void rejectsResidenceTimesBelowOneDay() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new LinearReservoir(0.5, 0));
    assertEquals("residence time must be at least 1 day, got 0.5", e.getMessage());
  }
}
