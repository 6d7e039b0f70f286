package org.slackwater.core.catalog;

import java.util.Objects;
import java.util.Optional;

/**
 * One entry of a cube's version history: which file made which version and what it changed. The
 * history outlives the versions themselves (only the current version's chunks are kept) and a
 * removed cube's history stays, so version numbers are never reused.
 *
 * @param cube the cube's name
 * @param version the version this file made
 * @param previousVersion the version it replaced; 0 for a new cube
 * @param change what kind of change it was
 * @param provenance the file (name, SHA-256, variable, reader) and the commit time
 * @param steps the cube's time steps in this version
 * @param appended steps the file added, in this version's indices; every step for a new or replaced cube
 * @param replaced steps the file replaced (a reprocessed version), in this version's indices
 */
public record VersionRecord(String cube, int version, int previousVersion, Change change, Provenance provenance, int steps,
    Optional<StepRange> appended, Optional<StepRange> replaced) {

  /** What a version did to its cube. */
  public enum Change {
    /** A new cube (or one whose name had been removed). */
    CREATED,
    /** New steps added to the cube, before, between or after its steps. */
    APPENDED,
    /** Existing steps replaced by a reprocessed file (and possibly new steps added). */
    REPROCESSED,
    /** The whole cube replaced by one file, on request. */
    REPLACED
  }

  public VersionRecord {
    Objects.requireNonNull(cube);
    Objects.requireNonNull(change);
    Objects.requireNonNull(provenance);
    Objects.requireNonNull(appended);
    Objects.requireNonNull(replaced);
    if (version < 1 || previousVersion < 0 || previousVersion >= version) {
      throw new IllegalArgumentException("version " + version + " cannot follow version " + previousVersion);
    }
  }

  /** True when this version started the cube's current lineage: later versions build on it. */
  public boolean startsLineage() {
    return change == Change.CREATED || change == Change.REPLACED;
  }
}
