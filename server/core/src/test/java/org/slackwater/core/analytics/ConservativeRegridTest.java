package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.region.SphericalArea;

class ConservativeRegridTest {

  private static double integral(LatLonGrid g, double[] v) {
    double s = 0;
    for (int y = 0; y < g.ny(); y++) {
      for (int x = 0; x < g.nx(); x++) {
        s += v[y * g.nx() + x] * SphericalArea.cell(g.latLower(y), g.latUpper(y), g.lonLower(x), g.lonUpper(x));
      }
    }
    return s;
  }

  /** Issue check: regridding conserves the area integral to 1e-9 relative on random fields. */
  @Test
  void theAreaIntegralIsConservedOnRandomFields() {
    LatLonGrid fine = LatLonGrid.regular(43.5, -32, 0.02, 0.02, 75, 100);   // 1.5 x 2 degrees
    LatLonGrid coarse = LatLonGrid.regular(43.5, -32, 0.25, 0.25, 6, 8);    // the same box
    LatLonGrid odd = LatLonGrid.regular(43.5, -32, 0.075, 0.0625, 20, 32);  // cells not aligned with either
    SplittableRandom rnd = new SplittableRandom(42);
    for (int trial = 0; trial < 5; trial++) {
      double[] f = new double[fine.cells()];
      for (int i = 0; i < f.length; i++) {
        f[i] = rnd.nextDouble() * 40 - 5;
      }
      double total = integral(fine, f);
      for (LatLonGrid target : new LatLonGrid[] {coarse, odd}) {
        double[] g = new ConservativeRegrid(fine, target).apply(f);
        assertEquals(total, integral(target, g), 1e-9 * Math.abs(total));
        double[] back = new ConservativeRegrid(target, fine).apply(g);
        assertEquals(total, integral(fine, back), 1e-9 * Math.abs(total));
      }
    }
  }

  @Test
  void aConstantStaysConstantAndMissingValuesAreLeftOut() {
    LatLonGrid a = LatLonGrid.regular(0, 0, 1, 1, 2, 2), b = LatLonGrid.regular(0, 0, 2, 2, 1, 1);
    assertEquals(7.0, new ConservativeRegrid(a, b).apply(new double[] {7, 7, 7, 7})[0], 1e-12);
    // One missing quarter: the mean of the other three, weighted by their areas.
    double[] v = {1, 2, 3, Double.NaN};
    double w0 = SphericalArea.cell(0, 1, 0, 1), w1 = w0, w2 = SphericalArea.cell(1, 2, 0, 1);
    assertEquals((w0 * 1 + w1 * 2 + w2 * 3) / (w0 + w1 + w2), new ConservativeRegrid(a, b).apply(v)[0], 1e-12);
    assertTrue(Double.isNaN(new ConservativeRegrid(a, b).apply(new double[] {Double.NaN, Double.NaN, Double.NaN, Double.NaN})[0]));
    assertEquals(1.0, new ConservativeRegrid(a, b).coveredFraction(0, 0), 1e-12);
  }
}
