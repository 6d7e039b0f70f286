package org.slackwater.core.region;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.sf.geographiclib.Geodesic;
import net.sf.geographiclib.PolygonArea;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class EllipsoidalAreaTest {

  @Test
  void totalAreaOfWgs84MatchesGeographicLibsPublishedValue() {
    // GeographicLib's own tests: WGS84 total area 510,065,621,724,088.5093 m^2 (../shared/REFERENCES.md).
    assertEquals(510_065_621_724_088.5093, EllipsoidalArea.cell(-90, 90, -180, 180), 0.5);
  }

  @Test
  void anOctantMatchesGeographicLibsPublishedValue() {
    // GeographicLib's tests: the octant (90,0),(0,0),(0,90) = 63,758,202,715,511.0 m^2; between the
    // equator and the pole and a quarter of the longitudes it is the cell 0..90 N, 0..90 E.
    assertEquals(63_758_202_715_511.0, EllipsoidalArea.cell(0, 90, 0, 90), 1.0);
  }

  /** Cells with parallels densified every 0.001 degree, against GeographicLib's geodesic polygon area. */
  @ParameterizedTest
  @CsvSource({"0, 1", "43.5, 44.5", "60, 61", "-45, -44"})
  void cellsAgreeWithGeographicLib(double south, double north) {
    PolygonArea p = new PolygonArea(Geodesic.WGS84, false);
    int n = 1000;
    for (int i = 0; i <= n; i++) {
      p.AddPoint(south, -31 + (double) i / n);
    }
    for (int i = 0; i <= n; i++) {
      p.AddPoint(north, -30 - (double) i / n);
    }
    double ref = Math.abs(p.Compute().area);
    // Chords between densified points cut the parallels by under 1e-8 of the area.
    assertEquals(ref, EllipsoidalArea.cell(south, north, -31, -30), 1e-7 * ref);
  }
}
