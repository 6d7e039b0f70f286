package org.slackwater.demo;

/**
 * Equirectangular kilometres around the scenario's centre (44.1 N, 31.1 W). Accurate to a fraction of
 * a percent across the 150 km of the scenario, which is all an invented landscape needs; it is used to
 * lay out shapes and to measure decay distances, never for published distances.
 */
final class LocalProjection {

  static final double LON0 = -31.1;
  static final double LAT0 = 44.1;
  /** Kilometres per degree of longitude at LAT0 (111.32 km times cos 44.1 deg). */
  static final double KM_PER_DEG_LON = 111.32 * Math.cos(Math.toRadians(LAT0));
  /** Kilometres per degree of latitude (mean meridian degree, 111.0 km). */
  static final double KM_PER_DEG_LAT = 111.0;

  private LocalProjection() {
  }

  static double xKm(double lon) {
    return (lon - LON0) * KM_PER_DEG_LON;
  }

  static double yKm(double lat) {
    return (lat - LAT0) * KM_PER_DEG_LAT;
  }

  static double lon(double xKm) {
    return LON0 + xKm / KM_PER_DEG_LON;
  }

  static double lat(double yKm) {
    return LAT0 + yKm / KM_PER_DEG_LAT;
  }

  static double distanceKm(double lon1, double lat1, double lon2, double lat2) {
    return Math.hypot(xKm(lon1) - xKm(lon2), yKm(lat1) - yKm(lat2));
  }
}
