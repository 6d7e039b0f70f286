package org.slackwater.query.ast;

import java.util.Objects;

/**
 * {@code with coverage at least <percent> %}: a step's value is kept only where at least this
 * share of the region's area had valid data.
 *
 * @throws IllegalArgumentException if the percentage is outside 0..100
 */
public record Coverage(double percent, Position position) implements Node {

    public Coverage {
        Objects.requireNonNull(position, "position");
        percent += 0.0; // no negative zero
        if (!(percent >= 0 && percent <= 100)) {
            throw new IllegalArgumentException("coverage outside 0..100 %: " + percent);
        }
    }
}
