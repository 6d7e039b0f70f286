package org.slackwater.query;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.ThresholdOperator;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.WatchSeries;
import org.slackwater.query.parser.SlackwaterBaseVisitor;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Builds the condition of a watch rule, one method per labelled alternative. {@code or} and
 * {@code and} chains become one {@link AnyOf} or {@link AllOf} each (flat lists, so a long
 * chain is no deeper than a short one). Checks what the grammar leaves open: windows and
 * persistence in whole days or weeks, no unit on a standardized anomaly or a percentile rank,
 * and a percentile rank between 0 and 100.
 */
final class ConditionBuilder extends SlackwaterBaseVisitor<Condition> {

    private final AstBuilder parts;
    private final Durations durations;
    private final String source;

    ConditionBuilder(AstBuilder parts, Durations durations, String source) {
        this.parts = parts;
        this.durations = durations;
        this.source = source;
    }

    @Override
    public Condition visitCondition(SlackwaterParser.ConditionContext ctx) {
        List<Condition> operands = new ArrayList<>();
        for (SlackwaterParser.ConjunctionContext conjunction : ctx.conjunction()) {
            operands.add(visit(conjunction));
        }
        return operands.size() == 1 ? operands.get(0) : new AnyOf(operands, Literals.position(ctx.getStart()));
    }

    @Override
    public Condition visitConjunction(SlackwaterParser.ConjunctionContext ctx) {
        List<Condition> operands = new ArrayList<>();
        for (SlackwaterParser.NegationContext negation : ctx.negation()) {
            operands.add(visit(negation));
        }
        return operands.size() == 1 ? operands.get(0) : new AllOf(operands, Literals.position(ctx.getStart()));
    }

    @Override
    public Condition visitNegation(SlackwaterParser.NegationContext ctx) {
        Condition operand = visit(ctx.conditionPrimary());
        return ctx.NOT() == null ? operand : new Not(operand, Literals.position(ctx.NOT().getSymbol()));
    }

    @Override
    public Condition visitGroupedCondition(SlackwaterParser.GroupedConditionContext ctx) {
        return visit(ctx.condition());
    }

    @Override
    public Condition visitThresholdCondition(SlackwaterParser.ThresholdConditionContext ctx) {
        return new ThresholdCondition(series(ctx.watchSeries()), threshold(ctx.threshold()),
                persistence(ctx.persistence()), Literals.position(ctx.getStart()));
    }

    @Override
    public Condition visitComparisonCondition(SlackwaterParser.ComparisonConditionContext ctx) {
        ComparisonKind kind = AstBuilder.comparisonKind(ctx.comparisonKind());
        Threshold threshold = threshold(ctx.threshold());
        SlackwaterParser.NumberUnitContext unit = ctx.threshold().numberUnit();
        if (unit != null && kind != ComparisonKind.ANOMALY) {
            String what = kind == ComparisonKind.STANDARDIZED_ANOMALY
                    ? "a standardized anomaly is a number of standard deviations"
                    : "a percentile rank is a number from 0 to 100";
            throw Literals.error(unit.getStart(), source, what + " and takes no unit, found "
                    + SyntaxErrors.quote(unit.getText()), "remove the unit");
        }
        if (kind == ComparisonKind.PERCENTILE_RANK && !(threshold.value() >= 0 && threshold.value() <= 100)) {
            throw Literals.error(ctx.threshold().NUMBER().getSymbol(), source,
                    "a percentile rank must be between 0 and 100, found " + Literals.formatNumber(threshold.value()),
                    "");
        }
        Optional<Period> baseline = Optional.ofNullable(ctx.baselineClause()).map(b -> parts.visitBaseline(b.baseline()));
        return new ComparisonCondition(kind, series(ctx.watchSeries()), threshold, baseline,
                persistence(ctx.persistence()), Literals.position(ctx.getStart()));
    }

    private WatchSeries series(SlackwaterParser.WatchSeriesContext ctx) {
        Identifier variable = parts.visitVariable(ctx.variable());
        Statistic statistic = parts.statisticOrMean(ctx.statistic(), variable);
        Optional<RegionRef> region = Optional.empty();
        Optional<Duration> window = Optional.empty();
        SlackwaterParser.WatchOverContext over = ctx.watchOver();
        if (over instanceof SlackwaterParser.WindowOnlyContext) {
            window = Optional.of(window(((SlackwaterParser.WindowOnlyContext) over).duration()));
        } else if (over instanceof SlackwaterParser.RegionAndWindowContext) {
            SlackwaterParser.RegionAndWindowContext both = (SlackwaterParser.RegionAndWindowContext) over;
            region = Optional.of(parts.visitRegion(both.region()));
            window = Optional.ofNullable(both.duration()).map(this::window);
        }
        return new WatchSeries(statistic, variable, region, window, Literals.position(ctx.getStart()));
    }

    private Duration window(SlackwaterParser.DurationContext ctx) {
        return durations.positiveDaysOrWeeks(ctx, "window");
    }

    private Optional<Duration> persistence(SlackwaterParser.PersistenceContext ctx) {
        return Optional.ofNullable(ctx).map(p -> durations.positiveDaysOrWeeks(p.duration(), "persistence"));
    }

    private Threshold threshold(SlackwaterParser.ThresholdContext ctx) {
        Token number = ctx.NUMBER().getSymbol();
        double magnitude = Literals.number(number);
        if (!Double.isFinite(magnitude)) {
            throw Literals.error(number, source, "the threshold " + SyntaxErrors.quote(number.getText())
                    + " is too large", "");
        }
        Optional<UnitRef> unit = Optional.ofNullable(ctx.numberUnit())
                .map(u -> Units.read(u.getStart(), Literals.position(u.getStart()), source));
        return new Threshold(operator(ctx.comparator()), ctx.MINUS() != null ? -magnitude : magnitude, unit,
                Literals.position(ctx.getStart()));
    }

    private static ThresholdOperator operator(SlackwaterParser.ComparatorContext ctx) {
        if (ctx instanceof SlackwaterParser.AboveComparatorContext) {
            return ThresholdOperator.ABOVE;
        }
        if (ctx instanceof SlackwaterParser.BelowComparatorContext) {
            return ThresholdOperator.BELOW;
        }
        return ((SlackwaterParser.AtComparatorContext) ctx).LEAST() != null
                ? ThresholdOperator.AT_LEAST
                : ThresholdOperator.AT_MOST;
    }
}
