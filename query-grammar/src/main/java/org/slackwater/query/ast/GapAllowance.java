package org.slackwater.query.ast;

import java.util.Objects;
import java.util.OptionalInt;

/**
 * {@code with at most <n> missing days[, <m> consecutive]}: a step (week, month, ...) keeps its
 * value only if no more than {@code missingDays} of its days lack a value and, when given, no
 * run of missing days is longer than {@code consecutiveDays}. Written for the missing-days rules
 * of climatological practice (e.g. "at most 5 missing, 3 consecutive").
 *
 * @throws IllegalArgumentException for negative counts, or a run allowance above the total
 */
public record GapAllowance(int missingDays, OptionalInt consecutiveDays, Position position) implements Node {

    public GapAllowance {
        Objects.requireNonNull(consecutiveDays, "consecutiveDays");
        Objects.requireNonNull(position, "position");
        if (missingDays < 0) {
            throw new IllegalArgumentException("missing days below 0: " + missingDays);
        }
        if (consecutiveDays.isPresent() && (consecutiveDays.getAsInt() < 0 || consecutiveDays.getAsInt() > missingDays)) {
            throw new IllegalArgumentException("consecutive missing days outside 0.." + missingDays + ": " + consecutiveDays.getAsInt());
        }
    }
}
