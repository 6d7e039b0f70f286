package org.slackwater.core.ingest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Pattern;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CatalogException;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.Provenance;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * Turns a source file into published cube versions: reads each variable band by band (a chunk's
 * worth of steps by a tile's worth of rows, all columns), cuts the band into chunks, writes them
 * to a staging directory, then publishes (rename, then catalog commit). Any failure deletes the
 * staging directory and leaves the catalog and the previous version as they were.
 *
 * <p>Reading and writing overlap: this thread reads and decodes bands and records the footprint
 * while the {@link ChunkWriter}'s threads encode and write the chunks already read, and the store
 * forces written files to disk in the background; publishing waits for all of it.
 *
 * <p>All variables of a file are opened and checked before the first is written, so a file with
 * one bad variable changes nothing.
 */
public final class Ingestor {

  private static final Pattern NAME = Pattern.compile("[a-z_][a-z0-9_]*");

  private final List<CubeSource> sources;
  private final Catalog catalog;
  private final CubeStore store;
  private final ChunkLayout layout;

  public Ingestor(List<CubeSource> sources, Catalog catalog, CubeStore store, ChunkLayout layout) {
    this.sources = List.copyOf(sources);
    this.catalog = Objects.requireNonNull(catalog);
    this.store = Objects.requireNonNull(store);
    this.layout = Objects.requireNonNull(layout);
  }

  /**
   * Ingests every gridded variable of {@code file} (or only {@code variable}), each as the cube
   * named after the variable (lower-cased).
   */
  public List<IngestReport> ingest(Path file, Optional<String> variable) throws IngestException {
    String label = file.getFileName().toString();
    if (!Files.isRegularFile(file)) {
      throw new IngestException("file " + label + " does not exist or is not a regular file");
    }
    CubeSource source = sources.stream().filter(s -> s.accepts(file)).findFirst()
        .orElseThrow(() -> new IngestException("file " + label + " is not in a format Slackwater reads (readers: "
            + sources.stream().map(CubeSource::name).toList() + "); CF-NetCDF files start with the bytes 'CDF' or '\\211HDF'"));
    List<String> names;
    try {
      names = variable.isPresent() ? List.of(variable.get()) : source.variables(file);
    } catch (SourceException e) {
      throw new IngestException(e.getMessage(), e);
    }
    if (names.isEmpty()) {
      throw new IngestException("file " + label + " holds no gridded variable with a time axis and 1-D latitude and longitude");
    }
    String sha = sha256(file);
    List<SourceCube> opened = new ArrayList<>();
    try {
      for (String n : names) {
        SourceCube cube = source.open(file, n);
        opened.add(cube);
        cubeName(cube.descriptor(), label);
      }
      List<IngestReport> reports = new ArrayList<>();
      for (SourceCube cube : opened) {
        reports.add(publish(cube, source.name(), label, sha));
      }
      return reports;
    } catch (SourceException e) {
      throw new IngestException(e.getMessage(), e);
    } finally {
      for (SourceCube c : opened) {
        try {
          c.close();
        } catch (SourceException ignored) {
          // Reading finished or failed already; a close failure adds nothing for the user.
        }
      }
    }
  }

  private IngestReport publish(SourceCube cube, String reader, String label, String sha) throws IngestException, SourceException {
    long start = System.nanoTime();
    CubeDescriptor d = cube.descriptor();
    String name = cubeName(d, label);
    LatLonGrid grid = d.grid();
    int nt = d.time().size(), ny = grid.ny(), nx = grid.nx();
    if (nt == 0) {
      throw new IngestException("file " + label + ", variable " + d.variable() + ": the time axis is empty");
    }
    int version = catalog.nextVersion(name);
    BitSet present = new BitSet(ny * nx);
    int steps = Math.min(layout.steps(), nt);
    int rows = Math.min(layout.rows(), ny);
    // When a tile spans all columns the band already is the chunk, in the same (time, row, column)
    // order, and is read straight into a writer buffer; otherwise tiles are cut from the band.
    boolean tiled = nx > layout.columns();
    List<ChunkRecord> chunks;
    long bytes = 0;
    try (CubeStore.Staging staging = store.stage(name);
        ChunkWriter writer = new ChunkWriter(staging, steps * rows * (tiled ? layout.columns() : nx), name)) {
      float[] band = tiled ? new float[steps * rows * nx] : null;
      int[] todo = new int[rows * nx];
      for (int t0 = 0; t0 < nt; t0 += layout.steps()) {
        int ct = Math.min(layout.steps(), nt - t0);
        for (int y0 = 0; y0 < ny; y0 += layout.rows()) {
          int cy = Math.min(layout.rows(), ny - y0);
          float[] target = tiled ? band : writer.buffer();
          cube.read(t0, ct, y0, cy, 0, nx, target);
          markPresent(target, ct, cy, nx, y0, todo, present);
          if (!tiled) {
            writer.write(new ChunkKey(t0, y0, 0, ct, cy, nx), target);
            continue;
          }
          for (int x0 = 0; x0 < nx; x0 += layout.columns()) {
            int cx = Math.min(layout.columns(), nx - x0);
            writer.write(new ChunkKey(t0, y0, x0, ct, cy, cx), cut(band, ct, cy, nx, x0, cx, writer.buffer()));
          }
        }
      }
      chunks = writer.finish();
      for (ChunkRecord rec : chunks) {
        bytes += rec.bytes();
      }
      staging.publish(version);
      CubeEntry entry = new CubeEntry(name, version, d, layout, chunks, new Footprint(ny * nx, present),
          new Provenance(label, sha, d.variable(), reader, Instant.now()));
      Optional<Integer> previous;
      try {
        previous = catalog.publish(entry);
      } catch (CatalogException e) {
        store.deleteVersion(name, version);
        throw new IngestException("file " + label + ": " + e.getMessage(), e);
      }
      if (previous.isPresent()) {
        store.deleteVersion(name, previous.get());
      }
    } catch (IOException e) {
      throw new IngestException("file " + label + ", variable " + d.variable() + ": writing the cube failed, nothing changed: " + e.getMessage(), e);
    }
    return new IngestReport(name, version, (long) nt * ny * nx, bytes, (System.nanoTime() - start) / 1e9);
  }

  /** Copies columns {@code [x0, x0+cx)} of every step and row of the band into {@code tile}. */
  private static float[] cut(float[] band, int ct, int cy, int nx, int x0, int cx, float[] tile) {
    for (int t = 0; t < ct; t++) {
      for (int y = 0; y < cy; y++) {
        System.arraycopy(band, (t * cy + y) * nx + x0, tile, (t * cy + y) * cx, cx);
      }
    }
    return tile;
  }

  /**
   * Sets the bit of every cell of the band that has a value at some step. Walks the band step by
   * step over a shrinking list of cells not yet seen with a value: a cell leaves the list at its
   * first value, so after a few steps only never-valid (land) cells are visited. Branch-free, as
   * the gaps of cloudy data are too irregular for branch prediction.
   */
  private static void markPresent(float[] band, int nt, int ny, int nx, int y0, int[] todo, BitSet present) {
    int cells = ny * nx;
    int left = cells;
    for (int c = 0; c < cells; c++) {
      todo[c] = c;
    }
    for (int t = 0; t < nt && left > 0; t++) {
      int base = t * cells;
      int kept = 0;
      for (int i = 0; i < left; i++) {
        int c = todo[i];
        todo[kept] = c;
        kept += 1 - presentBit(band[base + c]);
      }
      left = kept;
    }
    // The cells still listed (in ascending order: the compaction keeps order) never had a value.
    for (int c = 0, k = 0; c < cells; c++) {
      if (k < left && todo[k] == c) {
        k++;
      } else {
        present.set(y0 * nx + c);
      }
    }
  }

  /** 1 if {@code f} is a value, 0 if it is NaN (missing), without a branch. */
  private static int presentBit(float f) {
    // NaN is exactly the magnitudes above infinity's bit pattern 0x7f800000.
    return ((Float.floatToRawIntBits(f) & 0x7fffffff) - 0x7f800001) >>> 31;
  }

  private static String cubeName(CubeDescriptor d, String label) throws IngestException {
    String name = d.variable().toLowerCase(Locale.ROOT);
    if (!NAME.matcher(name).matches()) {
      throw new IngestException("file " + label + ", variable '" + d.variable()
          + "': cube names must be letters, digits and underscores starting with a letter; rename the variable");
    }
    return name;
  }

  private static String sha256(Path file) throws IngestException {
    try {
      return FileDigest.sha256(file);
    } catch (IOException e) {
      throw new IngestException("file " + file.getFileName() + " cannot be read: " + e.getMessage(), e);
    }
  }

}
