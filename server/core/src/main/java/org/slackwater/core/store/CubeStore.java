package org.slackwater.core.store;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import java.util.UUID;
import java.util.concurrent.ConcurrentLinkedDeque;
import java.util.stream.Stream;
import org.apache.arrow.memory.BufferAllocator;

/**
 * The chunk files of every cube, under {@code <root>/cubes/<cube>/v<version>/}.
 *
 * <p>Publishing is atomic: chunks are written into a staging directory ({@code .staging-<uuid>})
 * and fsynced, the directory is renamed to its version name and the parent fsynced; only then does
 * the caller commit the catalog row. A crash before the commit leaves a directory no catalog row
 * names, which {@link #removeUnreferenced} deletes at the next start; the previous version is
 * untouched throughout.
 *
 * <p>The fsync of each chunk file runs in the background ({@link BackgroundForce}) while later
 * chunks are encoded, but {@link Staging#publish} first waits for every one of them and fails if
 * any failed, and then fsyncs the staging directory itself; so at the rename, as before, every
 * file and every directory entry of the version is on disk. The order on disk is therefore: all
 * chunk files, the staging directory, the rename (parent directory), the catalog row.
 *
 * <p>A new version that keeps chunks of the current one (an append rewrites only the time chunks
 * it touches) {@linkplain Staging#reuse hard-links} those chunk files into its staging directory:
 * chunk files are never written twice, so two versions may share one file, and deleting a version
 * directory leaves the other's links intact. File systems without hard links get a copy.
 *
 * <p>A version that stops being current is {@linkplain #retire retired}: its files stay while
 * queries may still read it (see {@link VersionRetirement}) and are deleted once safe, at a later
 * retirement or {@link #sweepRetired sweep}, or at the next start.
 */
public final class CubeStore {

  /** How long a replaced version stays readable: longer than any query is expected to run. */
  public static final Duration DEFAULT_RETIRE_GRACE = Duration.ofMinutes(10);

  private final Path cubesDir;
  private final BufferAllocator allocator;
  private final VersionRetirement retirement;

  /** The allocator is borrowed, not owned: the caller closes it after the store is no longer used. */
  public CubeStore(Path root, BufferAllocator allocator) {
    this(root, allocator, DEFAULT_RETIRE_GRACE);
  }

  /** As above, keeping replaced versions for {@code retireGrace} (zero: as soon as no read holds them). */
  public CubeStore(Path root, BufferAllocator allocator, Duration retireGrace) {
    this.cubesDir = root.resolve("cubes");
    this.allocator = allocator;
    this.retirement = new VersionRetirement(retireGrace, System::nanoTime, (cube, version) -> deleteTree(versionDir(cube, version)));
    try {
      Files.createDirectories(cubesDir);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot create the data directory " + cubesDir, e);
    }
  }

  /** Keeps a version's files from being deleted until closed. */
  public interface Pin extends AutoCloseable {
    @Override
    void close();
  }

  public BufferAllocator allocator() {
    return allocator;
  }

  /** A new, empty staging directory for the next version of {@code cube}. */
  public Staging stage(String cube) throws IOException {
    Path dir = cubesDir.resolve(cube).resolve(".staging-" + UUID.randomUUID());
    Files.createDirectories(dir);
    return new Staging(cube, dir);
  }

  /** Where version {@code version} of {@code cube} lives. */
  public Path versionDir(String cube, int version) {
    return cubesDir.resolve(cube).resolve("v" + version);
  }

  /**
   * Reads one chunk of a published version into {@code dest}, holding the version while it reads.
   *
   * @throws IOException also when the version was retired and deleted before the read began
   */
  public void read(String cube, int version, ChunkRecord chunk, float[] dest) throws IOException {
    try (Pin p = pin(cube, version)) {
      ChunkCodec.read(allocator, versionDir(cube, version).resolve(chunk.file()), chunk.key(), dest);
    }
  }

  /**
   * Holds a version's files until the pin is closed, for a reader that wants a version to outlive
   * the grace period (a long export).
   *
   * @throws IOException if the version was retired and its files are gone already
   */
  public Pin pin(String cube, int version) throws IOException {
    retirement.pin(cube, version);
    return () -> retirement.unpin(cube, version);
  }

  /**
   * Marks a version that the catalog no longer names for deletion once no reader can still be using
   * it, and deletes every retired version that is safe to delete now.
   *
   * @return the {@code cube/vN} directories deleted by this call
   */
  public List<String> retire(String cube, int version) throws IOException {
    return retirement.retire(cube, version);
  }

  /** Deletes the retired versions that are safe to delete now; returns their {@code cube/vN} names. */
  public List<String> sweepRetired() throws IOException {
    return retirement.sweep();
  }

  /** The {@code cube/vN} names of versions retired and not deleted yet. */
  public Set<String> retiredVersions() {
    return retirement.pending();
  }

  /**
   * Deletes staging directories and version directories that the catalog does not reference.
   *
   * @param live the {@code cube/vN} names the catalog references
   */
  public void removeUnreferenced(Set<String> live) throws IOException {
    try (DirectoryStream<Path> cubes = Files.newDirectoryStream(cubesDir)) {
      for (Path cube : cubes) {
        if (!Files.isDirectory(cube)) {
          continue;
        }
        try (DirectoryStream<Path> versions = Files.newDirectoryStream(cube)) {
          for (Path v : versions) {
            String key = cube.getFileName() + "/" + v.getFileName();
            if (!live.contains(key)) {
              deleteTree(v);
            }
          }
        }
      }
    }
  }

  /**
   * Removes a published version's files after the catalog has moved on from it: the same as {@link
   * #retire}, so queries still reading it are not cut short.
   */
  public void deleteVersion(String cube, int version) throws IOException {
    retire(cube, version);
  }

  /**
   * Deletes at once a version that was renamed into place but whose catalog commit failed: no
   * reader has ever seen it.
   */
  public void deleteUncommitted(String cube, int version) throws IOException {
    deleteTree(versionDir(cube, version));
  }

  static void deleteTree(Path dir) throws IOException {
    if (!Files.exists(dir)) {
      return;
    }
    try (Stream<Path> walk = Files.walk(dir)) {
      for (Path p : (Iterable<Path>) walk.sorted(Comparator.reverseOrder())::iterator) {
        Files.deleteIfExists(p);
      }
    }
  }

  static void fsyncDirectory(Path dir) throws IOException {
    // Linux allows opening a directory read-only to force its entries to disk; elsewhere skip.
    try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
      ch.force(true);
    } catch (IOException | UnsupportedOperationException e) {
      if (System.getProperty("os.name", "").toLowerCase().contains("linux")) {
        throw e instanceof IOException io ? io : new IOException(e);
      }
    }
  }

  /**
   * A version being written. {@link #write} may be called from several threads at once (chunks are
   * independent files); {@link #publish} and {@link #close} are called by one thread after every
   * {@code write} has returned to it (a {@code Future.get} or a join is enough).
   */
  public final class Staging implements AutoCloseable {
    private final String cube;
    private final Path dir;
    private final BackgroundForce force;
    /** Encoders not in use; a writing thread takes one, so there are as many as concurrent writers. */
    private final ConcurrentLinkedDeque<ChunkEncoder> encoders = new ConcurrentLinkedDeque<>();
    private boolean published;

    private Staging(String cube, Path dir) {
      this.cube = cube;
      this.dir = dir;
      this.force = new BackgroundForce(cube);
    }

    /**
     * Writes one chunk file. It is on disk only once {@link #publish} has returned; a failure to
     * force it surfaces from a later {@code write} or from {@code publish}.
     */
    public ChunkRecord write(ChunkKey key, float[] values) throws IOException {
      Path file = dir.resolve(key.fileName());
      ChunkEncoder encoder = Objects.requireNonNullElseGet(encoders.poll(), () -> new ChunkEncoder(allocator));
      try {
        FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        ChunkRecord rec;
        try {
          rec = encoder.write(ch, key.fileName(), key, values);
        } catch (IOException | RuntimeException | Error e) {
          try {
            ch.close();
          } catch (IOException closing) {
            e.addSuppressed(closing);
          }
          throw e;
        }
        force.submit(ch, file);
        return rec;
      } finally {
        encoders.push(encoder);
      }
    }

    /**
     * Puts chunk {@code rec} of version {@code fromVersion} (the current one) into this version
     * unchanged: a hard link to the same file, or a copy forced to disk where the file system has
     * no hard links. The record, checksum included, stays valid.
     *
     * @throws IOException if the source file is missing or not the size the record says
     */
    public ChunkRecord reuse(int fromVersion, ChunkRecord rec) throws IOException {
      Path from = versionDir(cube, fromVersion).resolve(rec.file());
      Path to = dir.resolve(rec.file());
      long size = Files.size(from);
      if (size != rec.bytes()) {
        throw new IOException("chunk file " + from + " is " + size + " bytes but the catalog records " + rec.bytes()
            + "; the store is damaged: restore the data directory from a backup or re-ingest the cube");
      }
      try {
        Files.createLink(to, from);
      } catch (UnsupportedOperationException | FileSystemException e) {
        Files.deleteIfExists(to);
        Files.copy(from, to);
        force.submit(FileChannel.open(to, StandardOpenOption.WRITE), to);
      }
      return rec;
    }

    /**
     * Waits until every chunk file is on disk, fsyncs the staging directory, renames it to version
     * {@code version} and fsyncs the parent; the catalog commit must follow.
     */
    public Path publish(int version) throws IOException {
      force.awaitAll();
      Path target = versionDir(cube, version);
      if (Files.exists(target)) {
        // Left over from a crash between rename and catalog commit: no row references it.
        deleteTree(target);
      }
      fsyncDirectory(dir);
      try {
        Files.move(dir, target, StandardCopyOption.ATOMIC_MOVE);
      } catch (AtomicMoveNotSupportedException e) {
        throw new IOException("the data directory's file system cannot rename atomically: " + dir, e);
      }
      fsyncDirectory(target.getParent());
      published = true;
      return target;
    }

    /** Waits for outstanding background work, then deletes the staging directory unless it was published. */
    @Override
    public void close() throws IOException {
      force.close();
      for (ChunkEncoder e; (e = encoders.poll()) != null; ) {
        e.close();
      }
      if (!published) {
        deleteTree(dir);
      }
    }
  }
}
