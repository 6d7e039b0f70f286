package org.slackwater.core.store;

import java.io.IOException;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.LongSupplier;

/**
 * When the files of a version that is no longer current may be deleted.
 *
 * <p>A query takes its {@code CubeEntry} (and so its version) from the catalog once and then reads
 * that version's chunk files for as long as it runs; a publish meanwhile must not pull the files
 * from under it. So a replaced version is <em>retired</em>, not deleted: its directory is removed
 * only once (a) the grace period has passed since it was retired, meant to be longer than any
 * query runs, and (b) no read of it is in flight and no {@link CubeStore#pin pin} holds it. Every
 * chunk read holds a pin while it runs, so a deletion never overlaps a read. A read that comes
 * after the deletion (a query running longer than the grace period) fails with a message saying
 * so, never with a half-read chunk. Versions retired but not yet deleted when the process stops
 * are removed at the next start, as the catalog no longer names them.
 *
 * <p>Thread-safe; the deletion itself runs outside the lock, after the version has been marked
 * removed under it, so no new pin can be taken on a version being deleted.
 */
final class VersionRetirement {

  /** Deletes one version directory. */
  interface Deleter {
    void delete(String cube, int version) throws IOException;
  }

  private record Retired(String cube, int version, long atNanos) {
    String key() {
      return VersionRetirement.key(cube, version);
    }
  }

  private final long graceNanos;
  private final LongSupplier clock;
  private final Deleter deleter;
  private final Map<String, Integer> pins = new HashMap<>();
  private final Set<String> removed = new HashSet<>();
  private final List<Retired> retired = new ArrayList<>();

  VersionRetirement(Duration grace, LongSupplier nanoClock, Deleter deleter) {
    if (grace.isNegative()) {
      throw new IllegalArgumentException("the retirement grace period cannot be negative: " + grace);
    }
    this.graceNanos = grace.toNanos();
    this.clock = nanoClock;
    this.deleter = deleter;
  }

  static String key(String cube, int version) {
    return cube + "/v" + version;
  }

  /** Holds {@code cube} version {@code version}; throws if its files are already gone. */
  void pin(String cube, int version) throws IOException {
    String k = key(cube, version);
    synchronized (this) {
      if (removed.contains(k)) {
        throw new IOException("version " + version + " of cube '" + cube + "' was replaced by a newer version and its files"
            + " were removed while this query ran (it ran longer than the " + Duration.ofNanos(graceNanos).toSeconds()
            + " s the store keeps replaced versions); run the query again to read the current version");
      }
      pins.merge(k, 1, Integer::sum);
    }
  }

  void unpin(String cube, int version) {
    String k = key(cube, version);
    synchronized (this) {
      pins.computeIfPresent(k, (key, n) -> n == 1 ? null : n - 1);
    }
  }

  /** Marks a version for deletion once safe, then deletes whatever is safe to delete now. */
  List<String> retire(String cube, int version) throws IOException {
    synchronized (this) {
      String k = key(cube, version);
      if (!removed.contains(k) && retired.stream().noneMatch(r -> r.key().equals(k))) {
        retired.add(new Retired(cube, version, clock.getAsLong()));
      }
    }
    return sweep();
  }

  /** Deletes every retired version past its grace period that nothing holds; returns their {@code cube/vN} names. */
  List<String> sweep() throws IOException {
    List<Retired> due = new ArrayList<>();
    synchronized (this) {
      long now = clock.getAsLong();
      for (Iterator<Retired> it = retired.iterator(); it.hasNext(); ) {
        Retired r = it.next();
        if (now - r.atNanos() >= graceNanos && !pins.containsKey(r.key())) {
          removed.add(r.key());
          due.add(r);
          it.remove();
        }
      }
    }
    List<String> deleted = new ArrayList<>();
    IOException first = null;
    for (Retired r : due) {
      try {
        deleter.delete(r.cube(), r.version());
        deleted.add(r.key());
      } catch (IOException e) {
        // The catalog no longer names it, so the next start removes what is left.
        first = first == null ? e : first;
      }
    }
    if (first != null) {
      throw first;
    }
    return deleted;
  }

  /** {@code cube/vN} of the versions retired and not yet deleted. */
  synchronized Set<String> pending() {
    Set<String> out = new HashSet<>();
    retired.forEach(r -> out.add(r.key()));
    return out;
  }
}
