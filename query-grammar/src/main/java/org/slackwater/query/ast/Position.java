package org.slackwater.query.ast;

/**
 * Where a node starts in the query text: 1-based line and 1-based column, the column counted
 * in Unicode code points (a tab counts as one).
 *
 * <p>{@link #NONE} (0:0) marks trees built by code or with positions erased for comparison;
 * the parser never produces it.
 *
 * @throws IllegalArgumentException if only one of line and column is 0, or either is negative
 */
public record Position(int line, int column) {

    /** The position of nodes that do not come from query text. */
    public static final Position NONE = new Position(0, 0);

    public Position {
        boolean none = line == 0 && column == 0;
        if (!none && (line < 1 || column < 1)) {
            throw new IllegalArgumentException(
                    "position must be 1-based (or 0:0 for none), got " + line + ":" + column);
        }
    }

    @Override
    public String toString() {
        return line + ":" + column;
    }
}
