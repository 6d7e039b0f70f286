package org.slackwater.core.ingest;

import java.util.List;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.store.ChunkRecord;

/**
 * The chunks of a staged version, its footprint, and the bytes newly written.
 *
 * @param valuesRead time steps x cells read from the source file
 */
record WrittenVersion(List<ChunkRecord> chunks, Footprint footprint, long bytesWritten, long valuesRead) {
  WrittenVersion {
    chunks = List.copyOf(chunks);
  }
}
