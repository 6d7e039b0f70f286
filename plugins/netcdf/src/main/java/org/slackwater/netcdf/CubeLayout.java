package org.slackwater.netcdf;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import ucar.nc2.Dimension;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;

/**
 * How one data variable lies on its coordinates: the time, latitude and longitude coordinate
 * variables of its three dimensions, in the order (time, lat, lon).
 *
 * <p>{@link #whyNot} says why a variable is not a cube at all (no time axis, no 1-D latitude or
 * longitude, a coordinate or bounds variable, ...); {@link #of} also insists on the dimension
 * order and otherwise fails with a {@link Problem} that says how to fix the file.
 */
record CubeLayout(Variable data, Variable time, Variable lat, Variable lon) {

  CubeLayout {
    Objects.requireNonNull(data, "data");
    Objects.requireNonNull(time, "time");
    Objects.requireNonNull(lat, "lat");
    Objects.requireNonNull(lon, "lon");
  }

  /** The layout of a cube variable. */
  static CubeLayout of(NetcdfFile file, Variable v) throws Problem {
    String reason = whyNot(file, v);
    if (reason != null) {
      throw new Problem(reason);
    }
    Variable[] roles = roles(file, v);
    List<Dimension> dims = v.getDimensions();
    Variable t = null;
    Variable y = null;
    Variable x = null;
    for (Variable c : roles) {
      if (c != null && AxisRecognizer.isTime(c)) {
        t = c;
      } else if (c != null && AxisRecognizer.isLatitude(c)) {
        y = c;
      } else if (c != null && AxisRecognizer.isLongitude(c)) {
        x = c;
      }
    }
    if (dims.size() != 3 || roles[0] != t || roles[1] != y || roles[2] != x) {
      throw new Problem("its dimensions are (" + v.getDimensionsString().replace(" ", ", ") + "); only the order (time,"
          + " latitude, longitude) is supported, here (" + t.getShortName() + ", " + y.getShortName() + ", " + x.getShortName() + ")"
          + (dims.size() > 3 ? "; select a single level of the extra dimensions" : "")
          + "; rewrite the variable with its dimensions in that order");
    }
    return new CubeLayout(v, t, y, x);
  }

  /** Why {@code v} is not a cube variable, or null if it is one (dimension order aside). */
  static String whyNot(NetcdfFile file, Variable v) {
    if (!v.getDataType().isNumeric()) {
      return "it holds " + v.getDataType() + " values, not numbers";
    }
    if (v.isCoordinateVariable()) {
      return "it is a coordinate variable";
    }
    if (AxisRecognizer.isBoundsOf(v, file.getVariables())) {
      return "it is a bounds variable (CF 7.1)";
    }
    Variable[] roles = roles(file, v);
    boolean time = false;
    boolean lat = false;
    boolean lon = false;
    for (Variable c : roles) {
      time |= c != null && AxisRecognizer.isTime(c);
      lat |= c != null && AxisRecognizer.isLatitude(c);
      lon |= c != null && AxisRecognizer.isLongitude(c);
    }
    String dims = "(" + v.getDimensionsString().replace(" ", ", ") + ")";
    if (!time) {
      return "no time axis: none of its dimensions " + dims + " has a time coordinate variable; add one with units"
          + " such as 'days since 2000-01-01' (CF 4.4)";
    }
    if (!lat || !lon) {
      List<String> twoD = twoDimensionalLatLon(file, v);
      if (!twoD.isEmpty()) {
        return "curvilinear grids are not supported yet; regrid to a regular lat/lon grid first (its coordinates "
            + String.join(", ", twoD) + " are 2-D)";
      }
      String missing = !lat ? "latitude" : "longitude";
      String units = !lat ? "degrees_north" : "degrees_east";
      return "no " + missing + " axis: none of its dimensions " + dims + " has a 1-D coordinate variable with units '"
          + units + "' (CF 4." + (!lat ? "1" : "2") + "); add one";
    }
    return null;
  }

  /** The coordinate variable of each dimension of {@code v}, or null where there is none. */
  private static Variable[] roles(NetcdfFile file, Variable v) {
    List<Dimension> dims = v.getDimensions();
    Variable[] out = new Variable[dims.size()];
    for (int i = 0; i < out.length; i++) {
      Dimension d = dims.get(i);
      Variable c = d.getShortName() == null ? null : file.findVariable(NetcdfFile.makeValidPathName(d.getShortName()));
      if (c == null && v.getParentGroup() != null) {
        c = v.getParentGroup().findVariable(d.getShortName());
      }
      if (c != null && c.getRank() == 1 && c.getDimension(0).equals(d) && c != v) {
        out[i] = c;
      }
    }
    return out;
  }

  /** Names of 2-D latitude or longitude variables that describe {@code v}'s grid. */
  private static List<String> twoDimensionalLatLon(NetcdfFile file, Variable v) {
    List<Variable> candidates = new ArrayList<>();
    String coordinates = Attributes.text(v, "coordinates");
    if (coordinates != null) {
      for (String name : coordinates.split("\\s+")) {
        Variable c = file.findVariable(name);
        if (c != null) {
          candidates.add(c);
        }
      }
    }
    for (Variable c : file.getVariables()) {
      if (c.getRank() >= 2 && v.getDimensions().containsAll(c.getDimensions()) && !candidates.contains(c)) {
        candidates.add(c);
      }
    }
    List<String> names = new ArrayList<>();
    for (Variable c : candidates) {
      if (c.getRank() >= 2 && (AxisRecognizer.isLatitude(c) || AxisRecognizer.isLongitude(c))) {
        names.add("'" + c.getShortName() + "'");
      }
    }
    return names;
  }
}
