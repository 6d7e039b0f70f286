package org.slackwater.core.store;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Forces written chunk files to disk on background threads, so that the disk flushes one chunk
 * while the ingest encodes the next, and several flushes can share one file-system journal commit.
 * Forcing each file in the writing thread made an ingest wait for the disk once per chunk, which
 * cost about as much as all the computing.
 *
 * <p>{@link #submit} takes ownership of an open channel: it is forced ({@code fsync}) and closed on
 * a worker. At most {@link #MAX_PENDING} channels are outstanding; {@code submit} blocks beyond
 * that, which bounds open file descriptors and lets a slow disk slow the writer down.
 * {@link #awaitAll} returns once every submitted file is on disk, or throws the first failure
 * (naming the file): only after it returns may the files' directory be published. {@code submit}
 * may be called from several threads at once; {@code awaitAll} and {@code close} only once no
 * {@code submit} is running any more.
 */
final class BackgroundForce implements AutoCloseable {

  /** Concurrent fsyncs: two kept the measured disk busy; more only added threads. */
  private static final int THREADS = 2;
  static final int MAX_PENDING = 16;

  private static final AtomicInteger SERIAL = new AtomicInteger();

  private final ExecutorService workers;
  private final Semaphore slots = new Semaphore(MAX_PENDING);
  private final AtomicReference<IOException> failure = new AtomicReference<>();

  BackgroundForce(String label) {
    int serial = SERIAL.incrementAndGet();
    AtomicInteger thread = new AtomicInteger();
    workers = Executors.newFixedThreadPool(THREADS, r -> {
      Thread t = new Thread(r, "slackwater-fsync-" + label + "-" + serial + "-" + thread.incrementAndGet());
      t.setDaemon(true); // never keeps the JVM alive; close() waits for the work that matters
      return t;
    });
  }

  /** Forces and closes {@code channel} (the file {@code file}) in the background. */
  void submit(FileChannel channel, Path file) throws IOException {
    throwFailure();
    try {
      slots.acquire();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      closeQuietly(channel);
      throw new InterruptedIOException("interrupted while waiting to force " + file);
    }
    try {
      workers.execute(() -> force(channel, file));
    } catch (RuntimeException e) {
      finished(new IOException("cannot force " + file + ": " + e, e));
      closeQuietly(channel);
      throw e;
    }
  }

  private void force(FileChannel channel, Path file) {
    IOException failed = null;
    try {
      channel.force(true);
    } catch (IOException e) {
      failed = new IOException("forcing chunk file " + file + " to disk failed: " + e.getMessage(), e);
    } finally {
      try {
        channel.close();
      } catch (IOException e) {
        // A close error after a successful force can still mean lost data (NFS reports late).
        if (failed == null) {
          failed = new IOException("closing chunk file " + file + " failed: " + e.getMessage(), e);
        }
      }
      finished(failed);
    }
  }

  private void finished(IOException failed) {
    if (failed != null) {
      failure.compareAndSet(null, failed);
    }
    slots.release(); // after recording the failure, so awaitAll sees it
  }

  /**
   * Waits until every submitted file is forced and closed (all slots are free again: no submit
   * runs meanwhile, so none is taken); throws the first failure.
   */
  void awaitAll() throws IOException {
    try {
      slots.acquire(MAX_PENDING);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new InterruptedIOException("interrupted while waiting for chunk files to reach the disk");
    }
    slots.release(MAX_PENDING);
    throwFailure();
  }

  private void throwFailure() throws IOException {
    IOException first = failure.get();
    if (first != null) {
      throw new IOException(first.getMessage(), first);
    }
  }

  /**
   * Lets the outstanding forces finish (so no channel stays open and no worker touches files the
   * caller is about to delete), then stops the workers. Failures are not reported here.
   */
  @Override
  public void close() {
    workers.shutdown();
    boolean interrupted = false;
    while (true) {
      try {
        if (workers.awaitTermination(1, TimeUnit.MINUTES)) {
          break;
        }
      } catch (InterruptedException e) {
        interrupted = true;
      }
    }
    if (interrupted) {
      Thread.currentThread().interrupt();
    }
  }

  private static void closeQuietly(FileChannel channel) {
    try {
      channel.close();
    } catch (IOException ignored) {
      // the file is abandoned; its staging directory is deleted
    }
  }
}
