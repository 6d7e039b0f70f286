package org.slackwater.core.ingest;

import java.util.Objects;
import java.util.Optional;

/**
 * How to ingest a file.
 *
 * <p>By default a file whose variable is already a cube is <em>appended</em> to it: its new steps
 * are added, and steps the cube already holds must hold the same values. A file is a
 * <em>reprocessed</em> version when the caller says so here ({@link #reprocessed()}) or the file
 * says so itself with the global attribute {@value #REPROCESSED_ATTRIBUTE} {@code = "true"}; its
 * values then replace those of the steps the cube already holds. {@link #replacingCube()} is the
 * blunt tool: the file becomes the whole cube, whatever its grid or time axis.
 *
 * @param variable only this variable of the file (otherwise every gridded variable)
 * @param reprocessed the file is a reprocessed version of steps the cube may hold
 * @param replaceCube the file replaces the cube entirely
 */
public record IngestOptions(Optional<String> variable, boolean reprocessed, boolean replaceCube) {

  /** The global attribute by which a file declares itself a reprocessed version ({@code "true"} or {@code "false"}). */
  public static final String REPROCESSED_ATTRIBUTE = "slackwater_reprocessed";

  public IngestOptions {
    Objects.requireNonNull(variable);
    if (reprocessed && replaceCube) {
      throw new IllegalArgumentException("choose one: 'reprocessed' replaces some steps, 'replace cube' replaces everything");
    }
  }

  /** Append every variable. */
  public static IngestOptions defaults() {
    return new IngestOptions(Optional.empty(), false, false);
  }

  /** Append, restricted to {@code variable} if present. */
  public static IngestOptions of(Optional<String> variable) {
    return new IngestOptions(variable, false, false);
  }

  public IngestOptions withVariable(String name) {
    return new IngestOptions(Optional.of(name), reprocessed, replaceCube);
  }

  /** The same options with the file taken as a reprocessed version. */
  public IngestOptions asReprocessed() {
    return new IngestOptions(variable, true, false);
  }

  /** The same options with the file replacing the whole cube. */
  public IngestOptions replacingCube() {
    return new IngestOptions(variable, false, true);
  }
}
