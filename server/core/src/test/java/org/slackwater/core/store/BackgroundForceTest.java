package org.slackwater.core.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.MappedByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.ReadableByteChannel;
import java.nio.channels.WritableByteChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The part of the crash-safety argument that runs in the background: a file counts as written
 * only once its force has returned, and a failed force is reported, never dropped.
 */
class BackgroundForceTest {
  @TempDir Path dir;

  @Test
  void awaitAllReturnsOnlyAfterEveryForceHasReturned() throws Exception {
    CountDownLatch release = new CountDownLatch(1);
    AtomicInteger forced = new AtomicInteger();
    List<ControlledChannel> channels = new ArrayList<>();
    try (BackgroundForce force = new BackgroundForce("test")) {
      try {
        for (int i = 0; i < 5; i++) {
          ControlledChannel ch = new ControlledChannel(open("f" + i), () -> {
            release.await();
            forced.incrementAndGet();
          });
          channels.add(ch);
          force.submit(ch, dir.resolve("f" + i));
        }
        AtomicReference<Throwable> failed = new AtomicReference<>();
        Thread waiter = new Thread(() -> {
          try {
            force.awaitAll();
          } catch (Throwable t) {
            failed.set(t);
          }
        });
        waiter.start();
        waiter.join(200);
        // Every force is held back, so awaitAll cannot have returned, however slow this machine is.
        assertTrue(waiter.isAlive(), "awaitAll returned while forces were still running");
        assertEquals(0, forced.get());
        release.countDown();
        waiter.join(10_000);
        assertFalse(waiter.isAlive());
        assertEquals(null, failed.get());
        assertEquals(5, forced.get());
      } finally {
        release.countDown(); // never leave a worker blocked, or close() would wait for it forever
      }
    }
    for (ControlledChannel ch : channels) {
      assertFalse(ch.isOpen(), "a forced channel is closed");
    }
  }

  @Test
  void aFailedForceIsReportedWithTheFileAndStopsFurtherSubmits() throws Exception {
    try (BackgroundForce force = new BackgroundForce("test")) {
      ControlledChannel good = new ControlledChannel(open("good"), () -> {});
      ControlledChannel bad = new ControlledChannel(open("bad"), () -> {
        throw new IOException("the device is gone");
      });
      force.submit(good, dir.resolve("good"));
      force.submit(bad, dir.resolve("bad"));
      IOException e = assertThrows(IOException.class, force::awaitAll);
      assertTrue(e.getMessage().contains("bad") && e.getMessage().contains("the device is gone"), e.getMessage());
      assertFalse(bad.isOpen(), "a channel whose force failed is closed all the same");
      ControlledChannel later = new ControlledChannel(open("later"), () -> {});
      assertThrows(IOException.class, () -> force.submit(later, dir.resolve("later")));
    }
  }

  private FileChannel open(String name) throws IOException {
    return FileChannel.open(dir.resolve(name), StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
  }

  interface ForceAction {
    void run() throws Exception;
  }

  /** A real file channel whose force first runs a test's action (wait, or fail). */
  private static final class ControlledChannel extends FileChannel {
    private final FileChannel real;
    private final ForceAction onForce;

    ControlledChannel(FileChannel real, ForceAction onForce) {
      this.real = real;
      this.onForce = onForce;
    }

    @Override
    public void force(boolean metaData) throws IOException {
      try {
        onForce.run();
      } catch (IOException e) {
        throw e;
      } catch (Exception e) {
        throw new IOException(e);
      }
      real.force(metaData);
    }

    @Override
    protected void implCloseChannel() throws IOException {
      real.close();
    }

    @Override
    public int read(ByteBuffer dst) throws IOException {
      return real.read(dst);
    }

    @Override
    public long read(ByteBuffer[] dsts, int offset, int length) throws IOException {
      return real.read(dsts, offset, length);
    }

    @Override
    public int write(ByteBuffer src) throws IOException {
      return real.write(src);
    }

    @Override
    public long write(ByteBuffer[] srcs, int offset, int length) throws IOException {
      return real.write(srcs, offset, length);
    }

    @Override
    public long position() throws IOException {
      return real.position();
    }

    @Override
    public FileChannel position(long newPosition) throws IOException {
      real.position(newPosition);
      return this;
    }

    @Override
    public long size() throws IOException {
      return real.size();
    }

    @Override
    public FileChannel truncate(long size) throws IOException {
      real.truncate(size);
      return this;
    }

    @Override
    public long transferTo(long position, long count, WritableByteChannel target) throws IOException {
      return real.transferTo(position, count, target);
    }

    @Override
    public long transferFrom(ReadableByteChannel src, long position, long count) throws IOException {
      return real.transferFrom(src, position, count);
    }

    @Override
    public int read(ByteBuffer dst, long position) throws IOException {
      return real.read(dst, position);
    }

    @Override
    public int write(ByteBuffer src, long position) throws IOException {
      return real.write(src, position);
    }

    @Override
    public MappedByteBuffer map(MapMode mode, long position, long size) throws IOException {
      return real.map(mode, position, size);
    }

    @Override
    public FileLock lock(long position, long size, boolean shared) throws IOException {
      return real.lock(position, size, shared);
    }

    @Override
    public FileLock tryLock(long position, long size, boolean shared) throws IOException {
      return real.tryLock(position, size, shared);
    }
  }
}
