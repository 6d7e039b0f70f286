package org.slackwater.core.region;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.sf.geographiclib.Geodesic;
import net.sf.geographiclib.PolygonArea;
import net.sf.geographiclib.PolygonResult;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.io.WKTReader;

class SphericalAreaTest {

  @Test
  void oneDegreeCellsMatchTheClosedForm() {
    // CF conventions 7.2: area weighting of lat/lon cells is proportional to dlon (sin lat2 - sin lat1).
    // Values from ../shared/REFERENCES.md, computed from A = R^2 dlon (sin lat2 - sin lat1), R = 6371000 m.
    assertEquals(12_363_683_990.0, SphericalArea.cell(0, 1, 0, 1), 1.0);
    assertEquals(6_088_401_114.0, SphericalArea.cell(60, 61, 10, 11), 1.0);
  }

  @Test
  void wholeSphereIsFourPiRSquared() {
    // Textbook: the area of a sphere is 4 pi R^2.
    double r = SphericalArea.EARTH_RADIUS_M;
    assertEquals(4 * Math.PI * r * r, SphericalArea.cell(-90, 90, -180, 180), 1e-6 * r * r);
  }

  @Test
  void polygonAreaOfAnAxisAlignedBoxEqualsTheCellFormula() throws Exception {
    Geometry box = new WKTReader().read("POLYGON((-31.5 43.75, -30.5 43.75, -30.5 44.5, -31.5 44.5, -31.5 43.75))");
    assertEquals(SphericalArea.cell(43.75, 44.5, -31.5, -30.5), SphericalArea.of(box), 1e-12 * SphericalArea.of(box));
  }

  @Test
  void holesAreSubtractedAndOrientationDoesNotMatter() throws Exception {
    Geometry cw = new WKTReader().read("POLYGON((0 0, 0 2, 2 2, 2 0, 0 0), (0.5 0.5, 1.5 0.5, 1.5 1.5, 0.5 1.5, 0.5 0.5))");
    double expected = SphericalArea.cell(0, 2, 0, 2) - SphericalArea.cell(0.5, 1.5, 0.5, 1.5);
    assertEquals(expected, SphericalArea.of(cw), 1e-3);
  }

  /**
   * One edge's ∫ (sin φ − sin φ₀) dλ against Gauss-Legendre quadrature of the same integrand
   * (Hipparchus GaussIntegratorFactory, high-precision Legendre rule) along φ linear in λ: a cell-sized edge, one a
   * 1e-9 degree from horizontal (where Δλ (cos φ₁ − cos φ₂) / Δφ would lose most of its digits to
   * cancellation), a long steep edge, and a westward one.
   */
  @ParameterizedTest
  @CsvSource({"-31.0, 44.0, -30.99, 44.004, 44.0", "-31.0, 44.00007, -30.99, 44.000070001, 44.0",
      "-31.5, 43.2, -30.8, 45.9, 43.2", "-30.2, 44.61, -30.21, 44.6, 44.6"})
  void edgeIntegralMatchesQuadrature(double lon1, double lat1, double lon2, double lat2, double refDeg) {
    double l1 = Math.toRadians(lon1), l2 = Math.toRadians(lon2), p1 = Math.toRadians(lat1), p2 = Math.toRadians(lat2);
    double ref = Math.toRadians(refDeg);
    // sin φ − sin φ₀ = 2 cos((φ + φ₀) / 2) sin((φ − φ₀) / 2), so the integrand keeps its digits near φ₀.
    org.hipparchus.analysis.UnivariateFunction f = l -> {
      double p = p1 + (l - l1) * (p2 - p1) / (l2 - l1);
      return 2 * Math.cos(0.5 * (p + ref)) * Math.sin(0.5 * (p - ref));
    };
    // A 12-point rule integrates this smooth integrand over at most a few degrees to rounding.
    double quad = new org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory()
        .legendreHighPrecision(12, Math.min(l1, l2), Math.max(l1, l2)).integrate(f) * Math.signum(l2 - l1);
    // Latitudes in radians carry about 1e-16 of rounding, which moves the integral by up to
    // |Δλ| 1e-16 whatever the formula; beyond that both must agree to 1e-12. (The former closed
    // form Δλ (cos φ₁ − cos φ₂) / Δφ is off by about 1e-5 Δλ on the nearly horizontal edge.)
    assertEquals(quad, SphericalArea.edgeIntegral(lon1, lat1, lon2, lat2, ref), 1e-12 * Math.abs(quad) + 1e-15 * Math.abs(l2 - l1));
  }

  @Test
  void aSmallCellFarFromTheEquatorKeepsItsDigits() throws Exception {
    // sin b − sin a = 2 cos((a + b) / 2) sin((b − a) / 2) (trigonometric identity): a 0.001-degree
    // cell at 60 N from the polygon integral, to 1e-12.
    double s = 60.0, n = 60.001, w = 10.0, e = 10.001;
    double a = Math.toRadians(s), b = Math.toRadians(n), r = SphericalArea.EARTH_RADIUS_M;
    double expected = r * r * Math.toRadians(e - w) * 2 * Math.cos(0.5 * (a + b)) * Math.sin(0.5 * (b - a));
    Geometry cell = new WKTReader().read("POLYGON((10.0 60.0, 10.001 60.0, 10.001 60.001, 10.0 60.001, 10.0 60.0))");
    assertEquals(expected, SphericalArea.of(cell), 1e-12 * expected);
  }

  /**
   * The sphere against GeographicLib's geodesic polygon area on WGS84 (Karney 2013). The cells'
   * parallels are not geodesics, so each parallel edge is densified every 0.001 degree; the chord
   * error is then below 1e-9 relative. Expected ratio: the WGS84 area element over the sphere's is
   * a^2 (1 - e^2) / (R^2 (1 - e^2 sin^2 phi)^2), from 0.99553 at the equator to 1.00899 at the
   * poles (a = 6378137 m, e^2 = 0.00669438, R = 6371000 m); we check the computed ratio to 1e-4
   * against that formula at the cell's mid-latitude, and the bound of 1 % everywhere.
   */
  @ParameterizedTest
  @CsvSource({"0, 1", "43.5, 44.5", "60, 61", "-45, -44", "80, 81"})
  void sphereAgreesWithGeographicLibOnWgs84(double south, double north) {
    double west = -31, east = -30;
    PolygonArea p = new PolygonArea(Geodesic.WGS84, false);
    int n = 1000;
    for (int i = 0; i <= n; i++) {
      p.AddPoint(south, west + (east - west) * i / n);
    }
    for (int i = 0; i <= n; i++) {
      p.AddPoint(north, east - (east - west) * i / n);
    }
    PolygonResult r = p.Compute();
    double ellipsoid = Math.abs(r.area);
    double sphere = SphericalArea.cell(south, north, west, east);
    double a = 6378137.0, f = 1 / 298.257223563, e2 = f * (2 - f), rr = SphericalArea.EARTH_RADIUS_M;
    double s = Math.sin(Math.toRadians(0.5 * (south + north)));
    double expectedRatio = a * a * (1 - e2) / (rr * rr * Math.pow(1 - e2 * s * s, 2));
    assertEquals(expectedRatio, ellipsoid / sphere, 1e-4);
    assertTrue(Math.abs(ellipsoid / sphere - 1) < 0.01);
  }
}
