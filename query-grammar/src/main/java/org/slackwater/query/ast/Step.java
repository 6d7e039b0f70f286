package org.slackwater.query.ast;

import java.util.Objects;

/** {@code by <step>}: the time step of a series. */
public record Step(StepKind kind, Position position) implements Node {

    public Step {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(position, "position");
    }
}
