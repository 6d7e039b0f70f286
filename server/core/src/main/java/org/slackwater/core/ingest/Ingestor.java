package org.slackwater.core.ingest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.locks.ReentrantLock;
import java.util.function.Consumer;
import java.util.regex.Pattern;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CatalogException;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.Provenance;
import org.slackwater.core.catalog.StepRange;
import org.slackwater.core.catalog.VersionRecord;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.CubeStore;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Turns source files into published cube versions. Each gridded variable of a file (or the one
 * asked for) goes to the cube named after it (lower-cased):
 *
 * <ul>
 *   <li>no such cube: the file becomes it (version 1, or the next number if the name was used);
 *   <li>the file was ingested into the cube's current content before (same SHA-256): nothing
 *       happens, and the report says "already ingested" ({@link IngestReport.Change#UNCHANGED});
 *   <li>otherwise it is appended, if its grid, unit and calendar match ({@link CubeCompatibility})
 *       and its steps fit ({@link AppendPlan}): new steps are added anywhere outside the cube's
 *       steps; steps the cube holds must hold the same values unless the file is a reprocessed
 *       version ({@link IngestOptions}), whose values then replace them. Gaps are allowed and
 *       reported. A file adding nothing is {@code UNCHANGED};
 *   <li>with {@link IngestOptions#replaceCube()} the file replaces the cube whole.
 * </ul>
 *
 * <p>Every variable of a file is opened and checked (including comparing overlapping values)
 * before the first is written, so a file refused for one variable changes nothing. (A disk or
 * read failure while writing the second variable of a file, after the first was committed,
 * leaves the first committed; ingesting the file again then skips it as already ingested.) A version is
 * written to a staging directory, fsynced, renamed, then committed to the catalog with its history
 * record; any failure before the commit deletes what was staged and leaves the catalog and the
 * current version as they were. The replaced version is retired (deleted once no query can still
 * read it, see {@link CubeStore}). After the commits, {@linkplain #onIngest listeners} get the
 * report of every cube that changed.
 *
 * <p>Thread-safe: ingests of the same cube take turns (a lock per cube, taken in name order for
 * files with several variables); ingests of different cubes run side by side.
 */
public final class Ingestor {

  private static final Logger LOG = LoggerFactory.getLogger(Ingestor.class);
  private static final Pattern NAME = Pattern.compile("[a-z_][a-z0-9_]*");

  /** Ends a listener's subscription. */
  public interface Subscription extends AutoCloseable {
    @Override
    void close();
  }

  private final List<CubeSource> sources;
  private final Catalog catalog;
  private final CubeStore store;
  private final ChunkLayout layout;
  private final IngestListeners listeners = new IngestListeners();
  private final Map<String, ReentrantLock> locks = new ConcurrentHashMap<>();

  public Ingestor(List<CubeSource> sources, Catalog catalog, CubeStore store, ChunkLayout layout) {
    this.sources = List.copyOf(sources);
    this.catalog = Objects.requireNonNull(catalog);
    this.store = Objects.requireNonNull(store);
    this.layout = Objects.requireNonNull(layout);
  }

  /** Calls {@code listener} with the report of every cube an ingest changed, after its catalog commit. */
  public Subscription onIngest(Consumer<IngestReport> listener) {
    return listeners.add(listener);
  }

  /** Ingests every gridded variable of {@code file} (or only {@code variable}) with the default options. */
  public List<IngestReport> ingest(Path file, Optional<String> variable) throws IngestException {
    return ingest(file, IngestOptions.of(variable));
  }

  /**
   * Ingests {@code file} as {@code options} say; one report per variable, changed or not.
   *
   * @throws IngestException naming the file, the variable, what is wrong and how to fix it; nothing was changed
   */
  public List<IngestReport> ingest(Path file, IngestOptions options) throws IngestException {
    String label = file.getFileName().toString();
    if (!Files.isRegularFile(file)) {
      throw new IngestException("file " + label + " does not exist or is not a regular file");
    }
    CubeSource source = sources.stream().filter(s -> s.accepts(file)).findFirst()
        .orElseThrow(() -> new IngestException("file " + label + " is not in a format Slackwater reads (readers: "
            + sources.stream().map(CubeSource::name).toList() + "); CF-NetCDF files start with the bytes 'CDF' or '\\211HDF'"));
    List<String> names;
    try {
      names = options.variable().isPresent() ? List.of(options.variable().get()) : source.variables(file);
    } catch (SourceException e) {
      throw new IngestException(e.getMessage(), e);
    }
    if (names.isEmpty()) {
      throw new IngestException("file " + label + " holds no gridded variable with a time axis and 1-D latitude and longitude");
    }
    String sha = sha256(file);
    List<SourceCube> opened = new ArrayList<>();
    List<IngestReport> reports = new ArrayList<>();
    try {
      Map<String, SourceCube> byCube = new LinkedHashMap<>();
      for (String n : names) {
        SourceCube cube = source.open(file, n);
        opened.add(cube);
        String cubeName = cubeName(cube.descriptor(), label);
        SourceCube other = byCube.put(cubeName, cube);
        if (other != null) {
          throw new IngestException("file " + label + ": variables '" + other.descriptor().variable() + "' and '"
              + cube.descriptor().variable() + "' would both become cube '" + cubeName + "'; ingest one of them with the variable option");
        }
      }
      List<ReentrantLock> held = lock(byCube.keySet());
      try {
        List<Planned> plans = new ArrayList<>();
        for (Map.Entry<String, SourceCube> e : byCube.entrySet()) {
          plans.add(plan(e.getKey(), e.getValue(), options, label, sha));
        }
        for (Planned p : plans) {
          reports.add(execute(p, source.name(), label, sha));
        }
      } finally {
        held.forEach(ReentrantLock::unlock);
      }
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
    for (IngestReport r : reports) {
      if (r.changed()) {
        listeners.deliver(r);
      }
    }
    return List.copyOf(reports);
  }

  /** What to do with one variable, decided before anything is written. */
  private sealed interface Planned permits Unchanged, Whole, Append {}

  private record Unchanged(IngestReport report) implements Planned {}

  /** The file becomes the whole cube; {@code current} is the version it replaces, if any. */
  private record Whole(String name, SourceCube cube, Optional<CubeEntry> current, long startNanos) implements Planned {}

  private record Append(String name, SourceCube cube, StoredChunks stored, AppendPlan plan, long startNanos) implements Planned {}

  private Planned plan(String name, SourceCube cube, IngestOptions options, String label, String sha)
      throws IngestException, SourceException {
    long start = System.nanoTime();
    CubeDescriptor d = cube.descriptor();
    String where = "file " + label + ", variable " + d.variable();
    if (d.time().size() == 0) {
      throw new IngestException(where + ": the time axis is empty");
    }
    boolean reprocessed = options.reprocessed() || declaredReprocessed(d, where);
    Optional<CubeEntry> current = catalog.cube(name);
    if (current.isEmpty()) {
      return new Whole(name, cube, current, start);
    }
    CubeEntry c = current.get();
    List<VersionRecord> lineage = catalog.lineage(name);
    Optional<VersionRecord> same = lineage.stream().filter(r -> r.provenance().sourceSha256().equals(sha)).findFirst();
    if (same.isPresent() && (!options.replaceCube() || lineage.size() == 1)) {
      VersionRecord r = same.get();
      return unchanged(c, label, sha, start, "already ingested: version " + r.version() + " of cube '" + name + "' came from "
          + r.provenance().sourceFile() + " (the same SHA-256) at " + r.provenance().ingestedAt());
    }
    if (options.replaceCube()) {
      return new Whole(name, cube, current, start);
    }
    CubeCompatibility.check(name, c.descriptor(), d, where);
    AppendPlan plan = AppendPlan.of(c.descriptor().time(), d.time(), reprocessed, name, where);
    StoredChunks stored = new StoredChunks(store, c);
    if (plan.overlaps() && !plan.reprocessed()) {
      try {
        OverlapCheck.requireSameValues(stored, cube, plan, name, where);
      } catch (IOException e) {
        throw new IngestException(where + ": reading cube '" + name + "' to compare the steps it shares with the file failed,"
            + " nothing changed: " + e.getMessage(), e);
      }
    }
    if (plan.changesNothing()) {
      return unchanged(c, label, sha, start, "its " + d.time().size() + " step(s) are all in cube '" + name + "' already, with the same values");
    }
    return new Append(name, cube, stored, plan, start);
  }

  private static Unchanged unchanged(CubeEntry c, String label, String sha, long start, String note) {
    return new Unchanged(new IngestReport(c.name(), IngestReport.Change.UNCHANGED, c.version(), c.version(), label, sha, Optional.empty(),
        Optional.empty(), List.of(), c.descriptor().time().size(), 0, 0, seconds(start), note));
  }

  private IngestReport execute(Planned p, String reader, String label, String sha) throws IngestException, SourceException {
    if (p instanceof Unchanged u) {
      return u.report();
    }
    if (p instanceof Whole w) {
      return writeWhole(w, reader, label, sha);
    }
    return writeAppend((Append) p, reader, label, sha);
  }

  private IngestReport writeWhole(Whole w, String reader, String label, String sha) throws IngestException, SourceException {
    CubeDescriptor d = w.cube().descriptor();
    int version = catalog.nextVersion(w.name());
    int nt = d.time().size();
    Optional<StepRange> all = Optional.of(new StepRange(0, nt - 1, nt, d.time().instant(0), d.time().instant(nt - 1)));
    boolean[] isNew = new boolean[nt];
    java.util.Arrays.fill(isNew, true);
    List<StepGap> gaps = StepGaps.around(d.time().epochSeconds(), isNew, d.time().alignment());
    VersionRecord.Change change = w.current().isPresent() ? VersionRecord.Change.REPLACED : VersionRecord.Change.CREATED;
    int previous = w.current().map(CubeEntry::version).orElse(0);
    try (CubeStore.Staging staging = store.stage(w.name())) {
      WrittenVersion out = FullCubeWriter.write(staging, w.cube(), layout, w.name());
      staging.publish(version);
      Provenance prov = new Provenance(label, sha, d.variable(), reader, Instant.now());
      CubeEntry entry = new CubeEntry(w.name(), version, d, layout, out.chunks(), out.footprint(), prov);
      commit(entry, new VersionRecord(w.name(), version, previous, change, prov, nt, all, Optional.empty()),
          w.current().map(c -> OptionalInt.of(c.version())).orElse(OptionalInt.empty()), label);
      return new IngestReport(w.name(), IngestReport.Change.valueOf(change.name()), previous, version, label, sha, all, Optional.empty(),
          gaps, nt, out.valuesRead(), out.bytesWritten(), seconds(w.startNanos()), "");
    } catch (IOException e) {
      throw new IngestException("file " + label + ", variable " + d.variable() + ": writing the cube failed, nothing changed: " + e.getMessage(), e);
    }
  }

  private IngestReport writeAppend(Append a, String reader, String label, String sha) throws IngestException, SourceException {
    CubeEntry current = a.stored().entry();
    CubeDescriptor old = current.descriptor();
    CubeDescriptor file = a.cube().descriptor();
    AppendPlan plan = a.plan();
    int version = catalog.nextVersion(a.name());
    TimeAxis axis = new TimeAxis(old.time().calendar(), old.time().units(), old.time().alignment(), plan.combinedAxis());
    Map<String, String> attributes = new HashMap<>(old.attributes());
    attributes.putAll(file.attributes());
    CubeDescriptor d = new CubeDescriptor(old.variable(), old.standardName(), old.longName(), old.units(), old.sourceUnits(),
        old.grid(), axis, attributes);
    VersionRecord.Change change = plan.replaced().isPresent() ? VersionRecord.Change.REPROCESSED : VersionRecord.Change.APPENDED;
    try (CubeStore.Staging staging = store.stage(a.name())) {
      WrittenVersion out = CubeAppender.write(staging, a.stored(), a.cube(), plan, a.name());
      staging.publish(version);
      Provenance prov = new Provenance(label, sha, file.variable(), reader, Instant.now());
      CubeEntry entry = new CubeEntry(a.name(), version, d, current.layout(), out.chunks(), out.footprint(), prov);
      commit(entry, new VersionRecord(a.name(), version, current.version(), change, prov, axis.size(), plan.appended(), plan.replaced()),
          OptionalInt.of(current.version()), label);
      return new IngestReport(a.name(), IngestReport.Change.valueOf(change.name()), current.version(), version, label, sha,
          plan.appended(), plan.replaced(), plan.gaps(axis.alignment()), axis.size(), out.valuesRead(), out.bytesWritten(),
          seconds(a.startNanos()), "");
    } catch (IOException e) {
      throw new IngestException("file " + label + ", variable " + file.variable() + ": writing the new version of cube '" + a.name()
          + "' failed, nothing changed: " + e.getMessage(), e);
    }
  }

  /** Commits, or deletes the renamed version directory if the catalog refuses; then retires the replaced version. */
  private void commit(CubeEntry entry, VersionRecord record, OptionalInt expected, String label) throws IngestException, IOException {
    Optional<Integer> previous;
    try {
      previous = catalog.publish(entry, record, expected);
    } catch (CatalogException e) {
      store.deleteUncommitted(entry.name(), entry.version());
      throw new IngestException("file " + label + ": " + e.getMessage(), e);
    }
    if (previous.isPresent()) {
      try {
        store.retire(entry.name(), previous.get());
      } catch (IOException e) {
        // Committed already; the catalog does not name the old files, so the next start removes them.
        LOG.warn("removing replaced versions of cube '{}' failed; they are removed at the next start: {}", entry.name(), e.getMessage());
      }
    }
  }

  /** Whether the file declares itself a reprocessed version, by the global attribute. */
  private static boolean declaredReprocessed(CubeDescriptor d, String where) throws IngestException {
    String v = d.attributes().get(":" + IngestOptions.REPROCESSED_ATTRIBUTE);
    if (v == null) {
      return false;
    }
    return switch (v.trim().toLowerCase(Locale.ROOT)) {
      case "true" -> true;
      case "false" -> false;
      default -> throw new IngestException(where + ": the global attribute " + IngestOptions.REPROCESSED_ATTRIBUTE + " is '" + v
          + "'; write \"true\" (this file replaces steps the cube holds) or \"false\"");
    };
  }

  private List<ReentrantLock> lock(java.util.Set<String> names) {
    List<ReentrantLock> held = new ArrayList<>();
    for (String n : new TreeSet<>(names)) {
      ReentrantLock l = locks.computeIfAbsent(n, k -> new ReentrantLock());
      l.lock();
      held.add(l);
    }
    return held;
  }

  private static double seconds(long startNanos) {
    return (System.nanoTime() - startNanos) / 1e9;
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
