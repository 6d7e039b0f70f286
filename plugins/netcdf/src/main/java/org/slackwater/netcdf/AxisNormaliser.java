package org.slackwater.netcdf;

import java.util.Locale;

/**
 * Brings latitude and longitude axes into the {@link org.slackwater.core.cube.LatLonGrid}
 * orientation and gives every cell its bounds.
 *
 * <p>Bounds come from the CF bounds variable (CF 7.1: two vertices per cell, in either order),
 * else from midpoints between neighbouring centres with the edge cells extended by half of
 * their neighbour spacing; latitudes are clamped to [-90, 90].
 *
 * <p>Latitudes become ascending (a descending file axis is flipped). Longitudes become ascending
 * and, where the grid stays contiguous, are moved so that cells start within [-180, 180): a grid
 * entirely west of 180 in 0..360 is shifted, a global grid is rotated at the 180 meridian. A regional grid that
 * crosses 180 would break apart in -180..180, so it keeps its 0..360 values (the LatLonGrid
 * contract allows [-180, 360)).
 *
 * <p>Failure modes ({@link Problem}): fewer than two centres and no bounds (the cell size is
 * unknown); centres that are not strictly monotonic; non-finite values; latitudes or explicit
 * latitude bounds beyond the poles;
 * longitudes spanning more than 360 degrees.
 */
final class AxisNormaliser {

  /** Latitudes this far beyond a pole (float noise in bounds) are clamped rather than refused. */
  private static final double POLE_TOLERANCE = 1e-4;

  private AxisNormaliser() {}

  static NormalisedAxis latitude(String name, double[] centres, double[] boundPairs) throws Problem {
    Ascending a = ascending(name, "latitude", centres, boundPairs);
    for (int i = 0; i < a.size(); i++) {
      boolean beyond = a.lower[i] < -90 - POLE_TOLERANCE || a.upper[i] > 90 + POLE_TOLERANCE;
      if (beyond && a.explicitBounds) {
        throw new Problem(String.format(Locale.ROOT,
            "latitude cell %d of '%s' spans %s..%s, beyond the poles; latitudes must lie within -90..90 degrees_north",
            i, name, a.lower[i], a.upper[i]));
      }
      if (a.centre[i] < -90 - POLE_TOLERANCE || a.centre[i] > 90 + POLE_TOLERANCE) {
        throw new Problem(String.format(Locale.ROOT,
            "latitude %s of '%s' is beyond the poles; latitudes must lie within -90..90 degrees_north", a.centre[i], name));
      }
      a.lower[i] = Math.max(-90, a.lower[i]);
      a.upper[i] = Math.min(90, a.upper[i]);
    }
    return new NormalisedAxis(a.lower, a.upper, a.fileIndex, a.flipped ? "flipped from descending to ascending" : "");
  }

  static NormalisedAxis longitude(String name, double[] centres, double[] boundPairs) throws Problem {
    Ascending a = ascending(name, "longitude", centres, boundPairs);
    int n = a.size();
    double span = a.upper[n - 1] - a.lower[0];
    if (span > 360 + 1e-6) {
      throw new Problem(String.format(Locale.ROOT,
          "longitudes of '%s' span %s degrees, more than a full circle; remove the repeated columns", name, span));
    }
    double[] shift = new double[n];
    int start = 0;
    // Wrapping by the lower bound keeps every bound within [-180, 360) as LatLonGrid asks, also
    // for a cell centred on 180 (it stays at the east end rather than poking below -180).
    for (int i = 0; i < n; i++) {
      shift[i] = -360 * Math.floor((a.lower[i] + 180) / 360);
      if (a.lower[i] + shift[i] < a.lower[start] + shift[start]) {
        start = i;
      }
    }
    String flipNote = a.flipped ? "flipped from descending to ascending; " : "";
    if (start == 0) {
      String note = shift[0] == 0 ? "" : String.format(Locale.ROOT, "shifted by %s degrees into -180..180", shift[0]);
      return shifted(a, 0, shift, flipNote + note);
    }
    // The wrapped columns lead; that is contiguous only if the grid closes the circle.
    double seamGap = a.lower[0] + 360 - a.upper[n - 1];
    double tolerance = 1e-6 * Math.max(1, a.upper[0] - a.lower[0]);
    if (Math.abs(seamGap) <= tolerance) {
      return shifted(a, start, shift, flipNote + "global grid rotated from 0..360 to -180..180");
    }
    // A regional grid across 180: keep it whole, with its first column in -180..180.
    double[] same = new double[n];
    java.util.Arrays.fill(same, shift[0]);
    return shifted(a, 0, same, flipNote + "crosses 180 degrees east without closing the circle, so longitudes stay"
        + " within 0..360 to keep the grid contiguous");
  }

  private static NormalisedAxis shifted(Ascending a, int start, double[] shift, String note) {
    int n = a.size();
    double[] lo = new double[n];
    double[] hi = new double[n];
    int[] idx = new int[n];
    for (int x = 0; x < n; x++) {
      int i = (start + x) % n;
      lo[x] = a.lower[i] + shift[i];
      hi[x] = a.upper[i] + shift[i];
      idx[x] = a.fileIndex[i];
    }
    return new NormalisedAxis(lo, hi, idx, note.endsWith("; ") ? note.substring(0, note.length() - 2) : note);
  }

  /** An axis sorted ascending, with bounds, and where each cell came from in the file. */
  private record Ascending(double[] centre, double[] lower, double[] upper, int[] fileIndex, boolean flipped,
      boolean explicitBounds) {
    int size() {
      return centre.length;
    }
  }

  private static Ascending ascending(String name, String what, double[] centres, double[] boundPairs) throws Problem {
    int n = centres.length;
    if (n == 0) {
      throw new Problem("the " + what + " axis '" + name + "' is empty");
    }
    for (int i = 0; i < n; i++) {
      if (!Double.isFinite(centres[i])) {
        throw new Problem(what + " value " + i + " of '" + name + "' is " + centres[i]
            + "; coordinate variables must not have missing values (CF 5)");
      }
    }
    boolean descending = n > 1 && centres[1] < centres[0];
    for (int i = 1; i < n; i++) {
      if (descending ? !(centres[i] < centres[i - 1]) : !(centres[i] > centres[i - 1])) {
        throw new Problem(String.format(Locale.ROOT,
            "%s values of '%s' are not strictly monotonic at index %d (%s after %s); coordinate variables must be"
                + " strictly increasing or decreasing (CF 1.3)", what, name, i, centres[i], centres[i - 1]));
      }
    }
    double[] c = new double[n];
    int[] idx = new int[n];
    for (int i = 0; i < n; i++) {
      idx[i] = descending ? n - 1 - i : i;
      c[i] = centres[idx[i]];
    }
    double[] lo = new double[n];
    double[] hi = new double[n];
    if (boundPairs != null) {
      if (boundPairs.length != 2 * n) {
        throw new Problem("the bounds variable of '" + name + "' does not have shape (" + n + ", 2) (CF 7.1)");
      }
      for (int i = 0; i < n; i++) {
        double b0 = boundPairs[2 * idx[i]];
        double b1 = boundPairs[2 * idx[i] + 1];
        if (!Double.isFinite(b0) || !Double.isFinite(b1) || b0 == b1) {
          throw new Problem(String.format(Locale.ROOT,
              "the bounds of %s cell %d of '%s' are %s and %s; each cell needs two distinct finite bounds (CF 7.1)",
              what, idx[i], name, b0, b1));
        }
        lo[i] = Math.min(b0, b1);
        hi[i] = Math.max(b0, b1);
      }
    } else {
      if (n < 2) {
        throw new Problem("the " + what + " axis '" + name + "' has a single value and no bounds variable, so its cell"
            + " size is unknown; add a bounds variable (CF 7.1)");
      }
      for (int i = 0; i < n; i++) {
        lo[i] = i == 0 ? c[0] - 0.5 * (c[1] - c[0]) : 0.5 * (c[i - 1] + c[i]);
        hi[i] = i == n - 1 ? c[n - 1] + 0.5 * (c[n - 1] - c[n - 2]) : 0.5 * (c[i] + c[i + 1]);
      }
    }
    return new Ascending(c, lo, hi, idx, descending, boundPairs != null);
  }
}
