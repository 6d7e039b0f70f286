package org.slackwater.query.ast;

import java.time.LocalDate;
import java.util.Objects;

/**
 * The days from the first day of {@code from} to the last day of {@code to}, both included;
 * {@code during 2014} has {@code from} and {@code to} both 2014.
 *
 * @throws IllegalArgumentException if the period ends before it starts
 */
public record Period(PartialDate from, PartialDate to, Position position) implements Node {

    public Period {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
        Objects.requireNonNull(position, "position");
        if (to.last().isBefore(from.first())) {
            throw new IllegalArgumentException(
                    "period ends (" + to.last() + ") before it starts (" + from.first() + ")");
        }
    }

    /** The first day of the period. */
    public LocalDate start() {
        return from.first();
    }

    /** The last day of the period, included. */
    public LocalDate endInclusive() {
        return to.last();
    }

    /** Whether the period was (or can be) written as {@code during <date>}: one date. */
    public boolean isSingleDate() {
        return from.year() == to.year() && from.month() == to.month() && from.day() == to.day();
    }
}
