package org.slackwater.query.ast;

/**
 * How each value is compared with the baseline climatology: the difference from the baseline
 * mean, that difference divided by the baseline standard deviation, or the percentile rank
 * within the baseline values.
 */
public enum ComparisonKind {
    ANOMALY,
    STANDARDIZED_ANOMALY,
    PERCENTILE_RANK
}
