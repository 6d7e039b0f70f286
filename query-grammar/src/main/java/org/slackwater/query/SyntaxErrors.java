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

    private static final IntervalSet STATEMENT_START = set(MEAN, SUM, MIN, MAX, MEDIAN, PERCENTILE_STAT, LIST,
            DESCRIBE, CORRELATE, RANK, WINDOW, MAP, WATCH, LET, CELLS);
    private static final IntervalSet IDENTIFIER = set(IDENT, N, S, E, W, M, KM);
    private static final IntervalSet STATISTIC = set(MEAN, SUM, MIN, MAX, MEDIAN, PERCENTILE_STAT);
    private static final IntervalSet SERIES_START = union(STATISTIC, IDENTIFIER);
    private static final IntervalSet CONDITION_START = union(SERIES_START, set(ANOMALY, STANDARDIZED, PERCENTILE, LPAREN));
    private static final IntervalSet EXPRESSION_START = union(IDENTIFIER, set(NUMBER, LPAREN));
    private static final IntervalSet OPERATOR = set(PLUS, MINUS, STAR, SLASH);
    private static final IntervalSet TIME_UNIT = set(DAY, WEEK, MONTH, SEASON, YEAR, DAYS, WEEKS, MONTHS, SEASONS, YEARS);
    private static final IntervalSet COMPARATOR = set(ABOVE, BELOW, AT);
    private static final IntervalSet REGION_START = set(STRING, CIRCLE, BOX, WKT, LPAREN);
    private static final IntervalSet HEMISPHERE = set(N, S, E, W);
    private static final IntervalSet DISTANCE_UNIT = set(M, KM, IDENT);
    private static final IntervalSet DATE_START = set(DATE, NUMBER);
    private static final IntervalSet ANGLE_START = set(MINUS, NUMBER);
    private static final IntervalSet UNIT = set(UNIT_WORD, STRING);
    /** A unit right after a number: a unit word, a quoted unit or a plain word. */
    private static final IntervalSet NUMBER_UNIT = union(UNIT, IDENTIFIER);
    private static final IntervalSet STATEMENT_END = set(SEMI, Token.EOF);
    private static final IntervalSet CLAUSE_KEYWORDS = set(OVER, FROM, DURING, BY, IN, AS, WITH, LAGS, USING,
            DESEASONALIZED, AGAINST, MINUS_WORD);
    private static final String CLAUSE_ORDER =
            "the clauses of a series come in this order: over <region>, from/during <period>, by <step>,"
                    + " then optionally in <unit>, as <comparison>, with coverage";
    private static final String CORRELATION_ORDER =
            "the clauses of a correlation come in this order: with <series>, over <region>, from/during <period>,"
                    + " by <step>, then optionally lags, using <method>, deseasonalized, with coverage";
    private static final String RANKING_ORDER =
            "the clauses of a driver ranking come in this order: among <drivers>, over <region>,"
                    + " from/during <period>, by <step>, then optionally lags, using <method>, against <baseline>,"
                    + " with coverage";
    private static final String WINDOW_ORDER =
            "the clauses of an event window come in this order: before <dates>, of <variables>, over <region>,"
                    + " then optionally against <baseline>, with coverage";
    private static final String MAP_ORDER =
            "the clauses of a map come in this order: over <region>, from/during <period>, then optionally"
                    + " minus <period>, in <unit>, as <comparison>";
    private static final String CORRELATION_MAP_ORDER =
            "the clauses of a correlation map come in this order: of <series> over <region>,"
                    + " with <series> over <region>, from/during <period>, by <step>, then optionally lags,"
                    + " using <method>, deseasonalized";

    private static final String WITHIN_REGION =
            "name the series' own region after 'within', e.g. sum rainfall within \"Harle Watershed\"; a region is"
                    + " a quoted name, circle(lat, lon, radius), box(south, west, north, east) or wkt \"POLYGON((...))\"";

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

        if (offending.getType() == WITHIN && inRule(context, RULE_mapSpec) && !contains(expected, IDENTIFIER)) {
            return error("a map takes its region from 'over'; remove 'within ...'", line, column,
                    mapOf(context) instanceof CorrelationMapContext
                            ? "write each series' region with 'over': map correlation of <series> over <region>"
                                    + " with <series> over <region> ..."
                            : "every cell of the region after 'over' is mapped, e.g. map sum rainfall over"
                                    + " \"Harle Watershed\" during 2014-06");
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
        // A clause keyword or 'within' out of place: say where it belongs. After 'within' a region is
        // missing, whatever word took its place.
        String placement = inRule(context, RULE_withinClause) && contains(expected, REGION_START) ? WITHIN_REGION
                : CLAUSE_KEYWORDS.contains(offending.getType()) ? clauseOrder(context)
                : offending.getType() == WITHIN ? withinHint(context, expected) : null;
        if (contains(STATEMENT_END, expected)) {
            return error("unexpected " + found + " after the end of the statement", line, column,
                    placement != null ? placement : "separate statements with ';'");
        }
        List<String> items = items(expected, context);
        String hint = placement != null ? placement : specialHint(offending, previous, expected)
                .orElseGet(() -> hint(expected, context));
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

    /** The clause order of the statement at hand (or just ended), or null when it has none to tell. */
    private static String clauseOrder(RuleContext context) {
        RuleContext statement = statementOf(context);
        if (statement instanceof AreaSeriesContext) {
            return CLAUSE_ORDER;
        }
        if (statement instanceof CorrelationContext) {
            return CORRELATION_ORDER;
        }
        if (statement instanceof DriverRankingContext) {
            return RANKING_ORDER;
        }
        if (statement instanceof EventWindowContext) {
            return WINDOW_ORDER;
        }
        if (statement instanceof MapContext) {
            MapSpecContext spec = ((MapContext) statement).mapSpec();
            return spec instanceof CorrelationMapContext ? CORRELATION_MAP_ORDER : MAP_ORDER;
        }
        return null;
    }

    /** The statement at hand, or the one just ended when the context is the script; or null. */
    private static RuleContext statementOf(RuleContext context) {
        RuleContext statement = context;
        while (statement != null && !(statement instanceof StatementContext)) {
            statement = statement.parent;
        }
        if (statement == null && context instanceof ScriptContext) {
            List<StatementContext> done = ((ScriptContext) context).statement();
            statement = done.isEmpty() ? null : done.get(done.size() - 1);
        }
        return statement;
    }

    /** The map statement around the context, or null. */
    private static MapSpecContext mapOf(RuleContext context) {
        for (RuleContext c = context; c != null; c = c.parent) {
            if (c instanceof MapSpecContext) {
                return (MapSpecContext) c;
            }
        }
        return null;
    }

    /** Where 'within' belongs, said for the statement in which it was misplaced. */
    private static String withinHint(RuleContext context, IntervalSet expected) {
        if (contains(expected, IDENTIFIER)) {
            return "'within' is a keyword and cannot name a variable";
        }
        if (inRule(context, RULE_withinClause)) {
            return "a series has one region; for the part of one region inside another write 'clipped to',"
                    + " e.g. within \"Harle Watershed\" clipped to box(44.3, -32.2, 44.9, -31.4)";
        }
        RuleContext statement = statementOf(context);
        if (statement instanceof WatchContext) {
            return "a watch series names its own region with 'over', e.g. 'sum runoff over \"Harle Watershed\""
                    + " over 7 days above 3000000 m3'";
        }
        String series = "'within <region>' follows the variable of a series in correlate, rank drivers or window,"
                + " e.g. 'sum runoff within \"Harle Watershed\"'";
        if (statement instanceof AreaSeriesContext) {
            return "an area series takes its region from 'over', e.g. 'mean chlorophyll over \"Outer Bay\"'; "
                    + series;
        }
        return series;
    }

    /** Hints for a few slips that the expected tokens alone would not explain. */
    private static Optional<String> specialHint(Token offending, Optional<Token> previous, IntervalSet expected) {
        int type = offending.getType();
        int before = previous.map(Token::getType).orElse(Token.INVALID_TYPE);
        if (type == DATE && !expected.contains(DATE) && expected.contains(NUMBER)) {
            return Optional.of("put spaces around '-' between numbers: 10 - 3 (without them, 10-3 reads as a date)");
        }
        if (type == NOT && before == NOT) {
            return Optional.of("'not' takes one condition: write not (not ...)");
        }
        if (type == MINUS && before == MINUS && contains(expected, EXPRESSION_START)) {
            return Optional.of("one minus sign at a time: write -(-x)");
        }
        if (type == AGAINST && expected.contains(FOR)) {
            return Optional.of("a baseline belongs to a comparison, e.g. 'anomaly of mean water_temperature above 2"
                    + " against 2006 to 2020'");
        }
        if (contains(expected, NUMBER_UNIT) && literal(type).filter(w -> Character.isLetter(w.charAt(0))).isPresent()) {
            return Optional.of("a unit that is also a word of the language goes in double quotes: \""
                    + offending.getText() + "\"");
        }
        return Optional.empty();
    }

    /** The expected tokens in words, groups first, then single tokens, end of query last. */
    private static List<String> items(IntervalSet expected, RuleContext context) {
        IntervalSet rest = new IntervalSet(expected);
        List<String> items = new ArrayList<>();
        if (take(rest, STATEMENT_START)) {
            items.add("a statement");
        }
        if (take(rest, CONDITION_START)) {
            rest.remove(NOT);
            items.add("a condition");
        }
        if (take(rest, SERIES_START)) {
            items.add("a variable name");
        }
        if (take(rest, EXPRESSION_START)) {
            rest.remove(MINUS);
            items.add("a number, a variable name or '('");
        }
        if (take(rest, NUMBER_UNIT)) {
            items.add("a unit");
        }
        if (take(rest, IDENTIFIER)) {
            items.add(identifierName(context));
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
        if (take(rest, OPERATOR)) {
            items.add("an operator (+ - * /)");
        }
        if (take(rest, TIME_UNIT)) {
            items.add("a unit of time (days, weeks, months, seasons or years)");
        }
        if (take(rest, COMPARATOR)) {
            items.add("a comparison (above, below, at least or at most)");
        }
        boolean end = rest.contains(Token.EOF);
        rest.remove(Token.EOF);
        for (int type : rest.toArray()) {
            items.add(tokenName(type, expected, context));
        }
        if (end) {
            items.add("end of query");
        }
        return items;
    }

    private static String identifierName(RuleContext context) {
        if (inRule(context, RULE_variable)) {
            return "a variable name";
        }
        if (inRule(context, RULE_methodClause)) {
            return "a correlation method (pearson or spearman)";
        }
        if (inRule(context, RULE_watchRule) && !inRule(context, RULE_condition)) {
            return "a severity (notice, warning or alert)";
        }
        return "a name";
    }

    private static String tokenName(int type, IntervalSet expected, RuleContext context) {
        switch (type) {
            case NUMBER:
                return inRule(context, RULE_distance) ? "a radius such as 3 km"
                        : inRule(context, RULE_coverageClause) ? "a percentage" : "a number";
            case STRING:
                if (inRule(context, RULE_regionPrimary)) {
                    return "the WKT text in double quotes";
                }
                return context instanceof WatchContext ? "the watch's name in double quotes" : "a quoted string";
            case WATER:
                return "water year";
            case STANDARDIZED:
                return "standardized anomaly";
            case CLIPPED:
                return "clipped to";
            case AT:
                return expected.contains(LAGS) || expected.contains(USING) ? "at lag" : "at least";
            case AS:
                return expected.contains(DESEASONALIZED) ? "as anomalies" : "as";
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

    private static String hint(IntervalSet expected, RuleContext context) {
        if (expected.contains(FROM) && expected.contains(DURING)) {
            return "give the period, e.g. 'during 2014' or 'from 2014-06 to 2014-08'";
        }
        if (contains(expected, STATEMENT_START)) {
            return "a statement starts with mean, sum, min, max, median, pNN, list, describe, correlate, rank,"
                    + " window, map, watch, let or cells";
        }
        if (contains(expected, CONDITION_START)) {
            return "a condition compares a series with a number, e.g. 'mean chlorophyll above 10 mg/m3', or its"
                    + " comparison with a baseline, e.g. 'standardized anomaly of sum runoff over 30 days above 2'";
        }
        if (contains(expected, SERIES_START)) {
            return "a statistic may come before the variable: mean (the default), sum, min, max, median or pNN";
        }
        if (contains(expected, EXPRESSION_START)) {
            return "an expression combines numbers (with a unit if needed, e.g. 25 degC) and variables with"
                    + " + - * / and parentheses";
        }
        if (contains(expected, REGION_START)) {
            return "write a quoted region name such as \"Outer Bay\", circle(lat, lon, radius),"
                    + " box(south, west, north, east) or wkt \"POLYGON((...))\"";
        }
        if (contains(expected, DATE_START)) {
            return "write dates as YYYY, YYYY-MM or YYYY-MM-DD";
        }
        if (expected.contains(OVER) && context instanceof WatchContext) {
            return "name the watched region after the watch's name, e.g. over \"North Intake\"";
        }
        if (expected.contains(OVER) && expected.contains(WITHIN)) {
            return "name the statement's region after the series, e.g. over \"Outer Bay\"; one series may have"
                    + " a region of its own, e.g. sum rainfall within \"Harle Watershed\"";
        }
        if (expected.contains(OVER) && !expected.contains(ABOVE)) {
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

    private static IntervalSet union(IntervalSet a, IntervalSet b) {
        IntervalSet set = new IntervalSet(a);
        set.addAll(b);
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
        return quote(text, MAX_SHOWN);
    }

    /** The text in single quotes, shortened to {@code max} code points when longer. */
    static String quote(String text, int max) {
        String shown = text.codePointCount(0, text.length()) > max
                ? text.substring(0, text.offsetByCodePoints(0, max - 3)) + "..."
                : text;
        return "'" + shown + "'";
    }
}
