package org.slackwater.query.ast;

import java.util.Objects;

/** A variable in an expression: a catalog variable or one defined by an earlier {@code let}. */
public record VariableRef(Identifier variable, Position position) implements Expression {

    public VariableRef {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(position, "position");
    }
}
