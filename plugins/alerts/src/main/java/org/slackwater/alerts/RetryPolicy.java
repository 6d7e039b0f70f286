package org.slackwater.alerts;

import java.time.Duration;
import java.util.Objects;

/**
 * When the outbox tries a failed delivery again: after attempt {@code n} (1, 2, ...) fails, it
 * waits {@code min(max, base * 2^(n-1))}, so a receiver that is down for a while is not hammered
 * and one that comes back is found within {@code max}. After {@code maxAttempts} failed attempts
 * the row is marked failed (kept, listed by {@link Outbox#failed()}) for an operator to look at.
 */
public record RetryPolicy(Duration base, Duration max, int maxAttempts) {

  /** 30 s doubling to at most 1 h, 12 attempts: roughly 5 h of trying before a row is marked failed. */
  public static final RetryPolicy DEFAULT = new RetryPolicy(Duration.ofSeconds(30), Duration.ofHours(1), 12);

  public RetryPolicy {
    Objects.requireNonNull(base, "base");
    Objects.requireNonNull(max, "max");
    if (base.isNegative() || base.isZero()) {
      throw new IllegalArgumentException("retry base delay must be positive, got " + base);
    }
    if (max.compareTo(base) < 0) {
      throw new IllegalArgumentException("retry max delay " + max + " is shorter than the base delay " + base + "; raise max");
    }
    if (maxAttempts < 1) {
      throw new IllegalArgumentException("maxAttempts must be at least 1, got " + maxAttempts);
    }
  }

  /** The wait after failed attempt {@code attempt} (1-based). */
  public Duration delayAfter(int attempt) {
    if (attempt < 1) {
      throw new IllegalArgumentException("attempt numbers start at 1, got " + attempt);
    }
    Duration d = base;
    for (int i = 1; i < attempt && d.compareTo(max) < 0; i++) {
      d = d.multipliedBy(2);
    }
    return d.compareTo(max) > 0 ? max : d;
  }
}
