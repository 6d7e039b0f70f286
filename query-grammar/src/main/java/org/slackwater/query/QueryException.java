package org.slackwater.query;

import java.util.Objects;
import org.slackwater.query.ast.Node;
import org.slackwater.query.ast.Position;

/**
 * The one error type of the query language, for syntax errors (from {@link QueryParser}) and
 * for semantic errors found later (by the server's analyzer, through {@link #at}).
 *
 * <p>It carries a 1-based line and column, the problem in plain words ({@link #detail()}), an
 * optional hint on how to fix it, and the query text so that {@link #excerpt()} can show the
 * offending line with a caret. {@link #getMessage()} is {@code line L:C: <detail>} followed by
 * {@code \n  hint: <hint>} when there is a hint.
 */
public class QueryException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** Code points of the offending line shown on each side of the column in an excerpt. */
    private static final int EXCERPT_HALF_WIDTH = 60;

    private final String detail;
    private final int line;
    private final int column;
    private final String source;
    private final String hint;

    /**
     * @param message the problem in plain words, without the position
     * @param line 1-based line
     * @param column 1-based column, in code points
     * @param source the whole query text (may be empty when unknown)
     * @param hint how to fix it, or empty
     */
    public QueryException(String message, int line, int column, String source, String hint) {
        super(format(message, line, column, hint));
        this.detail = Objects.requireNonNull(message, "message");
        this.line = line;
        this.column = column;
        this.source = source == null ? "" : source;
        this.hint = hint == null ? "" : hint;
    }

    /** A semantic error at the first token of {@code node}, e.g. an unknown variable. */
    public static QueryException at(Node node, String source, String message, String hint) {
        Position position = node.position();
        return new QueryException(message, position.line(), position.column(), source, hint);
    }

    private static String format(String message, int line, int column, String hint) {
        String text = "line " + line + ":" + column + ": " + message;
        return hint == null || hint.isEmpty() ? text : text + "\n  hint: " + hint;
    }

    public int line() {
        return line;
    }

    public int column() {
        return column;
    }

    /** The problem in plain words, without position or hint. */
    public String detail() {
        return detail;
    }

    /** How to fix the problem, or the empty string. */
    public String hint() {
        return hint;
    }

    /** The query text the error was found in (empty when unknown). */
    public String source() {
        return source;
    }

    /**
     * The offending line of the query and, below it, a caret under the column; empty when the
     * line is not in the source. Long lines are cut to a window around the column, marked
     * with "...". Tabs before the column are repeated in the caret line so the caret lines up.
     */
    public String excerpt() {
        String[] lines = source.split("\r\n|\r|\n", -1);
        if (line < 1 || line > lines.length) {
            return "";
        }
        int[] text = lines[line - 1].codePoints().toArray();
        int caret = Math.min(Math.max(column - 1, 0), text.length);
        int from = Math.max(0, caret - EXCERPT_HALF_WIDTH);
        int to = Math.min(text.length, caret + EXCERPT_HALF_WIDTH);
        StringBuilder shown = new StringBuilder(from > 0 ? "..." : "");
        StringBuilder pointer = new StringBuilder(from > 0 ? "   " : "");
        for (int i = from; i < to; i++) {
            shown.appendCodePoint(text[i]);
        }
        for (int i = from; i < caret; i++) {
            pointer.append(text[i] == '\t' ? '\t' : ' ');
        }
        if (to < text.length) {
            shown.append("...");
        }
        return shown + "\n" + pointer + "^";
    }
}
