package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Malformed queries and the exact error each one gets: message, line and column. The messages
 * are part of the language's contract (users and the docs' error catalogue rely on them).
 */
class SyntaxErrorTest {

    private static final String BAY = "mean chlorophyll over \"Outer Bay\" ";
    private static final String TAIL = " during 2014 by month";

    static Stream<Arguments> errors() {
        return Stream.of(
                // statement start
                row("", "the query is empty", 1, 1),
                row("   # only a comment", "the query is empty", 1, 20),
                row("mena chlorophyll over \"Outer Bay\" during 2014 by month", "unknown word 'mena'", 1, 1),
                row("select chlorophyll", "expected a statement, found 'select'", 1, 1),
                row("42", "expected a statement, found '42'", 1, 1),
                row(";", "expected a statement, found ';'", 1, 1),
                row("list", "unexpected end of query after 'list'; expected one of: variables, regions", 1, 5),
                row("list varaibles", "unknown word 'varaibles'", 1, 6),
                row("list variables extra", "unexpected 'extra' after the end of the statement", 1, 16),
                row("list variables;;", "unexpected ';' after the end of the statement", 1, 16),
                row("list regions\nlist variables", "unexpected 'list' after the end of the statement", 2, 1),
                row("describe", "expected a variable name after 'describe', found end of query", 1, 9),
                row("describe over", "expected a variable name after 'describe', found 'over'", 1, 10),
                // statistic and variable
                row("mean over \"Outer Bay\" during 2014 by month",
                        "expected a variable name after 'mean', found 'over'", 1, 6),
                row("p0 chlorophyll over \"Outer Bay\"" + TAIL, "percentile must be between p1 and p99, found 'p0'", 1, 1),
                row("p100 chlorophyll over \"Outer Bay\"" + TAIL,
                        "percentile must be between p1 and p99, found 'p100'", 1, 1),
                row("p123456789012345678901 chlorophyll over \"Outer Bay\"" + TAIL,
                        "percentile must be between p1 and p99, found 'p123456789012345678901'", 1, 1),
                row("mean chlorophyll \"Outer Bay\"" + TAIL,
                        "expected 'over' after 'chlorophyll', found '\"Outer Bay\"'", 1, 18),
                row("mean chlorophyll during 2014 by month", "expected 'over' after 'chlorophyll', found 'during'", 1, 18),
                // regions
                row("mean chlorophyll over 2014 by month", "expected a region after 'over', found '2014'", 1, 23),
                row("mean chlorophyll over \"Outer Bay during 2014 by month",
                        "unterminated string: the closing double quote is missing", 1, 23),
                row("mean chlorophyll over \"\"" + TAIL, "the region name is empty", 1, 23),
                row("mean chlorophyll over \"Outer \\q Bay\"" + TAIL, "unknown escape '\\q' in a string", 1, 30),
                row("mean chlorophyll over 'Outer Bay'" + TAIL, "unexpected character \"'\" (U+0027)", 1, 23),
                row("mean chlorophyll over \u201COuter Bay\u201D" + TAIL, "unexpected character '\u201C' (U+201C)", 1, 23),
                row("mean chlorophyll over \"Outer Bay\" clipped \"Mid Reach\"" + TAIL,
                        "expected 'to' after 'clipped', found '\"Mid Reach\"'", 1, 43),
                row("mean chlorophyll over \"Outer Bay\" clipped to during 2014 by month",
                        "expected a region after 'to', found 'during'", 1, 46),
                row("mean chlorophyll over circle 44.1 N" + TAIL, "expected '(' after 'circle', found '44.1'", 1, 30),
                row("mean chlorophyll over circle(44.1 N, 31.2 W, 3 mi)" + TAIL,
                        "distance unit must be m or km, found 'mi'", 1, 48),
                row("mean chlorophyll over circle(44.1 N, 31.2 W, km)" + TAIL,
                        "expected a radius such as 3 km after ',', found 'km'", 1, 46),
                row("mean chlorophyll over circle(44.1 N, 31.2 W, 0 km)" + TAIL, "the radius must be greater than 0", 1, 46),
                row("mean chlorophyll over circle(44.1 N, 31.2 W, 20001 km)" + TAIL,
                        "the radius must be at most 20000 km, found 20001 km", 1, 46),
                row("mean chlorophyll over circle(44.1 N, 31.2 W 3 km)" + TAIL, "expected ',' after 'W', found '3'", 1, 45),
                row("mean chlorophyll over circle(44.1 N, , 3 km)" + TAIL,
                        "expected a longitude after ',', found ','", 1, 38),
                row("mean chlorophyll over circle(, 31.2 W, 3 km)" + TAIL,
                        "expected a latitude after '(', found ','", 1, 30),
                row("mean chlorophyll over circle(44.1 W, 31.2 N, 3 km)" + TAIL,
                        "a latitude takes N or S, found 'W'", 1, 35),
                row("mean chlorophyll over circle(44.1 N, 31.2 S, 3 km)" + TAIL,
                        "a longitude takes E or W, found 'S'", 1, 43),
                row("mean chlorophyll over circle(44.1 N, 31.2, 3 km)" + TAIL,
                        "give both coordinates a hemisphere letter, or neither", 1, 38),
                row("mean chlorophyll over circle(-44.1 N, 31.2 W, 3 km)" + TAIL,
                        "write a sign or a hemisphere letter, not both", 1, 30),
                row("mean chlorophyll over circle(95, 31.2, 3 km)" + TAIL,
                        "latitude must be between -90 and 90 degrees, found 95", 1, 30),
                row("mean chlorophyll over circle(90.5 S, 31.2 W, 3 km)" + TAIL,
                        "latitude must be at most 90 degrees N or S, found 90.5 S", 1, 30),
                row("mean chlorophyll over circle(44, -180.5, 3 km)" + TAIL,
                        "longitude must be between -180 and 180 degrees (or 0 and 360), found -180.5", 1, 34),
                row("mean chlorophyll over circle(44, 360.01, 3 km)" + TAIL,
                        "longitude must be between -180 and 180 degrees (or 0 and 360), found 360.01", 1, 34),
                row("mean chlorophyll over circle(44 N, 181 W, 3 km)" + TAIL,
                        "longitude must be at most 180 degrees E or W, found 181 W", 1, 36),
                row("mean chlorophyll over circle(44, 1" + "0".repeat(400) + ", 3 km)" + TAIL,
                        "longitude must be between -180 and 180 degrees (or 0 and 360), found 1" + "0".repeat(400), 1, 34),
                row("mean chlorophyll over box(44.2 N, 31.30 W, 43.95 N, 30.95 W)" + TAIL,
                        "the box's north edge (43.95) is south of its south edge (44.2)", 1, 44),
                row("mean chlorophyll over box(44 N, 31 W, 44 N, 30 W)" + TAIL,
                        "the box has no height: south and north are both 44", 1, 39),
                row("mean chlorophyll over box(44 N, 31 W, 45 N, 329)" + TAIL,
                        "give both coordinates a hemisphere letter, or neither", 1, 45),
                row("mean chlorophyll over box(44, -31, 45, 329)" + TAIL,
                        "the box has no width: west and east are the same meridian", 1, 40),
                row("mean chlorophyll over box(43.95 N, 30.95 W, 44.2 N, 31.30 W)" + TAIL,
                        "the box is 359.65 degrees wide; a box may span at most 180 degrees of longitude", 1, 53),
                row("mean chlorophyll over wkt \"  \"" + TAIL, "the WKT text is empty", 1, 27),
                row("mean chlorophyll over wkt POLYGON" + TAIL,
                        "expected the WKT text in double quotes after 'wkt', found 'POLYGON'", 1, 27),
                row("mean chlorophyll over (\"Outer Bay\"" + TAIL,
                        "unexpected 'during' after '\"Outer Bay\"'; expected one of: clipped to, ')'", 1, 36),
                // period
                row(BAY + "2014 by month",
                        "unexpected '2014' after '\"Outer Bay\"'; expected one of: from, during, clipped to", 1, 35),
                row(BAY + "durng 2014 by month", "unknown word 'durng'", 1, 35),
                row(BAY + "from 2014 by month", "expected 'to' after '2014', found 'by'", 1, 45),
                row(BAY + "during june by month", "expected a date after 'during', found 'june'", 1, 42),
                row(BAY + "during 2014-13 by month", "invalid date '2014-13': the month must be 01 to 12", 1, 42),
                row(BAY + "during 2014-00 by month", "invalid date '2014-00': the month must be 01 to 12", 1, 42),
                row(BAY + "during 2014-02-30 by month",
                        "invalid date '2014-02-30': the day must be 01 to 28 in February 2014", 1, 42),
                row(BAY + "during 2015-02-29 by month",
                        "invalid date '2015-02-29': the day must be 01 to 28 in February 2015", 1, 42),
                row(BAY + "during 2014-7 by month",
                        "invalid date '2014-7': write dates as YYYY, YYYY-MM or YYYY-MM-DD", 1, 42),
                row(BAY + "during 14 by month", "invalid date '14': write dates as YYYY, YYYY-MM or YYYY-MM-DD", 1, 42),
                row(BAY + "during 2014.5 by month",
                        "invalid date '2014.5': write dates as YYYY, YYYY-MM or YYYY-MM-DD", 1, 42),
                row(BAY + "from 2014-08 to 2014-06 by month",
                        "the period ends on 2014-06-30, before it starts on 2014-08-01", 1, 51),
                // step
                row(BAY + "during 2014", "expected 'by <step>' after '2014', found end of query", 1, 46),
                row(BAY + "during 2014 in degF", "expected 'by <step>' after '2014', found 'in'", 1, 47),
                row(BAY + "during 2014 bi month", "unknown word 'bi'", 1, 47),
                row(BAY + "during 2014 by fortnight",
                        "unexpected 'fortnight' after 'by'; expected one of: day, week, month, season, year, water year",
                        1, 50),
                row(BAY + "during 2014 by weak", "unknown word 'weak'", 1, 50),
                row(BAY + "during 2014 by water", "expected 'year' after 'water', found end of query", 1, 55),
                // optional clauses and trailing input
                row(BAY + "during 2014 by month foo",
                        "unexpected 'foo' after 'month'; expected one of: in, as, with, ';', end of query", 1, 56),
                row(BAY + "during 2014 by month\n  by day",
                        "unexpected 'by' after 'month'; expected one of: in, as, with, ';', end of query", 2, 3),
                row(BAY + "during 2014 by month wiht coverage at least 50 %", "unknown word 'wiht'", 1, 56),
                row(BAY + "during 2014 by month in", "expected a unit after 'in', found end of query", 1, 58),
                row(BAY + "during 2014 by month in \"\"", "the unit is empty", 1, 59),
                row(BAY + "during 2014 by month in degF in degC",
                        "unexpected 'in' after 'degF'; expected one of: as, with, ';', end of query", 1, 64),
                row(BAY + "during 2014 by month as",
                        "unexpected end of query after 'as'; expected one of: anomaly, standardized anomaly, percentile",
                        1, 58),
                row(BAY + "during 2014 by month as standardized",
                        "expected 'anomaly' after 'standardized', found end of query", 1, 71),
                row(BAY + "during 2014 by month as anomaly against",
                        "expected a date after 'against', found end of query", 1, 74),
                row(BAY + "during 2014 by month as anomaly against 2020 to 2006",
                        "the period ends on 2006-12-31, before it starts on 2020-01-01", 1, 83),
                row(BAY + "during 2014 by month with coverage 50 %",
                        "expected 'at least' after 'coverage', found '50'", 1, 70),
                row(BAY + "during 2014 by month with coverage at least 50",
                        "expected '%' after '50', found end of query", 1, 81),
                row(BAY + "during 2014 by month with coverage at least 150 %",
                        "coverage must be between 0 and 100 %, found 150", 1, 79),
                row(BAY + "during 2014 by month with at most 5 missing days, 6 consecutive",
                        "6 consecutive missing days exceed the 5 missing days allowed in all", 1, 85),
                row(BAY + "during 2014 by month with at most 2.5 missing days",
                        "missing days must be a whole number of days from 0 to 366, found 2.5", 1, 69),
                row(BAY + "during 2014 by month with at most 5 missing",
                        "expected 'days' after 'missing', found end of query", 1, 78),
                row(BAY + "during 2014 by month with at most 5 days",
                        "expected 'missing' after '5', found 'days'", 1, 71),
                row(BAY + "during 2014 by month with coverage at least 50 % as anomaly",
                        "unexpected 'as' after the end of the statement", 1, 84),
                row(BAY + "during 2014 by month; mean", "expected a variable name after 'mean', found end of query", 1, 61),
                // characters
                row("list variables @", "unexpected character '@' (U+0040)", 1, 16),
                row("list\u0000variables", "unexpected character U+0000", 1, 5),
                row("list variables;\n\tdescribe .5", "unexpected character '.' (U+002E)", 2, 11),
                row("describe chlorophyll\u00e9", "unexpected character '\u00e9' (U+00E9)", 1, 21),
                row("describe \uD83C\uDF0A", "unexpected character '\uD83C\uDF0A' (U+1F30A)", 1, 10));
    }

    @ParameterizedTest(name = "[{index}] {1}")
    @MethodSource("errors")
    void malformedQueryGetsExactMessageAndPosition(String text, String detail, int line, int column) {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals(detail, e.detail(), "detail");
        assertEquals(line, e.line(), "line");
        assertEquals(column, e.column(), "column");
        assertEquals("line " + line + ":" + column + ": " + detail
                + (e.hint().isEmpty() ? "" : "\n  hint: " + e.hint()), e.getMessage());
    }

    static Stream<Arguments> hints() {
        return Stream.of(
                Arguments.of("mena chlorophyll over \"Outer Bay\" during 2014 by month", "did you mean 'mean'?"),
                Arguments.of(BAY + "during 2014 by weak", "did you mean 'week'?"),
                Arguments.of(BAY + "durng 2014 by month", "did you mean 'during'?"),
                Arguments.of("list varaibles", "did you mean 'variables'?"),
                Arguments.of(BAY + "during 2014",
                        "add the time step, e.g. 'by month' (day, week, month, season, year or water year)"),
                Arguments.of("p0 chlorophyll over \"Outer Bay\"" + TAIL, "use 'min' for the smallest value"),
                Arguments.of("p100 chlorophyll over \"Outer Bay\"" + TAIL, "use 'max' for the largest value"),
                Arguments.of("list variables extra", "separate statements with ';'"),
                Arguments.of(BAY + "during 2014 by month with coverage at least 50 % as anomaly",
                        "the clauses of a series come in this order: over <region>, from/during <period>, by <step>,"
                                + " then optionally in <unit>, as <comparison>, with coverage"),
                Arguments.of("mean chlorophyll over \u201COuter Bay\u201D" + TAIL,
                        "use straight double quotes (\") around names"),
                Arguments.of("", "write a statement, for example: list variables"));
    }

    @ParameterizedTest
    @MethodSource("hints")
    void errorsCarryAHintOnHowToFixThem(String text, String hint) {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals(hint, e.hint());
    }

    @Test
    void queryTooLargeIsRefusedBeforeLexing() {
        String text = "list variables;".repeat(QueryParser.MAX_LENGTH / 15 + 1);
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals("query too large: 1,000,005 characters, the limit is 1,000,000", e.detail());
        assertEquals(1, e.line());
        assertEquals(1, e.column());
    }

    @Test
    void deepParenthesesAreRefusedWithoutStackOverflow() {
        String text = "mean chlorophyll over " + "(".repeat(200_000) + "\"Outer Bay\"" + ")".repeat(200_000) + TAIL;
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals("regions nested too deeply: more than 32 levels of parentheses", e.detail());
        assertEquals(23 + 32, e.column());
    }

    @Test
    void longClippedToChainsAreRefusedAtTheFirstOneTooMany() {
        String text = "mean chlorophyll over \"Outer Bay\"" + " clipped to \"Mid Reach\"".repeat(10_000) + TAIL;
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals("too many 'clipped to' in one statement: the limit is 64", e.detail());
        // The 65th 'clipped' starts after the 33-character head and 64 repetitions of 23 characters.
        assertEquals(33 + 64 * 23 + 2, e.column());
    }

    @Test
    void limitsThemselvesAreAccepted() {
        String nested = "mean chlorophyll over " + "(".repeat(32) + "\"Outer Bay\"" + ")".repeat(32) + TAIL;
        String chain = "mean chlorophyll over \"Outer Bay\"" + " clipped to \"Mid Reach\"".repeat(64) + TAIL;
        assertEquals(1, QueryParser.parse(nested).statements().size());
        assertEquals(1, QueryParser.parse(chain).statements().size());
        // The clipped-to limit counts per statement.
        assertEquals(2, QueryParser.parse(chain + ";\n" + chain).statements().size());
    }

    private static Arguments row(String text, String detail, int line, int column) {
        return Arguments.of(text, detail, line, column);
    }
}
