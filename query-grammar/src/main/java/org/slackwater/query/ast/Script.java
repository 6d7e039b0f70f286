package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;

/** A whole query text: one or more statements, in order. */
public record Script(List<Statement> statements, Position position) implements Node {

    public Script {
        statements = List.copyOf(statements);
        Objects.requireNonNull(position, "position");
    }
}
