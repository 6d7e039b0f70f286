package org.slackwater.core.region;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.Polygon;

/**
 * Areas on a sphere of radius {@link #EARTH_RADIUS_M} for shapes whose edges are straight lines in
 * longitude/latitude (as GeoJSON and WKT in degrees define them, RFC 7946 section 3.1.1).
 *
 * <p>For such a shape the area is R² ∬ cos φ dφ dλ, which Green's theorem turns into the exact
 * line integral R² ∮ sin φ dλ. Along an edge where φ varies linearly with λ the integral has the
 * closed form Δλ (cos φ₁ − cos φ₂) / Δφ (and Δλ sin φ when Δφ = 0). For a lat/lon cell this gives
 * R² Δλ (sin φ₂ − sin φ₁), the cell area the CF conventions use for area weighting (section 7.2).
 *
 * <p>The sphere is the usual choice for gridded products; the WGS84 ellipsoid differs by up to
 * about 0.7 % in cell area at mid-latitudes, and equally for every cell of a row, so area-weighted
 * means within a small region are nearly unaffected.
 */
public final class SphericalArea {

  /** Mean Earth radius in metres (IUGG mean radius R1, rounded as commonly used). */
  public static final double EARTH_RADIUS_M = 6_371_000.0;

  private SphericalArea() {}

  /** Area in m² of the cell between two parallels and two meridians (degrees). */
  public static double cell(double latSouth, double latNorth, double lonWest, double lonEast) {
    return EARTH_RADIUS_M * EARTH_RADIUS_M
        * Math.toRadians(lonEast - lonWest)
        * (Math.sin(Math.toRadians(latNorth)) - Math.sin(Math.toRadians(latSouth)));
  }

  /** Area in m² of a polygonal geometry in lon/lat degrees (holes subtracted); 0 for points and lines. */
  public static double of(Geometry geometry) {
    double sum = 0;
    for (int i = 0; i < geometry.getNumGeometries(); i++) {
      Geometry part = geometry.getGeometryN(i);
      if (part instanceof Polygon p) {
        sum += Math.abs(ringIntegral(p.getExteriorRing()));
        for (int h = 0; h < p.getNumInteriorRing(); h++) {
          sum -= Math.abs(ringIntegral(p.getInteriorRingN(h)));
        }
      } else if (part.getNumGeometries() > 1 || part != geometry) {
        sum += of(part);
      }
    }
    return sum * EARTH_RADIUS_M * EARTH_RADIUS_M;
  }

  /** ∮ sin φ dλ (radians) around a closed ring; its sign follows the ring's orientation. */
  static double ringIntegral(LineString ring) {
    Coordinate[] c = ring.getCoordinates();
    double s = 0;
    for (int i = 0; i + 1 < c.length; i++) {
      s += edgeIntegral(c[i].x, c[i].y, c[i + 1].x, c[i + 1].y);
    }
    return s;
  }

  private static double edgeIntegral(double lon1, double lat1, double lon2, double lat2) {
    double dLon = Math.toRadians(lon2 - lon1);
    double p1 = Math.toRadians(lat1), p2 = Math.toRadians(lat2);
    double dLat = p2 - p1;
    if (Math.abs(dLat) < 1e-12) {
      return dLon * Math.sin(0.5 * (p1 + p2));
    }
    return dLon * (Math.cos(p1) - Math.cos(p2)) / dLat;
  }
}
