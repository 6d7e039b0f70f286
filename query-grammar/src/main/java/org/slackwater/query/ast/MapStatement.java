package org.slackwater.query.ast;

/**
 * A {@code map} statement: one value per grid cell of {@code region()} over {@code period()}.
 */
public sealed interface MapStatement extends Statement
        permits StatisticMap, DifferenceMap, ComparisonMap, CorrelationMap {

    /** The cells mapped: those of this region. */
    RegionRef region();

    /** The days each cell's value is taken over. */
    Period period();
}
