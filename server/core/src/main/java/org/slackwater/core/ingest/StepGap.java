package org.slackwater.core.ingest;

import java.time.Instant;
import java.util.Objects;
import org.slackwater.core.catalog.StepText;

/**
 * A stretch without steps next to steps an ingest added: no step lies strictly between {@code
 * after} and {@code before}, where the cube's usual spacing would put about {@code missingSteps}.
 * Gaps are allowed (a missing day of a daily product); a later file may fill them.
 */
public record StepGap(Instant after, Instant before, int missingSteps) {
  public StepGap {
    Objects.requireNonNull(after);
    Objects.requireNonNull(before);
    if (!before.isAfter(after) || missingSteps < 1) {
      throw new IllegalArgumentException("invalid gap " + after + " .. " + before);
    }
  }

  /** e.g. {@code about 2 steps missing between 2024-01-10 and 2024-01-13}. */
  public String describe() {
    return "about " + missingSteps + (missingSteps == 1 ? " step" : " steps") + " missing between " + StepText.of(after) + " and " + StepText.of(before);
  }
}
