package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.Script;

/**
 * Seeded random and mutated inputs: the parser either returns a tree that survives a round
 * trip or throws a {@link QueryException} with a position inside the text; never any other
 * exception, never a stack overflow, and quickly.
 */
class FuzzTest {

    private static final int INPUTS = 20_000;
    private static final String ALPHABET = "abcdefghijklmnopqrstuvwxyz NSEW019.-,;()\"\\#%/+*=\n\t"
            + "\u00e9\u201C\u0000\uFEFF\uD83C\uDF0A\uD800";
    private static final List<String> FRAGMENTS = List.of("mean ", "p90 ", "chlorophyll ", "over ", "\"Outer Bay\" ",
            "circle(", "box(", "wkt ", "44.1 N", ", ", "31.2 W", "3 km", ")", " clipped to ", "from ", "during ",
            "2014", "-07", "-31", " to ", " by ", "water year", "month", " in ", "mg/m3", " as ", "standardized ",
            "anomaly", " against ", " with coverage at least ", "60 %", ";", "list ", "variables", "describe ",
            "(", "#c\n", "1" + "0".repeat(330), "99999999999999999999999999", "p100", "\"", "\u00e9",
            // the statements being built
            "correlate ", " with ", "lags ", "-4", "12 ", "weeks", " step ", "at lag ", "using spearman",
            " deseasonalized", " as anomalies", "rank drivers of ", " among ", "window ", "60 days", " before ",
            "2014-06-20", " of ", "map ", "correlation ", " minus ", "watch ", " when ", " above ", " below ",
            "at least ", "at most ", " for ", "3 days", " and ", " or ", "not ", " severity alert", "let ", "x", " = ", " within ", "\"Harle Watershed\"",
            " + ", " - ", " * ", " / ", "10-3", "25 degC", "10 mg/m3");

    @Test
    void randomAndMutatedInputsFailOnlyWithPositionedQueryErrors() {
        Random random = new Random(0x5eed);
        RandomTrees trees = new RandomTrees(random);
        long parsing = 0; // time spent in the parser only, not in making inputs
        int parsed = 0;
        for (int i = 0; i < INPUTS; i++) {
            String input = input(i, random, trees);
            long start = System.nanoTime();
            try {
                Script script = QueryParser.parse(input);
                parsing += System.nanoTime() - start;
                parsed++;
                Script again = QueryParser.parse(QueryPrinter.print(script));
                assertEquals(AstPositions.erase(script), AstPositions.erase(again), input);
            } catch (QueryException e) {
                parsing += System.nanoTime() - start;
                assertTrue(e.line() >= 1 && e.column() >= 1, () -> "position " + e.line() + ":" + e.column() + " for " + input);
                assertFalse(e.detail().isEmpty());
                assertTrue(e.getMessage().startsWith("line " + e.line() + ":" + e.column() + ": "));
                e.excerpt(); // must not throw
            } catch (RuntimeException | StackOverflowError e) {
                fail("unexpected " + e + " for input: " + input, e);
            }
        }
        double seconds = parsing / 1e9;
        assertTrue(seconds < 20, "parsing took " + seconds + " s");
        // The mutations must not be so wild that nothing parses, nor so tame that everything does.
        assertTrue(parsed > INPUTS / 20 && parsed < INPUTS / 2, "parsed " + parsed + " of " + INPUTS);
    }

    private static String input(int i, Random random, RandomTrees trees) {
        String valid = QueryPrinter.print(trees.statement());
        switch (i % 8) {
            case 0:
                return valid.substring(0, random.nextInt(valid.length() + 1)); // truncation
            case 1:
                return mutateCharacters(valid, random);
            case 2:
                return randomText(random);
            case 3:
                return fragments(random);
            case 4:
                return deepNesting(random);
            case 5:
                return valid; // valid, to check the round trip under load
            case 6:
                return valid + (random.nextBoolean() ? ";" : "; " + QueryPrinter.print(trees.statement()));
            default:
                return swapTokens(valid, random);
        }
    }

    private static String mutateCharacters(String text, Random random) {
        StringBuilder s = new StringBuilder(text);
        for (int n = 1 + random.nextInt(3); n > 0 && s.length() > 0; n--) {
            int at = random.nextInt(s.length());
            switch (random.nextInt(3)) {
                case 0:
                    s.deleteCharAt(at);
                    break;
                case 1:
                    s.insert(at, ALPHABET.charAt(random.nextInt(ALPHABET.length())));
                    break;
                default:
                    s.setCharAt(at, ALPHABET.charAt(random.nextInt(ALPHABET.length())));
            }
        }
        return s.toString();
    }

    private static String randomText(Random random) {
        StringBuilder s = new StringBuilder();
        for (int n = random.nextInt(60); n > 0; n--) {
            s.append(ALPHABET.charAt(random.nextInt(ALPHABET.length())));
        }
        return s.toString();
    }

    private static String fragments(Random random) {
        StringBuilder s = new StringBuilder();
        for (int n = 1 + random.nextInt(25); n > 0; n--) {
            s.append(FRAGMENTS.get(random.nextInt(FRAGMENTS.size())));
        }
        return s.toString();
    }

    private static String deepNesting(Random random) {
        // Around and beyond the limits; far deeper inputs are tested once each in SyntaxErrorTest
        // and LanguageV1ErrorTest.
        int depth = random.nextInt(3) == 0 ? 20 + random.nextInt(20) : 40 + random.nextInt(400);
        switch (random.nextInt(6)) {
            case 0:
                return "let x = " + "-(".repeat(depth) + "a" + ")".repeat(random.nextInt(depth + 1));
            case 1:
                return "let x = a" + " - a".repeat(depth / 2 + random.nextInt(depth));
            case 2:
                return "watch \"w\" over \"North Intake\" when " + "not (".repeat(depth) + "a above 1"
                        + ")".repeat(random.nextInt(depth + 1));
            default:
                break;
        }
        if (random.nextBoolean()) {
            return "mean chlorophyll over " + "(".repeat(depth) + "\"Outer Bay\"" + ")".repeat(random.nextInt(depth + 1))
                    + " during 2014 by month";
        }
        return "mean chlorophyll over \"Outer Bay\"" + " clipped to (\"Mid Reach\"".repeat(depth / 2)
                + ")".repeat(depth / 2) + " during 2014 by month";
    }

    private static String swapTokens(String text, Random random) {
        String[] words = text.split(" ");
        int a = random.nextInt(words.length);
        int b = random.nextInt(words.length);
        String t = words[a];
        words[a] = words[b];
        words[b] = t;
        return String.join(" ", words);
    }
}
