package org.slackwater.query.ast;

/**
 * A node of a parsed query. Every node is an immutable value with the position of its first
 * token; equality includes positions (compare with {@link AstPositions#erase} to ignore them).
 */
public sealed interface Node
        permits Script, Statement, RegionRef, Statistic, Identifier, Coordinate, Quantity, Period,
                PartialDate, Step, UnitRef, Comparison, Coverage, GapAllowance, SeriesTerm, Duration, LagRange,
                Deseasonalized, WatchRule, WatchSeries, Threshold, Condition, Expression {

    /** Line and column of the node's first token. */
    Position position();
}
