package org.slackwater.query;

import java.math.BigDecimal;
import java.util.EnumSet;
import java.util.Locale;
import java.util.Set;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.parser.SlackwaterParser;
import org.slackwater.query.parser.SlackwaterParser.DurationContext;
import org.slackwater.query.parser.SlackwaterParser.DurationUnitContext;
import org.slackwater.query.parser.SlackwaterParser.LagRangeContext;
import org.slackwater.query.parser.SlackwaterParser.LagValueContext;
import org.slackwater.query.parser.SlackwaterParser.SingleLagContext;

/**
 * Reads durations ({@code 30 days}) and lags ({@code lags -4 to 12 weeks step 2 weeks},
 * {@code at lag 4 weeks}). Amounts are whole numbers (a written {@code 12.0} is 12) of at most
 * {@link Duration#MAX_AMOUNT}; each use says what it calls the amount in its messages, so that
 * an error reads "the persistence must be at least 1 day" rather than naming a token.
 */
final class Durations {

    /** The units of a watch's windows and persistence, which are checked day by day. */
    static final Set<DurationUnit> DAYS_OR_WEEKS = EnumSet.of(DurationUnit.DAY, DurationUnit.WEEK);

    private final String source;

    Durations(String source) {
        this.source = source;
    }

    /** A duration of at least 1, called {@code what} in messages ("window", "persistence"). */
    Duration positive(DurationContext ctx, String what) {
        DurationUnit unit = unit(ctx.durationUnit());
        Token number = ctx.NUMBER().getSymbol();
        int amount = whole(number, false, what, unit);
        if (amount < 1) {
            throw error(number, "the " + what + " must be at least 1 " + singular(unit), "");
        }
        return new Duration(amount, unit, Literals.position(number));
    }

    /** As {@link #positive}, and only in days or weeks. */
    Duration positiveDaysOrWeeks(DurationContext ctx, String what) {
        Duration duration = positive(ctx, what);
        if (!DAYS_OR_WEEKS.contains(duration.unit())) {
            Token unit = ctx.durationUnit().getStart();
            throw error(unit, "the " + what + " must be in days or weeks, found '" + unit.getText() + "'",
                    "watches are checked day by day, e.g. 'for 3 days' or 'over 2 weeks'");
        }
        return duration;
    }

    /** {@code at lag <n> <unit>} as a range of one lag. */
    LagRange singleLagRange(SingleLagContext ctx) {
        DurationUnit unit = unit(ctx.durationUnit());
        int amount = lag(ctx.lagValue(), unit);
        return new LagRange(amount, amount, 1, unit, Literals.position(ctx.getStart()));
    }

    LagRange range(LagRangeContext ctx) {
        DurationUnit unit = unit(ctx.durationUnit());
        int first = lag(ctx.lagValue(0), unit);
        int last = lag(ctx.lagValue(1), unit);
        if (last < first) {
            throw error(ctx.lagValue(1).getStart(), "the lags end at " + amount(last, unit)
                    + ", before they start at " + amount(first, unit), "put the smaller lag first");
        }
        int step = 1;
        if (ctx.duration() != null) {
            DurationUnit stepUnit = unit(ctx.duration().durationUnit());
            if (stepUnit != unit) {
                Token word = ctx.duration().durationUnit().getStart();
                throw error(word, "the lag step must be in " + plural(unit) + ", like the lags, found '"
                        + word.getText() + "'", "for example 'lags 0 to 12 weeks step 2 weeks'");
            }
            step = positive(ctx.duration(), "lag step").amount();
        }
        return new LagRange(first, last, step, unit, Literals.position(ctx.getStart()));
    }

    private int lag(LagValueContext ctx, DurationUnit unit) {
        int magnitude = whole(ctx.NUMBER().getSymbol(), ctx.MINUS() != null, "lag", unit);
        return ctx.MINUS() != null ? -magnitude : magnitude;
    }

    /** The whole amount of a NUMBER token; checked as a decimal so that huge numbers cannot overflow. */
    private int whole(Token number, boolean negative, String what, DurationUnit unit) {
        BigDecimal value = new BigDecimal(number.getText());
        String written = (negative ? "-" : "") + number.getText();
        if (value.stripTrailingZeros().scale() > 0) {
            throw error(number, "the " + what + " must be a whole number of " + plural(unit) + ", found " + written,
                    "");
        }
        if (value.compareTo(BigDecimal.valueOf(Duration.MAX_AMOUNT)) > 0) {
            throw error(number, "the " + what + " must be at most " + Duration.MAX_AMOUNT + " " + plural(unit)
                    + (negative ? " either way" : "") + ", found " + written, "");
        }
        return value.intValueExact();
    }

    static DurationUnit unit(DurationUnitContext ctx) {
        if (ctx instanceof SlackwaterParser.DayUnitContext) {
            return DurationUnit.DAY;
        }
        if (ctx instanceof SlackwaterParser.WeekUnitContext) {
            return DurationUnit.WEEK;
        }
        if (ctx instanceof SlackwaterParser.MonthUnitContext) {
            return DurationUnit.MONTH;
        }
        if (ctx instanceof SlackwaterParser.SeasonUnitContext) {
            return DurationUnit.SEASON;
        }
        return DurationUnit.YEAR;
    }

    static String singular(DurationUnit unit) {
        return unit.name().toLowerCase(Locale.ROOT);
    }

    static String plural(DurationUnit unit) {
        return singular(unit) + "s";
    }

    /** "1 week", "-1 week", "12 weeks", "0 weeks": the form the printer writes. */
    static String amount(int amount, DurationUnit unit) {
        return amount + " " + (Math.abs(amount) == 1 ? singular(unit) : plural(unit));
    }

    private QueryException error(Token token, String message, String hint) {
        return Literals.error(token, source, message, hint);
    }
}
