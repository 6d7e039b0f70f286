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
