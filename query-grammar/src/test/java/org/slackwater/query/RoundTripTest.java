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
        for (Token token = lexer.nextToken(); token.getType() != Token.EOF; token = lexer.nextToken()) {
            String t = token.getText();
            if (token.getType() == SlackwaterLexer.WS) {
                String[] spaces = {" ", "  ", "\t", "\n", " # a comment\n", "\r\n   "};
                out.append(spaces[random.nextInt(spaces.length)]);
            } else if (token.getType() == SlackwaterParser.UNIT_WORD || token.getType() == SlackwaterLexer.STRING) {
                out.append(t); // case matters inside units and names
            } else {
                StringBuilder cased = new StringBuilder();
                for (char c : t.toCharArray()) {
                    cased.append(random.nextBoolean() ? Character.toUpperCase(c) : c);
                }
                out.append(cased);
            }
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
