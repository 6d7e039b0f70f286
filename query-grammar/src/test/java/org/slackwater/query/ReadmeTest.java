package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.DescribeVariable;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.Statement;

/**
 * The language reference cannot drift from the parser: every {@code swq} block of README.md
 * parses and uses only the demo scenario's names and years (so the server can run it), and
 * every error example gives the documented message.
 */
class ReadmeTest {

    private static final Set<String> DEMO_VARIABLES =
            Set.of("rainfall", "runoff", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll");
    private static final Set<String> DEMO_REGIONS = Set.of("Upper Reach", "Mid Reach", "Outer Bay",
            "Harle Watershed", "North Intake", "Harle Intake");
    private static final LocalDate DATA_START = LocalDate.of(2006, 1, 1);
    private static final LocalDate DATA_END = LocalDate.of(2025, 12, 31);

    static List<String> swqBlocks() throws IOException {
        return blocks("swq");
    }

    static List<String> errorExamples() throws IOException {
        List<String> examples = new ArrayList<>();
        for (String block : blocks("text")) {
            if (block.contains("\n=> ")) {
                examples.add(block);
            }
        }
        return examples;
    }

    @Test
    void readmeHasExamplesOfEveryKind() throws IOException {
        assertTrue(swqBlocks().size() >= 15, "swq examples");
        assertTrue(errorExamples().size() >= 25, "error examples");
    }

    @ParameterizedTest
    @MethodSource("swqBlocks")
    void swqBlockParsesAndUsesOnlyTheDemoScenario(String block) {
        Script script = QueryParser.parse(block);
        assertFalse(script.statements().isEmpty());
        for (Statement statement : script.statements()) {
            if (statement instanceof DescribeVariable) {
                assertTrue(DEMO_VARIABLES.contains(((DescribeVariable) statement).variable().name()), block);
            }
            if (statement instanceof AreaSeries) {
                AreaSeries s = (AreaSeries) statement;
                assertTrue(DEMO_VARIABLES.contains(s.variable().name()), block);
                checkRegions(s.region(), block);
                checkWithinData(s.period(), block);
                s.comparison().flatMap(Comparison::baseline).ifPresent(p -> checkWithinData(p, block));
            }
        }
        assertEquals(AstPositions.erase(script), AstPositions.erase(QueryParser.parse(QueryPrinter.print(script))));
    }

    @ParameterizedTest
    @MethodSource("errorExamples")
    void errorExampleGivesTheDocumentedMessage(String block) {
        int arrow = block.indexOf("\n=> ");
        String query = block.substring(0, arrow);
        String[] expected = block.substring(arrow + 4).split("\n");
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(query), query);
        assertEquals(expected[0], e.getMessage().split("\n")[0]);
        if (expected.length > 1) {
            assertEquals(expected[1], "  hint: " + e.hint());
        }
    }

    private static void checkRegions(RegionRef region, String block) {
        if (region instanceof NamedRegion) {
            assertTrue(DEMO_REGIONS.contains(((NamedRegion) region).name()), block);
        } else if (region instanceof ClippedRegion) {
            checkRegions(((ClippedRegion) region).region(), block);
            checkRegions(((ClippedRegion) region).clip(), block);
        }
    }

    private static void checkWithinData(Period period, String block) {
        assertFalse(period.start().isBefore(DATA_START), block);
        assertFalse(period.endInclusive().isAfter(DATA_END), block);
    }

    /** The contents of the fenced blocks with the given info string, in order. */
    private static List<String> blocks(String info) throws IOException {
        List<String> lines = Files.readAllLines(Path.of("README.md"), StandardCharsets.UTF_8);
        List<String> blocks = new ArrayList<>();
        StringBuilder current = null;
        for (String line : lines) {
            if (current == null && line.equals("```" + info)) {
                current = new StringBuilder();
            } else if (current != null && line.equals("```")) {
                blocks.add(current.toString().stripTrailing());
                current = null;
            } else if (current != null) {
                current.append(line).append('\n');
            }
        }
        return blocks;
    }
}
