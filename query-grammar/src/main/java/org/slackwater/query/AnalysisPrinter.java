package org.slackwater.query;

import java.util.Locale;
import java.util.stream.Collectors;
import org.slackwater.query.ast.ComparisonMap;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.Deseasonalized;
import org.slackwater.query.ast.DifferenceMap;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.StatisticMap;

/**
 * Writes the analysis statements (correlate, rank drivers, window, map) in the canonical form
 * of {@link QueryPrinter}: clauses in grammar order, options at their defaults left out.
 */
final class AnalysisPrinter {

    private AnalysisPrinter() {}

    /** The statement's text, or null when it is not an analysis statement. */
    static String print(Statement statement) {
        if (statement instanceof Correlation c) {
            return "correlate " + QueryPrinter.series(c.series()) + " with " + QueryPrinter.series(c.driver())
                    + " over " + QueryPrinter.print(c.region()) + " " + QueryPrinter.period(c.period())
                    + " " + QueryPrinter.step(c.step()) + c.lags().map(AnalysisPrinter::lags).orElse("")
                    + method(c.method()) + c.deseasonalized().map(AnalysisPrinter::deseasonalized).orElse("")
                    + c.gaps().map(QueryPrinter::gaps).orElse("")
                    + c.coverage().map(QueryPrinter::coverage).orElse("");
        }
        if (statement instanceof DriverRanking r) {
            return "rank drivers of " + QueryPrinter.series(r.series()) + " among "
                    + r.drivers().stream().map(QueryPrinter::series).collect(Collectors.joining(", "))
                    + " over " + QueryPrinter.print(r.region()) + " " + QueryPrinter.period(r.period())
                    + " " + QueryPrinter.step(r.step()) + r.lags().map(AnalysisPrinter::lags).orElse("")
                    + method(r.method()) + r.baseline().map(b -> " against " + QueryPrinter.baseline(b)).orElse("")
                    + r.gaps().map(QueryPrinter::gaps).orElse("")
                    + r.coverage().map(QueryPrinter::coverage).orElse("");
        }
        if (statement instanceof EventWindow w) {
            return "window " + duration(w.length()) + " before "
                    + w.events().stream().map(PartialDate::text).collect(Collectors.joining(", "))
                    + " of " + w.drivers().stream().map(QueryPrinter::series).collect(Collectors.joining(", "))
                    + " over " + QueryPrinter.print(w.region())
                    + w.baseline().map(b -> " against " + QueryPrinter.baseline(b)).orElse("")
                    + w.coverage().map(QueryPrinter::coverage).orElse("");
        }
        if (statement instanceof StatisticMap m) {
            return mapHead(m.values(), m.region(), m.period()) + m.unit().map(QueryPrinter::unitClause).orElse("");
        }
        if (statement instanceof DifferenceMap m) {
            return mapHead(m.values(), m.region(), m.period()) + " minus " + QueryPrinter.baseline(m.reference())
                    + m.unit().map(QueryPrinter::unitClause).orElse("");
        }
        if (statement instanceof ComparisonMap m) {
            return mapHead(m.values(), m.region(), m.period()) + m.unit().map(QueryPrinter::unitClause).orElse("")
                    + " " + QueryPrinter.comparison(m.comparison());
        }
        if (statement instanceof CorrelationMap m) {
            return "map correlation of " + QueryPrinter.series(m.values()) + " over " + QueryPrinter.print(m.region())
                    + " with " + QueryPrinter.series(m.driver()) + " over " + QueryPrinter.print(m.driverRegion())
                    + " " + QueryPrinter.period(m.period()) + " " + QueryPrinter.step(m.step())
                    + m.lags().map(AnalysisPrinter::lags).orElse("") + method(m.method())
                    + m.deseasonalized().map(AnalysisPrinter::deseasonalized).orElse("");
        }
        return null;
    }

    private static String mapHead(SeriesTerm values, RegionRef region, Period period) {
        return "map " + QueryPrinter.series(values) + " over " + QueryPrinter.print(region) + " "
                + QueryPrinter.period(period);
    }

    private static String lags(LagRange lags) {
        if (lags.isSingle()) {
            return " at lag " + Durations.amount(lags.first(), lags.unit());
        }
        String range = " lags " + lags.first() + " to " + Durations.amount(lags.last(), lags.unit());
        return lags.step() == 1 ? range : range + " step " + Durations.amount(lags.step(), lags.unit());
    }

    private static String method(CorrelationMethod method) {
        return method == CorrelationMethod.PEARSON ? "" : " using " + method.name().toLowerCase(Locale.ROOT);
    }

    private static String deseasonalized(Deseasonalized d) {
        return " deseasonalized" + d.baseline().map(b -> " against " + QueryPrinter.baseline(b)).orElse("");
    }

    static String duration(Duration duration) {
        return Durations.amount(duration.amount(), duration.unit());
    }
}
