package org.slackwater.alerts;

/**
 * The outbox file could not be opened, read or written. The message names the file, what went
 * wrong and what to do; alerts already written stay in the file.
 */
public final class OutboxException extends RuntimeException {

  public OutboxException(String message, Throwable cause) {
    super(message, cause);
  }

  public OutboxException(String message) {
    super(message);
  }
}
