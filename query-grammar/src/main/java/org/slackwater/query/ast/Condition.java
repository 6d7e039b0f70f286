package org.slackwater.query.ast;

/**
 * A condition of a watch rule, true or false on each day. {@code and} binds more tightly than
 * {@code or}; the tree keeps the grouping as written (no flattening), positions at the first
 * token.
 */
public sealed interface Condition extends Node
        permits AnyOf, AllOf, Not, ThresholdCondition, ComparisonCondition {}
