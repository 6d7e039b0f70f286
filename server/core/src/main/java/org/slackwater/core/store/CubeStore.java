package org.slackwater.core.store;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.Comparator;
import java.util.Set;
import java.util.UUID;
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
 */
public final class CubeStore {

  private final Path cubesDir;
  private final BufferAllocator allocator;

  /** The allocator is borrowed, not owned: the caller closes it after the store is no longer used. */
  public CubeStore(Path root, BufferAllocator allocator) {
    this.cubesDir = root.resolve("cubes");
    this.allocator = allocator;
    try {
      Files.createDirectories(cubesDir);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot create the data directory " + cubesDir, e);
    }
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

  /** Reads one chunk of a published version into {@code dest}. */
  public void read(String cube, int version, ChunkRecord chunk, float[] dest) throws IOException {
    ChunkCodec.read(allocator, versionDir(cube, version).resolve(chunk.file()), chunk.key(), dest);
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

  /** Deletes a published version's files (after the catalog has moved on from it). */
  public void deleteVersion(String cube, int version) throws IOException {
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

  /** A version being written. Not thread-safe. */
  public final class Staging implements AutoCloseable {
    private final String cube;
    private final Path dir;
    private boolean published;

    private Staging(String cube, Path dir) {
      this.cube = cube;
      this.dir = dir;
    }

    public ChunkRecord write(ChunkKey key, float[] values) throws IOException {
      return ChunkCodec.write(allocator, dir.resolve(key.fileName()), key, values);
    }

    /** Renames the staging directory to version {@code version}; the catalog commit must follow. */
    public Path publish(int version) throws IOException {
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

    /** Deletes the staging directory unless it was published. */
    @Override
    public void close() throws IOException {
      if (!published) {
        deleteTree(dir);
      }
    }
  }
}
