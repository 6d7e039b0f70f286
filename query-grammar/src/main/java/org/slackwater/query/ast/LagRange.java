package org.slackwater.query.ast;

import java.util.Objects;

/**
 * The lags of a correlation: {@code first}, {@code first + step}, ... up to at most
 * {@code last}, in {@code unit}s; {@code lags 0 to 12 weeks step 2 weeks} or the single lag
 * {@code at lag 4 weeks} (first = last, step 1). A positive lag k pairs the first series at
 * time t with the second (driver) series at time t - k: the driver leads.
 *
 * @throws IllegalArgumentException if first is after last, the step is below 1, or a lag is
 *     beyond {@link Duration#MAX_AMOUNT}
 */
public record LagRange(int first, int last, int step, DurationUnit unit, Position position) implements Node {

    public LagRange {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        if (Math.abs(first) > Duration.MAX_AMOUNT || Math.abs(last) > Duration.MAX_AMOUNT
                || step > Duration.MAX_AMOUNT) {
            throw new IllegalArgumentException("lag beyond " + Duration.MAX_AMOUNT);
        }
        if (first > last) {
            throw new IllegalArgumentException("lags end (" + last + ") before they start (" + first + ")");
        }
        if (step < 1) {
            throw new IllegalArgumentException("lag step below 1: " + step);
        }
    }

    /** Whether this is one lag only, as {@code at lag <n> <unit>} writes it. */
    public boolean isSingle() {
        return first == last && step == 1;
    }
}
