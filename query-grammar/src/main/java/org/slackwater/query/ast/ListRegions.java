package org.slackwater.query.ast;

import java.util.Objects;

/** {@code list regions}: the named regions known to the server. */
public record ListRegions(Position position) implements Statement {

    public ListRegions {
        Objects.requireNonNull(position, "position");
    }
}
