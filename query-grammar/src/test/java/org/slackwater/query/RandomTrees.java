package org.slackwater.query;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.Set;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.ArithmeticOperator;
import org.slackwater.query.ast.BinaryOp;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Deseasonalized;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.Expression;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.Negate;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Severity;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.ThresholdOperator;
import org.slackwater.query.ast.VariableRef;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.CircleRegion;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.Coordinate;
import org.slackwater.query.ast.Coverage;
import org.slackwater.query.ast.GapAllowance;
import org.slackwater.query.ast.CellExport;
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
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.WktRegion;

/**
 * Random valid statements (trees without positions) for round-trip and fuzz tests: every kind
 * of statement, with the values the parser can produce (distinct drivers and events, whole
 * lags, no unit on standardized anomalies and percentile ranks, let names that cannot collide).
 */
final class RandomTrees {

    static final List<String> VARIABLES =
            List.of("rainfall", "runoff", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll", "n", "km");
    static final List<String> REGIONS = List.of("Upper Reach", "Mid Reach", "Outer Bay", "Harle Watershed",
            "North Intake", "Harle Intake", "Say \"Reach\"", "back\\slash", "Baie \u00e9t\u00e9 \uD83C\uDF0A", "#not a comment");
    static final List<String> UNITS =
            List.of("degF", "degC", "FNU", "mm/day", "mg/m3", "kg m-2 s-1", "m-3", "%", "1", "mg m-3", "\"q\"", "K");

    private static final Position NONE = Position.NONE;
    private final Random random;

    RandomTrees(Random random) {
        this.random = random;
    }

    Statement statement() {
        switch (random.nextInt(17)) {
            case 0:
                return new ListVariables(NONE);
            case 1:
                return new ListRegions(NONE);
            case 2:
                return new DescribeVariable(variable(), NONE);
            case 3:
                return correlation();
            case 4:
                return driverRanking();
            case 5:
                return eventWindow();
            case 6:
                return map();
            case 7:
                return correlationMap();
            case 8:
                return watch();
            case 9:
                return derivedVariable();
            case 10:
                return cellExport();
            default:
                return areaSeries();
        }
    }

    // ---- the statements being built ---------------------------------------------------------

    Correlation correlation() {
        return new Correlation(regionalSeries(), regionalSeries(), region(2), period(), step(), maybe(this::lags),
                pick(CorrelationMethod.values()), maybe(this::deseasonalized), maybe(this::gaps), maybe(this::coverage), NONE);
    }

    DriverRanking driverRanking() {
        RegionRef region = region(2);
        List<SeriesTerm> all = distinctSeries(2 + random.nextInt(4), region);
        return new DriverRanking(all.get(0), all.subList(1, all.size()), region, period(), step(), maybe(this::lags),
                pick(CorrelationMethod.values()), maybe(this::period), maybe(this::gaps), maybe(this::coverage), NONE);
    }

    EventWindow eventWindow() {
        Set<java.time.LocalDate> days = new LinkedHashSet<>();
        List<PartialDate> events = new ArrayList<>();
        for (int n = 1 + random.nextInt(3); n > 0; n--) {
            PartialDate day = day();
            if (days.add(day.first())) {
                events.add(day);
            }
        }
        RegionRef region = region(2);
        return new EventWindow(duration(1, 120, DurationUnit.values()), events,
                distinctSeries(1 + random.nextInt(4), region), region, maybe(this::period), maybe(this::coverage), NONE);
    }

    Statement map() {
        SeriesTerm values = series();
        RegionRef region = region(2);
        Period period = period();
        Optional<UnitRef> unit = maybe(() -> new UnitRef(pick(UNITS), NONE));
        switch (random.nextInt(3)) {
            case 0:
                return new StatisticMap(values, region, period, unit, NONE);
            case 1:
                return new DifferenceMap(values, region, period, period(), unit, NONE);
            default:
                return new ComparisonMap(values, region, period, unit,
                        new Comparison(pick(ComparisonKind.values()), maybe(this::period), NONE), NONE);
        }
    }

    CorrelationMap correlationMap() {
        return new CorrelationMap(series(), region(2), series(), region(2), period(), step(),
                maybe(this::lags), pick(CorrelationMethod.values()),
                maybe(this::deseasonalized), NONE);
    }

    Watch watch() {
        List<WatchRule> rules = new ArrayList<>();
        for (int n = 1 + random.nextInt(3); n > 0; n--) {
            rules.add(new WatchRule(condition(3), pick(Severity.values()), NONE));
        }
        return new Watch(pick(REGIONS), region(2), rules, NONE);
    }

    /** A random name for a let: 'd' and six characters, so that two in one script do not collide. */
    DerivedVariable derivedVariable() {
        StringBuilder name = new StringBuilder("d");
        for (int i = 0; i < 6; i++) {
            name.append("abcdefghijklmnopqrstuvwxyz0123456789_".charAt(random.nextInt(37)));
        }
        return new DerivedVariable(new Identifier(name.toString(), NONE), expression(4),
                maybe(() -> new UnitRef(pick(UNITS), NONE)), NONE);
    }

    Condition condition(int depth) {
        switch (random.nextInt(depth > 0 ? 6 : 2)) {
            case 0:
                return new ThresholdCondition(watchSeries(), threshold(true, false), maybe(this::daysOrWeeks), NONE);
            case 1:
                ComparisonKind kind = pick(ComparisonKind.values());
                return new ComparisonCondition(kind, watchSeries(),
                        threshold(kind == ComparisonKind.ANOMALY, kind == ComparisonKind.PERCENTILE_RANK),
                        maybe(this::period), maybe(this::daysOrWeeks), NONE);
            case 2:
                return new AnyOf(conditions(depth - 1), NONE);
            case 3:
                return new AllOf(conditions(depth - 1), NONE);
            case 4:
                return new Not(condition(depth - 1), NONE);
            default:
                return condition(0);
        }
    }

    private List<Condition> conditions(int depth) {
        List<Condition> operands = new ArrayList<>();
        for (int n = 2 + random.nextInt(2); n > 0; n--) {
            operands.add(condition(depth));
        }
        return operands;
    }

    WatchSeries watchSeries() {
        return new WatchSeries(statistic(), variable(), maybe(() -> region(1)), maybe(this::daysOrWeeks), NONE);
    }

    Threshold threshold(boolean unit, boolean percentile) {
        double value = percentile ? random.nextInt(101) : random.nextBoolean() ? random.nextInt(50) - 10
                : (random.nextDouble() - 0.3) * 100;
        return new Threshold(pick(ThresholdOperator.values()), value,
                unit ? maybe(() -> new UnitRef(pick(UNITS), NONE)) : Optional.empty(), NONE);
    }

    Expression expression(int depth) {
        switch (random.nextInt(depth > 0 ? 5 : 2)) {
            case 0:
                return new VariableRef(variable(), NONE);
            case 1:
                double value = random.nextBoolean() ? random.nextInt(100) : random.nextDouble() * 10;
                return new NumberLiteral(value, maybe(() -> new UnitRef(pick(UNITS), NONE)), NONE);
            case 2:
                return new Negate(expression(depth - 1), NONE);
            default:
                return new BinaryOp(expression(depth - 1), pick(ArithmeticOperator.values()), expression(depth - 1), NONE);
        }
    }

    /** A series of a map: no region of its own. */
    SeriesTerm series() {
        return new SeriesTerm(statistic(), variable(), Optional.empty(), NONE);
    }

    /**
     * A series of correlate, rank drivers or window: half of them with a region of their own,
     * and then often a named one, so that one variable within two regions comes up.
     */
    SeriesTerm regionalSeries() {
        Optional<RegionRef> region = maybe(() -> random.nextBoolean() ? new NamedRegion(pick(REGIONS), NONE) : region(1));
        return new SeriesTerm(statistic(), variable(), region, NONE);
    }

    /** Series that differ once placed in the statement's region, as the parser requires. */
    private List<SeriesTerm> distinctSeries(int count, RegionRef statementRegion) {
        List<SeriesTerm> terms = new ArrayList<>();
        while (terms.size() < count) {
            SeriesTerm term = regionalSeries();
            if (terms.stream().noneMatch(t -> t.sameSeries(term, statementRegion))) {
                terms.add(term);
            }
        }
        return terms;
    }

    Step step() {
        return new Step(pick(StepKind.values()), NONE);
    }

    LagRange lags() {
        int first = random.nextInt(30) - 10;
        int last = random.nextBoolean() ? first : first + random.nextInt(30);
        int step = random.nextBoolean() ? 1 : 1 + random.nextInt(5);
        return new LagRange(first, last, step, pick(DurationUnit.values()), NONE);
    }

    Deseasonalized deseasonalized() {
        return new Deseasonalized(maybe(this::period), NONE);
    }

    GapAllowance gaps() {
        int total = random.nextInt(12);
        return new GapAllowance(total, random.nextBoolean() ? java.util.OptionalInt.of(random.nextInt(total + 1)) : java.util.OptionalInt.empty(), NONE);
    }

    Coverage coverage() {
        return new Coverage(random.nextBoolean() ? random.nextInt(101) : random.nextDouble() * 100, NONE);
    }

    Duration daysOrWeeks() {
        return duration(1, 60, new DurationUnit[] {DurationUnit.DAY, DurationUnit.WEEK});
    }

    Duration duration(int from, int to, DurationUnit[] units) {
        return new Duration(from + random.nextInt(to - from + 1), pick(units), NONE);
    }

    PartialDate day() {
        int year = 2006 + random.nextInt(20);
        int month = 1 + random.nextInt(12);
        return PartialDate.ofDay(year, month, 1 + random.nextInt(java.time.YearMonth.of(year, month).lengthOfMonth()),
                NONE);
    }

    CellExport cellExport() {
        return new CellExport(variable(), region(3), period(), maybe(() -> new UnitRef(pick(UNITS), NONE)), NONE);
    }

    AreaSeries areaSeries() {
        return new AreaSeries(statistic(), variable(), region(3), period(), step(),
                maybe(() -> new UnitRef(pick(UNITS), NONE)),
                maybe(() -> new Comparison(pick(ComparisonKind.values()), maybe(this::period), NONE)),
                maybe(this::gaps), maybe(this::coverage), NONE);
    }

    Statistic statistic() {
        StatisticKind kind = pick(StatisticKind.values());
        return kind == StatisticKind.PERCENTILE
                ? Statistic.percentile(1 + random.nextInt(99), NONE)
                : Statistic.of(kind, NONE);
    }

    Identifier variable() {
        if (random.nextBoolean()) {
            return new Identifier(pick(VARIABLES), NONE);
        }
        // 'v' then random letters, digits and '_' never collides with a keyword.
        StringBuilder name = new StringBuilder("v");
        for (int i = random.nextInt(8); i > 0; i--) {
            name.append("abcdefghijklmnopqrstuvwxyz0123456789_".charAt(random.nextInt(37)));
        }
        return new Identifier(name.toString(), NONE);
    }

    RegionRef region(int depth) {
        int choice = random.nextInt(depth > 0 ? 5 : 4);
        switch (choice) {
            case 0:
                return new NamedRegion(pick(REGIONS), NONE);
            case 1:
                return new CircleRegion(coordinate(), radius(), NONE);
            case 2:
                return box();
            case 3:
                return new WktRegion("POLYGON((-31.3 44.0, -31.0 44.0, -31.0 44." + random.nextInt(10) + ", -31.3 44.0))",
                        NONE);
            default:
                return new ClippedRegion(region(depth - 1), region(depth - 1), NONE);
        }
    }

    Coordinate coordinate() {
        return new Coordinate(degrees(-90, 90), random.nextInt(4) == 0 ? degrees(0, 360) : degrees(-180, 180), NONE);
    }

    Quantity radius() {
        boolean km = random.nextBoolean();
        double value = random.nextBoolean() ? 1 + random.nextInt(50) : 0.001 + random.nextDouble() * (km ? 500 : 5000);
        return new Quantity(value, km ? "km" : "m", NONE);
    }

    BoxRegion box() {
        double south = degrees(-90, 89);
        double north = Math.min(90, south + 0.001 + random.nextDouble() * 10);
        double west = degrees(-180, 179);
        double east = west + 0.001 + random.nextDouble() * 20;
        if (east > 180) {
            east -= 360; // across the 180 degree meridian
        }
        if (random.nextInt(4) == 0 && west < 0 && east < 0) {
            west += 360; // written in 0..360
            east += 360;
        }
        return new BoxRegion(south, west, north, east, NONE);
    }

    /** Degrees, sometimes round, sometimes to a few decimals, sometimes to full double precision. */
    double degrees(double from, double to) {
        double value = from + random.nextDouble() * (to - from);
        switch (random.nextInt(3)) {
            case 0:
                return Math.rint(value);
            case 1:
                return Math.rint(value * 100) / 100;
            default:
                return value;
        }
    }

    Period period() {
        PartialDate from = date();
        PartialDate to = from;
        if (random.nextBoolean()) {
            do {
                to = date();
            } while (to.last().isBefore(from.first()));
        }
        return new Period(from, to, NONE);
    }

    PartialDate date() {
        int year = 2006 + random.nextInt(20);
        switch (random.nextInt(3)) {
            case 0:
                return PartialDate.ofYear(year, NONE);
            case 1:
                return PartialDate.ofMonth(year, 1 + random.nextInt(12), NONE);
            default:
                int month = 1 + random.nextInt(12);
                return PartialDate.ofDay(year, month, 1 + random.nextInt(java.time.YearMonth.of(year, month).lengthOfMonth()),
                        NONE);
        }
    }

    private <T> Optional<T> maybe(java.util.function.Supplier<T> value) {
        return random.nextBoolean() ? Optional.of(value.get()) : Optional.empty();
    }

    private <T> T pick(List<T> values) {
        return values.get(random.nextInt(values.size()));
    }

    private <T> T pick(T[] values) {
        return values[random.nextInt(values.length)];
    }
}
