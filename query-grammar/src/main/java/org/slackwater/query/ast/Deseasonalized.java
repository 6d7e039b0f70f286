package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code deseasonalized [against <baseline>]} (or {@code as anomalies ...}): both series are
 * correlated as anomalies, each value minus the baseline mean for its time of year. Without a
 * baseline the analyzer uses the period of the statement.
 */
public record Deseasonalized(Optional<Period> baseline, Position position) implements Node {

    public Deseasonalized {
        Objects.requireNonNull(baseline, "baseline");
        Objects.requireNonNull(position, "position");
    }
}
