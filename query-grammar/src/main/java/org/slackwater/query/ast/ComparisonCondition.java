package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code <kind> of <series> above 2 [against <baseline>] [for 3 days]}: the series compared
 * with its baseline climatology for the time of year (anomaly, standardized anomaly or
 * percentile rank 0..100) passes the threshold. Without a baseline the analyzer's default
 * applies. Standardized anomalies and percentiles are plain numbers: their threshold has no
 * unit.
 */
public record ComparisonCondition(ComparisonKind kind, WatchSeries series, Threshold threshold,
        Optional<Period> baseline, Optional<Duration> persistence, Position position) implements Condition {

    public ComparisonCondition {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(series, "series");
        Objects.requireNonNull(threshold, "threshold");
        Objects.requireNonNull(baseline, "baseline");
        Objects.requireNonNull(persistence, "persistence");
        Objects.requireNonNull(position, "position");
    }
}
