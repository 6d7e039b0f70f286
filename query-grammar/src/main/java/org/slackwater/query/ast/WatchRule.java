package org.slackwater.query.ast;

import java.util.Objects;

/** {@code when <condition> [severity <level>]}; the position is that of {@code when}. */
public record WatchRule(Condition condition, Severity severity, Position position) implements Node {

    public WatchRule {
        Objects.requireNonNull(condition, "condition");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(position, "position");
    }
}
