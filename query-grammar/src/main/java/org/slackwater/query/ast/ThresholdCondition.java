package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code <series> above 10 mg/m3 [for 3 days]}: the series' value passes the threshold, on each
 * of the last {@code persistence} days or weeks when one is given, else on the day itself.
 */
public record ThresholdCondition(WatchSeries series, Threshold threshold, Optional<Duration> persistence,
        Position position) implements Condition {

    public ThresholdCondition {
        Objects.requireNonNull(series, "series");
        Objects.requireNonNull(threshold, "threshold");
        Objects.requireNonNull(persistence, "persistence");
        Objects.requireNonNull(position, "position");
    }
}
