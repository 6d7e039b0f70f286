package org.slackwater.core.analytics.correlation;

import java.util.Objects;

/**
 * A correlation request that cannot be computed as asked. The message is written for the person
 * who wrote the request (what is wrong, the numbers involved, how to fix it); {@link #kind()} lets
 * the query analyzer attach it to the right part of the statement (the lag clause, a series, the
 * settings) without parsing the message.
 */
public final class CorrelationInputException extends IllegalArgumentException {
  private static final long serialVersionUID = 1L;

  /** Which part of the request is at fault. */
  public enum Kind {
    /** A lag range at least as long as one of the series. */
    LAG_RANGE_TOO_LONG,
    /** No date has a value in both series at any lag of the range. */
    NO_OVERLAP,
    /** A series without a single value. */
    EMPTY_SERIES,
    /** The two series are reported at different steps (e.g. monthly and daily). */
    STEP_MISMATCH,
    /** Dates that are not strictly increasing or not the first day of their period. */
    BAD_DATES,
    /** A setting out of range: lag step, alpha, window, baseline. */
    BAD_SETTING
  }

  private final Kind kind;

  public CorrelationInputException(Kind kind, String message) {
    super(message);
    this.kind = Objects.requireNonNull(kind, "kind");
  }

  public Kind kind() {
    return kind;
  }
}
