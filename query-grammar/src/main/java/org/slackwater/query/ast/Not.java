package org.slackwater.query.ast;

import java.util.Objects;

/** {@code not <condition>}: true when the operand is false; the position is that of {@code not}. */
public record Not(Condition operand, Position position) implements Condition {

    public Not {
        Objects.requireNonNull(operand, "operand");
        Objects.requireNonNull(position, "position");
    }
}
