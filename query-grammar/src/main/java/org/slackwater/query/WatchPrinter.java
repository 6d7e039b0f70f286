package org.slackwater.query;

import java.util.List;
import java.util.Locale;
import java.util.function.Predicate;
import java.util.stream.Collectors;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.Severity;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;

/**
 * Writes watches. Parentheses go exactly where the tree's grouping differs from what the
 * precedence ({@code not} over {@code and} over {@code or}) would read: an operand of
 * {@code or} that is itself an {@code or}, an operand of {@code and} that is an {@code and} or
 * {@code or}, and any compound or negated operand of {@code not}.
 */
final class WatchPrinter {

    private WatchPrinter() {}

    static String watch(Watch watch) {
        StringBuilder text = new StringBuilder("watch ").append(Literals.quote(watch.name()))
                .append(" over ").append(QueryPrinter.print(watch.region()));
        for (WatchRule rule : watch.rules()) {
            text.append(" when ").append(condition(rule.condition()));
            if (rule.severity() != Severity.WARNING) {
                text.append(" severity ").append(rule.severity().name().toLowerCase(Locale.ROOT));
            }
        }
        return text.toString();
    }

    static String condition(Condition condition) {
        if (condition instanceof AnyOf a) {
            return join(a.operands(), " or ", c -> c instanceof AnyOf);
        }
        if (condition instanceof AllOf a) {
            return join(a.operands(), " and ", c -> c instanceof AnyOf || c instanceof AllOf);
        }
        if (condition instanceof Not n) {
            Condition operand = n.operand();
            boolean group = operand instanceof AnyOf || operand instanceof AllOf || operand instanceof Not;
            return "not " + (group ? "(" + condition(operand) + ")" : condition(operand));
        }
        if (condition instanceof ThresholdCondition t) {
            return series(t.series()) + " " + threshold(t.threshold())
                    + t.persistence().map(p -> " for " + AnalysisPrinter.duration(p)).orElse("");
        }
        ComparisonCondition c = (ComparisonCondition) condition;
        return QueryPrinter.comparisonKind(c.kind()) + " of " + series(c.series()) + " " + threshold(c.threshold())
                + c.baseline().map(b -> " against " + QueryPrinter.baseline(b)).orElse("")
                + c.persistence().map(p -> " for " + AnalysisPrinter.duration(p)).orElse("");
    }

    private static String join(List<Condition> operands, String word, Predicate<Condition> group) {
        return operands.stream()
                .map(c -> group.test(c) ? "(" + condition(c) + ")" : condition(c))
                .collect(Collectors.joining(word));
    }

    private static String series(WatchSeries series) {
        return QueryPrinter.statistic(series.statistic()) + " " + series.variable().name()
                + series.region().map(r -> " over " + QueryPrinter.print(r)).orElse("")
                + series.window().map(w -> " over " + AnalysisPrinter.duration(w)).orElse("");
    }

    private static String threshold(Threshold threshold) {
        String operator;
        switch (threshold.operator()) {
            case ABOVE:
                operator = "above";
                break;
            case BELOW:
                operator = "below";
                break;
            case AT_LEAST:
                operator = "at least";
                break;
            default:
                operator = "at most";
        }
        return operator + " " + Literals.formatNumber(threshold.value())
                + threshold.unit().map(u -> " " + QueryPrinter.numberUnit(u)).orElse("");
    }
}
