package org.slackwater.core.cube;

import java.util.Arrays;
import java.util.Objects;

/**
 * A regular (rectilinear) latitude/longitude grid with known cell bounds, in the orientation every
 * cube is stored in: latitudes ascending (row 0 is the southern-most row), longitudes ascending and
 * contiguous, in degrees east within [-180, 360).
 *
 * <p>Sources normalise their files to this orientation (flipping descending latitudes, rotating
 * 0-360 longitudes) so that the store, the region weights and every operator see one layout. Cell
 * {@code (y, x)} spans {@code [latLower[y], latUpper[y]] x [lonLower[x], lonUpper[x]]}.
 *
 * <p>Arrays are copied on the way in and out; the record is immutable.
 */
public record LatLonGrid(double[] latLower, double[] latUpper, double[] lonLower, double[] lonUpper) {

  /**
   * How far neighbouring cells may overlap, as a fraction of a cell, before the grid is refused:
   * coordinates stored as float32 round 44.05 to about 4e-6 degrees, which must not count.
   */
  private static final double SEAM = 1e-3;

  public LatLonGrid {
    Objects.requireNonNull(latLower, "latLower");
    Objects.requireNonNull(latUpper, "latUpper");
    Objects.requireNonNull(lonLower, "lonLower");
    Objects.requireNonNull(lonUpper, "lonUpper");
    if (latLower.length != latUpper.length || lonLower.length != lonUpper.length) {
      throw new IllegalArgumentException("lower and upper bounds differ in length");
    }
    if (latLower.length == 0 || lonLower.length == 0) {
      throw new IllegalArgumentException("a grid needs at least one row and one column");
    }
    latLower = latLower.clone();
    latUpper = latUpper.clone();
    lonLower = lonLower.clone();
    lonUpper = lonUpper.clone();
    for (int y = 0; y < latLower.length; y++) {
      if (!(latLower[y] < latUpper[y]) || latLower[y] < -90 || latUpper[y] > 90) {
        throw new IllegalArgumentException("latitude bounds of row " + y + " are not an ascending pair within [-90, 90]");
      }
      if (y > 0 && latLower[y] < latUpper[y - 1] - SEAM * (latUpper[y] - latLower[y])) {
        throw new IllegalArgumentException("latitude rows overlap or are not ascending at row " + y);
      }
    }
    for (int x = 0; x < lonLower.length; x++) {
      if (!(lonLower[x] < lonUpper[x])) {
        throw new IllegalArgumentException("longitude bounds of column " + x + " are not ascending");
      }
      if (x > 0 && lonLower[x] < lonUpper[x - 1] - SEAM * (lonUpper[x] - lonLower[x])) {
        throw new IllegalArgumentException("longitude columns overlap or are not ascending at column " + x);
      }
    }
    if (lonUpper[lonUpper.length - 1] - lonLower[0] > 360 + 1e-9) {
      throw new IllegalArgumentException("longitudes span more than 360 degrees");
    }
  }

  /** Builds a grid of equal cells: {@code ny} rows from {@code south}, {@code nx} columns from {@code west}. */
  public static LatLonGrid regular(double south, double west, double dLat, double dLon, int ny, int nx) {
    double[] la = new double[ny], lb = new double[ny], oa = new double[nx], ob = new double[nx];
    for (int y = 0; y < ny; y++) {
      la[y] = south + y * dLat;
      lb[y] = south + (y + 1) * dLat;
    }
    for (int x = 0; x < nx; x++) {
      oa[x] = west + x * dLon;
      ob[x] = west + (x + 1) * dLon;
    }
    return new LatLonGrid(la, lb, oa, ob);
  }

  public int ny() {
    return latLower.length;
  }

  public int nx() {
    return lonLower.length;
  }

  public int cells() {
    return ny() * nx();
  }

  public double latCenter(int y) {
    return 0.5 * (latLower[y] + latUpper[y]);
  }

  public double lonCenter(int x) {
    return 0.5 * (lonLower[x] + lonUpper[x]);
  }

  @Override
  public double[] latLower() {
    return latLower.clone();
  }

  @Override
  public double[] latUpper() {
    return latUpper.clone();
  }

  @Override
  public double[] lonLower() {
    return lonLower.clone();
  }

  @Override
  public double[] lonUpper() {
    return lonUpper.clone();
  }

  public double latLower(int y) {
    return latLower[y];
  }

  public double latUpper(int y) {
    return latUpper[y];
  }

  public double lonLower(int x) {
    return lonLower[x];
  }

  public double lonUpper(int x) {
    return lonUpper[x];
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof LatLonGrid g
        && Arrays.equals(latLower, g.latLower)
        && Arrays.equals(latUpper, g.latUpper)
        && Arrays.equals(lonLower, g.lonLower)
        && Arrays.equals(lonUpper, g.lonUpper);
  }

  @Override
  public int hashCode() {
    return Objects.hash(Arrays.hashCode(latLower), Arrays.hashCode(latUpper), Arrays.hashCode(lonLower), Arrays.hashCode(lonUpper));
  }

  @Override
  public String toString() {
    return "LatLonGrid[" + ny() + " x " + nx() + ", lat " + latLower[0] + ".." + latUpper[ny() - 1]
        + ", lon " + lonLower[0] + ".." + lonUpper[nx() - 1] + "]";
  }
}
