package org.slackwater.demo;

/**
 * A regular latitude-longitude grid of one file, with the cell order in which it is written.
 *
 * <p>Longitudes are held in -180..180 for computation; {@code lon360} only changes how the file states
 * them (0..360). With {@code latDescending} row 0 is the northernmost row. Cell {@code (row, col)} has
 * flat index {@code row * nLon + col}, which is also its position in a written (lat, lon) slab.
 *
 * <p>Immutable; the factory rejects empty or inverted extents with {@link IllegalArgumentException}.
 */
record GridSpec(String name, double south, double north, double west, double east, int nLat, int nLon,
                boolean latDescending, boolean lon360) {

  /** No grid is made coarser than this many cells per direction. */
  static final int MIN_CELLS = 3;

  GridSpec {
    if (!(north > south) || !(east > west) || nLat < 1 || nLon < 1) {
      throw new IllegalArgumentException("grid " + name + " has an empty extent or no cells");
    }
  }

  /**
   * A grid over the given box whose nominal resolution {@code resDeg} is made {@code divisor} times
   * coarser per direction: cells per direction = max(3, round(extent / res) / divisor).
   */
  static GridSpec of(String name, double south, double north, double west, double east, double resDeg,
                     int divisor, boolean latDescending, boolean lon360) {
    int nLat = Math.max(MIN_CELLS, (int) Math.round((north - south) / resDeg) / divisor);
    int nLon = Math.max(MIN_CELLS, (int) Math.round((east - west) / resDeg) / divisor);
    return new GridSpec(name, south, north, west, east, nLat, nLon, latDescending, lon360);
  }

  double dLat() {
    return (north - south) / nLat;
  }

  double dLon() {
    return (east - west) / nLon;
  }

  int cells() {
    return nLat * nLon;
  }

  /** Latitude of the centre of written row {@code row}. */
  double lat(int row) {
    return latDescending ? north - (row + 0.5) * dLat() : south + (row + 0.5) * dLat();
  }

  /** Longitude (-180..180) of the centre of column {@code col}. */
  double lon(int col) {
    return west + (col + 0.5) * dLon();
  }

  /** Longitude of column {@code col} as the file states it. */
  double fileLon(int col) {
    return lon(col) + (lon360 ? 360 : 0);
  }

  /** The two latitude bounds of row {@code row}, ordered like the coordinate (CF 7.1). */
  double[] latBounds(int row) {
    double c = lat(row);
    double h = dLat() / 2;
    return latDescending ? new double[] {c + h, c - h} : new double[] {c - h, c + h};
  }

  double[] fileLonBounds(int col) {
    double c = fileLon(col);
    double h = dLon() / 2;
    return new double[] {c - h, c + h};
  }

  double cellLon(int flat) {
    return lon(flat % nLon);
  }

  double cellLat(int flat) {
    return lat(flat / nLon);
  }

  /**
   * Fractional row coordinate of {@code lat} (0 at the centre of row 0), for interpolation; may lie
   * outside 0..nLat-1 near the edges.
   */
  double rowOf(double lat) {
    return latDescending ? (north - lat) / dLat() - 0.5 : (lat - south) / dLat() - 0.5;
  }

  double colOf(double lon) {
    return (lon - west) / dLon() - 0.5;
  }
}
