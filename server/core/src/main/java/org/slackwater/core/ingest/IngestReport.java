package org.slackwater.core.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.slackwater.core.catalog.StepRange;

/**
 * What one ingest did to one cube, for people (see {@link #summary}) and for whatever runs on new
 * data (the watch evaluator reads {@link #appended} and {@link #replaced} to evaluate only those
 * steps).
 *
 * @param cube the cube's name
 * @param change what happened; {@link Change#UNCHANGED} when the file added nothing
 * @param previousVersion the version before the ingest (0 for a new cube)
 * @param version the version now current (equal to {@code previousVersion} when unchanged)
 * @param sourceFile the file's name
 * @param sourceSha256 SHA-256 of the file's bytes
 * @param appended the steps the file added, in indices of the new version; every step of a new or
 *     replaced cube; empty when none
 * @param replaced the steps a reprocessed file replaced, in indices of the new version
 * @param gaps stretches without steps next to the added steps (allowed, reported)
 * @param steps the cube's time steps now
 * @param values time steps x cells read from the file
 * @param bytesWritten size of the chunk files written (reused chunks not counted)
 * @param seconds wall time from open to commit
 * @param note a sentence for people on why nothing changed, or empty
 */
public record IngestReport(String cube, Change change, int previousVersion, int version, String sourceFile, String sourceSha256,
    Optional<StepRange> appended, Optional<StepRange> replaced, List<StepGap> gaps, int steps, long values, long bytesWritten,
    double seconds, String note) {

  /** What an ingest did to a cube. */
  public enum Change {
    /** A new cube. */
    CREATED,
    /** Steps added to an existing cube. */
    APPENDED,
    /** Steps of an existing cube replaced by a reprocessed file, possibly with steps added. */
    REPROCESSED,
    /** The whole cube replaced, on request. */
    REPLACED,
    /** Nothing: the file was ingested before, or holds only steps the cube has with the same values. */
    UNCHANGED
  }

  public IngestReport {
    Objects.requireNonNull(cube);
    Objects.requireNonNull(change);
    Objects.requireNonNull(sourceFile);
    Objects.requireNonNull(sourceSha256);
    Objects.requireNonNull(appended);
    Objects.requireNonNull(replaced);
    Objects.requireNonNull(note);
    gaps = List.copyOf(gaps);
  }

  /** True unless the ingest left the cube as it was. */
  public boolean changed() {
    return change != Change.UNCHANGED;
  }

  /** Throughput in MB/s of float32 values (4 bytes each), the figure the ingest benchmark quotes. */
  public double valueMegabytesPerSecond() {
    return seconds > 0 ? values * 4.0 / 1e6 / seconds : Double.POSITIVE_INFINITY;
  }

  /**
   * One line, e.g. {@code cube temp: appended 5 steps, 2024-01-11..2024-01-15 (version 1 -> 2, 15
   * steps)}.
   */
  public String summary() {
    StringBuilder b = new StringBuilder("cube ").append(cube).append(": ");
    if (!changed()) {
      return b.append("unchanged (version ").append(version).append("): ").append(note).toString();
    }
    List<String> parts = new ArrayList<>();
    switch (change) {
      case CREATED -> parts.add("created with " + appended.map(StepRange::describe).orElse("no steps"));
      case REPLACED -> parts.add("replaced entirely by " + appended.map(StepRange::describe).orElse("no steps"));
      default -> {
        replaced.ifPresent(r -> parts.add("replaced " + r.describe()));
        appended.ifPresent(a -> parts.add("appended " + a.describe()));
      }
    }
    b.append(String.join("; ", parts));
    b.append(" (version ").append(previousVersion == 0 ? "new" : String.valueOf(previousVersion)).append(" -> ").append(version)
        .append(", ").append(steps).append(" steps)");
    for (StepGap g : gaps) {
      b.append("; gap: ").append(g.describe());
    }
    return b.toString();
  }
}
