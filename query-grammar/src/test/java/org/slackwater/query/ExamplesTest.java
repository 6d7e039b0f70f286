package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.CircleRegion;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.Coordinate;
import org.slackwater.query.ast.Coverage;
import org.slackwater.query.ast.DescribeVariable;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.ListRegions;
import org.slackwater.query.ast.ListVariables;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.Position;
import org.slackwater.query.ast.Quantity;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.WktRegion;

/**
 * The examples of the language brief, each parsed to the tree it must give. Coordinates are
 * signed with N and E positive (ISO 6709); a reduced date such as 2014-08 ends on its last day
 * (ISO 8601 reduced precision read as the whole month).
 */
class ExamplesTest {

    static final Position NONE = Position.NONE;

    static final String EX1 = "mean chlorophyll over \"Outer Bay\" from 2014-06 to 2014-08 by week";
    static final String EX2 = "sum rainfall over \"Harle Watershed\" during 2014 by month";
    static final String EX3 = "p90 turbidity over circle(44.10 N, 31.20 W, 3 km) from 2014-07-01 to 2014-07-31"
            + " by day in FNU with coverage at least 60 %";
    static final String EX4 = "max water_temperature over box(43.95 N, 31.30 W, 44.20 N, 30.95 W) during 2014-07"
            + " by day in degF";
    static final String EX5 = "mean chlorophyll over \"Outer Bay\" during 2006 to 2025 by month as anomaly"
            + " against 2006 to 2020";
    static final String EX6 = "median cloud_fraction over wkt \"POLYGON((-31.3 44.0, -31.0 44.0, -31.0 44.2,"
            + " -31.3 44.0))\" during 2014 by season";
    static final String EX7 = "mean turbidity over circle(44.12 N, 31.25 W, 5 km) clipped to \"Mid Reach\""
            + " during 2014 by water year";

    static Stream<Arguments> examples() {
        return Stream.of(
                Arguments.of(EX1, series(Statistic.of(StatisticKind.MEAN, NONE), "chlorophyll", named("Outer Bay"),
                        period(month(2014, 6), month(2014, 8)), StepKind.WEEK, null, null, null)),
                Arguments.of(EX2, series(Statistic.of(StatisticKind.SUM, NONE), "rainfall", named("Harle Watershed"),
                        period(year(2014), year(2014)), StepKind.MONTH, null, null, null)),
                Arguments.of(EX3, series(Statistic.percentile(90, NONE), "turbidity",
                        new CircleRegion(new Coordinate(44.10, -31.20, NONE), new Quantity(3, "km", NONE), NONE),
                        period(day(2014, 7, 1), day(2014, 7, 31)), StepKind.DAY, "FNU", null, 60.0)),
                Arguments.of(EX4, series(Statistic.of(StatisticKind.MAX, NONE), "water_temperature",
                        new BoxRegion(43.95, -31.30, 44.20, -30.95, NONE),
                        period(month(2014, 7), month(2014, 7)), StepKind.DAY, "degF", null, null)),
                Arguments.of(EX5, series(Statistic.of(StatisticKind.MEAN, NONE), "chlorophyll", named("Outer Bay"),
                        period(year(2006), year(2025)), StepKind.MONTH, null,
                        new Comparison(ComparisonKind.ANOMALY, Optional.of(period(year(2006), year(2020))), NONE),
                        null)),
                Arguments.of(EX6, series(Statistic.of(StatisticKind.MEDIAN, NONE), "cloud_fraction",
                        new WktRegion("POLYGON((-31.3 44.0, -31.0 44.0, -31.0 44.2, -31.3 44.0))", NONE),
                        period(year(2014), year(2014)), StepKind.SEASON, null, null, null)),
                Arguments.of(EX7, series(Statistic.of(StatisticKind.MEAN, NONE), "turbidity",
                        new ClippedRegion(
                                new CircleRegion(new Coordinate(44.12, -31.25, NONE), new Quantity(5, "km", NONE), NONE),
                                named("Mid Reach"), NONE),
                        period(year(2014), year(2014)), StepKind.WATER_YEAR, null, null, null)),
                Arguments.of("list variables", new ListVariables(NONE)),
                Arguments.of("describe chlorophyll", new DescribeVariable(new Identifier("chlorophyll", NONE), NONE)),
                Arguments.of("list regions", new ListRegions(NONE)));
    }

    @ParameterizedTest
    @MethodSource("examples")
    void exampleParsesToItsTree(String text, Statement expected) {
        Script script = QueryParser.parse(text);
        assertEquals(new Script(List.of(expected), NONE), AstPositions.erase(script));
    }

    @Test
    void wholeTreeWithPositionsForTheCircleExample() {
        // Columns counted by hand on EX3 (1-based):
        // p90=1 turbidity=5 over=15 circle=20 44.10=27 3=45 from=51 2014-07-01=56 to=67
        // 2014-07-31=70 by=81 in=88 with=95 60=112
        Script expected = new Script(List.of(new AreaSeries(
                Statistic.percentile(90, at(1, 1)),
                new Identifier("turbidity", at(1, 5)),
                new CircleRegion(new Coordinate(44.10, -31.20, at(1, 27)), new Quantity(3, "km", at(1, 45)), at(1, 20)),
                new Period(PartialDate.ofDay(2014, 7, 1, at(1, 56)), PartialDate.ofDay(2014, 7, 31, at(1, 70)), at(1, 51)),
                new Step(StepKind.DAY, at(1, 81)),
                Optional.of(new UnitRef("FNU", at(1, 88))),
                Optional.empty(),
                Optional.of(new Coverage(60, at(1, 95))),
                at(1, 1))), at(1, 1));
        assertEquals(expected, QueryParser.parse(EX3));
    }

    @Test
    void wholeTreeWithPositionsForAScriptOnSeveralLines() {
        String text = "# catalog first\n"
                + "list variables;\n"
                + "  describe Chlorophyll ;\n"
                + "mean chlorophyll over \"Outer Bay\"\n"
                + "    clipped to \"Mid Reach\" clipped to \"Upper Reach\"\n"
                + "    during 2006 to 2025 by month as anomaly against 2006 to 2020;";
        RegionRef outer = new NamedRegion("Outer Bay", at(4, 23));
        RegionRef clipped = new ClippedRegion(
                new ClippedRegion(outer, new NamedRegion("Mid Reach", at(5, 16)), at(4, 23)),
                new NamedRegion("Upper Reach", at(5, 39)), at(4, 23));
        Script expected = new Script(List.of(
                new ListVariables(at(2, 1)),
                new DescribeVariable(new Identifier("chlorophyll", at(3, 12)), at(3, 3)),
                new AreaSeries(
                        Statistic.of(StatisticKind.MEAN, at(4, 1)),
                        new Identifier("chlorophyll", at(4, 6)),
                        clipped,
                        new Period(PartialDate.ofYear(2006, at(6, 12)), PartialDate.ofYear(2025, at(6, 20)), at(6, 5)),
                        new Step(StepKind.MONTH, at(6, 25)),
                        Optional.empty(),
                        Optional.of(new Comparison(ComparisonKind.ANOMALY, Optional.of(new Period(
                                PartialDate.ofYear(2006, at(6, 53)), PartialDate.ofYear(2020, at(6, 61)), at(6, 53))),
                                at(6, 34))),
                        Optional.empty(),
                        at(4, 1))),
                at(2, 1));
        assertEquals(expected, QueryParser.parse(text));
    }

    @Test
    void positionsOfTheBoxExampleFollowTheText() {
        AreaSeries series = (AreaSeries) QueryParser.parse(EX4).statements().get(0);
        assertEquals(column(EX4, "box("), series.region().position().column());
        assertEquals(column(EX4, "during"), series.period().position().column());
        assertEquals(column(EX4, "2014-07"), series.period().from().position().column());
        assertEquals(column(EX4, "by day"), series.step().position().column());
        assertEquals(column(EX4, "in degF"), series.unit().orElseThrow().position().column());
    }

    @Test
    void reducedDatesStandForWholeMonthsAndYears() {
        // ISO 8601 reduced precision: 2014-08 is the month, its last day 2014-08-31.
        Period p = ((AreaSeries) QueryParser.parse(EX1).statements().get(0)).period();
        assertEquals(java.time.LocalDate.of(2014, 6, 1), p.start());
        assertEquals(java.time.LocalDate.of(2014, 8, 31), p.endInclusive());
        Period year = ((AreaSeries) QueryParser.parse(EX2).statements().get(0)).period();
        assertEquals(java.time.LocalDate.of(2014, 1, 1), year.start());
        assertEquals(java.time.LocalDate.of(2014, 12, 31), year.endInclusive());
    }

    @Test
    void keywordsAreCaseInsensitiveNamesLowerCasedUnitsKept() {
        Script upper = QueryParser.parse("MEAN Chlorophyll OVER \"Outer Bay\" DURING 2014 BY Water Year IN DegF");
        AreaSeries s = (AreaSeries) upper.statements().get(0);
        assertEquals("chlorophyll", s.variable().name());
        assertEquals(StepKind.WATER_YEAR, s.step().kind());
        assertEquals("DegF", s.unit().orElseThrow().unit());
        assertEquals("Outer Bay", ((NamedRegion) s.region()).name());
    }

    @Test
    void plainSignedDegreesMeanTheSameAsHemisphereLetters() {
        Script letters = QueryParser.parse("mean turbidity over circle(44.10 N, 31.20 W, 500 m) during 2014 by day");
        Script signed = QueryParser.parse("mean turbidity over circle(44.10, -31.20, 500 m) during 2014 by day");
        Script south = QueryParser.parse("mean turbidity over circle(44.10 S, 31.20 E, 500 m) during 2014 by day");
        assertEquals(AstPositions.erase(letters), AstPositions.erase(signed));
        CircleRegion c = (CircleRegion) ((AreaSeries) south.statements().get(0)).region();
        assertEquals(-44.10, c.center().latitude());
        assertEquals(31.20, c.center().longitude());
        assertEquals(500.0, c.radius().metres());
    }

    @Test
    void longitudesFrom0To360AreKeptAsWrittenAndNormalizedOnRequest() {
        CircleRegion c = (CircleRegion) ((AreaSeries) QueryParser.parse(
                "mean turbidity over circle(44.1, 328.8, 3 km) during 2014 by day").statements().get(0)).region();
        assertEquals(328.8, c.center().longitude());
        assertEquals(-31.2, c.center().normalizedLongitude(), 1e-12);
    }

    @Test
    void stringEscapesAreResolved() {
        NamedRegion r = (NamedRegion) ((AreaSeries) QueryParser.parse(
                "mean turbidity over \"Say \\\"Reach\\\" \\\\ two\" during 2014 by day").statements().get(0)).region();
        assertEquals("Say \"Reach\" \\ two", r.name());
    }

    // ---- helpers --------------------------------------------------------------------------

    static Position at(int line, int column) {
        return new Position(line, column);
    }

    static int column(String text, String needle) {
        return text.indexOf(needle) + 1;
    }

    static NamedRegion named(String name) {
        return new NamedRegion(name, NONE);
    }

    static PartialDate year(int y) {
        return PartialDate.ofYear(y, NONE);
    }

    static PartialDate month(int y, int m) {
        return PartialDate.ofMonth(y, m, NONE);
    }

    static PartialDate day(int y, int m, int d) {
        return PartialDate.ofDay(y, m, d, NONE);
    }

    static Period period(PartialDate from, PartialDate to) {
        return new Period(from, to, NONE);
    }

    static AreaSeries series(Statistic statistic, String variable, RegionRef region, Period period, StepKind step,
            String unit, Comparison comparison, Double coverage) {
        return new AreaSeries(statistic, new Identifier(variable, NONE), region, period, new Step(step, NONE),
                Optional.ofNullable(unit).map(u -> new UnitRef(u, NONE)), Optional.ofNullable(comparison),
                Optional.ofNullable(coverage).map(c -> new Coverage(c, NONE)), NONE);
    }
}
