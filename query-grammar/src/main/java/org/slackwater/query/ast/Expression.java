package org.slackwater.query.ast;

/**
 * An arithmetic expression of a {@code let}. {@code *} and {@code /} bind more tightly than
 * {@code +} and {@code -}; all four group from the left. Parentheses leave no node of their
 * own: the tree's shape is the grouping.
 */
public sealed interface Expression extends Node permits BinaryOp, Negate, VariableRef, NumberLiteral {}
