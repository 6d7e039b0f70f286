package org.slackwater.query.ast;

import java.util.Objects;

/**
 * All points within {@code radius} of {@code center}, the distance measured on the Earth's
 * surface (the analyzer decides the geodesic model).
 */
public record CircleRegion(Coordinate center, Quantity radius, Position position) implements RegionRef {

    public CircleRegion {
        Objects.requireNonNull(center, "center");
        Objects.requireNonNull(radius, "radius");
        Objects.requireNonNull(position, "position");
    }
}
