package org.slackwater.core.region;

/**
 * Cell areas on the WGS84 ellipsoid through the authalic (equal-area) latitude: the area between
 * two parallels and two meridians is a² Δλ [q(φ₂) − q(φ₁)] / 2 with
 * q(φ) = (1 − e²) [sin φ / (1 − e² sin² φ) − (1 / 2e) ln((1 − e sin φ) / (1 + e sin φ))]
 * (Snyder 1987, Map Projections — A Working Manual, eq. 3-12).
 *
 * <p>For weights within a small region the sphere ({@link SphericalArea}) differs from this by a
 * nearly constant factor, so area means barely change; area integrals (sums) change by up to
 * about 0.7 %, which is when this matters.
 */
public final class EllipsoidalArea {
  /** WGS84 semi-major axis (m) and flattening, as defined by the datum. */
  public static final double A = 6_378_137.0, F = 1 / 298.257223563;
  private static final double E2 = F * (2 - F), E = Math.sqrt(E2);

  private EllipsoidalArea() {}

  public static double cell(double latSouth, double latNorth, double lonWest, double lonEast) {
    return cellFromBand(band(latSouth, latNorth), lonWest, lonEast);
  }

  /** The latitude factor q(φ₂) − q(φ₁) of {@link #cell}, shared by every cell of a row. */
  static double band(double latSouth, double latNorth) {
    return q(latNorth) - q(latSouth);
  }

  /** {@link #cell} from its row's {@link #band}; the same operations in the same order, so the same bits. */
  static double cellFromBand(double band, double lonWest, double lonEast) {
    return A * A * Math.toRadians(lonEast - lonWest) * band / 2;
  }

  static double q(double latDeg) {
    double s = Math.sin(Math.toRadians(latDeg));
    return (1 - E2) * (s / (1 - E2 * s * s) - 1 / (2 * E) * Math.log((1 - E * s) / (1 + E * s)));
  }
}
