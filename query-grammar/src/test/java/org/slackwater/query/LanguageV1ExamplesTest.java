package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.slackwater.query.ExamplesTest.NONE;
import static org.slackwater.query.ExamplesTest.at;
import static org.slackwater.query.ExamplesTest.day;
import static org.slackwater.query.ExamplesTest.month;
import static org.slackwater.query.ExamplesTest.named;
import static org.slackwater.query.ExamplesTest.period;
import static org.slackwater.query.ExamplesTest.year;

import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.ArithmeticOperator;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.BinaryOp;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.Coverage;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Deseasonalized;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.Expression;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.Negate;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Severity;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.ThresholdOperator;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.VariableRef;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;

/**
 * The examples of the "Query language v1" issue, each parsed to the tree it must give, plus
 * the rules of grouping: {@code *} before {@code +}, left grouping of {@code -} and {@code /}
 * (school arithmetic), {@code and} before {@code or} (as in Boolean algebra), and the
 * defaults (mean, pearson, warning, lag step 1).
 */
class LanguageV1ExamplesTest {

    static final String CORRELATE = "correlate chlorophyll with runoff over \"Outer Bay\" during 2006 to 2025 by week"
            + " lags 0 to 12 weeks";
    static final String CORRELATE_OPTIONS = "correlate mean chlorophyll with sum rainfall over \"Outer Bay\""
            + " during 2006 to 2025 by week lags -4 to 12 weeks step 2 weeks using spearman deseasonalized"
            + " against 2006 to 2020 with coverage at least 50 %";
    static final String RANK = "rank drivers of chlorophyll among rainfall, runoff, water_temperature, cloud_fraction"
            + " over \"Outer Bay\" during 2006 to 2025 by week lags 0 to 26 weeks";
    static final String WINDOW = "window 60 days before 2014-06-20 of rainfall, runoff, water_temperature"
            + " over \"Outer Bay\" against 2006 to 2025";
    static final String WINDOW_DATES = "window 60 days before 2009-07-04, 2014-06-20 of sum rainfall,"
            + " mean water_temperature over \"Outer Bay\"";
    static final String MAP = "map mean chlorophyll over \"Outer Bay\" during 2014-06";
    static final String MAP_DIFFERENCE = "map mean chlorophyll over \"Outer Bay\" during 2014-06 minus 2013-06";
    static final String MAP_ANOMALY = "map mean water_temperature over \"Outer Bay\" during 2014-06 as anomaly"
            + " against 2006 to 2020";
    static final String MAP_CORRELATION = "map correlation of chlorophyll over \"Outer Bay\" with mean runoff"
            + " over \"Harle Watershed\" during 2006 to 2025 by week at lag 4 weeks";
    /** Many lags on a map, with every optional clause after them. */
    static final String MAP_CORRELATION_LAGS = "map correlation of chlorophyll over \"Outer Bay\" with sum runoff"
            + " over \"Harle Watershed\" during 2006 to 2025 by week lags -4 to 26 weeks step 2 weeks using spearman"
            + " deseasonalized against 2006 to 2020";
    static final String WATCH = "watch \"North Intake bloom\" over \"North Intake\" when mean chlorophyll above"
            + " 10 mg/m3 for 3 days or (standardized anomaly of sum runoff over 30 days above 2 against 2006 to 2020)";
    static final String LET = "let sediment = 1.3 * turbidity + 2.1 in mg/L";
    /** The three statements of the "per-series region" issue, word for word. */
    static final String RANK_WITHIN = "rank drivers of chlorophyll among sum rainfall within \"Harle Watershed\","
            + " runoff within \"Harle Watershed\", water_temperature, cloud_fraction over \"Outer Bay\""
            + " during 2006 to 2025 by week lags 0 to 26 weeks";
    static final String CORRELATE_WITHIN = "correlate chlorophyll with sum runoff within \"Harle Watershed\""
            + " over \"Outer Bay\" during 2006 to 2025 by week lags 0 to 12 weeks deseasonalized";
    static final String WINDOW_WITHIN = "window 60 days before 2014-06-20 of sum rainfall within \"Harle Watershed\","
            + " water_temperature over \"Outer Bay\"";

    static Stream<Arguments> examples() {
        return Stream.of(
                Arguments.of(CORRELATE, new Correlation(mean("chlorophyll"), mean("runoff"), named("Outer Bay"),
                        period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(0, 12, 1, DurationUnit.WEEK, NONE)), CorrelationMethod.PEARSON,
                        Optional.empty(), Optional.empty(), NONE)),
                Arguments.of(CORRELATE_OPTIONS, new Correlation(mean("chlorophyll"), term(StatisticKind.SUM, "rainfall"),
                        named("Outer Bay"), period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(-4, 12, 2, DurationUnit.WEEK, NONE)), CorrelationMethod.SPEARMAN,
                        Optional.of(new Deseasonalized(Optional.of(period(year(2006), year(2020))), NONE)),
                        Optional.of(new Coverage(50, NONE)), NONE)),
                Arguments.of("correlate chlorophyll with runoff over \"Outer Bay\" during 2006 to 2025 by month"
                                + " at lag 2 months as anomalies",
                        new Correlation(mean("chlorophyll"), mean("runoff"), named("Outer Bay"),
                                period(year(2006), year(2025)), step(StepKind.MONTH),
                                Optional.of(new LagRange(2, 2, 1, DurationUnit.MONTH, NONE)), CorrelationMethod.PEARSON,
                                Optional.of(new Deseasonalized(Optional.empty(), NONE)), Optional.empty(), NONE)),
                Arguments.of(RANK, new DriverRanking(mean("chlorophyll"),
                        List.of(mean("rainfall"), mean("runoff"), mean("water_temperature"), mean("cloud_fraction")),
                        named("Outer Bay"), period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(0, 26, 1, DurationUnit.WEEK, NONE)), CorrelationMethod.PEARSON,
                        Optional.empty(), Optional.empty(), NONE)),
                Arguments.of(WINDOW, new EventWindow(new Duration(60, DurationUnit.DAY, NONE), List.of(day(2014, 6, 20)),
                        List.of(mean("rainfall"), mean("runoff"), mean("water_temperature")), named("Outer Bay"),
                        Optional.of(period(year(2006), year(2025))), Optional.empty(), NONE)),
                Arguments.of(WINDOW_DATES, new EventWindow(new Duration(60, DurationUnit.DAY, NONE),
                        List.of(day(2009, 7, 4), day(2014, 6, 20)),
                        List.of(term(StatisticKind.SUM, "rainfall"), mean("water_temperature")), named("Outer Bay"),
                        Optional.empty(), Optional.empty(), NONE)),
                Arguments.of(MAP, new StatisticMap(mean("chlorophyll"), named("Outer Bay"),
                        period(month(2014, 6), month(2014, 6)), Optional.empty(), NONE)),
                Arguments.of(MAP_DIFFERENCE, new DifferenceMap(mean("chlorophyll"), named("Outer Bay"),
                        period(month(2014, 6), month(2014, 6)), period(month(2013, 6), month(2013, 6)),
                        Optional.empty(), NONE)),
                Arguments.of(MAP_ANOMALY, new ComparisonMap(mean("water_temperature"), named("Outer Bay"),
                        period(month(2014, 6), month(2014, 6)), Optional.empty(),
                        new Comparison(ComparisonKind.ANOMALY, Optional.of(period(year(2006), year(2020))), NONE), NONE)),
                Arguments.of("map p90 turbidity over \"Mid Reach\" during 2014-07 in FNU",
                        new StatisticMap(new SeriesTerm(Statistic.percentile(90, NONE), id("turbidity"), Optional.empty(), NONE),
                                named("Mid Reach"), period(month(2014, 7), month(2014, 7)),
                                Optional.of(new UnitRef("FNU", NONE)), NONE)),
                Arguments.of(MAP_CORRELATION, new CorrelationMap(mean("chlorophyll"), named("Outer Bay"), mean("runoff"),
                        named("Harle Watershed"), period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(4, 4, 1, DurationUnit.WEEK, NONE)), CorrelationMethod.PEARSON,
                        Optional.empty(), NONE)),
                Arguments.of(MAP_CORRELATION_LAGS, new CorrelationMap(mean("chlorophyll"), named("Outer Bay"),
                        new SeriesTerm(Statistic.of(StatisticKind.SUM, NONE), id("runoff"), Optional.empty(), NONE),
                        named("Harle Watershed"), period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(-4, 26, 2, DurationUnit.WEEK, NONE)), CorrelationMethod.SPEARMAN,
                        Optional.of(new Deseasonalized(Optional.of(period(year(2006), year(2020))), NONE)), NONE)),
                Arguments.of(WATCH, new Watch("North Intake bloom", named("North Intake"), List.of(new WatchRule(
                        new AnyOf(List.of(
                                new ThresholdCondition(watchSeries(StatisticKind.MEAN, "chlorophyll", null),
                                        threshold(ThresholdOperator.ABOVE, 10, "mg/m3"),
                                        Optional.of(new Duration(3, DurationUnit.DAY, NONE)), NONE),
                                new ComparisonCondition(ComparisonKind.STANDARDIZED_ANOMALY,
                                        watchSeries(StatisticKind.SUM, "runoff", new Duration(30, DurationUnit.DAY, NONE)),
                                        threshold(ThresholdOperator.ABOVE, 2, null),
                                        Optional.of(period(year(2006), year(2020))), Optional.empty(), NONE)), NONE),
                        Severity.WARNING, NONE)), NONE)),
                Arguments.of(RANK_WITHIN, new DriverRanking(mean("chlorophyll"),
                        List.of(within(term(StatisticKind.SUM, "rainfall"), named("Harle Watershed")),
                                within(mean("runoff"), named("Harle Watershed")), mean("water_temperature"),
                                mean("cloud_fraction")),
                        named("Outer Bay"), period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(0, 26, 1, DurationUnit.WEEK, NONE)), CorrelationMethod.PEARSON,
                        Optional.empty(), Optional.empty(), NONE)),
                Arguments.of(CORRELATE_WITHIN, new Correlation(mean("chlorophyll"),
                        within(term(StatisticKind.SUM, "runoff"), named("Harle Watershed")), named("Outer Bay"),
                        period(year(2006), year(2025)), step(StepKind.WEEK),
                        Optional.of(new LagRange(0, 12, 1, DurationUnit.WEEK, NONE)), CorrelationMethod.PEARSON,
                        Optional.of(new Deseasonalized(Optional.empty(), NONE)), Optional.empty(), NONE)),
                Arguments.of(WINDOW_WITHIN, new EventWindow(new Duration(60, DurationUnit.DAY, NONE),
                        List.of(day(2014, 6, 20)),
                        List.of(within(term(StatisticKind.SUM, "rainfall"), named("Harle Watershed")),
                                mean("water_temperature")),
                        named("Outer Bay"), Optional.empty(), Optional.empty(), NONE)),
                // The series being explained may have a region of its own too, and any region follows 'within'.
                Arguments.of("correlate chlorophyll within \"Mid Reach\" clipped to box(44.0, -31.2, 44.2, -31.0) with"
                                + " runoff within \"Harle Watershed\" over \"Outer Bay\" during 2006 to 2025 by week",
                        new Correlation(within(mean("chlorophyll"), new ClippedRegion(named("Mid Reach"),
                                        new BoxRegion(44.0, -31.2, 44.2, -31.0, NONE), NONE)),
                                within(mean("runoff"), named("Harle Watershed")), named("Outer Bay"),
                                period(year(2006), year(2025)), step(StepKind.WEEK), Optional.empty(),
                                CorrelationMethod.PEARSON, Optional.empty(), Optional.empty(), NONE)),
                // One variable within two regions is two drivers; so is the target's variable elsewhere.
                Arguments.of("rank drivers of chlorophyll among turbidity within \"Upper Reach\", turbidity,"
                                + " chlorophyll within \"Outer Bay\" over \"Mid Reach\" during 2006 to 2025 by week",
                        new DriverRanking(mean("chlorophyll"),
                                List.of(within(mean("turbidity"), named("Upper Reach")), mean("turbidity"),
                                        within(mean("chlorophyll"), named("Outer Bay"))),
                                named("Mid Reach"), period(year(2006), year(2025)), step(StepKind.WEEK),
                                Optional.empty(), CorrelationMethod.PEARSON, Optional.empty(), Optional.empty(), NONE)),
                Arguments.of(LET, new DerivedVariable(id("sediment"),
                        new BinaryOp(new BinaryOp(number(1.3, null), ArithmeticOperator.MULTIPLY, variable("turbidity"),
                                NONE), ArithmeticOperator.ADD, number(2.1, null), NONE),
                        Optional.of(new UnitRef("mg/L", NONE)), NONE)));
    }

    @ParameterizedTest
    @MethodSource("examples")
    void exampleParsesToItsTree(String text, Statement expected) {
        assertEquals(new Script(List.of(expected), NONE), AstPositions.erase(QueryParser.parse(text)));
    }

    @Test
    void andBindsMoreTightlyThanOrAndNotTakesOneOperand() {
        Condition a = threshold("a");
        Condition b = threshold("b");
        Condition c = threshold("c");
        assertEquals(new AnyOf(List.of(a, new AllOf(List.of(b, c), NONE)), NONE),
                condition("a above 1 or b above 1 and c above 1"));
        assertEquals(new AllOf(List.of(new AnyOf(List.of(a, b), NONE), c), NONE),
                condition("(a above 1 or b above 1) and c above 1"));
        assertEquals(new AnyOf(List.of(new Not(a, NONE), b, c), NONE),
                condition("not a above 1 or b above 1 or c above 1"), "a chain of 'or' is one AnyOf");
        assertEquals(new Not(new AllOf(List.of(a, b), NONE), NONE), condition("not (a above 1 and b above 1)"));
        assertEquals(new AnyOf(List.of(a, new AnyOf(List.of(b, c), NONE)), NONE),
                condition("a above 1 or (b above 1 or c above 1)"), "parentheses are kept as written");
    }

    @Test
    void arithmeticFollowsSchoolPrecedenceAndGroupsFromTheLeft() {
        Expression a = variable("a");
        Expression b = variable("b");
        Expression c = variable("c");
        // a - b - c is (a - b) - c; a / b * c is (a / b) * c; a + b * c is a + (b * c).
        assertEquals(op(op(a, ArithmeticOperator.SUBTRACT, b), ArithmeticOperator.SUBTRACT, c), expression("a - b - c"));
        assertEquals(op(op(a, ArithmeticOperator.DIVIDE, b), ArithmeticOperator.MULTIPLY, c), expression("a / b * c"));
        assertEquals(op(a, ArithmeticOperator.ADD, op(b, ArithmeticOperator.MULTIPLY, c)), expression("a + b * c"));
        assertEquals(op(a, ArithmeticOperator.SUBTRACT, op(b, ArithmeticOperator.SUBTRACT, c)), expression("a - (b - c)"));
        assertEquals(op(new Negate(a, NONE), ArithmeticOperator.MULTIPLY, b), expression("-a * b"));
        assertEquals(op(a, ArithmeticOperator.SUBTRACT, new Negate(b, NONE)), expression("a - -b"));
        assertEquals(new Negate(new Negate(a, NONE), NONE), expression("-(-a)"));
    }

    @Test
    void numbersCarryUnitsPlainQuotedOrCompound() {
        assertEquals(op(variable("water_temperature"), ArithmeticOperator.SUBTRACT, number(25, "degC")),
                expression("water_temperature - 25 degC"));
        assertEquals(op(number(1.3, "mg/L"), ArithmeticOperator.MULTIPLY, variable("turbidity")),
                expression("1.3 mg/L * turbidity"));
        assertEquals(op(number(2, "kg m-2 s-1"), ArithmeticOperator.DIVIDE, number(4, "m")),
                expression("2 \"kg m-2 s-1\" / 4 m"));
        // Without spaces '/' still divides after a number; after a unit word it belongs to the unit.
        assertEquals(op(number(10, null), ArithmeticOperator.DIVIDE, variable("x")), expression("10/x"));
    }

    @Test
    void wholeTreeWithPositionsForAWatchOnSeveralLines() {
        String text = "watch \"Bloom\" over \"North Intake\"\n"
                + "  when max chlorophyll at least 25 mg/m3 severity alert\n"
                + "  when not percentile of mean turbidity over \"Outer Bay\" at most 10";
        // Columns counted by hand: line 2 when=3 max=8 chlorophyll=12 at=24 25=33 mg/m3=36;
        // line 3 when=3 not=8 percentile=12 mean=26 turbidity=31 "Outer Bay"=46 at=58.
        Watch expected = new Watch("Bloom", new NamedRegion("North Intake", at(1, 20)), List.of(
                new WatchRule(new ThresholdCondition(
                        new WatchSeries(Statistic.of(StatisticKind.MAX, at(2, 8)), new Identifier("chlorophyll", at(2, 12)),
                                Optional.empty(), Optional.empty(), at(2, 8)),
                        new Threshold(ThresholdOperator.AT_LEAST, 25, Optional.of(new UnitRef("mg/m3", at(2, 36))),
                                at(2, 24)),
                        Optional.empty(), at(2, 8)), Severity.ALERT, at(2, 3)),
                new WatchRule(new Not(new ComparisonCondition(ComparisonKind.PERCENTILE_RANK,
                        new WatchSeries(Statistic.of(StatisticKind.MEAN, at(3, 26)), new Identifier("turbidity", at(3, 31)),
                                Optional.of(new NamedRegion("Outer Bay", at(3, 46))),
                                Optional.empty(), at(3, 26)),
                        new Threshold(ThresholdOperator.AT_MOST, 10, Optional.empty(), at(3, 58)),
                        Optional.empty(), Optional.empty(), at(3, 12)), at(3, 8)), Severity.WARNING, at(3, 3))),
                at(1, 1));
        assertEquals(new Script(List.of(expected), at(1, 1)), QueryParser.parse(text));
    }

    @Test
    void wholeTreeWithPositionsForALetAndItsUse() {
        String text = "let excess = -(water_temperature - 25 degC);\n"
                + "correlate excess with p90 runoff over \"Mid Reach\" from 2010 to 2012 by day lags -3 to 3 days";
        // Line 1: let=1 excess=5 -=14 water_temperature=16 25=36 degC=39.
        // Line 2: correlate=1 excess=11 p90=23 runoff=27 over=34 "Mid Reach"=39 from=51 2010=56
        // 2012=64 by=69 lags=76.
        DerivedVariable let = new DerivedVariable(new Identifier("excess", at(1, 5)),
                new Negate(new BinaryOp(new VariableRef(new Identifier("water_temperature", at(1, 16)), at(1, 16)),
                        ArithmeticOperator.SUBTRACT,
                        new NumberLiteral(25, Optional.of(new UnitRef("degC", at(1, 39))), at(1, 36)), at(1, 16)),
                        at(1, 14)),
                Optional.empty(), at(1, 1));
        Correlation correlation = new Correlation(
                new SeriesTerm(Statistic.of(StatisticKind.MEAN, at(2, 11)), new Identifier("excess", at(2, 11)),
                        Optional.empty(), at(2, 11)),
                new SeriesTerm(Statistic.percentile(90, at(2, 23)), new Identifier("runoff", at(2, 27)),
                        Optional.empty(), at(2, 23)),
                new NamedRegion("Mid Reach", at(2, 39)),
                new Period(PartialDate.ofYear(2010, at(2, 56)), PartialDate.ofYear(2012, at(2, 64)), at(2, 51)),
                new Step(StepKind.DAY, at(2, 69)),
                Optional.of(new LagRange(-3, 3, 1, DurationUnit.DAY, at(2, 76))), CorrelationMethod.PEARSON,
                Optional.empty(), Optional.empty(), at(2, 1));
        assertEquals(new Script(List.of(let, correlation), at(1, 1)), QueryParser.parse(text));
    }

    @Test
    void wholeTreeWithPositionsForASeriesWithinItsOwnRegion() {
        String text = "window 60 days before 2014-06-20 of sum rainfall within \"Harle Watershed\",\n"
                + "  water_temperature over \"Outer Bay\"";
        // Line 1: window=1 60=8 2014-06-20=23 sum=37 rainfall=41 "Harle Watershed"=57.
        // Line 2: water_temperature=3 "Outer Bay"=26.
        EventWindow expected = new EventWindow(new Duration(60, DurationUnit.DAY, at(1, 8)),
                List.of(PartialDate.ofDay(2014, 6, 20, at(1, 23))),
                List.of(new SeriesTerm(Statistic.of(StatisticKind.SUM, at(1, 37)), new Identifier("rainfall", at(1, 41)),
                                Optional.of(new NamedRegion("Harle Watershed", at(1, 57))), at(1, 37)),
                        new SeriesTerm(Statistic.of(StatisticKind.MEAN, at(2, 3)),
                                new Identifier("water_temperature", at(2, 3)), Optional.empty(), at(2, 3))),
                new NamedRegion("Outer Bay", at(2, 26)), Optional.empty(), Optional.empty(), at(1, 1));
        assertEquals(new Script(List.of(expected), at(1, 1)), QueryParser.parse(text));
    }

    @Test
    void withinIsCaseInsensitiveAndAnIdentifierMayContainIt() {
        Correlation c = (Correlation) QueryParser.parse("CORRELATE chlorophyll WITH runoff WiThIn \"Harle Watershed\""
                + " OVER \"Outer Bay\" DURING 2006 BY WEEK").statements().get(0);
        assertEquals(Optional.of("Harle Watershed"), c.driver().region().map(r -> ((NamedRegion) r).name()));
        // Only the whole word is the keyword: within_bay and withinx are variable names.
        Correlation d = (Correlation) QueryParser.parse("correlate within_bay with withinx over \"Outer Bay\""
                + " during 2006 by week").statements().get(0);
        assertEquals("within_bay", d.series().variable().name());
        assertEquals(Optional.empty(), d.series().region());
        assertEquals("withinx", d.driver().variable().name());
    }

    @Test
    void keywordsOfTheNewStatementsAreCaseInsensitive() {
        String upper = "CORRELATE Chlorophyll WITH Runoff OVER \"Outer Bay\" DURING 2006 TO 2025 BY Week"
                + " LAGS 0 TO 12 WEEKS USING SPEARMAN AS ANOMALIES";
        Correlation c = (Correlation) QueryParser.parse(upper).statements().get(0);
        assertEquals(CorrelationMethod.SPEARMAN, c.method());
        assertEquals("chlorophyll", c.series().variable().name());
        Watch w = (Watch) QueryParser.parse("WATCH \"w\" OVER \"North Intake\" WHEN Chlorophyll AT MOST 3 DegC"
                + " SEVERITY Notice").statements().get(0);
        assertEquals(Severity.NOTICE, w.rules().get(0).severity());
        assertEquals("DegC", ((ThresholdCondition) w.rules().get(0).condition()).threshold().unit().orElseThrow().unit());
    }

    // ---- helpers --------------------------------------------------------------------------

    private static Condition condition(String text) {
        Watch w = (Watch) AstPositions.erase(QueryParser.parse("watch \"w\" over \"North Intake\" when " + text))
                .statements().get(0);
        return w.rules().get(0).condition();
    }

    private static Expression expression(String text) {
        return ((DerivedVariable) AstPositions.erase(QueryParser.parse("let y = " + text)).statements().get(0))
                .expression();
    }

    private static Condition threshold(String variable) {
        return new ThresholdCondition(watchSeries(StatisticKind.MEAN, variable, null),
                threshold(ThresholdOperator.ABOVE, 1, null), Optional.empty(), NONE);
    }

    private static BinaryOp op(Expression left, ArithmeticOperator operator, Expression right) {
        return new BinaryOp(left, operator, right, NONE);
    }

    private static Identifier id(String name) {
        return new Identifier(name, NONE);
    }

    static SeriesTerm mean(String variable) {
        return term(StatisticKind.MEAN, variable);
    }

    static SeriesTerm within(SeriesTerm term, RegionRef region) {
        return new SeriesTerm(term.statistic(), term.variable(), Optional.of(region), NONE);
    }

    static SeriesTerm term(StatisticKind kind, String variable) {
        return new SeriesTerm(Statistic.of(kind, NONE), id(variable), Optional.empty(), NONE);
    }

    private static Step step(StepKind kind) {
        return new Step(kind, NONE);
    }

    private static WatchSeries watchSeries(StatisticKind kind, String variable, Duration window) {
        return new WatchSeries(Statistic.of(kind, NONE), id(variable), Optional.empty(), Optional.ofNullable(window), NONE);
    }

    private static Threshold threshold(ThresholdOperator operator, double value, String unit) {
        return new Threshold(operator, value, Optional.ofNullable(unit).map(u -> new UnitRef(u, NONE)), NONE);
    }

    private static NumberLiteral number(double value, String unit) {
        return new NumberLiteral(value, Optional.ofNullable(unit).map(u -> new UnitRef(u, NONE)), NONE);
    }

    private static VariableRef variable(String name) {
        return new VariableRef(id(name), NONE);
    }
}
