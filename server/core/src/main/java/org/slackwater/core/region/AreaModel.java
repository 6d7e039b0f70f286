package org.slackwater.core.region;

/**
 * The figure of the Earth that cell areas are measured on. The sphere of radius 6,371,000 m is
 * the usual choice for gridded products; WGS84 measures on the ellipsoid (authalic latitude).
 * For a cell cut by a region the inside area is the spherical inside area times the cell's
 * ellipsoid/sphere ratio; that ratio changes by under 1e-5 across a 0.1-degree cell.
 */
public enum AreaModel {
  SPHERE, WGS84;

  public double cell(double latSouth, double latNorth, double lonWest, double lonEast) {
    return this == SPHERE ? SphericalArea.cell(latSouth, latNorth, lonWest, lonEast)
        : EllipsoidalArea.cell(latSouth, latNorth, lonWest, lonEast);
  }

  /** The part of {@link #cell} that depends on latitude only, computed once per grid row. */
  double band(double latSouth, double latNorth) {
    return this == SPHERE ? SphericalArea.band(latSouth, latNorth) : EllipsoidalArea.band(latSouth, latNorth);
  }

  /** {@link #cell} from its row's {@link #band}: bit for bit the same value. */
  double cellFromBand(double band, double lonWest, double lonEast) {
    return this == SPHERE ? SphericalArea.cellFromBand(band, lonWest, lonEast) : EllipsoidalArea.cellFromBand(band, lonWest, lonEast);
  }
}
