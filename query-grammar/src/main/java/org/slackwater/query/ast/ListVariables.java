package org.slackwater.query.ast;

import java.util.Objects;

/** {@code list variables}: the variables in the catalog. */
public record ListVariables(Position position) implements Statement {

    public ListVariables {
        Objects.requireNonNull(position, "position");
    }
}
