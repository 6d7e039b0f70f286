package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;

/**
 * {@code a and b and ...}: true when every operand is.
 *
 * @throws IllegalArgumentException if there are fewer than two operands
 */
public record AllOf(List<Condition> operands, Position position) implements Condition {

    public AllOf {
        operands = List.copyOf(operands);
        Objects.requireNonNull(position, "position");
        if (operands.size() < 2) {
            throw new IllegalArgumentException("'and' needs two or more operands, got " + operands.size());
        }
    }
}
