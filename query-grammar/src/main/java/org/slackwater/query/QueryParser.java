package org.slackwater.query;

import java.util.List;
import java.util.Objects;
import org.antlr.v4.runtime.BaseErrorListener;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.CommonTokenStream;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.Recognizer;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.Script;
import org.slackwater.query.parser.SlackwaterLexer;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Parses query text into a {@link Script}.
 *
 * <p>Every failure is a {@link QueryException} with a 1-based line and column: characters the
 * language does not use, unterminated strings, syntax errors (the first one only, with the
 * expected words), and bad values (dates, coordinates, percentiles, radii, coverage, lags,
 * durations, thresholds, repeated names). Input is
 * bounded before parsing so that no input can exhaust the stack: at most {@link #MAX_LENGTH}
 * characters, {@link #MAX_NESTING} levels of parentheses, {@link #MAX_CLIPS} uses of
 * {@code clipped to} in one statement and {@link #MAX_OPERATORS} operators in one {@code let};
 * {@code not} and unary minus take a single operand each, never a chain of their own. The parser keeps no state; it is safe to call from
 * several threads.
 */
public final class QueryParser {

    /** The longest query text accepted, in UTF-16 characters. */
    public static final int MAX_LENGTH = 1_000_000;
    /** The deepest nesting of parentheses accepted. */
    public static final int MAX_NESTING = 32;
    /** The most {@code clipped to} accepted in one statement. */
    public static final int MAX_CLIPS = 64;
    /** The most arithmetic operators (+ - * /, unary minus included) accepted in one {@code let}. */
    public static final int MAX_OPERATORS = 128;

    private QueryParser() {}

    /** Parses {@code text}, one or more statements separated by ';'. */
    public static Script parse(String text) {
        Objects.requireNonNull(text, "text");
        if (text.length() > MAX_LENGTH) {
            throw new QueryException(String.format("query too large: %,d characters, the limit is %,d",
                    text.length(), MAX_LENGTH), 1, 1, "", "split the work into several smaller queries");
        }
        SlackwaterLexer lexer = new SlackwaterLexer(CharStreams.fromString(text));
        lexer.removeErrorListeners();
        lexer.addErrorListener(new BaseErrorListener() {
            @Override
            public void syntaxError(Recognizer<?, ?> recognizer, Object symbol, int line, int column,
                    String msg, RecognitionException e) {
                // Unreachable while the lexer ends with a catch-all rule; kept so a grammar
                // change cannot let ANTLR print to the console instead of failing.
                throw new QueryException("unexpected input", line, column + 1, text, "");
            }
        });
        CommonTokenStream tokens = new CommonTokenStream(new LimitedTokenSource(lexer, text));
        tokens.fill();
        checkNotEmpty(tokens.getTokens(), text);

        SyntaxErrors errors = new SyntaxErrors(text);
        SlackwaterParser parser = new SlackwaterParser(tokens);
        parser.removeErrorListeners();
        parser.setErrorHandler(new FailFastErrorStrategy(errors));
        SlackwaterParser.ScriptContext tree = parser.script();
        return new AstBuilder(text).visitScript(tree);
    }

    private static void checkNotEmpty(List<Token> tokens, String text) {
        for (Token token : tokens) {
            if (token.getType() != Token.EOF && token.getChannel() == Token.DEFAULT_CHANNEL) {
                return;
            }
        }
        Token eof = tokens.get(tokens.size() - 1);
        throw error(eof, text, "the query is empty", "write a statement, for example: list variables");
    }

    private static QueryException error(Token token, String text, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, text, hint);
    }
}
