package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.stream.Stream;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.Token;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.Position;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.parser.SlackwaterLexer;
import org.slackwater.query.parser.SlackwaterParser;

/** parse -> print -> parse gives the same tree (positions aside), and printing is canonical. */
class RoundTripTest {

    static Stream<String> examples() {
        return Stream.of(ExamplesTest.EX1, ExamplesTest.EX2, ExamplesTest.EX3, ExamplesTest.EX4, ExamplesTest.EX5,
                ExamplesTest.EX6, ExamplesTest.EX7, "list variables", "describe chlorophyll", "list regions",
                "list variables; describe rainfall; list regions;",
                "mean chlorophyll over (\"Outer Bay\" clipped to \"Mid Reach\") clipped to (\"Upper Reach\" clipped to"
                        + " box(44, 328.7, 44.2, 329)) during 2014 by month",
                "mean turbidity over circle(44.1, -31.2, 250.5 m) during 2014-07 to 2014-07-15 by day"
                        + " in \"mg m-3\" as standardized anomaly",
                "p5 runoff over \"Harle Watershed\" during 2010 by season as percentile against 2006");
    }

    static Stream<String> languageV1Examples() {
        return Stream.of(LanguageV1ExamplesTest.CORRELATE, LanguageV1ExamplesTest.CORRELATE_OPTIONS,
                LanguageV1ExamplesTest.RANK, LanguageV1ExamplesTest.WINDOW, LanguageV1ExamplesTest.WINDOW_DATES,
                LanguageV1ExamplesTest.MAP, LanguageV1ExamplesTest.MAP_DIFFERENCE, LanguageV1ExamplesTest.MAP_ANOMALY,
                LanguageV1ExamplesTest.MAP_CORRELATION, LanguageV1ExamplesTest.MAP_CORRELATION_LAGS,
                LanguageV1ExamplesTest.WATCH, LanguageV1ExamplesTest.LET,
                LanguageV1ExamplesTest.RANK_WITHIN, LanguageV1ExamplesTest.CORRELATE_WITHIN,
                LanguageV1ExamplesTest.WINDOW_WITHIN,
                "correlate p90 turbidity within circle(44.1 N, 31.2 W, 3 km) clipped to (\"Mid Reach\" clipped to"
                        + " box(44, -31.2, 44.2, -31)) with sum runoff within wkt \"POLYGON((-31.9 44.4, -31.5 44.4,"
                        + " -31.5 44.8, -31.9 44.4))\" over \"Outer Bay\" during 2010 by day at lag 2 days",
                "correlate p90 turbidity with max runoff over circle(44.1 N, 31.2 W, 3 km) clipped to \"Mid Reach\""
                        + " from 2014-04 to 2014-09-15 by day at lag -1 day using pearson as anomalies against 2010",
                "rank drivers of median chlorophyll among sum rainfall, p10 cloud_fraction over box(44, -31.3, 44.2, -31)"
                        + " during 2006 to 2025 by month lags 0 to 6 months step 3 months using spearman against 2006"
                        + " to 2020 with coverage at least 25.5 %",
                "mean water_temperature over \"Outer Bay\" during 2014 by month with at most 5 missing days, 3 consecutive",
                "sum rainfall over \"Harle Watershed\" during 2014 by month with at most 2 missing days with coverage at least 60 %",
                "window 2 weeks before 2008-03-01, 2012-12-31, 2020-02-29 of min water_temperature over \"Upper Reach\""
                        + " with coverage at least 80 %",
                "map sum rainfall over \"Harle Watershed\" from 2014-06 to 2014-08 minus 2013-06 to 2013-08 in mm",
                "map max turbidity over \"Outer Bay\" during 2014 in \"mg m-3\" as percentile",
                "map correlation of p75 turbidity over \"Outer Bay\" with sum runoff over \"Harle Watershed\""
                        + " during 2010 to 2020 by season using spearman deseasonalized against 2010 to 2015",
                "watch \"A \\\"quoted\\\" name\" over circle(44.1, -31.2, 500 m) when not (a above 1 and b below -2.5 K)"
                        + " or c at most 3 \"mg m-3\" severity alert when not not_a_keyword above 0 severity notice",
                "watch \"Intake\" over \"Harle Intake\" when anomaly of mean water_temperature over \"Mid Reach\""
                        + " over 2 weeks at least 1.5 degC against 2006 to 2015 for 1 week",
                "let flux = runoff * (0.5 mg/L + turbidity * 0.02 \"mg L-1 FNU-1\") / 3.6 in kg/s;"
                        + " let warm = -(-(water_temperature - 25 degC)) / 2; mean flux over \"Outer Bay\" during 2014 by month");
    }

    @ParameterizedTest
    @MethodSource("languageV1Examples")
    void languageV1ExamplesSurviveARoundTrip(String text) {
        assertRoundTrip(QueryParser.parse(text));
    }

    @Test
    void newStatementsPrintCanonically() {
        // Statistics written, defaults (pearson, step 1, warning) left out, 'as anomalies' as 'deseasonalized'.
        assertEquals("correlate mean chlorophyll with mean runoff over \"Outer Bay\" from 2006 to 2025 by week"
                        + " lags 0 to 12 weeks deseasonalized",
                print("correlate chlorophyll with runoff over \"Outer Bay\" during 2006 to 2025 by week"
                        + " lags 0 to 12 weeks step 1 week using pearson as anomalies"));
        assertEquals("correlate mean a with mean b over \"Outer Bay\" during 2014 by day at lag 1 day",
                print("correlate a with b over \"Outer Bay\" during 2014 by day lags 1 to 1 days"));
        // A map's lags print as correlate's: one lag as 'at lag', step 1 left out, other steps written.
        String map = "map correlation of mean a over \"Outer Bay\" with mean b over \"Mid Reach\" during 2014 by week";
        assertEquals(map + " at lag -1 week", print(map + " lags -1 to -1 weeks"));
        assertEquals(map + " lags 0 to 12 weeks", print(map + " lags 0 to 12 weeks step 1 week"));
        assertEquals(map + " lags -4 to 12 weeks step 4 weeks using spearman",
                print(map + " LAGS -4 TO 12 WEEK STEP 4 WEEK using spearman"));
        assertEquals("watch \"w\" over \"North Intake\" when mean a above 1 or mean b above 2 and not (mean c above 3"
                        + " or mean d above 4)",
                print("watch \"w\" over \"North Intake\" when (a above 1) or ((b above 2) and not (c above 3 or d above 4))"
                        + " severity warning"));
        // 'within <region>' right after the variable, the region printed as after 'over'.
        assertEquals("rank drivers of mean chlorophyll among sum rainfall within \"Harle Watershed\", mean runoff"
                        + " within \"Harle Watershed\" clipped to box(44.3 N, 32.2 W, 44.9 N, 31.4 W), mean turbidity"
                        + " over \"Outer Bay\" from 2006 to 2025 by week",
                print("RANK DRIVERS OF chlorophyll AMONG SUM rainfall WITHIN \"Harle Watershed\", runoff within"
                        + " (\"Harle Watershed\" clipped to box(44.3, -32.2, 44.9, -31.4)), turbidity over \"Outer Bay\""
                        + " during 2006 to 2025 by week"));
        assertEquals("let x = (a + b) * -c - (d - e) / 2 degC",
                print("let x = ((a + b) * (-c)) - ((d - e) / (2 degC))"));
        assertEquals("let y = 1.5 \"day\" + 2 mg/m3 + 3 \"kg m-2\"",
                print("let y = 1.5 \"day\" + 2 \"mg/m3\" + 3 \"kg m-2\""));
    }

    private static String print(String text) {
        return QueryPrinter.print(QueryParser.parse(text));
    }

    @ParameterizedTest
    @MethodSource("examples")
    void examplesSurviveARoundTrip(String text) {
        assertRoundTrip(QueryParser.parse(text));
    }

    @Test
    void printedExampleIsCanonical() {
        assertEquals("p90 turbidity over circle(44.1 N, 31.2 W, 3 km) from 2014-07-01 to 2014-07-31 by day in FNU"
                        + " with coverage at least 60 %",
                QueryPrinter.print(QueryParser.parse(ExamplesTest.EX3)));
        assertEquals("mean chlorophyll over \"Outer Bay\" from 2006 to 2025 by month as anomaly against 2006 to 2020",
                QueryPrinter.print(QueryParser.parse(ExamplesTest.EX5)));
        assertEquals("list variables;\ndescribe rainfall",
                QueryPrinter.print(QueryParser.parse("LIST Variables ; describe RAINFALL;")));
    }

    @Test
    void thousandRandomStatementsSurviveARoundTrip() {
        RandomTrees trees = new RandomTrees(new Random(20240601L));
        for (int i = 0; i < 1000; i++) {
            List<Statement> statements = new ArrayList<>();
            for (int n = 1 + (i % 3); n > 0; n--) {
                statements.add(trees.statement());
            }
            Script script = new Script(statements, Position.NONE);
            String text = QueryPrinter.print(script);
            assertEquals(script, AstPositions.erase(QueryParser.parse(text)), text);
        }
    }

    /**
     * Random spellings of random statements: keywords in any case, any mix of spaces, tabs,
     * line breaks and comments between tokens. All mean the same tree as the canonical text.
     */
    @Test
    void randomSpellingsParseToTheSameTree() {
        Random random = new Random(7L);
        RandomTrees trees = new RandomTrees(random);
        for (int i = 0; i < 500; i++) {
            Script script = new Script(List.of(trees.statement()), Position.NONE);
            String canonical = QueryPrinter.print(script);
            String respelled = respell(canonical, random);
            assertEquals(script, AstPositions.erase(QueryParser.parse(respelled)), respelled);
        }
    }

    private static String respell(String text, Random random) {
        SlackwaterLexer lexer = new SlackwaterLexer(CharStreams.fromString(text));
        StringBuilder out = new StringBuilder();
        int previous = Token.INVALID_TYPE;
        for (Token token = lexer.nextToken(); token.getType() != Token.EOF; token = lexer.nextToken()) {
            String t = token.getText();
            if (token.getType() == SlackwaterLexer.WS) {
                String[] spaces = {" ", "  ", "\t", "\n", " # a comment\n", "\r\n   "};
                out.append(spaces[random.nextInt(spaces.length)]);
                continue;
            }
            if (token.getType() == SlackwaterParser.UNIT_WORD || token.getType() == SlackwaterLexer.STRING
                    || previous == SlackwaterLexer.NUMBER) {
                out.append(t); // case matters inside units (also a plain word after a number) and names
            } else {
                StringBuilder cased = new StringBuilder();
                for (char c : t.toCharArray()) {
                    cased.append(random.nextBoolean() ? Character.toUpperCase(c) : c);
                }
                out.append(cased);
            }
            previous = token.getType();
        }
        return out.toString();
    }

    private static void assertRoundTrip(Script parsed) {
        String printed = QueryPrinter.print(parsed);
        Script again = QueryParser.parse(printed);
        assertEquals(AstPositions.erase(parsed), AstPositions.erase(again), printed);
        assertEquals(printed, QueryPrinter.print(again), "printing is canonical");
    }

    @Test
    void keywordCaseDoesNotChangeTheTree() {
        String text = ExamplesTest.EX7;
        assertEquals(AstPositions.erase(QueryParser.parse(text)),
                AstPositions.erase(QueryParser.parse(text.toUpperCase(Locale.ROOT).replace("\"MID REACH\"", "\"Mid Reach\""))));
    }
}
