package org.slackwater.demo;

/** What a named region of the scenario is; its lower-case name is the GeoJSON {@code kind} property. */
enum RegionKind {
  /** A bay segment; the three segments tile the water. */
  SEGMENT,
  /** The land catchment of the Harle River. */
  WATERSHED,
  /** A drinking-water intake: a point with a protection radius. */
  INTAKE;

  String geoJsonName() {
    return name().toLowerCase(java.util.Locale.ROOT);
  }
}
