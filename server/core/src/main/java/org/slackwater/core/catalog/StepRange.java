package org.slackwater.core.catalog;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Objects;

/**
 * Some time steps of one cube version: {@code count} steps, all within the step indices {@code
 * [firstIndex, lastIndex]} of that version's time axis, the first at {@code first} and the last at
 * {@code last}. The steps need not be consecutive (a file that adds days on both sides of days the
 * cube already holds), so {@code count} may be less than {@code lastIndex - firstIndex + 1}.
 */
public record StepRange(int firstIndex, int lastIndex, int count, Instant first, Instant last) {
  public StepRange {
    Objects.requireNonNull(first);
    Objects.requireNonNull(last);
    if (firstIndex < 0 || lastIndex < firstIndex || count < 1 || count > lastIndex - firstIndex + 1 || last.isBefore(first)) {
      throw new IllegalArgumentException("invalid step range " + firstIndex + ".." + lastIndex + " (" + count + " steps)");
    }
  }

  /** The UTC date of the first step. */
  public LocalDate firstDate() {
    return LocalDate.ofInstant(first, ZoneOffset.UTC);
  }

  /** The UTC date of the last step. */
  public LocalDate lastDate() {
    return LocalDate.ofInstant(last, ZoneOffset.UTC);
  }

  /** e.g. {@code 5 steps, 2024-01-11..2024-01-15} (instants when a step is not at midnight UTC). */
  public String describe() {
    return count + (count == 1 ? " step, " : " steps, ") + StepText.of(first) + (count == 1 ? "" : ".." + StepText.of(last));
  }
}
