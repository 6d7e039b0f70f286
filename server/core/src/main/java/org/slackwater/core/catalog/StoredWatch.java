package org.slackwater.core.catalog;

import java.time.Instant;
import java.util.Objects;

/**
 * A watch definition as stored: its name, canonical text, who stored it (SHA-256 of the bearer
 * token, never the token), when, and a version that grows with each redefinition.
 */
public record StoredWatch(String name, String text, String ownerSha256, Instant created, int version) {
  public StoredWatch {
    Objects.requireNonNull(name);
    Objects.requireNonNull(text);
    Objects.requireNonNull(ownerSha256);
    Objects.requireNonNull(created);
  }
}
