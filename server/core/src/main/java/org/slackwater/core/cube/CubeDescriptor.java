package org.slackwater.core.cube;

import java.util.Map;
import java.util.Objects;

/**
 * What a source says about one gridded variable, after normalisation: names, the canonical unit
 * its values are delivered in, the unit the file declared, the grid and the time axis.
 *
 * @param variable the variable's name in the source (becomes the cube name unless renamed)
 * @param standardName CF standard_name, or empty
 * @param longName CF long_name, or empty
 * @param units the canonical unit values are delivered in (e.g. {@code degC}, {@code mm/day})
 * @param sourceUnits the unit the file declared (e.g. {@code K}, {@code kg m-2 s-1})
 * @param grid the normalised grid
 * @param time the time axis on real instants
 * @param attributes other attributes worth keeping for provenance (copied, unmodifiable)
 */
public record CubeDescriptor(
    String variable,
    String standardName,
    String longName,
    String units,
    String sourceUnits,
    LatLonGrid grid,
    TimeAxis time,
    Map<String, String> attributes) {

  public CubeDescriptor {
    Objects.requireNonNull(variable, "variable");
    Objects.requireNonNull(standardName, "standardName");
    Objects.requireNonNull(longName, "longName");
    Objects.requireNonNull(units, "units");
    Objects.requireNonNull(sourceUnits, "sourceUnits");
    Objects.requireNonNull(grid, "grid");
    Objects.requireNonNull(time, "time");
    attributes = Map.copyOf(attributes);
  }
}
