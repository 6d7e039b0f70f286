package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.Coordinate;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.ListVariables;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.Position;
import org.slackwater.query.ast.Quantity;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;

/** The tree's invariants hold for trees built by code too, not only by the parser. */
class AstTest {

    private static final Position P = new Position(1, 1);

    @Test
    void listsAreCopiedAndImmutable() {
        List<Statement> statements = new ArrayList<>(List.of(new ListVariables(P)));
        Script script = new Script(statements, P);
        statements.clear();
        assertEquals(1, script.statements().size());
        assertThrows(UnsupportedOperationException.class, () -> script.statements().add(new ListVariables(P)));
    }

    @Test
    void nullsAreRejected() {
        assertThrows(NullPointerException.class, () -> new NamedRegion(null, P));
        assertThrows(NullPointerException.class, () -> new ListVariables(null));
        assertThrows(NullPointerException.class, () -> new Script(null, P));
    }

    @Test
    void positionsAreOneBasedOrNone() {
        assertThrows(IllegalArgumentException.class, () -> new Position(0, 3));
        assertThrows(IllegalArgumentException.class, () -> new Position(1, 0));
        assertEquals("0:0", Position.NONE.toString());
    }

    @Test
    void statisticPercentileFitsItsKind() {
        assertEquals(50.0, Statistic.of(StatisticKind.MEDIAN, P).percentile());
        assertEquals(Double.NaN, Statistic.of(StatisticKind.MEAN, P).percentile());
        assertEquals(Statistic.of(StatisticKind.MEAN, P), Statistic.of(StatisticKind.MEAN, P), "NaN equals NaN in records");
        assertThrows(IllegalArgumentException.class, () -> Statistic.percentile(100, P));
        assertThrows(IllegalArgumentException.class, () -> new Statistic(StatisticKind.MAX, 90, P));
    }

    @Test
    void identifiersAreLowerCase() {
        assertEquals("water_temperature", new Identifier("Water_Temperature", P).name());
        assertThrows(IllegalArgumentException.class, () -> new Identifier("9lives", P));
    }

    @Test
    void coordinatesAreCheckedAndNormalized() {
        assertThrows(IllegalArgumentException.class, () -> new Coordinate(90.5, 0, P));
        assertThrows(IllegalArgumentException.class, () -> new Coordinate(0, 360.5, P));
        assertEquals(0.0, new Coordinate(-0.0, 0, P).latitude(), "negative zero is plain zero");
        assertEquals(Double.doubleToLongBits(0.0), Double.doubleToLongBits(new Coordinate(-0.0, 0, P).latitude()));
        assertEquals(-180.0, new Coordinate(0, 180, P).normalizedLongitude());
        assertEquals(-31.25, new Coordinate(0, 328.75, P).normalizedLongitude());
    }

    @Test
    void boxWidthIsMeasuredEastwardAcrossTheAntimeridian() {
        assertEquals(0.35, new BoxRegion(43.95, -31.30, 44.20, -30.95, P).widthDegrees(), 1e-12);
        assertEquals(2.0, new BoxRegion(0, 179, 1, -179, P).widthDegrees(), 1e-12);
        assertThrows(IllegalArgumentException.class, () -> new BoxRegion(45, 0, 44, 1, P));
    }

    @Test
    void distancesConvertToMetres() {
        assertEquals(3000.0, new Quantity(3, "km", P).metres());
        assertEquals(500.0, new Quantity(500, "m", P).metres());
        assertThrows(IllegalStateException.class, () -> new Quantity(2, "mi", P).metres());
    }
}
