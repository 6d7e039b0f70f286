package org.slackwater.core;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.ServiceLoader;
import java.util.function.Consumer;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.ingest.Ingestor;
import org.slackwater.core.query.QueryEngine;
import org.slackwater.core.query.WeightsCache;
import org.slackwater.core.region.AreaModel;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.CubeStore;

/**
 * One data directory opened for use: the bounded Arrow allocator, the catalog ({@code
 * catalog.db}), the chunk store ({@code cubes/}), the chunk cache, the ingestor and the query
 * engine. Opening removes what a crashed ingest left behind (staging directories, versions the
 * catalog does not name). Closing closes everything it opened, the allocator last, so a leaked
 * Arrow buffer fails loudly.
 *
 * @param memoryLimitBytes the Arrow allocator's limit (off-heap buffers for chunk files)
 * @param cacheBytes the chunk cache's heap budget
 */
public final class Workspace implements AutoCloseable {

  private final Path root;
  private final BufferAllocator allocator;
  private final Catalog catalog;
  private final CubeStore store;
  private final ChunkCache cache;
  private final Ingestor ingestor;
  private final QueryEngine engine;
  private final List<CubeSource> sources;

  private Workspace(Path root, long memoryLimitBytes, long cacheBytes, ChunkLayout layout, AreaModel areas) throws IOException {
    this.root = root;
    this.allocator = new RootAllocator(memoryLimitBytes);
    Catalog c = null;
    try {
      c = Catalog.open(root.resolve("catalog.db"));
      this.catalog = c;
      this.store = new CubeStore(root, allocator);
      store.removeUnreferenced(catalog.liveVersionDirs());
      this.cache = new ChunkCache(store, cacheBytes);
      this.sources = loadSources();
      this.ingestor = new Ingestor(sources, catalog, store, layout);
      this.engine = new QueryEngine(catalog, cache, new WeightsCache(256, areas));
    } catch (IOException | RuntimeException e) {
      if (c != null) {
        c.close();
      }
      allocator.close();
      throw e;
    }
  }

  public static Workspace open(Path root) throws IOException {
    return open(root, 1L << 30, defaultCacheBytes(), ChunkLayout.DEFAULT);
  }

  /**
   * The chunk cache's default budget: 512 MB, or a quarter of the heap where that is less, so a
   * server started with a small heap still has room for the requests themselves.
   */
  public static long defaultCacheBytes() {
    return Math.min(512L << 20, Runtime.getRuntime().maxMemory() / 4);
  }

  public static Workspace open(Path root, long memoryLimitBytes, long cacheBytes, ChunkLayout layout) throws IOException {
    return new Workspace(root, memoryLimitBytes, cacheBytes, layout, AreaModel.SPHERE);
  }

  /** Opens with cell areas measured on {@code areas} (the sphere unless told otherwise). */
  public static Workspace open(Path root, AreaModel areas) throws IOException {
    return new Workspace(root, 1L << 30, defaultCacheBytes(), ChunkLayout.DEFAULT, areas);
  }

  private static List<CubeSource> loadSources() {
    List<CubeSource> out = new ArrayList<>();
    ServiceLoader.load(CubeSource.class).forEach(out::add);
    return List.copyOf(out);
  }

  public Path root() {
    return root;
  }

  public Catalog catalog() {
    return catalog;
  }

  public CubeStore store() {
    return store;
  }

  public Ingestor ingestor() {
    return ingestor;
  }

  /**
   * Calls {@code listener} with the report of every cube an ingest changes (created, appended,
   * reprocessed, replaced; not "unchanged"), on the ingesting thread after the catalog commit, so
   * the catalog already shows the new version. A listener that throws is logged and does not fail
   * the ingest. Close the subscription to stop.
   */
  public Ingestor.Subscription onIngest(Consumer<IngestReport> listener) {
    return ingestor.onIngest(listener);
  }

  public QueryEngine engine() {
    return engine;
  }

  public List<CubeSource> sources() {
    return sources;
  }

  public BufferAllocator allocator() {
    return allocator;
  }

  @Override
  public void close() {
    try {
      catalog.close();
    } finally {
      allocator.close();
    }
  }
}
