package org.slackwater.core.ingest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.apache.arrow.memory.RootAllocator;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.VersionRecord;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * A data directory with the {@link SpecSource} for the append tests: catalog, store (with a given
 * grace period for replaced versions), ingestor; and ways to read a cube back whole and to take a
 * snapshot of everything an ingest could change. Closing closes the allocator, so a leak fails.
 */
final class AppendFixture implements AutoCloseable {
  final Path root;
  final RootAllocator allocator = new RootAllocator(64L << 20);
  final Catalog catalog;
  final CubeStore store;
  final Ingestor ingestor;

  /** A small layout (4 steps x 2 rows x 3 columns) so that appends cross chunk boundaries. */
  static final ChunkLayout LAYOUT = new ChunkLayout(4, 2, 3);

  AppendFixture(Path root, Duration grace) throws IOException {
    this.root = root;
    this.catalog = Catalog.open(root.resolve("catalog.db"));
    this.store = new CubeStore(root, allocator, grace);
    this.ingestor = new Ingestor(List.of(new SpecSource()), catalog, store, LAYOUT);
  }

  CubeEntry cube(String name) {
    return catalog.cube(name).orElseThrow();
  }

  /** Every value of a cube version, [step][row * nx + column]. */
  float[][] values(CubeEntry c) throws IOException {
    int nt = c.descriptor().time().size();
    int nx = c.descriptor().grid().nx();
    float[][] out = new float[nt][c.descriptor().grid().cells()];
    for (ChunkRecord r : c.chunks()) {
      float[] v = new float[r.key().values()];
      store.read(c.name(), c.version(), r, v);
      int i = 0;
      for (int t = 0; t < r.key().nt(); t++) {
        for (int y = 0; y < r.key().ny(); y++) {
          for (int x = 0; x < r.key().nx(); x++) {
            out[r.key().t0() + t][(r.key().y0() + y) * nx + r.key().x0() + x] = v[i++];
          }
        }
      }
    }
    return out;
  }

  /** The UTC dates of a cube's steps. */
  static List<LocalDate> dates(CubeEntry c) {
    return java.util.stream.IntStream.range(0, c.descriptor().time().size()).mapToObj(c.descriptor().time()::date).toList();
  }

  /** What an ingest could change: the catalog's cube rows and history, and every stored file's SHA-256. */
  record Snapshot(List<CubeEntry> cubes, Map<String, List<VersionRecord>> history, Map<String, String> files) {}

  Snapshot snapshot(String... cubes) throws IOException {
    Map<String, List<VersionRecord>> h = new TreeMap<>();
    for (String c : cubes) {
      h.put(c, catalog.history(c));
    }
    Map<String, String> files = new TreeMap<>();
    try (Stream<Path> s = Files.walk(root.resolve("cubes"))) {
      for (Path p : (Iterable<Path>) s::iterator) {
        if (Files.isRegularFile(p)) {
          files.put(root.relativize(p).toString(), FileDigest.sha256(p));
        } else if (!p.equals(root.resolve("cubes"))) {
          files.put(root.relativize(p) + "/", "dir");
        }
      }
    }
    return new Snapshot(catalog.cubes(), h, files);
  }

  @Override
  public void close() {
    catalog.close();
    allocator.close();
  }
}
