package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.Script;

class QueryExceptionTest {

    @Test
    void messageIsPositionDetailAndHint() {
        QueryException e = new QueryException("unknown variable 'chlorophil'", 2, 6, "list regions;\nmean chlorophil", "did you mean 'chlorophyll'?");
        assertEquals("line 2:6: unknown variable 'chlorophil'\n  hint: did you mean 'chlorophyll'?", e.getMessage());
        assertEquals("unknown variable 'chlorophil'", e.detail());
        assertEquals(2, e.line());
        assertEquals(6, e.column());
        QueryException noHint = new QueryException("bad", 1, 1, "x", null);
        assertEquals("line 1:1: bad", noHint.getMessage());
        assertEquals("", noHint.hint());
    }

    @Test
    void excerptShowsTheLineWithACaretUnderTheColumn() {
        QueryException e = assertThrows(QueryException.class,
                () -> QueryParser.parse("list regions;\nmean over \"Outer Bay\" during 2014 by month"));
        assertEquals("mean over \"Outer Bay\" during 2014 by month\n     ^", e.excerpt());
    }

    @Test
    void excerptKeepsTabsSoTheCaretLinesUp() {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse("\tlist\tfoo"));
        assertEquals("\tlist\tfoo\n\t    \t^", e.excerpt());
    }

    @Test
    void excerptOfALongLineIsAWindowAroundTheColumn() {
        String text = "describe " + "x".repeat(200) + " @";
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(text));
        assertEquals(211, e.column());
        String[] lines = e.excerpt().split("\n");
        assertEquals("..." + "x".repeat(59) + " @", lines[0]);
        assertEquals(" ".repeat(3 + 60) + "^", lines[1]);
    }

    @Test
    void excerptAtEndOfInputPointsPastTheLastCharacter() {
        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse("describe"));
        assertEquals("describe\n        ^", e.excerpt());
        assertEquals("", new QueryException("x", 5, 1, "one line", "").excerpt());
    }

    @Test
    void atPlacesASemanticErrorOnANode() {
        String text = "mean chlorophil over \"Outer Bay\" during 2014 by month";
        Script script = QueryParser.parse(text);
        AreaSeries series = (AreaSeries) script.statements().get(0);
        QueryException e = QueryException.at(series.variable(), text, "unknown variable 'chlorophil'",
                "did you mean 'chlorophyll'?");
        assertEquals("line 1:6: unknown variable 'chlorophil'\n  hint: did you mean 'chlorophyll'?", e.getMessage());
        assertEquals(text + "\n     ^", e.excerpt());
    }
}
