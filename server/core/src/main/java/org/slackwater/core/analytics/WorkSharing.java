package org.slackwater.core.analytics;

import java.io.IOException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Runs numbered tasks on the calling thread and the common pool's workers, each thread taking the
 * next task number until none is left. Unlike a parallel stream, which on a two-core machine cuts
 * the work into four leaves up front, this balances to the size of one task, so a thread that the
 * scheduler holds back costs at most one task's time.
 *
 * <p>The caller never waits for a pool worker that has not started: a helper queued behind other
 * work finds no task left and does nothing. It does wait for tasks that are running, so when
 * {@link #run} returns every task's writes are visible to the caller.
 *
 * <p>The first failure stops further tasks from starting and is rethrown once no task is running
 * (an {@link IOException} as itself, any other exception or error unchanged).
 */
final class WorkSharing {
  /** A task that may fail with an I/O error (a chunk that cannot be read). */
  @FunctionalInterface
  interface Task {
    void run(int index) throws IOException;
  }

  private final int tasks;
  private final Task task;
  private final AtomicInteger next = new AtomicInteger();
  /** Threads between asking for a task and having finished it (or been told there is none). */
  private final AtomicInteger inFlight = new AtomicInteger();
  private final AtomicReference<Throwable> failure = new AtomicReference<>();
  private final Object idle = new Object();

  private WorkSharing(int tasks, Task task) {
    this.tasks = tasks;
    this.task = task;
  }

  static void run(int tasks, Task task) throws IOException {
    if (tasks <= 0) {
      return;
    }
    WorkSharing w = new WorkSharing(tasks, task);
    int helpers = Math.min(tasks - 1, ForkJoinPool.getCommonPoolParallelism());
    for (int h = 0; h < helpers; h++) {
      ForkJoinPool.commonPool().execute(w::work);
    }
    w.work();
    w.awaitIdle();
    Throwable t = w.failure.get();
    if (t instanceof IOException e) {
      throw e;
    } else if (t instanceof RuntimeException e) {
      throw e;
    } else if (t instanceof Error e) {
      throw e;
    }
  }

  private void work() {
    while (true) {
      inFlight.incrementAndGet();
      try {
        int i = next.getAndIncrement();
        if (i >= tasks) {
          return;
        }
        task.run(i);
      } catch (IOException | RuntimeException | Error e) {
        failure.compareAndSet(null, e);
        next.set(tasks);
        return;
      } finally {
        if (inFlight.decrementAndGet() == 0) {
          synchronized (idle) {
            idle.notifyAll();
          }
        }
      }
    }
  }

  private void awaitIdle() {
    boolean interrupted = false;
    synchronized (idle) {
      while (inFlight.get() > 0) {
        try {
          idle.wait();
        } catch (InterruptedException e) {
          interrupted = true; // the running tasks write into the caller's arrays: wait for them anyway
        }
      }
    }
    if (interrupted) {
      Thread.currentThread().interrupt();
    }
  }
}
