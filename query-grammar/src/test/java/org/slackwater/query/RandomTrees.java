package org.slackwater.query;

import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.slackwater.query.ast.AreaSeries;
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
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.WktRegion;

/** Random valid statements (trees without positions) for round-trip and fuzz tests. */
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
        switch (random.nextInt(8)) {
            case 0:
                return new ListVariables(NONE);
            case 1:
                return new ListRegions(NONE);
            case 2:
                return new DescribeVariable(variable(), NONE);
            default:
                return areaSeries();
        }
    }

    AreaSeries areaSeries() {
        return new AreaSeries(statistic(), variable(), region(3), period(), new Step(pick(StepKind.values()), NONE),
                maybe(() -> new UnitRef(pick(UNITS), NONE)),
                maybe(() -> new Comparison(pick(ComparisonKind.values()), maybe(this::period), NONE)),
                maybe(() -> new Coverage(random.nextBoolean() ? random.nextInt(101) : random.nextDouble() * 100, NONE)),
                NONE);
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
