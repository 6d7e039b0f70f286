package org.slackwater.query;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.CircleRegion;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.Comparison;
import org.slackwater.query.ast.ComparisonKind;
import org.slackwater.query.ast.Coverage;
import org.slackwater.query.ast.GapAllowance;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Coordinate;
import org.slackwater.query.ast.CellExport;
import org.slackwater.query.ast.DescribeVariable;
import org.slackwater.query.ast.ListRegions;
import org.slackwater.query.ast.ListVariables;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StatisticKind;
import org.slackwater.query.ast.Step;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WktRegion;
import org.slackwater.query.parser.SlackwaterLexer;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Writes trees back as canonical query text: lower-case keywords, one statement per line
 * separated by ';', {@code during <date>} for a one-date period and {@code from .. to ..}
 * otherwise, coordinates with hemisphere letters (plain signed degrees when a longitude is
 * beyond 180), numbers in plain decimal notation. Statistics are always written (a default
 * {@code mean} too), and a series' own region as {@code within <region>} right after its
 * variable; options at their defaults are left out ({@code using pearson},
 * {@code severity warning}, a lag step of 1), and {@code as anomalies} is written
 * {@code deseasonalized}. Expressions and conditions get parentheses only where the grouping
 * needs them.
 *
 * <p>For every tree the parser produces, {@code QueryParser.parse(print(tree))} equals the tree
 * once positions are erased. Trees built by code must stay within what the language can say
 * (whole-number percentiles, names without line breaks), or the text will not parse back.
 */
public final class QueryPrinter {

    /** Units that can be written without quotes: exactly the lexer's unit word after 'in'. */
    private static final Pattern BARE_UNIT = Pattern.compile("[a-z0-9%][a-z0-9_%/\\-^.*]*", Pattern.CASE_INSENSITIVE);
    /** The token types the grammar takes as a unit after a number. */
    private static final Set<Integer> NUMBER_UNIT_TYPES = Set.of(SlackwaterParser.UNIT_WORD, SlackwaterLexer.IDENT,
            SlackwaterLexer.N, SlackwaterLexer.S, SlackwaterLexer.E, SlackwaterLexer.W, SlackwaterLexer.M,
            SlackwaterLexer.KM);

    private QueryPrinter() {}

    public static String print(Script script) {
        return script.statements().stream().map(QueryPrinter::print).collect(Collectors.joining(";\n"));
    }

    public static String print(Statement statement) {
        if (statement instanceof AreaSeries) {
            return areaSeries((AreaSeries) statement);
        }
        if (statement instanceof ListVariables) {
            return "list variables";
        }
        if (statement instanceof ListRegions) {
            return "list regions";
        }
        if (statement instanceof DescribeVariable) {
            return "describe " + ((DescribeVariable) statement).variable().name();
        }
        if (statement instanceof Watch) {
            return WatchPrinter.watch((Watch) statement);
        }
        if (statement instanceof DerivedVariable) {
            return ExpressionPrinter.let((DerivedVariable) statement);
        }
        if (statement instanceof CellExport) {
            CellExport c = (CellExport) statement;
            return "cells of " + c.variable().name() + " over " + print(c.region()) + " " + period(c.period())
                    + c.unit().map(QueryPrinter::unitClause).orElse("");
        }
        String analysis = AnalysisPrinter.print(statement);
        if (analysis != null) {
            return analysis;
        }
        throw new IllegalArgumentException("unknown statement " + statement.getClass().getName());
    }

    private static String areaSeries(AreaSeries s) {
        StringBuilder text = new StringBuilder();
        text.append(statistic(s.statistic())).append(' ').append(s.variable().name())
                .append(" over ").append(print(s.region()))
                .append(' ').append(period(s.period()))
                .append(' ').append(step(s.step()));
        s.unit().ifPresent(u -> text.append(unitClause(u)));
        s.comparison().ifPresent(c -> text.append(' ').append(comparison(c)));
        s.gaps().ifPresent(g -> text.append(gaps(g)));
        s.coverage().ifPresent(c -> text.append(coverage(c)));
        return text.toString();
    }

    /** {@code " in <unit>"}, the unit bare when the lexer reads it back as one unit word. */
    static String unitClause(UnitRef unit) {
        return " in " + (BARE_UNIT.matcher(unit.unit()).matches() ? unit.unit() : Literals.quote(unit.unit()));
    }

    /** {@code " with at most <n> missing days[, <m> consecutive]"}. */
    static String gaps(GapAllowance g) {
        return " with at most " + g.missingDays() + " missing days"
                + (g.consecutiveDays().isPresent() ? ", " + g.consecutiveDays().getAsInt() + " consecutive" : "");
    }

    /** {@code " with coverage at least <n> %"}. */
    static String coverage(Coverage coverage) {
        return " with coverage at least " + Literals.formatNumber(coverage.percent()) + " %";
    }

    /** {@code <statistic> <variable> [within <region>]}, the statistic always written (mean included). */
    static String series(SeriesTerm term) {
        String series = statistic(term.statistic()) + " " + term.variable().name();
        return term.region().map(r -> series + " within " + print(r)).orElse(series);
    }

    static String statistic(Statistic statistic) {
        if (statistic.kind() == StatisticKind.PERCENTILE) {
            return "p" + Literals.formatNumber(statistic.percentile());
        }
        return statistic.kind().name().toLowerCase(Locale.ROOT);
    }

    public static String print(RegionRef region) {
        if (region instanceof NamedRegion) {
            return Literals.quote(((NamedRegion) region).name());
        }
        if (region instanceof CircleRegion) {
            CircleRegion c = (CircleRegion) region;
            return "circle(" + coordinate(c.center().latitude(), c.center().longitude()) + ", "
                    + Literals.formatNumber(c.radius().value()) + " " + c.radius().unit() + ")";
        }
        if (region instanceof BoxRegion) {
            BoxRegion b = (BoxRegion) region;
            return "box(" + coordinate(b.south(), b.west()) + ", " + coordinate(b.north(), b.east()) + ")";
        }
        if (region instanceof WktRegion) {
            return "wkt " + Literals.quote(((WktRegion) region).wkt());
        }
        if (region instanceof ClippedRegion) {
            ClippedRegion c = (ClippedRegion) region;
            // The chain is left-associative, so only a clipped region on the right needs parentheses.
            String clip = print(c.clip());
            return print(c.region()) + " clipped to " + (c.clip() instanceof ClippedRegion ? "(" + clip + ")" : clip);
        }
        throw new IllegalArgumentException("unknown region " + region.getClass().getName());
    }

    private static String coordinate(double latitude, double longitude) {
        if (longitude > 180) {
            return Literals.formatNumber(latitude) + ", " + Literals.formatNumber(longitude);
        }
        return Literals.formatNumber(Math.abs(latitude)) + (latitude < 0 ? " S" : " N") + ", "
                + Literals.formatNumber(Math.abs(longitude)) + (longitude < 0 ? " W" : " E");
    }

    /** Used for area-series periods: {@code during 2014} or {@code from 2014-06 to 2014-08}. */
    static String period(Period period) {
        return period.isSingleDate()
                ? "during " + period.from().text()
                : "from " + period.from().text() + " to " + period.to().text();
    }

    static String baseline(Period period) {
        return period.isSingleDate() ? period.from().text() : period.from().text() + " to " + period.to().text();
    }

    static String step(Step step) {
        return "by " + step.kind().name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }

    static String comparison(Comparison comparison) {
        String kind = "as " + comparisonKind(comparison.kind());
        return comparison.baseline().map(b -> kind + " against " + baseline(b)).orElse(kind);
    }

    static String comparisonKind(ComparisonKind kind) {
        switch (kind) {
            case ANOMALY:
                return "anomaly";
            case STANDARDIZED_ANOMALY:
                return "standardized anomaly";
            default:
                return "percentile";
        }
    }

    /**
     * A unit right after a number ({@code 10 mg/m3}, {@code 25 degC}): bare when the lexer reads
     * it back as that one word after a number, quoted otherwise (keywords, spaces, '*').
     */
    static String numberUnit(UnitRef unit) {
        String text = unit.unit();
        SlackwaterLexer lexer = new SlackwaterLexer(CharStreams.fromString("let x = 1 " + text));
        List<Token> tokens = new ArrayList<>();
        for (Token t = lexer.nextToken(); t.getType() != Token.EOF; t = lexer.nextToken()) {
            if (t.getChannel() == Token.DEFAULT_CHANNEL) {
                tokens.add(t);
            }
        }
        boolean bare = tokens.size() == 5 && tokens.get(4).getText().equals(text)
                && NUMBER_UNIT_TYPES.contains(tokens.get(4).getType());
        return bare ? text : Literals.quote(text);
    }

    /** Coordinates as this printer writes them, for messages elsewhere. */
    static String coordinate(Coordinate c) {
        return coordinate(c.latitude(), c.longitude());
    }
}
