package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;

/**
 * {@code a or b or ...}: true when any operand is. An operand is never itself an {@code AnyOf}
 * unless it was written in parentheses.
 *
 * @throws IllegalArgumentException if there are fewer than two operands
 */
public record AnyOf(List<Condition> operands, Position position) implements Condition {

    public AnyOf {
        operands = List.copyOf(operands);
        Objects.requireNonNull(position, "position");
        if (operands.size() < 2) {
            throw new IllegalArgumentException("'or' needs two or more operands, got " + operands.size());
        }
    }
}
