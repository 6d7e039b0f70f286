package org.slackwater.alerts;

import java.time.Instant;
import java.util.Objects;
import java.util.Optional;

/**
 * One outbox row as seen by an operator: one alert for one channel, its state and delivery history.
 * {@code attempts} counts sends tried; {@code nextAttemptAt} matters for pending rows only.
 */
public record OutboxEntry(String idempotencyKey, String channelId, Channel.Kind kind, String watch, Status status,
                          int attempts, Instant enqueuedAt, Instant nextAttemptAt, Optional<Instant> sentAt,
                          Optional<String> lastError) {

  public enum Status { PENDING, SENT, FAILED }

  public OutboxEntry {
    Objects.requireNonNull(idempotencyKey, "idempotencyKey");
    Objects.requireNonNull(channelId, "channelId");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(watch, "watch");
    Objects.requireNonNull(status, "status");
    Objects.requireNonNull(enqueuedAt, "enqueuedAt");
    Objects.requireNonNull(nextAttemptAt, "nextAttemptAt");
    Objects.requireNonNull(sentAt, "sentAt");
    Objects.requireNonNull(lastError, "lastError");
  }
}
