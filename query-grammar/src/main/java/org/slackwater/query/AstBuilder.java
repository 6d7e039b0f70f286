package org.slackwater.query;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
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
import org.slackwater.query.ast.Node;
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
import org.slackwater.query.parser.SlackwaterBaseVisitor;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Builds the AST from a parse tree, one method per labelled alternative, and checks the values
 * the grammar leaves open (dates, ranges, percentiles, units of distance), each failure a
 * {@link QueryException} at the offending token.
 */
final class AstBuilder extends SlackwaterBaseVisitor<Node> {

    /** Half the Earth's circumference is about 20,000 km; a larger radius means nothing more. */
    static final double MAX_RADIUS_KM = 20_000;

    private final String source;
    private final Coordinates coordinates;

    AstBuilder(String source) {
        this.source = source;
        this.coordinates = new Coordinates(source);
    }

    // ---- statements -----------------------------------------------------------------------

    @Override
    public Script visitScript(SlackwaterParser.ScriptContext ctx) {
        List<Statement> statements = new ArrayList<>();
        for (SlackwaterParser.StatementContext statement : ctx.statement()) {
            statements.add((Statement) visit(statement));
        }
        return new Script(statements, position(ctx));
    }

    @Override
    public AreaSeries visitAreaSeries(SlackwaterParser.AreaSeriesContext ctx) {
        return new AreaSeries(
                (Statistic) visit(ctx.statistic()),
                visitVariable(ctx.variable()),
                visitRegion(ctx.region()),
                (Period) visit(ctx.period()),
                (Step) visit(ctx.step().stepUnit()),
                Optional.ofNullable(ctx.unitClause()).map(this::visitUnitClause),
                Optional.ofNullable(ctx.comparisonClause()).map(this::visitComparisonClause),
                Optional.ofNullable(ctx.coverageClause()).map(this::visitCoverageClause),
                position(ctx));
    }

    @Override
    public Statement visitListCatalog(SlackwaterParser.ListCatalogContext ctx) {
        if (ctx.catalogList() instanceof SlackwaterParser.VariablesListContext) {
            return new ListVariables(position(ctx));
        }
        return new ListRegions(position(ctx));
    }

    @Override
    public DescribeVariable visitDescribeVariable(SlackwaterParser.DescribeVariableContext ctx) {
        return new DescribeVariable(visitVariable(ctx.variable()), position(ctx));
    }

    // ---- statistic and variable -----------------------------------------------------------

    @Override
    public Statistic visitMeanStatistic(SlackwaterParser.MeanStatisticContext ctx) {
        return Statistic.of(StatisticKind.MEAN, position(ctx));
    }

    @Override
    public Statistic visitSumStatistic(SlackwaterParser.SumStatisticContext ctx) {
        return Statistic.of(StatisticKind.SUM, position(ctx));
    }

    @Override
    public Statistic visitMinStatistic(SlackwaterParser.MinStatisticContext ctx) {
        return Statistic.of(StatisticKind.MIN, position(ctx));
    }

    @Override
    public Statistic visitMaxStatistic(SlackwaterParser.MaxStatisticContext ctx) {
        return Statistic.of(StatisticKind.MAX, position(ctx));
    }

    @Override
    public Statistic visitMedianStatistic(SlackwaterParser.MedianStatisticContext ctx) {
        return Statistic.of(StatisticKind.MEDIAN, position(ctx));
    }

    @Override
    public Statistic visitPercentileStatistic(SlackwaterParser.PercentileStatisticContext ctx) {
        Token token = ctx.PERCENTILE_STAT().getSymbol();
        String digits = token.getText().substring(1).replaceFirst("^0+(?=\\d)", "");
        // More than two digits is 100 or more; checked as text so huge numbers cannot overflow.
        int percentile = digits.length() > 2 ? 100 : Integer.parseInt(digits);
        if (percentile < 1 || percentile > 99) {
            throw error(token, "percentile must be between p1 and p99, found '" + token.getText() + "'",
                    percentile < 1 ? "use 'min' for the smallest value" : "use 'max' for the largest value");
        }
        return Statistic.percentile(percentile, position(ctx));
    }

    @Override
    public Identifier visitVariable(SlackwaterParser.VariableContext ctx) {
        return new Identifier(ctx.getText(), position(ctx));
    }

    // ---- regions --------------------------------------------------------------------------

    @Override
    public RegionRef visitRegion(SlackwaterParser.RegionContext ctx) {
        // Folded in a loop: 'a clipped to b clipped to c' is (a clipped to b) clipped to c.
        List<SlackwaterParser.RegionPrimaryContext> parts = ctx.regionPrimary();
        RegionRef region = (RegionRef) visit(parts.get(0));
        for (int i = 1; i < parts.size(); i++) {
            region = new ClippedRegion(region, (RegionRef) visit(parts.get(i)), position(ctx));
        }
        return region;
    }

    @Override
    public NamedRegion visitNamedRegion(SlackwaterParser.NamedRegionContext ctx) {
        Token token = ctx.STRING().getSymbol();
        String name = Literals.unquote(token, source);
        if (name.isBlank()) {
            throw error(token, "the region name is empty", "write the region's name between the quotes, e.g. \"Outer Bay\"");
        }
        return new NamedRegion(name, position(ctx));
    }

    @Override
    public CircleRegion visitCircleRegion(SlackwaterParser.CircleRegionContext ctx) {
        Coordinate center = coordinates.read(ctx.coordinate());
        return new CircleRegion(center, radius(ctx.distance()), position(ctx));
    }

    @Override
    public BoxRegion visitBoxRegion(SlackwaterParser.BoxRegionContext ctx) {
        Coordinate southWest = coordinates.read(ctx.coordinate(0));
        Coordinate northEast = coordinates.read(ctx.coordinate(1));
        Token north = ctx.coordinate(1).latitude().getStart();
        Token east = ctx.coordinate(1).longitude().getStart();
        double s = southWest.latitude();
        double n = northEast.latitude();
        if (s > n) {
            throw error(north, "the box's north edge (" + Literals.formatNumber(n) + ") is south of its south edge ("
                    + Literals.formatNumber(s) + ")", "write box(south, west, north, east)");
        }
        if (s == n) {
            throw error(north, "the box has no height: south and north are both " + Literals.formatNumber(s),
                    "write box(south, west, north, east)");
        }
        if (southWest.normalizedLongitude() == northEast.normalizedLongitude()) {
            throw error(east, "the box has no width: west and east are the same meridian",
                    "write box(south, west, north, east)");
        }
        BoxRegion box = new BoxRegion(s, southWest.longitude(), n, northEast.longitude(), position(ctx));
        if (box.widthDegrees() > 180) {
            throw error(east, "the box is " + Literals.formatNumber(box.widthDegrees())
                            + " degrees wide; a box may span at most 180 degrees of longitude",
                    "write box(south, west, north, east); were west and east swapped?");
        }
        return box;
    }

    @Override
    public WktRegion visitWktRegion(SlackwaterParser.WktRegionContext ctx) {
        Token token = ctx.STRING().getSymbol();
        String wkt = Literals.unquote(token, source);
        if (wkt.isBlank()) {
            throw error(token, "the WKT text is empty", "for example wkt \"POLYGON((-31.3 44.0, -31.0 44.0, -31.0 44.2, -31.3 44.0))\"");
        }
        return new WktRegion(wkt, position(ctx));
    }

    @Override
    public RegionRef visitParenthesizedRegion(SlackwaterParser.ParenthesizedRegionContext ctx) {
        return visitRegion(ctx.region());
    }

    private Quantity radius(SlackwaterParser.DistanceContext ctx) {
        Token number = ctx.NUMBER().getSymbol();
        Token unitToken = ctx.distanceUnit().getStart();
        String unit = unitToken.getText().toLowerCase(Locale.ROOT);
        if (!unit.equals("m") && !unit.equals("km")) {
            throw error(unitToken, "distance unit must be m or km, found '" + unitToken.getText() + "'",
                    "give the radius in metres or kilometres, e.g. 3 km");
        }
        double value = Literals.number(number);
        if (value <= 0) {
            throw error(number, "the radius must be greater than 0", "");
        }
        double km = unit.equals("km") ? value : value / 1000;
        if (!(km <= MAX_RADIUS_KM)) {
            throw error(number, "the radius must be at most 20000 km, found " + number.getText() + " " + unit, "");
        }
        return new Quantity(value, unit, position(ctx));
    }

    // ---- time -----------------------------------------------------------------------------

    @Override
    public Period visitFromToPeriod(SlackwaterParser.FromToPeriodContext ctx) {
        return period(ctx.date(0), ctx.date(1), position(ctx));
    }

    @Override
    public Period visitDuringPeriod(SlackwaterParser.DuringPeriodContext ctx) {
        return period(ctx.date(0), ctx.date().size() > 1 ? ctx.date(1) : ctx.date(0), position(ctx));
    }

    @Override
    public Period visitBaseline(SlackwaterParser.BaselineContext ctx) {
        return period(ctx.date(0), ctx.date().size() > 1 ? ctx.date(1) : ctx.date(0), position(ctx));
    }

    private Period period(SlackwaterParser.DateContext fromCtx, SlackwaterParser.DateContext toCtx, Position position) {
        PartialDate from = DateLiterals.read(fromCtx.getStart(), source);
        PartialDate to = fromCtx == toCtx ? from : DateLiterals.read(toCtx.getStart(), source);
        LocalDate start = from.first();
        LocalDate end = to.last();
        if (end.isBefore(start)) {
            throw error(toCtx.getStart(), "the period ends on " + end + ", before it starts on " + start,
                    "put the earlier date first");
        }
        return new Period(from, to, position);
    }

    @Override
    public Step visitDayStep(SlackwaterParser.DayStepContext ctx) {
        return step(StepKind.DAY, ctx);
    }

    @Override
    public Step visitWeekStep(SlackwaterParser.WeekStepContext ctx) {
        return step(StepKind.WEEK, ctx);
    }

    @Override
    public Step visitMonthStep(SlackwaterParser.MonthStepContext ctx) {
        return step(StepKind.MONTH, ctx);
    }

    @Override
    public Step visitSeasonStep(SlackwaterParser.SeasonStepContext ctx) {
        return step(StepKind.SEASON, ctx);
    }

    @Override
    public Step visitYearStep(SlackwaterParser.YearStepContext ctx) {
        return step(StepKind.YEAR, ctx);
    }

    @Override
    public Step visitWaterYearStep(SlackwaterParser.WaterYearStepContext ctx) {
        return step(StepKind.WATER_YEAR, ctx);
    }

    /** The step's position is that of 'by', the first token of the clause. */
    private static Step step(StepKind kind, SlackwaterParser.StepUnitContext ctx) {
        return new Step(kind, position(ctx.getParent()));
    }

    // ---- optional clauses -----------------------------------------------------------------

    @Override
    public UnitRef visitUnitClause(SlackwaterParser.UnitClauseContext ctx) {
        Token token = ctx.getStop();
        String unit = token.getType() == SlackwaterParser.STRING ? Literals.unquote(token, source) : token.getText();
        if (unit.isBlank()) {
            throw error(token, "the unit is empty", "write a unit such as degC, mm/day or \"mg m-3\"");
        }
        return new UnitRef(unit, position(ctx));
    }

    @Override
    public Comparison visitComparisonClause(SlackwaterParser.ComparisonClauseContext ctx) {
        ComparisonKind kind;
        if (ctx.comparisonKind() instanceof SlackwaterParser.AnomalyComparisonContext) {
            kind = ComparisonKind.ANOMALY;
        } else if (ctx.comparisonKind() instanceof SlackwaterParser.StandardizedAnomalyComparisonContext) {
            kind = ComparisonKind.STANDARDIZED_ANOMALY;
        } else {
            kind = ComparisonKind.PERCENTILE_RANK;
        }
        Optional<Period> baseline = Optional.ofNullable(ctx.baseline()).map(this::visitBaseline);
        return new Comparison(kind, baseline, position(ctx));
    }

    @Override
    public Coverage visitCoverageClause(SlackwaterParser.CoverageClauseContext ctx) {
        Token number = ctx.NUMBER().getSymbol();
        double percent = Literals.number(number);
        if (!(percent <= 100)) {
            throw error(number, "coverage must be between 0 and 100 %, found " + number.getText(), "");
        }
        return new Coverage(percent, position(ctx));
    }

    // ---- helpers --------------------------------------------------------------------------

    private static Position position(ParserRuleContext ctx) {
        return Literals.position(ctx.getStart());
    }

    private QueryException error(Token token, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, source, hint);
    }
}
