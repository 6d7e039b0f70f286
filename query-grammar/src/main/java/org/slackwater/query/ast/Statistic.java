package org.slackwater.query.ast;

import java.util.Objects;

/**
 * A statistic such as {@code mean} or {@code p90}.
 *
 * <p>{@code percentile} is the percentile in percent: strictly between 0 and 100 for
 * {@link StatisticKind#PERCENTILE}, 50 for {@link StatisticKind#MEDIAN}, NaN otherwise.
 *
 * @throws IllegalArgumentException if the percentile does not fit the kind
 */
public record Statistic(StatisticKind kind, double percentile, Position position) implements Node {

    public Statistic {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(position, "position");
        switch (kind) {
            case PERCENTILE:
                if (!(percentile > 0 && percentile < 100)) {
                    throw new IllegalArgumentException(
                            "percentile must be between 0 and 100 (exclusive), got " + percentile);
                }
                break;
            case MEDIAN:
                if (percentile != 50) {
                    throw new IllegalArgumentException("a median is the 50th percentile, got " + percentile);
                }
                break;
            default:
                if (!Double.isNaN(percentile)) {
                    throw new IllegalArgumentException(kind + " has no percentile, got " + percentile);
                }
        }
    }

    /** A statistic without a percentile parameter (MEDIAN gets 50). */
    public static Statistic of(StatisticKind kind, Position position) {
        if (kind == StatisticKind.PERCENTILE) {
            throw new IllegalArgumentException("use Statistic.percentile(p, position)");
        }
        return new Statistic(kind, kind == StatisticKind.MEDIAN ? 50 : Double.NaN, position);
    }

    /** The {@code p}-th percentile, {@code 0 < p < 100}. */
    public static Statistic percentile(double p, Position position) {
        return new Statistic(StatisticKind.PERCENTILE, p, position);
    }
}
