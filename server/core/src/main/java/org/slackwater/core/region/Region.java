package org.slackwater.core.region;

import java.util.Objects;
import org.locationtech.jts.geom.Geometry;

/**
 * A named area of interest: a bay segment, a watershed, an intake's surroundings.
 *
 * @param name the name queries use (matched case-insensitively)
 * @param kind free text such as {@code segment}, {@code watershed}, {@code intake}
 * @param geometry polygonal, in lon/lat degrees (a point with a radius is already buffered)
 * @param geoJson the feature as it was submitted, kept so that clients get back what they sent
 */
public record Region(String name, String kind, Geometry geometry, String geoJson) {
  public Region {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(geometry, "geometry");
    Objects.requireNonNull(geoJson, "geoJson");
    if (name.isBlank()) {
      throw new RegionException("a region needs a non-empty name");
    }
  }

  public double areaM2() {
    return SphericalArea.of(geometry);
  }
}
