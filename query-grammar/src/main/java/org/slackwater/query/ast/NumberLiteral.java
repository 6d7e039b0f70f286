package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * A number in an expression, with an optional unit ({@code 25 degC}, {@code 1.3 mg/L});
 * without one it is a plain (dimensionless) number. Never negative: {@code -3} is a
 * {@link Negate} of 3.
 *
 * @throws IllegalArgumentException if the value is negative or not finite
 */
public record NumberLiteral(double value, Optional<UnitRef> unit, Position position) implements Expression {

    public NumberLiteral {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        value += 0.0; // no negative zero
        if (!(value >= 0 && Double.isFinite(value))) {
            throw new IllegalArgumentException("a number literal is finite and not negative, got " + value);
        }
    }
}
