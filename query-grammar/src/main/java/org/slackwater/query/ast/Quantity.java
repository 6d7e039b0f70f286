package org.slackwater.query.ast;

import java.util.Objects;

/** A number with a unit, such as the radius {@code 3 km} (the parser writes distance units in lower case). */
public record Quantity(double value, String unit, Position position) implements Node {

    public Quantity {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        value += 0.0; // no negative zero
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("quantity is not finite: " + value);
        }
    }

    /** The value in metres, for the distance units m and km. */
    public double metres() {
        switch (unit) {
            case "m":
                return value;
            case "km":
                return value * 1000;
            default:
                throw new IllegalStateException("not a distance unit: " + unit);
        }
    }
}
