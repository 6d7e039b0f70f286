package org.slackwater.query.ast;

import java.util.Objects;

/** {@code -<operand>}; the position is that of the minus sign. */
public record Negate(Expression operand, Position position) implements Expression {

    public Negate {
        Objects.requireNonNull(operand, "operand");
        Objects.requireNonNull(position, "position");
    }
}
