package org.slackwater.query;

import static org.slackwater.query.parser.SlackwaterParser.*;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.RuleContext;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenStream;
import org.antlr.v4.runtime.misc.IntervalSet;

/**
 * Turns ANTLR's recognition errors into {@link QueryException}s in plain words: the expected
 * tokens are named as a reader knows them ("a variable name", "a region", "day, week, ..."),
 * never by token type, and a word that is not a keyword but close to an expected keyword gets
 * a "did you mean" hint.
 */
final class SyntaxErrors {

    private static final IntervalSet STATEMENT_START =
            set(MEAN, SUM, MIN, MAX, MEDIAN, PERCENTILE_STAT, LIST, DESCRIBE);
    private static final IntervalSet IDENTIFIER = set(IDENT, N, S, E, W, M, KM);
    private static final IntervalSet REGION_START = set(STRING, CIRCLE, BOX, WKT, LPAREN);
    private static final IntervalSet HEMISPHERE = set(N, S, E, W);
    private static final IntervalSet DISTANCE_UNIT = set(M, KM, IDENT);
    private static final IntervalSet DATE_START = set(DATE, NUMBER);
    private static final IntervalSet ANGLE_START = set(MINUS, NUMBER);
    private static final IntervalSet UNIT = set(UNIT_WORD, STRING);
    private static final IntervalSet STATEMENT_END = set(SEMI, Token.EOF);
    private static final IntervalSet CLAUSE_KEYWORDS = set(OVER, FROM, DURING, BY, IN, AS, WITH);
    private static final String CLAUSE_ORDER =
            "the clauses of a series come in this order: over <region>, from/during <period>, by <step>,"
                    + " then optionally in <unit>, as <comparison>, with coverage";

    /** Longest text of an offending token quoted in a message. */
    private static final int MAX_SHOWN = 40;

    private final String source;

    SyntaxErrors(String source) {
        this.source = source;
    }

    QueryException translate(Parser parser, RecognitionException e) {
        Token offending = e.getOffendingToken() != null ? e.getOffendingToken() : parser.getCurrentToken();
        IntervalSet expected = e.getExpectedTokens() != null ? e.getExpectedTokens() : parser.getExpectedTokens();
        RuleContext context = e.getCtx() != null ? e.getCtx() : parser.getContext();
        Optional<Token> previous = previousToken(parser.getInputStream(), offending);
        return describe(offending, expected, context, previous);
    }

    private QueryException describe(Token offending, IntervalSet expected, RuleContext context, Optional<Token> previous) {
        int line = offending.getLine();
        int column = offending.getCharPositionInLine() + 1;
        String found = found(offending);
        String after = previous.map(p -> " after " + quote(p.getText())).orElse("");

        if (offending.getType() == ERROR_CHAR) {
            return error("unexpected character " + describeCharacter(offending.getText()), line, column,
                    characterHint(offending.getText()));
        }
        if (offending.getType() == UNTERMINATED_STRING) {
            return error("unterminated string: the closing double quote is missing", line, column,
                    "a string ends on the line where it starts; write \\\" for a quote inside it");
        }

        if (offending.getType() == IDENT) {
            Optional<String> suggestion = Suggestions.nearest(offending.getText(), keywordsOf(expected));
            if (suggestion.isPresent()) {
                return error("unknown word " + quote(offending.getText()), line, column,
                        "did you mean '" + suggestion.get() + "'?");
            }
        }
        if (expected.contains(BY)) {
            return error("expected 'by <step>'" + after + ", found " + found, line, column,
                    "add the time step, e.g. 'by month' (day, week, month, season, year or water year)");
        }
        boolean misplacedClause = CLAUSE_KEYWORDS.contains(offending.getType());
        if (contains(STATEMENT_END, expected)) {
            return error("unexpected " + found + " after the end of the statement", line, column,
                    misplacedClause ? CLAUSE_ORDER : "separate statements with ';'");
        }
        List<String> items = items(expected, context);
        String hint = misplacedClause ? CLAUSE_ORDER : hint(expected);
        if (items.size() == 1) {
            return error("expected " + single(items.get(0)) + after + ", found " + found, line, column, hint);
        }
        return error("unexpected " + found + after + "; expected one of: " + String.join(", ", items),
                line, column, hint);
    }

    private static String describeCharacter(String text) {
        int c = text.codePointAt(0);
        String code = String.format("U+%04X", c);
        boolean invisible = Character.isISOControl(c) || Character.isWhitespace(c) || !Character.isDefined(c)
                || Character.getType(c) == Character.FORMAT || Character.getType(c) == Character.SURROGATE;
        if (invisible) {
            return code;
        }
        return (c == '\'' ? "\"'\"" : "'" + text + "'") + " (" + code + ")";
    }

    private static String characterHint(String text) {
        switch (text) {
            case "\u201C":
            case "\u201D":
                return "use straight double quotes (\") around names";
            case "'":
            case "\u2018":
            case "\u2019":
                return "names go in double quotes, e.g. \"Outer Bay\"";
            case ".":
                return "write decimal numbers with a digit before the point, e.g. 0.5";
            default:
                return "";
        }
    }

    private QueryException error(String detail, int line, int column, String hint) {
        return new QueryException(detail, line, column, source, hint);
    }

    /** The expected tokens in words, groups first, then single tokens, end of query last. */
    private static List<String> items(IntervalSet expected, RuleContext context) {
        IntervalSet rest = new IntervalSet(expected);
        List<String> items = new ArrayList<>();
        if (take(rest, STATEMENT_START)) {
            items.add("a statement");
        }
        if (take(rest, IDENTIFIER)) {
            items.add(inRule(context, RULE_variable) ? "a variable name" : "a name");
        }
        if (take(rest, REGION_START)) {
            items.add("a region");
        }
        if (take(rest, HEMISPHERE)) {
            items.add("a hemisphere letter (N, S, E or W)");
        }
        if (take(rest, DISTANCE_UNIT)) {
            items.add("a distance unit (m or km)");
        }
        if (take(rest, DATE_START)) {
            items.add("a date");
        }
        if (take(rest, ANGLE_START)) {
            items.add(inRule(context, RULE_latitude) ? "a latitude"
                    : inRule(context, RULE_longitude) ? "a longitude" : "a number");
        }
        if (take(rest, UNIT)) {
            items.add("a unit");
        }
        boolean end = rest.contains(Token.EOF);
        rest.remove(Token.EOF);
        for (int type : rest.toArray()) {
            items.add(tokenName(type, context));
        }
        if (end) {
            items.add("end of query");
        }
        return items;
    }

    private static String tokenName(int type, RuleContext context) {
        switch (type) {
            case NUMBER:
                return inRule(context, RULE_distance) ? "a radius such as 3 km"
                        : inRule(context, RULE_coverageClause) ? "a percentage" : "a number";
            case STRING:
                return inRule(context, RULE_regionPrimary) ? "the WKT text in double quotes" : "a quoted string";
            case WATER:
                return "water year";
            case STANDARDIZED:
                return "standardized anomaly";
            case CLIPPED:
                return "clipped to";
            case AT:
                return "at least";
            case PERCENTILE_STAT:
                return "a percentile such as p90";
            default:
                return literal(type).orElse(VOCABULARY.getDisplayName(type));
        }
    }

    /** A list item as the single expected thing: keywords and punctuation quoted, phrases not. */
    private static String single(String item) {
        return item.startsWith("a ") || item.startsWith("the ") || item.startsWith("end ") || item.startsWith("'")
                ? item
                : "'" + item + "'";
    }

    private static String hint(IntervalSet expected) {
        if (expected.contains(FROM) && expected.contains(DURING)) {
            return "give the period, e.g. 'during 2014' or 'from 2014-06 to 2014-08'";
        }
        if (contains(expected, STATEMENT_START)) {
            return "a statement starts with mean, sum, min, max, median, pNN, list or describe";
        }
        if (contains(expected, REGION_START)) {
            return "write a quoted region name such as \"Outer Bay\", circle(lat, lon, radius),"
                    + " box(south, west, north, east) or wkt \"POLYGON((...))\"";
        }
        if (contains(expected, DATE_START)) {
            return "write dates as YYYY, YYYY-MM or YYYY-MM-DD";
        }
        if (expected.contains(OVER)) {
            return "name the region after the variable, e.g. over \"Outer Bay\"";
        }
        return "";
    }

    /** The keywords among the expected tokens, as words to suggest. */
    private static List<String> keywordsOf(IntervalSet expected) {
        List<String> words = new ArrayList<>();
        for (int type : expected.toArray()) {
            literal(type).filter(w -> Character.isLetter(w.charAt(0)) && w.length() > 1).ifPresent(words::add);
        }
        return words;
    }

    /** The literal text of a token type ("over", "'%'"), keywords bare, punctuation quoted. */
    private static Optional<String> literal(int type) {
        String literal = VOCABULARY.getLiteralName(type);
        if (literal == null) {
            return Optional.empty();
        }
        String text = literal.substring(1, literal.length() - 1);
        return Optional.of(Character.isLetter(text.charAt(0)) ? text : "'" + text + "'");
    }

    private static IntervalSet set(int... types) {
        IntervalSet set = new IntervalSet();
        for (int type : types) {
            set.add(type);
        }
        return set;
    }

    private static boolean take(IntervalSet set, IntervalSet group) {
        if (!contains(set, group)) {
            return false;
        }
        for (int type : group.toArray()) {
            set.remove(type);
        }
        return true;
    }

    private static boolean contains(IntervalSet set, IntervalSet group) {
        return group.and(set).equals(group);
    }

    private static boolean inRule(RuleContext context, int ruleIndex) {
        for (RuleContext c = context; c != null; c = c.parent) {
            if (c.getRuleIndex() == ruleIndex) {
                return true;
            }
        }
        return false;
    }

    private static Optional<Token> previousToken(TokenStream tokens, Token offending) {
        for (int i = offending.getTokenIndex() - 1; i >= 0; i--) {
            Token token = tokens.get(i);
            if (token.getChannel() == Token.DEFAULT_CHANNEL) {
                return Optional.of(token);
            }
        }
        return Optional.empty();
    }

    private static String found(Token token) {
        return token.getType() == Token.EOF ? "end of query" : quote(token.getText());
    }

    /** The text in single quotes, shortened when long. */
    static String quote(String text) {
        String shown = text.codePointCount(0, text.length()) > MAX_SHOWN
                ? text.substring(0, text.offsetByCodePoints(0, MAX_SHOWN - 3)) + "..."
                : text;
        return "'" + shown + "'";
    }
}
