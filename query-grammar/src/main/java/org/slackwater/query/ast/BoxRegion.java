package org.slackwater.query.ast;

import java.util.Objects;

/**
 * A latitude/longitude box, edges in degrees. Longitudes are kept as written (-180..360);
 * when {@code west} is east of {@code east} the box crosses the 180 degree meridian. The parser
 * rejects boxes with no area and boxes wider than 180 degrees of longitude.
 *
 * @throws IllegalArgumentException if a latitude is outside -90..90, a longitude outside
 *     -180..360, or south is not below north
 */
public record BoxRegion(double south, double west, double north, double east, Position position)
        implements RegionRef {

    public BoxRegion {
        Objects.requireNonNull(position, "position");
        south += 0.0; // no negative zero
        west += 0.0;
        north += 0.0;
        east += 0.0;
        Coordinate.checkLatitude(south);
        Coordinate.checkLatitude(north);
        Coordinate.checkLongitude(west);
        Coordinate.checkLongitude(east);
        if (!(south < north)) {
            throw new IllegalArgumentException("south " + south + " is not below north " + north);
        }
    }

    /** Width in degrees measured eastward from the west edge to the east edge, in (0, 360). */
    public double widthDegrees() {
        double width = Coordinate.normalizeLongitude(east) - Coordinate.normalizeLongitude(west);
        return width <= 0 ? width + 360 : width;
    }
}
