package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.Watch;

/**
 * Malformed statements of the "Query language v1" issue and the exact error each gets. The
 * column is not copied from the parser's answer: each row names the offending word (or the end
 * of the text), and the column is where that word stands in the text.
 */
class LanguageV1ErrorTest {

    private static final String CORRELATE = "correlate chlorophyll with runoff over \"Outer Bay\" during 2006 to 2025"
            + " by week ";
    private static final String RANK = "rank drivers of chlorophyll among ";
    private static final String WINDOW = "window 60 days before ";
    private static final String MAP = "map mean chlorophyll over \"Outer Bay\" during 2014-06 ";
    private static final String CMAP = "map correlation of chlorophyll over \"Outer Bay\" with runoff over"
            + " \"Harle Watershed\" during 2006 to 2025 ";
    private static final String WATCH = "watch \"w\" over \"North Intake\" when ";
    private static final String BAY = " over \"Outer Bay\" during 2006 to 2025 by week";
    private static final String SHED = " within \"Harle Watershed\"";
    /** Marks a row whose error is at the end of the text; "last:word" marks the last 'word'. */
    private static final String END = "<end>";

    static Stream<Arguments> errors() {
        return Stream.of(
                // correlate
                row("correlate", END, "expected a variable name after 'correlate', found end of query"),
                row("correlate 2014", "2014", "expected a variable name after 'correlate', found '2014'"),
                row("correlate chlorophyll runoff", "runoff",
                        "unexpected 'runoff' after 'chlorophyll'; expected one of: with, within"),
                row("correlate chlorophyll with", END, "expected a variable name after 'with', found end of query"),
                row("correlate chlorophyll with mean", END, "expected a variable name after 'mean', found end of query"),
                row("correlate chlorophyll with runoff", END,
                        "unexpected end of query after 'runoff'; expected one of: over, within"),
                row("correlate chlorophyll with runoff over \"Outer Bay\" during 2006 to 2025", END,
                        "expected 'by <step>' after '2025', found end of query"),
                row(CORRELATE + "foo", "foo", "unexpected 'foo' after 'week'; expected one of: as anomalies, with,"
                        + " at lag, lags, using, deseasonalized, ';', end of query"),
                row(CORRELATE + "lags 0 12 weeks", "12", "expected 'to' after '0', found '12'"),
                row(CORRELATE + "lags 0 to 12", END, "expected a unit of time (days, weeks, months, seasons or years)"
                        + " after '12', found end of query"),
                row(CORRELATE + "lags 0 to 12 fortnights", "fortnights", "expected a unit of time (days, weeks,"
                        + " months, seasons or years) after '12', found 'fortnights'"),
                row(CORRELATE + "lags 12 to 0 weeks", "0 weeks", "the lags end at 0 weeks, before they start at 12 weeks"),
                row(CORRELATE + "lags 0 to 2.5 weeks", "2.5", "the lag must be a whole number of weeks, found 2.5"),
                row(CORRELATE + "lags -200000 to 0 weeks", "200000",
                        "the lag must be at most 100000 weeks either way, found -200000"),
                row(CORRELATE + "lags 0 to 12 weeks step 0 weeks", "0 weeks",
                        "the lag step must be at least 1 week"),
                row(CORRELATE + "lags 0 to 12 weeks step 7 days", "days",
                        "the lag step must be in weeks, like the lags, found 'days'"),
                row(CORRELATE + "at 4 weeks", "4", "expected 'lag' after 'at', found '4'"),
                row(CORRELATE + "using", END,
                        "expected a correlation method (pearson or spearman) after 'using', found end of query"),
                row(CORRELATE + "using kendall", "kendall", "unknown correlation method 'kendall'"),
                row(CORRELATE + "as anomaly", "anomaly", "expected 'anomalies' after 'as', found 'anomaly'"),
                row(CORRELATE + "deseasonalized using spearman", "using",
                        "unexpected 'using' after 'deseasonalized'; expected one of: against, with, ';', end of query"),
                row(CORRELATE + "in degC", "in degC", "unexpected 'in' after 'week'; expected one of: as anomalies, with,"
                        + " at lag, lags, using, deseasonalized, ';', end of query"),
                // rank drivers
                row("rank chlorophyll", "chlorophyll", "expected 'drivers' after 'rank', found 'chlorophyll'"),
                row("rank drivers chlorophyll", "chlorophyll", "expected 'of' after 'drivers', found 'chlorophyll'"),
                row(RANK, END, "expected a variable name after 'among', found end of query"),
                row(RANK + "rainfall runoff" + BAY, "runoff",
                        "unexpected 'runoff' after 'rainfall'; expected one of: over, within, ','"),
                row(RANK + "rainfall, over \"Outer Bay\"", "over", "expected a variable name after ',', found 'over'"),
                row(RANK + "rainfall, runoff, rainfall" + BAY, "rainfall over",
                        "the driver 'mean rainfall' is listed twice"),
                row(RANK + "sum rainfall, mean chlorophyll" + BAY, "mean chlorophyll",
                        "'mean chlorophyll' is the series being explained; it cannot be its own driver"),
                row(RANK + "rainfall" + BAY + " deseasonalized", "deseasonalized", "unexpected 'deseasonalized' after"
                        + " 'week'; expected one of: against, with, at lag, lags, using, ';', end of query"),
                // window
                row("window 60 before 2014-06-20 of rainfall over \"Outer Bay\"", "before", "expected a unit of time"
                        + " (days, weeks, months, seasons or years) after '60', found 'before'"),
                row("window 60 days 2014-06-20 of rainfall", "2014", "expected 'before' after 'days', found '2014-06-20'"),
                row(WINDOW + "of rainfall over \"Outer Bay\"", "of", "expected a date after 'before', found 'of'"),
                row(WINDOW + "2014-06 of rainfall over \"Outer Bay\"", "2014", "an event is one day, found '2014-06'"),
                row(WINDOW + "2014-06-31 of rainfall over \"Outer Bay\"", "2014",
                        "invalid date '2014-06-31': the day must be 01 to 30 in June 2014"),
                row("window 0 days before 2014-06-20 of rainfall over \"Outer Bay\"", "0",
                        "the window must be at least 1 day"),
                row("window 1.5 weeks before 2014-06-20 of rainfall over \"Outer Bay\"", "1.5",
                        "the window must be a whole number of weeks, found 1.5"),
                row(WINDOW + "2014-06-20, 2014-06-20 of rainfall over \"Outer Bay\"", "2014-06-20 of",
                        "the event 2014-06-20 is listed twice"),
                row(WINDOW + "2014-06-20 rainfall over \"Outer Bay\"", "rainfall",
                        "unexpected 'rainfall' after '2014-06-20'; expected one of: of, ','"),
                row(WINDOW + "2014-06-20 of rainfall, sum runoff, rainfall over \"Outer Bay\"", "rainfall over",
                        "the variable 'mean rainfall' is listed twice"),
                row(WINDOW + "2014-06-20 of rainfall over \"Outer Bay\" during 2014", "during", "unexpected 'during'"
                        + " after '\"Outer Bay\"'; expected one of: clipped to, against, with, ';', end of query"),
                // within: a series' own region
                row("correlate chlorophyll with runoff within", END,
                        "expected a region after 'within', found end of query"),
                row("correlate chlorophyll within over \"Outer Bay\"", "over",
                        "expected a region after 'within', found 'over'"),
                row(RANK + "rainfall within Harle" + BAY, "Harle", "expected a region after 'within', found 'Harle'"),
                row(RANK + "rainfall within within \"Harle Watershed\"" + BAY, "last:within",
                        "expected a region after 'within', found 'within'"),
                row(RANK + "rainfall within \"\"" + BAY, "\"\"", "the region name is empty"),
                row("correlate chlorophyll with runoff within \"Harle Watershed\" clipped to", END,
                        "expected a region after 'to', found end of query"),
                row("correlate chlorophyll with runoff within circle(44.5 N, 31.8 W, 0 km)" + BAY, "0 km",
                        "the radius must be greater than 0"),
                row(RANK + "rainfall" + SHED + " within \"Upper Reach\"" + BAY, "within \"Upper",
                        "unexpected 'within' after '\"Harle Watershed\"'; expected one of: over, clipped to, ','"),
                row(WINDOW + "2014-06-20 of rainfall" + SHED + " during 2014", "during",
                        "unexpected 'during' after '\"Harle Watershed\"'; expected one of: over, clipped to, ','"),
                row(RANK + "sum rainfall" + SHED + ", runoff" + SHED + ", sum rainfall" + SHED + BAY, "last:sum rainfall",
                        "the driver 'sum rainfall within \"Harle Watershed\"' is listed twice"),
                row(RANK + "rainfall, rainfall within \"Outer Bay\"" + BAY, "rainfall within",
                        "the driver 'mean rainfall within \"Outer Bay\"' is listed twice"),
                row(WINDOW + "2014-06-20 of water_temperature within \"Outer Bay\", mean water_temperature"
                        + " over \"Outer Bay\"", "mean water_temperature",
                        "the variable 'mean water_temperature' is listed twice"),
                row("rank drivers of chlorophyll within \"Outer Bay\" among runoff" + SHED + ", chlorophyll" + BAY,
                        "last:chlorophyll", "'mean chlorophyll' is the series being explained; it cannot be its own driver"),
                // Repeats are found in text order: here the second rainfall before the target.
                row(RANK + "rainfall" + SHED + ", rainfall" + SHED + ", chlorophyll" + BAY, "rainfall within \"Harle"
                        + " Watershed\", chl", "the driver 'mean rainfall within \"Harle Watershed\"' is listed twice"),
                row("mean rainfall" + SHED + " during 2014 by month", "within",
                        "expected 'over' after 'rainfall', found 'within'"),
                row("map sum rainfall" + SHED + " during 2014-06", "within",
                        "a map takes its region from 'over'; remove 'within ...'"),
                row(MAP.replace("during", "within \"Mid Reach\" during"), "within",
                        "a map takes its region from 'over'; remove 'within ...'"),
                row("map correlation of chlorophyll within \"Outer Bay\" with runoff over \"Harle Watershed\"", "within",
                        "a map takes its region from 'over'; remove 'within ...'"),
                row("map correlation of chlorophyll over \"Outer Bay\" with runoff" + SHED + " during 2006 to 2025"
                        + " by week", "within", "a map takes its region from 'over'; remove 'within ...'"),
                row(CORRELATE.replace(" during", " within \"Mid Reach\" during"), "within", "unexpected 'within'"
                        + " after '\"Outer Bay\"'; expected one of: from, during, clipped to"),
                row(WATCH + "chlorophyll within \"Mid Reach\" above 10", "within", "unexpected 'within' after"
                        + " 'chlorophyll'; expected one of: a comparison (above, below, at least or at most), over"),
                row("let within = 2", "within", "expected a variable name after 'let', found 'within'"),
                // maps
                row("map", END, "unexpected end of query after 'map'; expected one of: a variable name, correlation"),
                row("map chlorophyll during 2014", "during", "expected 'over' after 'chlorophyll', found 'during'"),
                row(MAP + "minus", END, "expected a date after 'minus', found end of query"),
                row(MAP + "- 2013-06", "- 2013",
                        "unexpected '-' after '2014-06'; expected one of: to, in, as, minus, ';', end of query"),
                row(MAP + "minus 2013-06 as anomaly", "as", "a map is either a difference ('minus') or a comparison"
                        + " ('as'), not both"),
                row(MAP + "by month", "by",
                        "unexpected 'by' after '2014-06'; expected one of: to, in, as, minus, ';', end of query"),
                row(MAP + "minus 2014 to 2013", "2013", "the period ends on 2013-12-31, before it starts on 2014-01-01"),
                row("map correlation chlorophyll", "chlorophyll", "expected 'of' after 'correlation', found 'chlorophyll'"),
                row("map correlation of chlorophyll with runoff", "with",
                        "expected 'over' after 'chlorophyll', found 'with'"),
                row(CMAP, END, "expected 'by <step>' after '2025', found end of query"),
                row(CMAP + "by week foo", "foo", "unexpected 'foo' after 'week'; expected one of:"
                        + " as anomalies, at lag, lags, using, deseasonalized, ';', end of query"),
                row(CMAP + "by week lags 26 to 0 weeks", "0 weeks",
                        "the lags end at 0 weeks, before they start at 26 weeks"),
                row(CMAP + "by week lags 0 to 26 weeks step 0 weeks", "0 weeks", "the lag step must be at least 1 week"),
                row(CMAP + "by week lags 0 to 26 weeks step 14 days", "days",
                        "the lag step must be in weeks, like the lags, found 'days'"),
                row(CMAP + "by week lags 0 to 26.5 weeks", "26.5", "the lag must be a whole number of weeks, found 26.5"),
                row(CMAP + "by week lags 0 to 26 weeks at lag 2 weeks", "at lag", "unexpected 'at' after 'weeks';"
                        + " expected one of: as anomalies, step, using, deseasonalized, ';', end of query"),
                row(CMAP + "by week at lag 1.5 weeks", "1.5", "the lag must be a whole number of weeks, found 1.5"),
                // watch
                row("watch", END, "expected the watch's name in double quotes after 'watch', found end of query"),
                row("watch North", "North", "expected the watch's name in double quotes after 'watch', found 'North'"),
                row("watch \" \" over \"North Intake\" when chlorophyll above 10", "\" \"", "the watch name is empty"),
                row("watch \"w\" when chlorophyll above 10", "when", "expected 'over' after '\"w\"', found 'when'"),
                row("watch \"w\" over \"North Intake\"", END,
                        "unexpected end of query after '\"North Intake\"'; expected one of: clipped to, when"),
                row(WATCH, END, "expected a condition after 'when', found end of query"),
                row(WATCH + "chlorophyll 10", "10", "unexpected '10' after 'chlorophyll'; expected one of:"
                        + " a comparison (above, below, at least or at most), over"),
                row(WATCH + "chlorophyll at 10", "10", "unexpected '10' after 'at'; expected one of: least, most"),
                row(WATCH + "chlorophyll above ten", "ten", "expected a number after 'above', found 'ten'"),
                row(WATCH + "chlorophyll above 10 mg/m3 for", END, "expected a number after 'for', found end of query"),
                row(WATCH + "chlorophyll above 10 mg/m3 for 3 months", "months",
                        "the persistence must be in days or weeks, found 'months'"),
                row(WATCH + "chlorophyll above 10 mg/m3 for 0 days", "0 days", "the persistence must be at least 1 day"),
                row(WATCH + "chlorophyll above 10 and", END, "expected a condition after 'and', found end of query"),
                row(WATCH + "chlorophyll above 10 or or", "last:or", "expected a condition after 'or', found 'or'"),
                row(WATCH + "(chlorophyll above 10 mg/m3", END,
                        "unexpected end of query after 'mg/m3'; expected one of: for, and, or, ')'"),
                row(WATCH + "not not chlorophyll above 10", "not chlorophyll",
                        "expected a condition after 'not', found 'not'"),
                row(WATCH + "chlorophyll above 10 severity", END,
                        "expected a severity (notice, warning or alert) after 'severity', found end of query"),
                row(WATCH + "chlorophyll above 10 severity critical", "critical", "unknown severity 'critical'"),
                row(WATCH + "standardized anomaly of runoff above 2 mg/m3", "mg/m3",
                        "a standardized anomaly is a number of standard deviations and takes no unit, found 'mg/m3'"),
                row(WATCH + "percentile of runoff above 90 %", "%",
                        "a percentile rank is a number from 0 to 100 and takes no unit, found '%'"),
                row(WATCH + "percentile of runoff above 120", "120", "a percentile rank must be between 0 and 100, found 120"),
                row(WATCH + "percentile runoff above 90", "runoff", "expected 'of' after 'percentile', found 'runoff'"),
                row(WATCH + "sum runoff over 2 months above 2", "months", "the window must be in days or weeks, found 'months'"),
                row(WATCH + "chlorophyll above 10 against 2006 to 2020", "against", "unexpected 'against' after '10';"
                        + " expected one of: a unit, when, severity, for, and, or, ';', end of query"),
                row(WATCH + "chlorophyll above 10 \"\"", "\"\"", "the unit is empty"),
                // let
                row("let", END, "expected a variable name after 'let', found end of query"),
                row("let x 2", "2", "expected '=' after 'x', found '2'"),
                row("let mean = 2", "mean", "expected a variable name after 'let', found 'mean'"),
                row("let x =", END, "expected a number, a variable name or '(' after '=', found end of query"),
                row("let x = 2 +", END, "expected a number, a variable name or '(' after '+', found end of query"),
                row("let x = (2 + a", END, "unexpected end of query after 'a'; expected one of: an operator (+ - * /), ')'"),
                row("let x = a b", "b",
                        "unexpected 'b' after 'a'; expected one of: an operator (+ - * /), in, ';', end of query"),
                row("let x = 2 * * a", "* a", "expected a number, a variable name or '(' after '*', found '*'"),
                row("let x = 10-3", "10", "expected a number, a variable name or '(' after '=', found '10-3'"),
                row("let x = --a", "-a", "expected a number, a variable name or '(' after '-', found '-'"),
                row("let x = 2 day", "day", "unexpected 'day' after '2'; expected one of: a unit,"
                        + " an operator (+ - * /), in, ';', end of query"),
                row("let x = a )", ")", "unexpected ')' after 'a'; expected one of: an operator (+ - * /), in, ';',"
                        + " end of query"),
                row("let x = 2 @ a", "@", "unexpected character '@' (U+0040)"),
                row("let x = a;\nlet x = b", "x = b", "'x' is already defined on line 1"),
                row("let x = 2 * (x + 1)", "x + 1", "'x' is used in its own definition"),
                row("let x = 1" + "0".repeat(400), "1", "the number '1" + "0".repeat(36) + "...' is too large"),
                row("let x = a in", END, "expected a unit after 'in', found end of query"));
    }

    @ParameterizedTest(name = "[{index}] {1}")
    @MethodSource("errors")
    void malformedStatementGetsExactMessageAndPosition(String text, String detail, int line, int column) {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals(detail, e.detail(), "detail");
        assertEquals(line, e.line(), "line");
        assertEquals(column, e.column(), "column");
    }

    @Test
    void thereAreAtLeastFortyCases() {
        assertEquals(true, errors().count() >= 40);
        // ... and at least ten about 'within'.
        assertEquals(true, errors().filter(a -> ((String) a.get()[0]).contains("within")).count() >= 10);
    }

    static Stream<Arguments> hints() {
        return Stream.of(
                Arguments.of("correlate 2014",
                        "a statistic may come before the variable: mean (the default), sum, min, max, median or pNN"),
                Arguments.of(CORRELATE + "lags 12 to 0 weeks", "put the smaller lag first"),
                Arguments.of(CORRELATE + "using kendall", "use pearson or spearman"),
                Arguments.of(CORRELATE + "using spearmen", "did you mean 'spearman'?"),
                Arguments.of(CORRELATE + "usng spearman", "did you mean 'using'?"),
                Arguments.of(CORRELATE + "deseasonalized using spearman", "the clauses of a correlation come in this"
                        + " order: with <series>, over <region>, from/during <period>, by <step>, then optionally lags,"
                        + " using <method>, deseasonalized, with coverage"),
                Arguments.of(CMAP + "by week using spearman lags 0 to 4 weeks", "the clauses of a correlation map"
                        + " come in this order: of <series> over <region>, with <series> over <region>, from/during"
                        + " <period>, by <step>, then optionally lags, using <method>, deseasonalized"),
                Arguments.of(CMAP + "by week lags 26 to 0 weeks", "put the smaller lag first"),
                Arguments.of(MAP + "by month", "the clauses of a map come in this order: over <region>,"
                        + " from/during <period>, then optionally minus <period>, in <unit>, as <comparison>"),
                Arguments.of(WINDOW + "2014-06 of rainfall over \"Outer Bay\"",
                        "write the event's date as YYYY-MM-DD, e.g. 2014-06-20"),
                Arguments.of(WATCH + "chlorophyll above 10 severity alrt", "did you mean 'alert'?"),
                Arguments.of(WATCH + "chlorophyll above 10 severity critical", "use notice, warning or alert"),
                Arguments.of(WATCH + "not not chlorophyll above 10", "'not' takes one condition: write not (not ...)"),
                Arguments.of(WATCH + "chlorophyll above 10 against 2006", "a baseline belongs to a comparison, e.g."
                        + " 'anomaly of mean water_temperature above 2 against 2006 to 2020'"),
                Arguments.of("watch \"w\" when chlorophyll above 10",
                        "name the watched region after the watch's name, e.g. over \"North Intake\""),
                Arguments.of("let x = 10-3",
                        "put spaces around '-' between numbers: 10 - 3 (without them, 10-3 reads as a date)"),
                Arguments.of("let x = --a", "one minus sign at a time: write -(-x)"),
                Arguments.of("let x = 2 day", "a unit that is also a word of the language goes in double quotes: \"day\""),
                Arguments.of("lett x = 2", "did you mean 'let'?"),
                Arguments.of("corelate a with b", "did you mean 'correlate'?"),
                Arguments.of(CORRELATE.replace("runoff", "runoff withn \"Harle Watershed\""), "did you mean 'within'?"),
                Arguments.of("correlate chlorophyll with runoff within over \"Outer Bay\"", "name the series' own region"
                        + " after 'within', e.g. sum rainfall within \"Harle Watershed\"; a region is a quoted name,"
                        + " circle(lat, lon, radius), box(south, west, north, east) or wkt \"POLYGON((...))\""),
                Arguments.of(RANK + "rainfall, rainfall within \"Outer Bay\"" + BAY, "a series without 'within' is"
                        + " taken over the statement's region \"Outer Bay\"; list it once"),
                Arguments.of("map sum rainfall" + SHED + " during 2014-06", "every cell of the region after 'over' is"
                        + " mapped, e.g. map sum rainfall over \"Harle Watershed\" during 2014-06"),
                Arguments.of("map correlation of chlorophyll over \"Outer Bay\" with runoff" + SHED, "write each series'"
                        + " region with 'over': map correlation of <series> over <region> with <series> over <region> ..."),
                Arguments.of("mean rainfall" + SHED + " during 2014 by month", "an area series takes its region from"
                        + " 'over', e.g. 'mean chlorophyll over \"Outer Bay\"'; 'within <region>' follows the variable of"
                        + " a series in correlate, rank drivers or window, e.g. 'sum runoff within \"Harle Watershed\"'"),
                Arguments.of(RANK + "rainfall" + SHED + " within \"Upper Reach\"", "a series has one region; for the part"
                        + " of one region inside another write 'clipped to', e.g. within \"Harle Watershed\" clipped to"
                        + " box(44.3, -32.2, 44.9, -31.4)"),
                Arguments.of(WATCH + "chlorophyll within \"Mid Reach\" above 10", "a watch series names its own region"
                        + " with 'over', e.g. 'sum runoff over \"Harle Watershed\" over 7 days above 3000000 m3'"),
                Arguments.of("let within = 2", "'within' is a keyword and cannot name a variable"),
                Arguments.of(CORRELATE + "within \"Mid Reach\"", "'within <region>' follows the variable of a series in"
                        + " correlate, rank drivers or window, e.g. 'sum runoff within \"Harle Watershed\"'"));
    }

    @ParameterizedTest
    @MethodSource("hints")
    void errorsCarryAHintOnHowToFixThem(String text, String hint) {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals(hint, e.hint());
    }

    // ---- limits ---------------------------------------------------------------------------

    @Test
    void deepExpressionsAndConditionsAreRefusedWithoutStackOverflow() {
        String let = "let x = " + "(".repeat(100_000) + "a" + ")".repeat(100_000);
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(let));
        assertEquals("expressions nested too deeply: more than 32 levels of parentheses", e.detail());
        assertEquals(9 + 32, e.column());
        String watch = WATCH + "(".repeat(100_000) + "a above 1" + ")".repeat(100_000);
        e = assertThrows(QueryException.class, () -> QueryParser.parse(watch));
        assertEquals("conditions nested too deeply: more than 32 levels of parentheses", e.detail());
        assertEquals(WATCH.length() + 1 + 32, e.column());
    }

    @Test
    void longArithmeticIsRefusedAtTheFirstOperatorTooMany() {
        String text = "let x = a" + " + a".repeat(10_000);
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals("expression too long: more than 128 operators in one let", e.detail());
        // The 129th '+' follows 'let x = a' (9 characters) and 128 repetitions of ' + a'.
        assertEquals(9 + 128 * 4 + 2, e.column());
    }

    @Test
    void limitsThemselvesAreAcceptedAndCountPerStatement() {
        String deepest = "let x = " + "(".repeat(32) + "a" + ")".repeat(32);
        String longest = "let y = a" + " * a".repeat(128);
        assertEquals(3, QueryParser.parse(deepest + ";\n" + longest + ";\n" + longest.replace("let y", "let z"))
                .statements().size());
        // Minus signs in coordinates of other statements are no arithmetic.
        String series = "mean chlorophyll over box(-44, -31, -43, -30) during 2014 by month";
        assertEquals(129, QueryParser.parse((series + ";").repeat(128) + series).statements().size());
    }

    @Test
    void longAndOrChainsAreFlatAndSurviveARoundTrip() {
        // 'or' and 'and' chains are lists, so 20,000 operands cost no stack in parsing, printing or comparing.
        String text = WATCH + "a above 1" + " or b above 2 and c below 3".repeat(10_000);
        Watch watch = (Watch) QueryParser.parse(text).statements().get(0);
        assertEquals(10_001, ((AnyOf) watch.rules().get(0).condition()).operands().size());
        assertEquals(org.slackwater.query.ast.AstPositions.erase(watch),
                org.slackwater.query.ast.AstPositions.erase(QueryParser.parse(QueryPrinter.print(watch)).statements().get(0)));
    }

    private static Arguments row(String text, String offending, String detail) {
        int index = offending.equals(END) ? text.length()
                : offending.startsWith("last:") ? text.lastIndexOf(offending.substring(5)) : text.indexOf(offending);
        if (index < 0) {
            throw new IllegalArgumentException("'" + offending + "' is not in: " + text);
        }
        int line = 1;
        int lineStart = 0;
        for (int i = 0; i < index; i++) {
            if (text.charAt(i) == '\n') {
                line++;
                lineStart = i + 1;
            }
        }
        return Arguments.of(text, detail, line, text.codePointCount(lineStart, index) + 1);
    }
}
