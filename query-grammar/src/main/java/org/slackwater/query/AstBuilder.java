package org.slackwater.query;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.AstPositions;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Deseasonalized;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Severity;
import org.slackwater.query.ast.StatisticMap;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
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
import org.slackwater.query.ast.Expression;
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
 * the grammar leaves open (dates, ranges, percentiles, units of distance, lags, correlation
 * methods, severities, repeated drivers or events, names defined twice by {@code let}), each
 * failure a {@link QueryException} at the offending token. Watch conditions and {@code let}
 * expressions are built by {@link ConditionBuilder} and {@link ExpressionBuilder}. One builder
 * serves one query text.
 */
final class AstBuilder extends SlackwaterBaseVisitor<Node> {

    /** Half the Earth's circumference is about 20,000 km; a larger radius means nothing more. */
    static final double MAX_RADIUS_KM = 20_000;
    /** Longest series text quoted in a message: room for a variable and a region name. */
    private static final int SERIES_SHOWN = 80;

    private static final Map<String, CorrelationMethod> METHODS = words(CorrelationMethod.values());
    private static final Map<String, Severity> SEVERITIES = words(Severity.values());

    private final String source;
    private final Coordinates coordinates;
    private final Durations durations;
    /** Names defined by the query's 'let' statements so far, with where they were defined. */
    private final Map<String, Position> defined = new HashMap<>();

    AstBuilder(String source) {
        this.source = source;
        this.coordinates = new Coordinates(source);
        this.durations = new Durations(source);
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
                Optional.ofNullable(ctx.gapClause()).map(this::visitGapClause),
                Optional.ofNullable(ctx.coverageClause()).map(this::visitCoverageClause),
                position(ctx));
    }

    @Override
    public CellExport visitCellExport(SlackwaterParser.CellExportContext ctx) {
        return new CellExport(visitVariable(ctx.variable()), visitRegion(ctx.region()), (Period) visit(ctx.period()),
                Optional.ofNullable(ctx.unitClause()).map(this::visitUnitClause), position(ctx));
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

    @Override
    public Correlation visitCorrelation(SlackwaterParser.CorrelationContext ctx) {
        return new Correlation(
                seriesTerm(ctx.seriesTerm(0)),
                seriesTerm(ctx.seriesTerm(1)),
                visitRegion(ctx.region()),
                (Period) visit(ctx.period()),
                (Step) visit(ctx.step().stepUnit()),
                lags(ctx.lagClause()),
                method(ctx.methodClause()),
                Optional.ofNullable(ctx.deseasonalizeClause()).map(this::deseasonalized),
                Optional.ofNullable(ctx.gapClause()).map(this::visitGapClause),
                Optional.ofNullable(ctx.coverageClause()).map(this::visitCoverageClause),
                position(ctx));
    }

    @Override
    public DriverRanking visitDriverRanking(SlackwaterParser.DriverRankingContext ctx) {
        List<SlackwaterParser.SeriesTermContext> terms = ctx.seriesTerm();
        SeriesTerm series = seriesTerm(terms.get(0));
        List<SlackwaterParser.SeriesTermContext> driverContexts = terms.subList(1, terms.size());
        List<SeriesTerm> drivers = seriesTerms(driverContexts);
        RegionRef region = visitRegion(ctx.region());
        requireDistinct(Optional.of(series), drivers, driverContexts, region, "driver");
        return new DriverRanking(series, drivers,
                region,
                (Period) visit(ctx.period()),
                (Step) visit(ctx.step().stepUnit()),
                lags(ctx.lagClause()),
                method(ctx.methodClause()),
                Optional.ofNullable(ctx.baselineClause()).map(b -> visitBaseline(b.baseline())),
                Optional.ofNullable(ctx.gapClause()).map(this::visitGapClause),
                Optional.ofNullable(ctx.coverageClause()).map(this::visitCoverageClause),
                position(ctx));
    }

    @Override
    public EventWindow visitEventWindow(SlackwaterParser.EventWindowContext ctx) {
        Map<LocalDate, PartialDate> events = new LinkedHashMap<>();
        for (SlackwaterParser.DateContext date : ctx.date()) {
            Token token = date.getStart();
            PartialDate event = DateLiterals.read(token, source);
            if (!event.hasDay()) {
                throw error(token, "an event is one day, found '" + token.getText() + "'",
                        "write the event's date as YYYY-MM-DD, e.g. 2014-06-20");
            }
            if (events.putIfAbsent(event.first(), event) != null) {
                throw error(token, "the event " + event.text() + " is listed twice", "");
            }
        }
        Duration length = durations.positive(ctx.duration(), "window");
        List<SeriesTerm> drivers = seriesTerms(ctx.seriesTerm());
        RegionRef region = visitRegion(ctx.region());
        requireDistinct(Optional.empty(), drivers, ctx.seriesTerm(), region, "variable");
        return new EventWindow(
                length,
                List.copyOf(events.values()),
                drivers,
                region,
                Optional.ofNullable(ctx.baselineClause()).map(b -> visitBaseline(b.baseline())),
                Optional.ofNullable(ctx.coverageClause()).map(this::visitCoverageClause),
                position(ctx));
    }

    @Override
    public Statement visitMap(SlackwaterParser.MapContext ctx) {
        return (Statement) visit(ctx.mapSpec());
    }

    /** One alternative, three statements: a plain map, a difference ('minus') or a comparison ('as'). */
    @Override
    public Statement visitStatisticMap(SlackwaterParser.StatisticMapContext ctx) {
        Position position = position(ctx.getParent());
        SeriesTerm values = mapTerm(ctx.mapTerm());
        RegionRef region = visitRegion(ctx.region());
        Period period = (Period) visit(ctx.period());
        Optional<UnitRef> unit = Optional.ofNullable(ctx.unitClause()).map(this::visitUnitClause);
        if (ctx.differenceClause() != null && ctx.comparisonClause() != null) {
            throw error(ctx.comparisonClause().getStart(),
                    "a map is either a difference ('minus') or a comparison ('as'), not both",
                    "make two maps, one with 'minus <period>' and one with 'as ...'");
        }
        if (ctx.differenceClause() != null) {
            Period reference = visitBaseline(ctx.differenceClause().baseline());
            return new DifferenceMap(values, region, period, reference, unit, position);
        }
        if (ctx.comparisonClause() != null) {
            return new ComparisonMap(values, region, period, unit, visitComparisonClause(ctx.comparisonClause()),
                    position);
        }
        return new StatisticMap(values, region, period, unit, position);
    }

    @Override
    public CorrelationMap visitCorrelationMap(SlackwaterParser.CorrelationMapContext ctx) {
        return new CorrelationMap(
                mapTerm(ctx.mapTerm(0)),
                visitRegion(ctx.region(0)),
                mapTerm(ctx.mapTerm(1)),
                visitRegion(ctx.region(1)),
                (Period) visit(ctx.period()),
                (Step) visit(ctx.step().stepUnit()),
                lags(ctx.lagClause()),
                method(ctx.methodClause()),
                Optional.ofNullable(ctx.deseasonalizeClause()).map(this::deseasonalized),
                position(ctx.getParent()));
    }

    @Override
    public Watch visitWatch(SlackwaterParser.WatchContext ctx) {
        Token name = ctx.STRING().getSymbol();
        String text = Literals.unquote(name, source);
        if (text.isBlank()) {
            throw error(name, "the watch name is empty", "name the watch, e.g. watch \"North Intake bloom\"");
        }
        RegionRef region = visitRegion(ctx.region());
        ConditionBuilder conditions = new ConditionBuilder(this, durations, source);
        List<WatchRule> rules = new ArrayList<>();
        for (SlackwaterParser.WatchRuleContext rule : ctx.watchRule()) {
            Severity severity = rule.identifier() == null ? Severity.WARNING
                    : choice(rule.identifier().getStart(), "severity", SEVERITIES);
            rules.add(new WatchRule(conditions.visit(rule.condition()), severity, position(rule)));
        }
        return new Watch(text, region, rules, position(ctx));
    }

    @Override
    public DerivedVariable visitDerivedVariable(SlackwaterParser.DerivedVariableContext ctx) {
        Identifier name = visitVariable(ctx.variable());
        Position earlier = defined.get(name.name());
        if (earlier != null) {
            throw error(ctx.variable().getStart(), "'" + name.name() + "' is already defined on line " + earlier.line(),
                    "give the new variable another name");
        }
        Expression expression = new ExpressionBuilder(source, name).visit(ctx.expression());
        defined.put(name.name(), name.position());
        return new DerivedVariable(name, expression,
                Optional.ofNullable(ctx.unitClause()).map(this::visitUnitClause), position(ctx));
    }

    // ---- parts of the statements beyond the area series -----------------------------------

    /** A series term; without a statistic, mean, placed at the variable; without 'within', no region of its own. */
    SeriesTerm seriesTerm(SlackwaterParser.SeriesTermContext ctx) {
        Identifier variable = visitVariable(ctx.variable());
        Statistic statistic = statisticOrMean(ctx.statistic(), variable);
        Optional<RegionRef> region = Optional.ofNullable(ctx.withinClause()).map(w -> visitRegion(w.region()));
        return new SeriesTerm(statistic, variable, region, position(ctx));
    }

    /** The series of a map, which takes its region from 'over' (the grammar has no 'within' there). */
    private SeriesTerm mapTerm(SlackwaterParser.MapTermContext ctx) {
        Identifier variable = visitVariable(ctx.variable());
        return new SeriesTerm(statisticOrMean(ctx.statistic(), variable), variable, Optional.empty(), position(ctx));
    }

    private List<SeriesTerm> seriesTerms(List<SlackwaterParser.SeriesTermContext> contexts) {
        List<SeriesTerm> terms = new ArrayList<>();
        for (SlackwaterParser.SeriesTermContext ctx : contexts) {
            terms.add(seriesTerm(ctx));
        }
        return terms;
    }

    Statistic statisticOrMean(SlackwaterParser.StatisticContext ctx, Identifier variable) {
        return ctx == null ? Statistic.of(StatisticKind.MEAN, variable.position()) : (Statistic) visit(ctx);
    }

    /**
     * Series that must all differ, and differ from the series being explained when there is one,
     * once each is placed in the statement's region: the same variable within two regions is two
     * series, {@code rainfall} and {@code rainfall within <the statement's region>} one. The error
     * is at the first term, in text order, that repeats another; {@code what} names one in the
     * message.
     */
    private void requireDistinct(Optional<SeriesTerm> explained, List<SeriesTerm> terms,
            List<SlackwaterParser.SeriesTermContext> contexts, RegionRef statementRegion, String what) {
        for (int i = 0; i < terms.size(); i++) {
            SeriesTerm term = terms.get(i);
            if (explained.isPresent() && term.sameSeries(explained.get(), statementRegion)) {
                throw error(contexts.get(i).getStart(), describe(term)
                        + " is the series being explained; it cannot be its own driver",
                        "list only the other series after 'among'; the same variable within another region may be"
                                + " a driver");
            }
            for (int j = 0; j < i; j++) {
                SeriesTerm earlier = terms.get(j);
                if (term.sameSeries(earlier, statementRegion)) {
                    boolean sameText = AstPositions.erase(term).equals(AstPositions.erase(earlier));
                    throw error(contexts.get(i).getStart(), "the " + what + " " + describe(term) + " is listed twice",
                            sameText ? "" : "a series without 'within' is taken over the statement's region "
                                    + QueryPrinter.print(statementRegion) + "; list it once");
                }
            }
        }
    }

    /** A series as written (its region included), quoted for a message. */
    private static String describe(SeriesTerm term) {
        return SyntaxErrors.quote(QueryPrinter.series(term), SERIES_SHOWN);
    }

    private Optional<LagRange> lags(SlackwaterParser.LagClauseContext ctx) {
        if (ctx == null) {
            return Optional.empty();
        }
        return Optional.of(ctx.lagRange() != null ? durations.range(ctx.lagRange())
                : durations.singleLagRange(ctx.singleLag()));
    }

    private CorrelationMethod method(SlackwaterParser.MethodClauseContext ctx) {
        return ctx == null ? CorrelationMethod.PEARSON : choice(ctx.identifier().getStart(), "correlation method", METHODS);
    }

    private Deseasonalized deseasonalized(SlackwaterParser.DeseasonalizeClauseContext ctx) {
        return new Deseasonalized(Optional.ofNullable(ctx.baselineClause()).map(b -> visitBaseline(b.baseline())),
                position(ctx));
    }

    /** The enum constant named by a word (any case), or an error listing the words there are. */
    private <E extends Enum<E>> E choice(Token word, String what, Map<String, E> words) {
        E value = words.get(word.getText().toLowerCase(Locale.ROOT));
        if (value != null) {
            return value;
        }
        List<String> names = new ArrayList<>(words.keySet());
        String hint = Suggestions.nearest(word.getText(), names).map(n -> "did you mean '" + n + "'?")
                .orElse("use " + String.join(", ", names.subList(0, names.size() - 1)) + " or " + names.get(names.size() - 1));
        throw error(word, "unknown " + what + " " + SyntaxErrors.quote(word.getText()), hint);
    }

    /** Lower-case names of enum constants, in declaration order. */
    private static <E extends Enum<E>> Map<String, E> words(E[] values) {
        Map<String, E> words = new LinkedHashMap<>();
        for (E value : values) {
            words.put(value.name().toLowerCase(Locale.ROOT), value);
        }
        return words;
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
        return Units.read(ctx.getStop(), position(ctx), source);
    }

    static ComparisonKind comparisonKind(SlackwaterParser.ComparisonKindContext ctx) {
        if (ctx instanceof SlackwaterParser.AnomalyComparisonContext) {
            return ComparisonKind.ANOMALY;
        }
        if (ctx instanceof SlackwaterParser.StandardizedAnomalyComparisonContext) {
            return ComparisonKind.STANDARDIZED_ANOMALY;
        }
        return ComparisonKind.PERCENTILE_RANK;
    }

    @Override
    public Comparison visitComparisonClause(SlackwaterParser.ComparisonClauseContext ctx) {
        ComparisonKind kind = comparisonKind(ctx.comparisonKind());
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

    @Override
    public GapAllowance visitGapClause(SlackwaterParser.GapClauseContext ctx) {
        Token total = ctx.NUMBER(0).getSymbol();
        int missing = wholeDays(total, "missing days");
        OptionalInt run = OptionalInt.empty();
        if (ctx.NUMBER().size() > 1) {
            Token t = ctx.NUMBER(1).getSymbol();
            int r = wholeDays(t, "consecutive missing days");
            if (r > missing) {
                throw error(t, r + " consecutive missing days exceed the " + missing + " missing days allowed in all",
                        "the run allowance is part of the total: write at most " + missing + " consecutive");
            }
            run = OptionalInt.of(r);
        }
        return new GapAllowance(missing, run, position(ctx));
    }

    private int wholeDays(Token number, String what) {
        double v = Literals.number(number);
        if (v != Math.rint(v) || v > 366) {
            throw error(number, what + " must be a whole number of days from 0 to 366, found " + number.getText(), "");
        }
        return (int) v;
    }

    // ---- helpers --------------------------------------------------------------------------

    private static Position position(ParserRuleContext ctx) {
        return Literals.position(ctx.getStart());
    }

    private QueryException error(Token token, String message, String hint) {
        return Literals.error(token, source, message, hint);
    }
}
