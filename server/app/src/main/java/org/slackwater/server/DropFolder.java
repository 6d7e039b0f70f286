package org.slackwater.server;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.nio.file.attribute.FileTime;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.LongSupplier;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestOptions;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.ingest.Ingestor;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A directory the server watches for files to ingest: put a file in it and the server ingests or
 * appends it, then moves it to {@code done/} with {@code NAME.report.txt} (what changed), or to
 * {@code failed/} with {@code NAME.reason.txt} (what was wrong, where, and how to fix it; the
 * catalog is then unchanged). Files put in {@code reprocessed/} are ingested as reprocessed
 * versions: their values replace the steps the cube already holds (see {@link IngestOptions}).
 *
 * <p>One background thread polls the directory (every two seconds by default) rather than using
 * {@code java.nio.file.WatchService}, which misses events on network and some container file
 * systems. A file is taken when it is complete, which the poller knows by one of:
 *
 * <ul>
 *   <li>a marker: an empty file {@code NAME.done} beside {@code NAME}, written after {@code NAME}
 *       is complete; the file is then taken at the next poll and the marker removed;
 *   <li>stability: the file's size, modification time and identity are the same at two polls at
 *       least the settle time apart (by default one poll interval). A writer that pauses longer
 *       than that mid-file must use a marker, or write {@code NAME.part} (or {@code .tmp}) and
 *       rename it when done.
 * </ul>
 *
 * <p>Ignored: names starting with a dot, ending in {@code .part} or {@code .tmp}, markers, and
 * directories other than {@code reprocessed/}. Files are taken one at a time in name order (name
 * daily files by date); a late file for a missing day still fits, as it fills a gap. A file left
 * in the directory when the server stopped is taken after the next start; if the server stopped
 * after ingesting a file but before moving it, taking it again is a no-op ("already ingested",
 * same SHA-256) and it moves to {@code done/}. A name already in {@code done/} or {@code failed/}
 * gets a numeric suffix ({@code x-2.nc}) instead of being overwritten.
 *
 * <p>Failure modes: an ingest refusal goes to {@code failed/}; an unexpected error (the catalog
 * database failing) too, with the error as the reason; a file that cannot be moved is logged and
 * left alone until it changes or the server restarts. {@link #close} waits for the file being
 * ingested, then stops.
 */
public final class DropFolder implements AutoCloseable {

  private static final Logger LOG = LoggerFactory.getLogger(DropFolder.class);

  public static final Duration DEFAULT_POLL = Duration.ofSeconds(2);
  public static final String DONE = "done";
  public static final String FAILED = "failed";
  public static final String REPROCESSED = "reprocessed";
  public static final String MARKER = ".done";

  /** What a poll did with one file. */
  public record Outcome(Path file, Path movedTo, boolean ingested, List<IngestReport> reports, String text) {
    public Outcome {
      Objects.requireNonNull(file);
      Objects.requireNonNull(movedTo);
      reports = List.copyOf(reports);
      Objects.requireNonNull(text);
    }
  }

  private record Seen(long size, FileTime modified, Object key, long sinceNanos) {
    boolean sameFile(BasicFileAttributes a) {
      return size == a.size() && modified.equals(a.lastModifiedTime()) && Objects.equals(key, a.fileKey());
    }
  }

  private final Ingestor ingestor;
  private final Path dir;
  private final Path done;
  private final Path failed;
  private final Path reprocessed;
  private final long settleNanos;
  private final LongSupplier clock;
  private final Map<Path, Seen> seen = new HashMap<>();
  /** Files whose move failed, with what they looked like then; skipped until they change. */
  private final Map<Path, Seen> stuck = new HashMap<>();
  private ScheduledExecutorService poller;
  private volatile boolean closing;

  /** For tests: polls only when {@link #pollOnce} is called; time from {@code nanoClock}. */
  DropFolder(Ingestor ingestor, Path dir, Duration settle, LongSupplier nanoClock) throws IOException {
    this.ingestor = Objects.requireNonNull(ingestor);
    this.dir = dir.toAbsolutePath().normalize();
    this.done = this.dir.resolve(DONE);
    this.failed = this.dir.resolve(FAILED);
    this.reprocessed = this.dir.resolve(REPROCESSED);
    this.settleNanos = settle.toNanos();
    this.clock = nanoClock;
    if (Files.exists(this.dir) && !Files.isDirectory(this.dir)) {
      throw new IOException("the drop folder " + this.dir + " is a file, not a directory; give a directory to --drop-folder");
    }
    for (Path p : List.of(this.dir, done, failed, reprocessed)) {
      Files.createDirectories(p);
    }
  }

  /** Watches {@code dir} (created if missing) on a background thread, polling every {@link #DEFAULT_POLL}. */
  public static DropFolder start(Ingestor ingestor, Path dir) throws IOException {
    return start(ingestor, dir, DEFAULT_POLL, DEFAULT_POLL);
  }

  /** As above, polling every {@code poll}; a file unmarked is taken once unchanged for {@code settle}. */
  public static DropFolder start(Ingestor ingestor, Path dir, Duration poll, Duration settle) throws IOException {
    DropFolder d = new DropFolder(ingestor, dir, settle, System::nanoTime);
    d.poller = Executors.newSingleThreadScheduledExecutor(r -> {
      Thread t = new Thread(r, "slackwater-drop-folder");
      t.setDaemon(true);
      return t;
    });
    d.poller.scheduleWithFixedDelay(d::pollLogged, 0, poll.toMillis(), TimeUnit.MILLISECONDS);
    LOG.info("watching the drop folder {} every {} ms", d.dir, poll.toMillis());
    return d;
  }

  public Path directory() {
    return dir;
  }

  private void pollLogged() {
    try {
      pollOnce();
    } catch (IOException | RuntimeException e) {
      // Listing failed (the folder was removed, a permission changed): try again at the next poll.
      LOG.warn("polling the drop folder {} failed: {}", dir, e.toString());
    }
  }

  /** One poll: notes new and changed files, and ingests those that are complete, one at a time. */
  synchronized List<Outcome> pollOnce() throws IOException {
    long now = clock.getAsLong();
    List<Candidate> ready = new ArrayList<>();
    Set<Path> present = new HashSet<>();
    scan(dir, false, now, present, ready);
    scan(reprocessed, true, now, present, ready);
    seen.keySet().retainAll(present);
    stuck.keySet().retainAll(present);
    ready.sort(Comparator.comparing((Candidate c) -> c.file().getFileName().toString()).thenComparing(c -> c.file().toString()));
    List<Outcome> out = new ArrayList<>();
    for (Candidate c : ready) {
      if (closing) {
        break;
      }
      out.add(take(c));
    }
    return out;
  }

  private record Candidate(Path file, boolean reprocessed, BasicFileAttributes attrs, Path marker) {}

  private void scan(Path folder, boolean asReprocessed, long now, Set<Path> present, List<Candidate> ready) throws IOException {
    List<Path> entries = new ArrayList<>();
    try (DirectoryStream<Path> s = Files.newDirectoryStream(folder)) {
      s.forEach(entries::add);
    }
    for (Path p : entries) {
      String name = p.getFileName().toString();
      if (ignored(name) || !Files.isRegularFile(p)) {
        continue;
      }
      BasicFileAttributes a;
      try {
        a = Files.readAttributes(p, BasicFileAttributes.class);
      } catch (IOException gone) {
        continue; // renamed or deleted since the listing
      }
      present.add(p);
      Seen stuckAs = stuck.get(p);
      if (stuckAs != null && stuckAs.sameFile(a)) {
        continue;
      }
      stuck.remove(p);
      Path marker = p.resolveSibling(name + MARKER);
      Seen before = seen.get(p);
      if (Files.exists(marker)) {
        ready.add(new Candidate(p, asReprocessed, a, marker));
      } else if (before != null && before.sameFile(a)) {
        if (now - before.sinceNanos() >= settleNanos) {
          ready.add(new Candidate(p, asReprocessed, a, null));
        }
      } else {
        seen.put(p, new Seen(a.size(), a.lastModifiedTime(), a.fileKey(), now));
      }
    }
  }

  static boolean ignored(String name) {
    return name.startsWith(".") || name.endsWith(".part") || name.endsWith(".tmp") || name.endsWith(MARKER);
  }

  /** Ingests one complete file and moves it with its report or reason. */
  private Outcome take(Candidate c) {
    Path file = c.file();
    String name = file.getFileName().toString();
    IngestOptions options = c.reprocessed() ? IngestOptions.defaults().asReprocessed() : IngestOptions.defaults();
    Instant when = Instant.now();
    List<IngestReport> reports = List.of();
    boolean ok;
    String text;
    try {
      reports = ingestor.ingest(file, options);
      ok = true;
      text = report(name, c.reprocessed(), when, reports);
    } catch (IngestException e) {
      ok = false;
      text = reason(name, c.reprocessed(), when, e.getMessage());
    } catch (RuntimeException e) {
      LOG.error("ingesting {} from the drop folder failed unexpectedly", file, e);
      ok = false;
      text = reason(name, c.reprocessed(), when, "the server failed while ingesting it (" + e.getMessage()
          + "); nothing was changed. This is not a problem of the file: check the server log, then put the file back");
    }
    Path target = file;
    try {
      target = unique(ok ? done : failed, name);
      Files.writeString(target.resolveSibling(target.getFileName() + (ok ? ".report.txt" : ".reason.txt")), text, StandardCharsets.UTF_8);
      Files.move(file, target, StandardCopyOption.ATOMIC_MOVE);
      if (c.marker() != null) {
        Files.deleteIfExists(c.marker());
      }
      seen.remove(file);
      LOG.info("drop folder: {} -> {}{}", name, dir.relativize(target), ok ? "" : " (" + firstLine(text) + ")");
    } catch (IOException e) {
      LOG.error("drop folder: {} was {} but cannot be moved to {}: {}; it stays until it changes or the server restarts",
          name, ok ? "ingested" : "refused", target, e.toString());
      stuck.put(file, new Seen(c.attrs().size(), c.attrs().lastModifiedTime(), c.attrs().fileKey(), 0));
    }
    return new Outcome(file, target, ok, reports, text);
  }

  /** {@code folder/name}, or {@code folder/base-N.ext} with the smallest N from 2 that is free (report and reason included). */
  private static Path unique(Path folder, String name) {
    int dot = name.lastIndexOf('.');
    String base = dot > 0 ? name.substring(0, dot) : name;
    String ext = dot > 0 ? name.substring(dot) : "";
    Path p = folder.resolve(name);
    for (int n = 2; taken(p); n++) {
      p = folder.resolve(base + "-" + n + ext);
    }
    return p;
  }

  private static boolean taken(Path p) {
    String n = p.getFileName().toString();
    return Files.exists(p) || Files.exists(p.resolveSibling(n + ".report.txt")) || Files.exists(p.resolveSibling(n + ".reason.txt"));
  }

  private static String report(String name, boolean reprocessed, Instant when, List<IngestReport> reports) {
    StringBuilder b = new StringBuilder();
    b.append("Slackwater ingested ").append(name).append(" at ").append(when).append(reprocessed
        ? " as a reprocessed version (it was in " + REPROCESSED + "/).\n" : ".\n");
    if (!reports.isEmpty()) {
      b.append("SHA-256: ").append(reports.get(0).sourceSha256()).append('\n');
    }
    for (IngestReport r : reports) {
      b.append(r.summary()).append('\n');
    }
    return b.toString();
  }

  private String reason(String name, boolean reprocessed, Instant when, String message) {
    return "Slackwater could not ingest " + name + " (taken from " + (reprocessed ? REPROCESSED + "/" : "the drop folder") + " at "
        + when + "). Nothing was changed in the catalog.\n\n"
        + "What is wrong:\n  " + message + "\n\n"
        + "To try again, correct the file and put it back into the drop folder " + dir + ":\n"
        + "  - directly, to add new steps to its cube (steps the cube holds must have the same values);\n"
        + "  - into " + REPROCESSED + "/, if it is a reprocessed version whose values replace steps the cube holds.\n"
        + "Write large files as NAME.part and rename them when complete, or add an empty NAME" + MARKER + " afterwards.\n";
  }

  private static String firstLine(String text) {
    int at = text.indexOf("What is wrong:\n  ");
    String s = at < 0 ? text : text.substring(at + "What is wrong:\n  ".length());
    int nl = s.indexOf('\n');
    return nl < 0 ? s : s.substring(0, nl);
  }

  /** Stops polling after the file being ingested, if any; waits up to a minute for it. */
  @Override
  public void close() {
    closing = true;
    if (poller == null) {
      return;
    }
    poller.shutdown();
    try {
      if (!poller.awaitTermination(1, TimeUnit.MINUTES)) {
        poller.shutdownNow();
      }
    } catch (InterruptedException e) {
      poller.shutdownNow();
      Thread.currentThread().interrupt();
    }
  }
}
