package org.slackwater.query.ast;

import java.util.Objects;

/** {@code describe <variable>}: the catalog entry of one variable. */
public record DescribeVariable(Identifier variable, Position position) implements Statement {

    public DescribeVariable {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(position, "position");
    }
}
