package org.slackwater.core.ingest;

import java.util.Locale;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;

/**
 * Whether a file's variable may be added to an existing cube of the same name: the same grid
 * (cell bounds equal to within a thousandth of a cell, so that float32 coordinates written by
 * different runs of one producer still match), the same canonical unit (a file in K adds to a cube
 * in degC: the source converts it; a file in mg m-2 does not add to a cube in mg m-3), the same
 * calendar and the same standard_name where both have one. Every refusal names what differs, both
 * values, and the ways out.
 */
final class CubeCompatibility {
  private static final double GRID_TOLERANCE = 1e-3;

  private CubeCompatibility() {}

  static void check(String cubeName, CubeDescriptor cube, CubeDescriptor file, String where) throws IngestException {
    String ways = "Nothing was changed. Regrid the file onto the cube's grid and units, rename the variable to make a new"
        + " cube, or ingest with the 'replace cube' option to replace cube '" + cubeName + "' entirely";
    String grid = gridDifference(cube.grid(), file.grid());
    if (grid != null) {
      throw new IngestException(where + ": its grid does not match cube '" + cubeName + "': " + grid + ". " + ways);
    }
    if (!cube.units().equals(file.units())) {
      throw new IngestException(where + ": its values are in '" + file.units() + "' (declared '" + file.sourceUnits()
          + "') but cube '" + cubeName + "' holds '" + cube.units() + "', which is not the same quantity. " + ways);
    }
    if (!cube.time().calendar().equals(file.time().calendar()) || cube.time().alignment() != file.time().alignment()) {
      throw new IngestException(where + ": its time axis uses the calendar '" + file.time().calendar() + "' but cube '" + cubeName
          + "' uses '" + cube.time().calendar() + "'; steps of different calendars cannot share one axis. " + ways);
    }
    String a = cube.standardName().trim().toLowerCase(Locale.ROOT);
    String b = file.standardName().trim().toLowerCase(Locale.ROOT);
    if (!a.isEmpty() && !b.isEmpty() && !a.equals(b)) {
      throw new IngestException(where + ": its standard_name is '" + file.standardName() + "' but cube '" + cubeName
          + "' holds '" + cube.standardName() + "'. " + ways);
    }
  }

  /** What differs between the grids, or null if they match. */
  static String gridDifference(LatLonGrid cube, LatLonGrid file) {
    if (cube.ny() != file.ny() || cube.nx() != file.nx()) {
      return "the cube has " + cube.ny() + " rows x " + cube.nx() + " columns (" + extent(cube) + "), the file "
          + file.ny() + " x " + file.nx() + " (" + extent(file) + ")";
    }
    for (int y = 0; y < cube.ny(); y++) {
      double tol = GRID_TOLERANCE * (cube.latUpper(y) - cube.latLower(y));
      if (Math.abs(cube.latLower(y) - file.latLower(y)) > tol || Math.abs(cube.latUpper(y) - file.latUpper(y)) > tol) {
        return "row " + y + " spans latitudes " + deg(cube.latLower(y)) + ".." + deg(cube.latUpper(y)) + " in the cube but "
            + deg(file.latLower(y)) + ".." + deg(file.latUpper(y)) + " in the file";
      }
    }
    for (int x = 0; x < cube.nx(); x++) {
      double tol = GRID_TOLERANCE * (cube.lonUpper(x) - cube.lonLower(x));
      if (Math.abs(cube.lonLower(x) - file.lonLower(x)) > tol || Math.abs(cube.lonUpper(x) - file.lonUpper(x)) > tol) {
        return "column " + x + " spans longitudes " + deg(cube.lonLower(x)) + ".." + deg(cube.lonUpper(x)) + " in the cube but "
            + deg(file.lonLower(x)) + ".." + deg(file.lonUpper(x)) + " in the file";
      }
    }
    return null;
  }

  private static String extent(LatLonGrid g) {
    return "latitude " + deg(g.latLower(0)) + ".." + deg(g.latUpper(g.ny() - 1)) + ", longitude " + deg(g.lonLower(0)) + ".."
        + deg(g.lonUpper(g.nx() - 1));
  }

  /** Degrees without binary noise: -31.849999999999998 reads -31.85. */
  private static String deg(double v) {
    return java.math.BigDecimal.valueOf(v).setScale(9, java.math.RoundingMode.HALF_EVEN).stripTrailingZeros().toPlainString();
  }
}
