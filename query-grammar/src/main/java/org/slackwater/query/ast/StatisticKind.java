package org.slackwater.query.ast;

/** The statistic taken over the values of each step. */
public enum StatisticKind {
    MEAN,
    SUM,
    MIN,
    MAX,
    MEDIAN,
    PERCENTILE
}
