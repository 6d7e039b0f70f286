package org.slackwater.query.ast;

/**
 * The unit of a {@link Duration} or a {@link LagRange}. SEASON is a meteorological season
 * (three months); how MONTH, SEASON and YEAR map to days is the analyzer's decision.
 */
public enum DurationUnit {
    DAY,
    WEEK,
    MONTH,
    SEASON,
    YEAR
}
