package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/** {@code as <kind> [against <baseline>]}; without a baseline the analyzer's default applies. */
public record Comparison(ComparisonKind kind, Optional<Period> baseline, Position position) implements Node {

    public Comparison {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(baseline, "baseline");
        Objects.requireNonNull(position, "position");
    }
}
