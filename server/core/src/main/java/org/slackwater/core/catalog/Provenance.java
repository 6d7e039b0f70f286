package org.slackwater.core.catalog;

import java.time.Instant;
import java.util.Objects;

/**
 * Where a cube version came from.
 *
 * @param sourceFile the file's name as given to the ingest (not a full machine path)
 * @param sourceSha256 SHA-256 of the source file's bytes
 * @param sourceVariable the variable's name in the file
 * @param reader the {@link org.slackwater.core.spi.CubeSource} that read it
 * @param ingestedAt when the version was committed
 */
public record Provenance(String sourceFile, String sourceSha256, String sourceVariable, String reader, Instant ingestedAt) {
  public Provenance {
    Objects.requireNonNull(sourceFile);
    Objects.requireNonNull(sourceSha256);
    Objects.requireNonNull(sourceVariable);
    Objects.requireNonNull(reader);
    Objects.requireNonNull(ingestedAt);
  }
}
