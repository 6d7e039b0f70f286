package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.sf.geographiclib.Geodesic;
import org.junit.jupiter.api.Test;

/** The local kilometre frame and the masks built on it. */
class GeographyTest {

  private final WrenmouthGeography geo = new WrenmouthGeography();

  @Test
  void localKilometresAgreeWithWgs84Geodesics() {
    // GeographicLib (Karney 2013) WGS84 inverse problem as the reference; the equirectangular frame
    // is meant to be good to well under 1 % across the scenario.
    double[][] pairs = {
        {WrenmouthGeography.MOUTH_LAT, WrenmouthGeography.MOUTH_LON, WrenmouthGeography.BAY_LAT, WrenmouthGeography.BAY_LON},
        {44.60, -31.78, 43.90, -30.85},
        {44.30, -32.20, 44.30, -31.35}};
    for (double[] p : pairs) {
      double ref = Geodesic.WGS84.Inverse(p[0], p[1], p[2], p[3]).s12 / 1000;
      double ours = LocalProjection.distanceKm(p[1], p[0], p[3], p[2]);
      assertEquals(ref, ours, 0.01 * ref, "distance " + java.util.Arrays.toString(p));
    }
  }

  @Test
  void alongAxisRunsFromMouthToOuterBay() {
    assertEquals(0, geo.alongKm(WrenmouthGeography.MOUTH_LON, WrenmouthGeography.MOUTH_LAT), 1e-9);
    assertEquals(geo.lengthKm(), geo.alongKm(WrenmouthGeography.BAY_LON, WrenmouthGeography.BAY_LAT), 1e-9);
    double ref = Geodesic.WGS84.Inverse(WrenmouthGeography.MOUTH_LAT, WrenmouthGeography.MOUTH_LON,
        WrenmouthGeography.BAY_LAT, WrenmouthGeography.BAY_LON).s12 / 1000;
    assertEquals(ref, geo.lengthKm(), 0.01 * ref);
  }

  @Test
  void segmentLookupFollowsTheMapFromMouthSeaward() {
    double[] upper = geo.axisPoint(0.1 * geo.lengthKm(), 0);
    double[] mid = geo.axisPoint(0.5 * geo.lengthKm(), 0);
    double[] outer = geo.axisPoint(0.9 * geo.lengthKm(), 0);
    assertEquals(WrenmouthGeography.UPPER_REACH, geo.segmentAt(upper[0], upper[1]).orElseThrow());
    assertEquals(WrenmouthGeography.MID_REACH, geo.segmentAt(mid[0], mid[1]).orElseThrow());
    assertEquals(WrenmouthGeography.OUTER_BAY, geo.segmentAt(outer[0], outer[1]).orElseThrow());
    assertTrue(geo.segmentAt(-31.78, 44.60).isEmpty(), "the watershed is land");
    assertTrue(geo.isInWatershed(-31.78, 44.60));
  }

  @Test
  void aGridWithoutWaterIsRejectedWithAnExplanation() {
    GridSpec elsewhere = new GridSpec("elsewhere", 40.0, 40.5, -20.5, -20.0, 3, 3, false, false);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> geo.waterCells(elsewhere));
    assertEquals("grid elsewhere (3 x 3 cells) has no cell centre in the estuary; use a smaller resolution divisor",
        e.getMessage());
  }
}
