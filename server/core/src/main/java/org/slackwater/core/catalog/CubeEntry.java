package org.slackwater.core.catalog;

import java.util.List;
import java.util.Objects;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;

/**
 * One published version of a cube as the catalog holds it.
 *
 * @param name the cube's name in queries (lower case)
 * @param version increases by one with each publish of the same name
 * @param descriptor units, grid, time axis
 * @param layout how it is chunked
 * @param chunks every chunk file with its checksum
 * @param footprint the cells that hold a value at some step
 * @param provenance source and ingest time
 */
public record CubeEntry(String name, int version, CubeDescriptor descriptor, ChunkLayout layout, List<ChunkRecord> chunks,
    Footprint footprint, Provenance provenance) {
  public CubeEntry {
    Objects.requireNonNull(name);
    Objects.requireNonNull(descriptor);
    Objects.requireNonNull(layout);
    Objects.requireNonNull(footprint);
    Objects.requireNonNull(provenance);
    chunks = List.copyOf(chunks);
    if (version < 1) {
      throw new IllegalArgumentException("versions start at 1");
    }
  }

  /** Total bytes of its chunk files. */
  public long bytes() {
    return chunks.stream().mapToLong(ChunkRecord::bytes).sum();
  }
}
