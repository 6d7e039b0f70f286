package org.slackwater.query.ast;

import java.util.Objects;

/**
 * {@code in <unit>}: the unit the result is converted to, as written (case kept: {@code degF},
 * {@code FNU}); the analyzer checks that it is a unit and that the variable converts to it.
 */
public record UnitRef(String unit, Position position) implements Node {

    public UnitRef {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        if (unit.isBlank()) {
            throw new IllegalArgumentException("unit is blank");
        }
    }
}
