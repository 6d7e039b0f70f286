package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code above 10 mg/m3}, {@code at most -1.5}: a comparison with a number, in the unit given
 * (the analyzer converts; no unit means the variable's own unit, or a plain number for
 * standardized anomalies and percentiles). The position is that of the comparison word.
 *
 * @throws IllegalArgumentException if the value is not finite
 */
public record Threshold(ThresholdOperator operator, double value, Optional<UnitRef> unit, Position position)
        implements Node {

    public Threshold {
        Objects.requireNonNull(operator, "operator");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        value += 0.0; // no negative zero
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("threshold is not finite: " + value);
        }
    }
}
