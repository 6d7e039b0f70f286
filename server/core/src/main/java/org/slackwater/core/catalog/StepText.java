package org.slackwater.core.catalog;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;

/** How a time step is written in messages: its date when it falls at midnight UTC, else the instant. */
public final class StepText {
  private StepText() {}

  public static String of(Instant step) {
    return step.getEpochSecond() % 86_400 == 0 && step.getNano() == 0 ? LocalDate.ofInstant(step, ZoneOffset.UTC).toString() : step.toString();
  }

  public static String of(long epochSecond) {
    return of(Instant.ofEpochSecond(epochSecond));
  }
}
