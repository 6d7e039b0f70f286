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
 * Rings are integrated as ∮ (sin φ − sin φ₀) dλ with φ₀ the first vertex's latitude (equal, since
 * ∮ dλ = 0), so a small polygon far from the equator is not the difference of large terms.
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
    return cellFromBand(band(latSouth, latNorth), lonWest, lonEast);
  }

  /** The latitude factor sin φ₂ − sin φ₁ of {@link #cell}, shared by every cell of a row. */
  static double band(double latSouth, double latNorth) {
    return Math.sin(Math.toRadians(latNorth)) - Math.sin(Math.toRadians(latSouth));
  }

  /** {@link #cell} from its row's {@link #band}; the same operations in the same order, so the same bits. */
  static double cellFromBand(double band, double lonWest, double lonEast) {
    return EARTH_RADIUS_M * EARTH_RADIUS_M * Math.toRadians(lonEast - lonWest) * band;
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

  /** ∮ sin φ dλ (radians) around a closed ring; its sign follows the ring's orientation (negative if counter-clockwise). */
  static double ringIntegral(LineString ring) {
    Coordinate[] c = ring.getCoordinates();
    if (c.length == 0) {
      return 0;
    }
    // ∮ sin φ₀ dλ = 0 around a closed ring, so integrating sin φ − sin φ₀ gives the same value
    // without cancelling large terms against each other.
    double ref = Math.toRadians(c[0].y);
    double s = 0;
    for (int i = 0; i + 1 < c.length; i++) {
      s += edgeIntegral(c[i].x, c[i].y, c[i + 1].x, c[i + 1].y, ref);
    }
    return s;
  }

  /**
   * ∫ (sin φ − sin φ₀) dλ (radians) along the edge from (lon1, lat1) to (lon2, lat2) in degrees,
   * straight in lon/lat, with φ₀ = {@code ref} in radians. With m and h the half sum and half
   * difference of the end latitudes, ∫ sin φ dλ = Δλ (cos φ₁ − cos φ₂) / Δφ = Δλ sin m · sin h / h;
   * written as Δλ [(sin m − sin φ₀) + sin m (sin h / h − 1)] with sin m − sin φ₀ as a product of
   * sines it loses no digits to cancellation, even for an edge a few ulps from horizontal.
   */
  static double edgeIntegral(double lon1, double lat1, double lon2, double lat2, double ref) {
    double dLon = Math.toRadians(lon2 - lon1);
    if (dLon == 0) {
      return 0;
    }
    double p1 = Math.toRadians(lat1), p2 = Math.toRadians(lat2);
    double m = 0.5 * (p1 + p2), h = 0.5 * (p2 - p1);
    return dLon * (sinDifference(m, ref) + Math.sin(m) * sincMinusOne(h));
  }

  /** sin a − sin b = 2 cos((a + b) / 2) sin((a − b) / 2), accurate when a and b are close. */
  static double sinDifference(double a, double b) {
    return 2 * Math.cos(0.5 * (a + b)) * Math.sin(0.5 * (a - b));
  }

  /** sin h / h − 1; by its Taylor series (error below h⁸/362880) where the quotient would cancel. */
  private static double sincMinusOne(double h) {
    double h2 = h * h;
    if (Math.abs(h) < 1e-2) {
      return h2 * (-1.0 / 6 + h2 * (1.0 / 120 - h2 / 5040));
    }
    return Math.sin(h) / h - 1;
  }
}
