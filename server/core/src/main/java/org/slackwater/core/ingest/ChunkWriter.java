package org.slackwater.core.ingest;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.UncheckedIOException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

/**
 * Writes the chunks of one staged cube version on writer threads, so that encoding chunks
 * (validity bitmap, Arrow IPC framing, SHA-256, the write itself) overlaps with reading and
 * decoding the next band on the ingesting thread. Writing a chunk costs about twice as much CPU as
 * reading it, so two writers keep both cores of a small machine busy; chunks are independent
 * files, so they may be written in any order.
 *
 * <p>Values travel in a small pool of buffers: {@link #buffer} hands out a free one (blocking
 * while all are being written), the caller fills it and passes it to {@link #write}, after which
 * the buffer belongs to the writer until {@code buffer} hands it out again. {@link #finish} waits
 * for every chunk and returns the records in the order the chunks were given.
 *
 * <p>Failure modes: a write failure surfaces as its {@link IOException} from the next {@code
 * write} or from {@code finish} (the ingest then stops reading); {@link #close} always waits for
 * the writer to stop touching the staging directory, so the caller may delete it afterwards. Used
 * by one ingesting thread.
 */
final class ChunkWriter implements AutoCloseable {

  private static final int WRITERS = 2;
  /** One buffer per writer, one waiting, one being filled. */
  private static final int BUFFERS = WRITERS + 2;

  private final CubeStore.Staging staging;
  private final int bufferValues;
  private final ExecutorService writer;
  private final BlockingQueue<float[]> free = new ArrayBlockingQueue<>(BUFFERS);
  private final ArrayDeque<Future<ChunkRecord>> pending = new ArrayDeque<>();
  private final List<ChunkRecord> written = new ArrayList<>();
  private int allocated;

  ChunkWriter(CubeStore.Staging staging, int bufferValues, String cube) {
    this.staging = staging;
    this.bufferValues = bufferValues;
    AtomicInteger serial = new AtomicInteger();
    this.writer = Executors.newFixedThreadPool(WRITERS, r -> {
      Thread t = new Thread(r, "slackwater-ingest-" + cube + "-" + serial.incrementAndGet());
      t.setDaemon(true);
      return t;
    });
  }

  /** A buffer of at least the chunk size given at construction, free to fill. */
  float[] buffer() throws IOException {
    float[] b = free.poll();
    if (b != null) {
      return b;
    }
    if (allocated < BUFFERS) {
      allocated++;
      return new float[bufferValues];
    }
    try {
      return free.take(); // the writer returns every buffer, failed or not
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new InterruptedIOException("interrupted while waiting for the chunk writer");
    }
  }

  /** Queues chunk {@code key} with its values in {@code values} for writing. */
  void write(ChunkKey key, float[] values) throws IOException {
    collectFinished();
    pending.add(writer.submit(() -> {
      try {
        return staging.write(key, values);
      } finally {
        free.add(values);
      }
    }));
  }

  /** Waits for every queued chunk; the records of all chunks in the order given. */
  List<ChunkRecord> finish() throws IOException {
    while (!pending.isEmpty()) {
      written.add(result(pending.poll()));
    }
    return List.copyOf(written);
  }

  /** Takes the results of chunks already written, so a failure stops the ingest early. */
  private void collectFinished() throws IOException {
    while (!pending.isEmpty() && pending.peek().isDone()) {
      written.add(result(pending.poll()));
    }
  }

  private static ChunkRecord result(Future<ChunkRecord> f) throws IOException {
    try {
      return f.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new InterruptedIOException("interrupted while waiting for the chunk writer");
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof IOException io) {
        throw io;
      } else if (cause instanceof UncheckedIOException io) {
        throw io.getCause();
      } else if (cause instanceof RuntimeException r) {
        throw r;
      } else if (cause instanceof Error err) {
        throw err;
      }
      throw new IOException(cause);
    }
  }

  /** Drops chunks not yet started and waits until the writer threads have stopped. */
  @Override
  public void close() {
    for (Future<ChunkRecord> f : pending) {
      f.cancel(false);
    }
    writer.shutdown();
    boolean interrupted = false;
    while (true) {
      try {
        if (writer.awaitTermination(1, TimeUnit.MINUTES)) {
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
}
