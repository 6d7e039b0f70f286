package org.slackwater.alerts;

import java.util.Optional;
import java.util.OptionalInt;

/**
 * A delivery did not succeed, or may not have: the message names the channel, what happened and,
 * for HTTP, the status code ({@link #status}). The outbox records the message and tries again.
 */
public final class DeliveryException extends Exception {

  private final OptionalInt status;

  public DeliveryException(String message) {
    this(message, OptionalInt.empty(), null);
  }

  public DeliveryException(String message, Throwable cause) {
    this(message, OptionalInt.empty(), cause);
  }

  public DeliveryException(String message, OptionalInt status, Throwable cause) {
    super(message, cause);
    this.status = status;
  }

  /** The HTTP status the receiver answered with, when it answered. */
  public OptionalInt status() {
    return status;
  }

  /** The cause's class and message, for a one-line error record. */
  static String describe(Throwable t) {
    return Optional.ofNullable(t.getMessage()).map(m -> t.getClass().getSimpleName() + ": " + m).orElse(t.getClass().getSimpleName());
  }
}
