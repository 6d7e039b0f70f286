package org.slackwater.core.analytics;

import java.util.OptionalInt;

/**
 * When a period (week, month, season ...) built from native steps keeps its value despite
 * native steps without one. A period is valid when it has at least one value, at most {@code
 * maxMissing} native steps without a value (if set) and no run of more than {@code
 * maxConsecutive} such steps (if set).
 *
 * <p>Defaults follow the statistic ({@link #defaultFor}): a mean, minimum, maximum or percentile
 * needs one value; a sum needs every step, since a total over gaps is too low. A query may
 * state its own rule ({@code with at most 5 missing days, 3 consecutive} is the climatological
 * "3/5 rule" for monthly means: a month is missing when more than 5 days in all, or more than 3
 * in a row, are missing; see the language reference for its source). A sum over a period with
 * allowed gaps is the mean of its values times the number of native steps in the period, so that
 * the total is not biased low; the result's metadata says so.
 */
public record GapRule(OptionalInt maxMissing, OptionalInt maxConsecutive) {

  /** A value needs one native step with a value. */
  public static final GapRule ONE_VALUE = new GapRule(OptionalInt.empty(), OptionalInt.empty());
  /** A value needs every native step. */
  public static final GapRule COMPLETE = new GapRule(OptionalInt.of(0), OptionalInt.of(0));

  public GapRule {
    if (maxMissing.isPresent() && maxMissing.getAsInt() < 0 || maxConsecutive.isPresent() && maxConsecutive.getAsInt() < 0) {
      throw new IllegalArgumentException("missing-step allowances must be at least 0");
    }
  }

  public static GapRule atMost(int missing, OptionalInt consecutive) {
    return new GapRule(OptionalInt.of(missing), consecutive);
  }

  public static GapRule defaultFor(SpatialStatistic stat) {
    return stat.kind() == SpatialStatistic.Kind.SUM ? COMPLETE : ONE_VALUE;
  }

  /**
   * Whether a period of {@code values.length} native steps (NaN = no value) over {@code [from,
   * to)} keeps a value.
   */
  public boolean accepts(double[] values, int from, int to) {
    int missing = 0, run = 0, longest = 0;
    for (int t = from; t < to; t++) {
      if (Double.isNaN(values[t])) {
        missing++;
        run++;
        longest = Math.max(longest, run);
      } else {
        run = 0;
      }
    }
    if (missing == to - from) {
      return false;
    }
    return (maxMissing.isEmpty() || missing <= maxMissing.getAsInt())
        && (maxConsecutive.isEmpty() || longest <= maxConsecutive.getAsInt());
  }

  /** Whether every native step is needed (sums are then plain totals, no scaling). */
  public boolean complete() {
    return maxMissing.isPresent() && maxMissing.getAsInt() == 0;
  }

  /** For metadata: the rule in words. */
  public String describe(String stepWord) {
    if (equals(ONE_VALUE)) {
      return "a " + stepWord + " has a value when at least one of its native steps has one";
    }
    if (complete()) {
      return "a " + stepWord + " has a value only when every one of its native steps has one";
    }
    StringBuilder b = new StringBuilder("a " + stepWord + " is missing when");
    maxMissing.ifPresent(m -> b.append(" more than ").append(m).append(" of its days are missing"));
    maxConsecutive.ifPresent(c -> b.append(maxMissing.isPresent() ? " or" : "").append(" more than ").append(c).append(" consecutive days are missing"));
    return b.toString();
  }
}
