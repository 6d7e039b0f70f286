package org.slackwater.core.store;

import java.util.Objects;

/**
 * A chunk as written: its key, the file name within the version directory, the SHA-256 of the
 * file's bytes, its size and how many of its values are present (not missing).
 */
public record ChunkRecord(ChunkKey key, String file, String sha256, long bytes, long validCount) {
  public ChunkRecord {
    Objects.requireNonNull(key);
    Objects.requireNonNull(file);
    Objects.requireNonNull(sha256);
  }
}
