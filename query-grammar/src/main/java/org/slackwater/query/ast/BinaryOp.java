package org.slackwater.query.ast;

import java.util.Objects;

/** {@code left <operator> right}; the position is that of the left operand's first token. */
public record BinaryOp(Expression left, ArithmeticOperator operator, Expression right, Position position)
        implements Expression {

    public BinaryOp {
        Objects.requireNonNull(left, "left");
        Objects.requireNonNull(operator, "operator");
        Objects.requireNonNull(right, "right");
        Objects.requireNonNull(position, "position");
    }
}
