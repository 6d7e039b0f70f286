package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.Severity;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.ThresholdOperator;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;
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

    @Test
    void lagRangesAreOrderedWithAPositiveStep() {
        assertThrows(IllegalArgumentException.class, () -> new LagRange(5, 4, 1, DurationUnit.WEEK, P));
        assertThrows(IllegalArgumentException.class, () -> new LagRange(0, 4, 0, DurationUnit.WEEK, P));
        assertThrows(IllegalArgumentException.class, () -> new LagRange(0, Duration.MAX_AMOUNT + 1, 1, DurationUnit.DAY, P));
        assertEquals(true, new LagRange(3, 3, 1, DurationUnit.DAY, P).isSingle());
        assertEquals(false, new LagRange(3, 3, 2, DurationUnit.DAY, P).isSingle(), "a step of 2 is written out");
    }

    @Test
    void theNewRecordsRefuseWhatTheLanguageCannotSay() {
        Condition a = new ThresholdCondition(new WatchSeries(Statistic.of(StatisticKind.MEAN, P), new Identifier("a", P),
                Optional.empty(), Optional.empty(), P),
                new Threshold(ThresholdOperator.ABOVE, 1, Optional.empty(), P), Optional.empty(), P);
        assertThrows(IllegalArgumentException.class, () -> new AnyOf(List.of(a), P));
        assertThrows(IllegalArgumentException.class, () -> new AllOf(List.of(), P));
        assertThrows(IllegalArgumentException.class, () -> new NumberLiteral(-1, Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new NumberLiteral(Double.POSITIVE_INFINITY, Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new Threshold(ThresholdOperator.BELOW, Double.NaN,
                Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new Watch(" ", new NamedRegion("X", P),
                List.of(new WatchRule(a, Severity.ALERT, P)), P));
        assertThrows(IllegalArgumentException.class, () -> new Watch("w", new NamedRegion("X", P), List.of(), P));
        SeriesTerm rain = new SeriesTerm(Statistic.of(StatisticKind.SUM, P), new Identifier("rainfall", P), Optional.empty(), P);
        Duration days = new Duration(60, DurationUnit.DAY, P);
        assertThrows(IllegalArgumentException.class, () -> new EventWindow(days,
                List.of(PartialDate.ofMonth(2014, 6, P)), List.of(rain), new NamedRegion("X", P), Optional.empty(),
                Optional.empty(), P), "an event is a whole day");
        assertThrows(IllegalArgumentException.class, () -> new EventWindow(new Duration(0, DurationUnit.DAY, P),
                List.of(PartialDate.ofDay(2014, 6, 20, P)), List.of(rain), new NamedRegion("X", P), Optional.empty(),
                Optional.empty(), P));
    }

    @Test
    void aSeriesTermsRegionIsItsOwnOrElseTheStatements() {
        NamedRegion bay = new NamedRegion("Outer Bay", P);
        NamedRegion shed = new NamedRegion("Harle Watershed", new Position(3, 4));
        SeriesTerm rain = term(StatisticKind.SUM, "rainfall", Optional.empty());
        SeriesTerm rainShed = term(StatisticKind.SUM, "rainfall", Optional.of(shed));
        assertEquals(bay, rain.regionOr(bay));
        assertEquals(shed, rainShed.regionOr(bay));
        assertThrows(NullPointerException.class, () -> new SeriesTerm(Statistic.of(StatisticKind.SUM, P),
                new Identifier("rainfall", P), null, P));
        // One series: the same statistic, variable and region once placed in the statement's region,
        // positions aside.
        SeriesTerm rainBay = term(StatisticKind.SUM, "rainfall", Optional.of(new NamedRegion("Outer Bay", new Position(9, 9))));
        assertEquals(true, rain.sameSeries(rainBay, bay));
        assertEquals(false, rain.sameSeries(rainShed, bay));
        assertEquals(true, rain.sameSeries(rainShed, shed));
        assertEquals(false, rainShed.sameSeries(term(StatisticKind.MEAN, "rainfall", Optional.of(shed)), bay));
        assertEquals(false, rainShed.sameSeries(term(StatisticKind.SUM, "runoff", Optional.of(shed)), bay));
    }

    @Test
    void recordsRefuseDriversListedTwiceAndMapSeriesWithARegion() {
        NamedRegion bay = new NamedRegion("Outer Bay", P);
        Optional<RegionRef> shed = Optional.of(new NamedRegion("Harle Watershed", P));
        SeriesTerm chl = term(StatisticKind.MEAN, "chlorophyll", Optional.empty());
        SeriesTerm rain = term(StatisticKind.SUM, "rainfall", Optional.empty());
        SeriesTerm rainShed = term(StatisticKind.SUM, "rainfall", shed);
        SeriesTerm rainBay = term(StatisticKind.SUM, "rainfall", Optional.of(bay));
        Period years = new Period(PartialDate.ofYear(2006, P), PartialDate.ofYear(2025, P), P);
        Step week = new Step(StepKind.WEEK, P);
        // The same variable within two regions is two drivers ...
        assertEquals(2, ranking(chl, List.of(rain, rainShed), bay).drivers().size());
        // ... the same variable and region twice is one, written with 'within' or not.
        assertThrows(IllegalArgumentException.class, () -> ranking(chl, List.of(rainShed, rainShed), bay));
        assertThrows(IllegalArgumentException.class, () -> ranking(chl, List.of(rain, rainBay), bay));
        assertThrows(IllegalArgumentException.class, () -> ranking(chl, List.of(rain,
                term(StatisticKind.MEAN, "chlorophyll", Optional.of(bay))), bay), "the target among its drivers");
        assertEquals(1, ranking(chl, List.of(term(StatisticKind.MEAN, "chlorophyll", shed)), bay).drivers().size());
        Duration days = new Duration(60, DurationUnit.DAY, P);
        List<PartialDate> event = List.of(PartialDate.ofDay(2014, 6, 20, P));
        assertEquals(2, new EventWindow(days, event, List.of(rain, rainShed), bay, Optional.empty(), Optional.empty(), P)
                .drivers().size());
        assertThrows(IllegalArgumentException.class, () -> new EventWindow(days, event, List.of(rainBay, rain), bay,
                Optional.empty(), Optional.empty(), P));
        // A map takes every region from 'over'.
        assertThrows(IllegalArgumentException.class, () -> new StatisticMap(rainShed, bay, years, Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new DifferenceMap(rainShed, bay, years, years,
                Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new ComparisonMap(rainShed, bay, years, Optional.empty(),
                new Comparison(ComparisonKind.ANOMALY, Optional.empty(), P), P));
        assertThrows(IllegalArgumentException.class, () -> new CorrelationMap(chl, bay, rainShed, bay, years, week,
                Optional.empty(), CorrelationMethod.PEARSON, Optional.empty(), P));
        assertThrows(IllegalArgumentException.class, () -> new CorrelationMap(rainShed, bay, chl, bay, years, week,
                Optional.empty(), CorrelationMethod.PEARSON, Optional.empty(), P));
        assertEquals(rain, new StatisticMap(rain, bay, years, Optional.empty(), P).values());
    }

    private static SeriesTerm term(StatisticKind kind, String variable, Optional<RegionRef> region) {
        return new SeriesTerm(Statistic.of(kind, P), new Identifier(variable, P), region, P);
    }

    private static DriverRanking ranking(SeriesTerm series, List<SeriesTerm> drivers, RegionRef region) {
        return new DriverRanking(series, drivers, region,
                new Period(PartialDate.ofYear(2006, P), PartialDate.ofYear(2025, P), P), new Step(StepKind.WEEK, P),
                Optional.empty(), CorrelationMethod.PEARSON, Optional.empty(), Optional.empty(), P);
    }

    @Test
    void newListsAreCopiedAndImmutable() {
        List<SeriesTerm> drivers = new ArrayList<>(List.of(
                new SeriesTerm(Statistic.of(StatisticKind.MEAN, P), new Identifier("runoff", P), Optional.empty(), P)));
        DriverRanking ranking = new DriverRanking(
                new SeriesTerm(Statistic.of(StatisticKind.MEAN, P), new Identifier("chlorophyll", P), Optional.empty(), P), drivers,
                new NamedRegion("X", P), new Period(PartialDate.ofYear(2006, P), PartialDate.ofYear(2006, P), P),
                new Step(StepKind.WEEK, P), Optional.empty(), CorrelationMethod.PEARSON, Optional.empty(),
                Optional.empty(), P);
        drivers.clear();
        assertEquals(1, ranking.drivers().size());
        assertThrows(UnsupportedOperationException.class, () -> ranking.drivers().clear());
    }

    @Test
    void erasingPositionsReachesEveryNewNode() {
        Script parsed = QueryParser.parse(String.join(";\n", LanguageV1ExamplesTest.CORRELATE_OPTIONS,
                LanguageV1ExamplesTest.RANK, LanguageV1ExamplesTest.WINDOW, LanguageV1ExamplesTest.MAP_DIFFERENCE,
                LanguageV1ExamplesTest.MAP_ANOMALY, LanguageV1ExamplesTest.MAP_CORRELATION,
                LanguageV1ExamplesTest.MAP_CORRELATION_LAGS, LanguageV1ExamplesTest.WATCH,
                LanguageV1ExamplesTest.RANK_WITHIN, LanguageV1ExamplesTest.CORRELATE_WITHIN,
                LanguageV1ExamplesTest.WINDOW_WITHIN,
                "let z = -(a - 2 degC) * b"));
        // The printed form of an erased tree parses to the same tree: nothing kept a position.
        Script erased = AstPositions.erase(parsed);
        assertEquals(false, erased.toString().matches("(?s).*position=[1-9].*"), erased.toString());
        assertEquals(erased, AstPositions.erase(QueryParser.parse(QueryPrinter.print(erased))));
    }
}
