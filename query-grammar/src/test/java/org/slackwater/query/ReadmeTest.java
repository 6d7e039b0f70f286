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
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.DescribeVariable;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.ListRegions;
import org.slackwater.query.ast.ListVariables;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.Node;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.Position;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.Watch;

/**
 * The language reference cannot drift from the parser: every {@code swq} block of README.md
 * parses, holds only statements the server runs (area series, catalog questions, correlate,
 * rank drivers, window, maps other than correlation maps, let and watch) and uses only the demo
 * scenario's names and years, with lag ranges small enough for the server's documentation test
 * to stay fast; a statement being built is fenced as text, parses, prints back and uses only demo
 * names; an example that needs a variable the demo lacks (a Kd cube for the euphotic depth) is
 * fenced as text in its own subsection, parses, prints back and uses only the demo's names and
 * that variable; every error example of the parser gives the
 * documented message; and every example of the errors the server finds against the data is
 * valid syntax, with its documented position at a node of the tree, so that only the server
 * can be the one refusing it.
 */
class ReadmeTest {

    private static final Set<String> DEMO_VARIABLES =
            Set.of("rainfall", "runoff", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll");
    private static final Set<String> DEMO_REGIONS = Set.of("Upper Reach", "Mid Reach", "Outer Bay",
            "Harle Watershed", "North Intake", "Harle Intake");
    private static final LocalDate DATA_START = LocalDate.of(2006, 1, 1);
    private static final LocalDate DATA_END = LocalDate.of(2025, 12, 31);
    /** The statements the server executes, the only ones a swq block may hold. */
    private static final Set<Class<?>> RUNNABLE = Set.of(AreaSeries.class, DescribeVariable.class,
            ListVariables.class, ListRegions.class, Correlation.class, DriverRanking.class, EventWindow.class,
            StatisticMap.class, DifferenceMap.class, ComparisonMap.class, CorrelationMap.class, DerivedVariable.class, Watch.class,
            org.slackwater.query.ast.CellExport.class);
    /** The statements that parse but that the server refuses as not run yet. */
    private static final Set<Class<?>> BEING_BUILT = Set.of();
    /** Must stand verbatim in the watch section: every watch answer of the server carries it (WatchStatements.CAUTION). */
    static final String CAUTION = "Screening aid only: built from remote-sensing and model data, which can be wrong. "
            + "Confirm with water sampling, and follow local drinking-water regulations and licensed operators before acting.";
    private static final String DATA_ERRORS = "### Errors found against the data";
    private static final java.util.regex.Pattern DOCUMENTED_ERROR =
            java.util.regex.Pattern.compile("line (\\d+):(\\d+): \\S.*");
    /** The subsections whose text examples need a variable the demo lacks, and those variables. */
    private static final java.util.Map<String, Set<String>> OTHER_DATA = java.util.Map.of(
            "### Light: euphotic depth", Set.of("kd"));
    /** At most 27 lags (0 to 26 weeks) in one swq example, reaching at most 26 weeks or 6 months. */
    private static final int MAX_LAGS = 27;
    private static final int MAX_LAG_DAYS = 6 * 31;

    static List<String> swqBlocks() throws IOException {
        return blocks("swq");
    }

    /** The error examples the parser gives: every text block with "=>" outside the server's errors. */
    static List<String> errorExamples() throws IOException {
        List<String> examples = new ArrayList<>();
        for (Block block : fenced("text")) {
            if (block.text().contains("\n=> ") && !block.subsection().equals(DATA_ERRORS)) {
                examples.add(block.text());
            }
        }
        return examples;
    }

    /** The error examples the server gives when it checks a query against the data. */
    static List<String> dataErrorExamples() throws IOException {
        List<String> examples = new ArrayList<>();
        for (Block block : fenced("text")) {
            if (block.text().contains("\n=> ") && block.subsection().equals(DATA_ERRORS)) {
                examples.add(block.text());
            }
        }
        return examples;
    }

    /** The examples of "Statements being built": fenced as text (the server cannot run them yet). */
    static List<String> statementsBeingBuilt() throws IOException {
        List<String> examples = new ArrayList<>();
        for (String block : blocks("text", "## Statements being built")) {
            if (!block.contains("\n=> ")) {
                examples.add(block);
            }
        }
        return examples;
    }

    /** The examples that need a variable the demo lacks: text blocks without "=>" in {@link #OTHER_DATA}'s subsections. */
    static List<String> otherDataExamples() throws IOException {
        List<String> examples = new ArrayList<>();
        for (Block block : fenced("text")) {
            if (!block.text().contains("\n=> ") && OTHER_DATA.containsKey(block.subsection())) {
                examples.add(block.text());
            }
        }
        return examples;
    }

    @Test
    void examplesNeedingOtherDataParsePrintBackAndNameOnlyTheirVariable() throws IOException {
        assertFalse(otherDataExamples().isEmpty());
        for (Block block : fenced("text")) {
            if (block.text().contains("\n=> ") || !OTHER_DATA.containsKey(block.subsection())) {
                continue;
            }
            Script script = QueryParser.parse(block.text());
            Set<String> variables = withLetNames(script);
            variables.addAll(OTHER_DATA.get(block.subsection()));
            checkNames(script, variables, block.text());
            for (Period period : nodes(script, Period.class)) {
                checkWithinData(period, block.text());
            }
            assertEquals(AstPositions.erase(script), AstPositions.erase(QueryParser.parse(QueryPrinter.print(script))));
        }
    }

    @Test
    void readmeHasExamplesOfEveryKind() throws IOException {
        assertTrue(swqBlocks().size() >= 25, "swq examples");
        assertTrue(errorExamples().size() >= 30, "error examples");
        assertTrue(dataErrorExamples().size() >= 10, "examples of errors found against the data");
        Set<Class<?>> runnable = new java.util.HashSet<>();
        boolean within = false;
        for (String block : swqBlocks()) {
            Script script = QueryParser.parse(block);
            script.statements().forEach(st -> runnable.add(st.getClass()));
            within |= nodes(script, SeriesTerm.class).stream().anyMatch(t -> t.region().isPresent());
        }
        assertEquals(RUNNABLE, runnable);
        assertTrue(within, "a swq example gives a series its own region with 'within'");
        Set<Class<?>> beingBuilt = new java.util.HashSet<>();
        for (String block : statementsBeingBuilt()) {
            QueryParser.parse(block).statements().forEach(st -> beingBuilt.add(st.getClass()));
        }
        assertEquals(BEING_BUILT, beingBuilt);
    }

    @Test
    void swqBlocksHoldOnlyStatementsTheServerRuns() throws IOException {
        // The server's documentation test runs every swq block; a statement it does not run would fail there.
        for (String block : swqBlocks()) {
            for (Statement statement : QueryParser.parse(block).statements()) {
                assertTrue(RUNNABLE.contains(statement.getClass()), block);
            }
        }
    }

    @Test
    void watchSectionRepeatsTheCautionAndSaysHowWatchesAreStored() throws IOException {
        String section = section("## Watches");
        assertTrue(section.contains(CAUTION), "the caution, verbatim");
        for (String endpoint : List.of("POST /api/watches", "GET /api/watches", "DELETE /api/watches/{name}")) {
            assertTrue(section.contains(endpoint), endpoint);
        }
        // The section's examples are checked (swq), not merely shown.
        assertTrue(blocks("swq", "## Watches").size() >= 3);
    }

    @Test
    void everyOtherTextBlockIsAnErrorExampleOrAStatementBeingBuilt() throws IOException {
        // A runnable example fenced as text would escape the server's documentation test.
        List<String> other = new ArrayList<>(blocks("text"));
        other.removeAll(errorExamples());
        other.removeAll(dataErrorExamples());
        other.removeAll(statementsBeingBuilt());
        other.removeAll(otherDataExamples());
        assertEquals(List.of(), other);
    }

    @ParameterizedTest
    @MethodSource("dataErrorExamples")
    void dataErrorExampleIsValidSyntaxWithThePositionOfANode(String block) {
        int arrow = block.indexOf("\n=> ");
        String query = block.substring(0, arrow);
        String[] expected = block.substring(arrow + 4).split("\n");
        // Parsing must succeed: a syntax error here would be reported by the parser, not the server.
        Script script = QueryParser.parse(query);
        checkNames(script, withLetNames(script), block);
        java.util.regex.Matcher m = DOCUMENTED_ERROR.matcher(expected[0]);
        assertTrue(m.matches(), expected[0]);
        // The server reports its errors at a node (QueryException.at), so the position is a node's.
        Position documented = new Position(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)));
        assertTrue(nodes(script, Node.class).stream().anyMatch(n -> n.position().equals(documented)),
                "no node starts at " + documented + " in " + query);
        assertTrue(expected.length <= 2, block);
        if (expected.length == 2) {
            assertTrue(expected[1].startsWith("  hint: ") && expected[1].length() > 8, expected[1]);
        }
    }

    /** The demo's variables and the names the script's lets define. */
    private static Set<String> withLetNames(Script script) {
        Set<String> variables = new java.util.HashSet<>(DEMO_VARIABLES);
        for (Statement statement : script.statements()) {
            if (statement instanceof DerivedVariable) {
                variables.add(((DerivedVariable) statement).name().name());
            }
        }
        return variables;
    }

    /** Every variable and named region of the tree is one of the demo's (or defined by a let). */
    private static void checkNames(Script script, Set<String> variables, String block) {
        for (Identifier name : nodes(script, Identifier.class)) {
            assertTrue(variables.contains(name.name()), name + " in " + block);
        }
        for (NamedRegion name : nodes(script, NamedRegion.class)) {
            assertTrue(DEMO_REGIONS.contains(name.name()), name + " in " + block);
        }
    }

    /** Every node of the type in the tree, found through the record components. */
    static <T> List<T> nodes(Object tree, Class<T> type) {
        List<T> found = new ArrayList<>();
        collect(tree, type, found);
        return found;
    }

    private static <T> void collect(Object node, Class<T> type, List<T> found) {
        if (type.isInstance(node)) {
            found.add(type.cast(node));
        }
        if (node instanceof java.util.Optional) {
            ((java.util.Optional<?>) node).ifPresent(n -> collect(n, type, found));
        } else if (node instanceof List) {
            ((List<?>) node).forEach(n -> collect(n, type, found));
        } else if (node instanceof Record) {
            for (java.lang.reflect.RecordComponent component : node.getClass().getRecordComponents()) {
                try {
                    collect(component.getAccessor().invoke(node), type, found);
                } catch (ReflectiveOperationException e) {
                    throw new AssertionError(e);
                }
            }
        }
    }

    @ParameterizedTest
    @MethodSource("swqBlocks")
    void swqBlockParsesAndUsesOnlyTheDemoScenario(String block) {
        Script script = QueryParser.parse(block);
        assertFalse(script.statements().isEmpty());
        // The server refuses a let that reuses a stored variable's name.
        for (DerivedVariable let : nodes(script, DerivedVariable.class)) {
            assertFalse(DEMO_VARIABLES.contains(let.name().name()), block);
        }
        checkNames(script, withLetNames(script), block);
        // Periods, baselines and events all lie in the data, and so does the window before an event.
        for (Period period : nodes(script, Period.class)) {
            checkWithinData(period, block);
        }
        for (PartialDate date : nodes(script, PartialDate.class)) {
            assertFalse(date.first().isBefore(DATA_START) || date.last().isAfter(DATA_END), block);
        }
        for (EventWindow window : nodes(script, EventWindow.class)) {
            LocalDate first = window.events().stream().map(PartialDate::first).min(LocalDate::compareTo).orElseThrow();
            assertFalse(first.minusDays((long) window.length().amount() * days(window.length().unit()))
                    .isBefore(DATA_START), block);
        }
        for (LagRange lags : nodes(script, LagRange.class)) {
            int count = (lags.last() - lags.first()) / lags.step() + 1;
            long reach = Math.max(Math.abs((long) lags.first()), Math.abs((long) lags.last())) * days(lags.unit());
            assertTrue(count <= MAX_LAGS && reach <= MAX_LAG_DAYS, "lags too many or too long for the docs test: " + block);
        }
        assertEquals(AstPositions.erase(script), AstPositions.erase(QueryParser.parse(QueryPrinter.print(script))));
    }

    /** The longest a unit can be in days (a month 31, a season 92, a year 366), for upper bounds. */
    private static int days(DurationUnit unit) {
        switch (unit) {
            case DAY:
                return 1;
            case WEEK:
                return 7;
            case MONTH:
                return 31;
            case SEASON:
                return 92;
            default:
                return 366;
        }
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

    private static void checkWithinData(Period period, String block) {
        assertFalse(period.start().isBefore(DATA_START), block);
        assertFalse(period.endInclusive().isAfter(DATA_END), block);
    }

    /** A fenced block: its contents and the headings ("## ...", "### ...") it stands under. */
    private record Block(String section, String subsection, String text) {}

    /** The contents of the fenced blocks with the given info string, in order. */
    private static List<String> blocks(String info) throws IOException {
        return blocks(info, null);
    }

    /** The same, only within the section of that heading when one is given. */
    private static List<String> blocks(String info, String section) throws IOException {
        List<String> texts = new ArrayList<>();
        for (Block block : fenced(info)) {
            if (section == null || block.section().equals(section)) {
                texts.add(block.text());
            }
        }
        return texts;
    }

    /** The fenced blocks with the given info string, in order, with their headings. */
    private static List<Block> fenced(String info) throws IOException {
        List<Block> blocks = new ArrayList<>();
        StringBuilder current = null;
        String section = "";
        String subsection = "";
        for (String line : readme()) {
            if (current == null && line.startsWith("## ")) {
                section = line;
                subsection = "";
            } else if (current == null && line.startsWith("### ")) {
                subsection = line;
            } else if (current == null && line.equals("```" + info)) {
                current = new StringBuilder();
            } else if (current != null && line.equals("```")) {
                blocks.add(new Block(section, subsection, current.toString().stripTrailing()));
                current = null;
            } else if (current != null) {
                current.append(line).append('\n');
            }
        }
        return blocks;
    }

    /** The text of one "## " section, up to the next. */
    private static String section(String heading) throws IOException {
        StringBuilder text = new StringBuilder();
        boolean in = false;
        boolean fence = false;
        for (String line : readme()) {
            if (!fence && line.startsWith("## ")) {
                in = line.equals(heading);
            }
            if (line.startsWith("```")) {
                fence = !fence;
            }
            if (in) {
                text.append(line).append('\n');
            }
        }
        assertFalse(text.length() == 0, "no section " + heading);
        return text.toString();
    }

    private static List<String> readme() throws IOException {
        return Files.readAllLines(Path.of("README.md"), StandardCharsets.UTF_8);
    }
}
