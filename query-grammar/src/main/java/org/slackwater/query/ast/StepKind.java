package org.slackwater.query.ast;

/**
 * The length of one step of a series. SEASON is the meteorological season (DJF, MAM, JJA,
 * SON); WATER_YEAR is the hydrological year, whose starting month the analyzer configures.
 */
public enum StepKind {
    DAY,
    WEEK,
    MONTH,
    SEASON,
    YEAR,
    WATER_YEAR
}
