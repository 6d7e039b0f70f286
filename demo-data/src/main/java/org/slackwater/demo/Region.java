package org.slackwater.demo;

import org.locationtech.jts.geom.Polygon;

/** A named polygon of the scenario (segment or watershed), coordinates in (lon, lat) degrees. */
record Region(String name, RegionKind kind, Polygon polygon) {
}
