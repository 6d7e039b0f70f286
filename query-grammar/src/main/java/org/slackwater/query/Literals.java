package org.slackwater.query;

import java.math.BigDecimal;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.Position;

/**
 * Reading and writing the literal forms of the language: numbers (no exponent, no sign of
 * their own), double-quoted strings with the two escapes {@code \"} and {@code \\}.
 */
final class Literals {

    private Literals() {}

    static Position position(Token token) {
        return new Position(token.getLine(), token.getCharPositionInLine() + 1);
    }

    /** A query error at {@code token}. */
    static QueryException error(Token token, String source, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, source, hint);
    }

    /** The value of a NUMBER token; very long numbers become infinite and fail range checks. */
    static double number(Token token) {
        return Double.parseDouble(token.getText()) + 0.0;
    }

    /** A number as the printer writes it: plain decimal, no exponent, no trailing zeros. */
    static String formatNumber(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("cannot write a non-finite number: " + value);
        }
        return BigDecimal.valueOf(value + 0.0).stripTrailingZeros().toPlainString();
    }

    /** The content of a STRING token, escapes resolved. */
    static String unquote(Token token, String source) {
        String text = token.getText();
        StringBuilder content = new StringBuilder(text.length());
        int column = token.getCharPositionInLine() + 2; // of the first code point after the quote
        int end = text.length() - 1;
        for (int i = 1; i < end; ) {
            int c = text.codePointAt(i);
            if (c == '\\') {
                int escaped = text.codePointAt(i + 1);
                if (escaped != '"' && escaped != '\\') {
                    throw new QueryException(
                            "unknown escape '\\" + new String(Character.toChars(escaped)) + "' in a string",
                            token.getLine(), column, source,
                            "only \\\" (a double quote) and \\\\ (a backslash) are escapes");
                }
                content.appendCodePoint(escaped);
                i += 1 + Character.charCount(escaped);
                column += 2;
            } else {
                content.appendCodePoint(c);
                i += Character.charCount(c);
                column += 1;
            }
        }
        return content.toString();
    }

    /** A string literal for the printer: double quotes, with {@code "} and {@code \} escaped. */
    static String quote(String content) {
        return '"' + content.replace("\\", "\\\\").replace("\"", "\\\"") + '"';
    }
}
