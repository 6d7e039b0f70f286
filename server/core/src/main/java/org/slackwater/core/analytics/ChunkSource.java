package org.slackwater.core.analytics;

import java.io.IOException;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.store.ChunkRecord;

/**
 * Where operators get a chunk's values ({@code float[]} in (time, row, column) order, NaN =
 * missing): the shared {@link ChunkCache} for stored cubes, or a request's derived variables
 * computed chunk by chunk from their inputs. The returned array is shared and must not be
 * modified.
 */
@FunctionalInterface
public interface ChunkSource {
  float[] get(CubeEntry cube, ChunkRecord chunk) throws IOException;
}
