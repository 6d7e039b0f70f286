package org.slackwater.query.ast;

import java.util.Objects;

/**
 * A whole number of days, weeks, months, seasons or years, such as {@code 30 days} or the lag
 * {@code -4 weeks}. Negative amounts occur only as lags; the parser checks the sign where it
 * matters (a window or a persistence is at least 1).
 *
 * @throws IllegalArgumentException if the amount is beyond {@link #MAX_AMOUNT} either way
 */
public record Duration(int amount, DurationUnit unit, Position position) implements Node {

    /** The largest amount the language accepts; larger values mean nothing for 20-year data. */
    public static final int MAX_AMOUNT = 100_000;

    public Duration {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        if (Math.abs(amount) > MAX_AMOUNT) {
            throw new IllegalArgumentException("duration beyond " + MAX_AMOUNT + ": " + amount);
        }
    }
}
