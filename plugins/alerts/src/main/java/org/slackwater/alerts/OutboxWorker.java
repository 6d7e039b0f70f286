package org.slackwater.alerts;

import java.time.Clock;
import java.time.Duration;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.Executors;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Calls {@link Outbox#deliverDue} on one background thread: every {@code period} (measured from
 * the end of one pass to the start of the next, so a slow receiver never stacks passes up) and
 * once more on {@link #wake()}, which an evaluator calls right after enqueueing.
 *
 * <p>A pass that throws is logged and the next pass runs as planned (a scheduled task that throws
 * would otherwise never run again). {@link #close()} stops scheduling, lets a pass in progress
 * finish (waiting at most {@code shutdownWait}, then interrupting it) and does not close the outbox,
 * which its owner closes afterwards.
 */
public final class OutboxWorker implements AutoCloseable {

  private static final Logger LOG = LoggerFactory.getLogger(OutboxWorker.class);

  private final Outbox outbox;
  private final Map<Channel.Kind, Notifier> notifiers;
  private final Clock clock;
  private final Duration shutdownWait;
  private final ScheduledExecutorService executor;
  private final AtomicLong passes = new AtomicLong();

  private OutboxWorker(Outbox outbox, Map<Channel.Kind, Notifier> notifiers, Clock clock, Duration shutdownWait) {
    this.outbox = outbox;
    this.notifiers = notifiers;
    this.clock = clock;
    this.shutdownWait = shutdownWait;
    this.executor = Executors.newSingleThreadScheduledExecutor(r -> {
      Thread t = new Thread(r, "slackwater-outbox");
      t.setDaemon(true);
      return t;
    });
  }

  /** {@link #start(Outbox, Map, Clock, Duration, Duration)} with the system clock and 30 s to finish on close. */
  public static OutboxWorker start(Outbox outbox, Map<Channel.Kind, Notifier> notifiers, Duration period) {
    return start(outbox, notifiers, Clock.systemUTC(), period, Duration.ofSeconds(30));
  }

  /** Starts a worker whose first pass runs at once, delivering stale rows left by a previous run. */
  public static OutboxWorker start(Outbox outbox, Map<Channel.Kind, Notifier> notifiers, Clock clock, Duration period,
                                   Duration shutdownWait) {
    Objects.requireNonNull(outbox, "outbox");
    Objects.requireNonNull(notifiers, "notifiers");
    Objects.requireNonNull(clock, "clock");
    Objects.requireNonNull(period, "period");
    Objects.requireNonNull(shutdownWait, "shutdownWait");
    if (period.isZero() || period.isNegative()) {
      throw new IllegalArgumentException("worker period must be positive, got " + period);
    }
    OutboxWorker w = new OutboxWorker(outbox, Map.copyOf(notifiers), clock, shutdownWait);
    w.executor.scheduleWithFixedDelay(w::pass, 0, period.toMillis(), TimeUnit.MILLISECONDS);
    return w;
  }

  /** Asks for a pass now (in addition to the periodic ones); does nothing once closed. */
  public void wake() {
    try {
      executor.execute(this::pass);
    } catch (RejectedExecutionException e) {
      LOG.debug("outbox worker is shut down; wake ignored");
    }
  }

  /** How many passes have completed (for monitoring and tests). */
  public long passes() {
    return passes.get();
  }

  @Override
  public void close() {
    executor.shutdown();
    try {
      if (!executor.awaitTermination(shutdownWait.toMillis(), TimeUnit.MILLISECONDS)) {
        LOG.warn("outbox worker still busy after {}; interrupting it (its current alert stays queued)", shutdownWait);
        executor.shutdownNow();
        executor.awaitTermination(shutdownWait.toMillis(), TimeUnit.MILLISECONDS);
      }
    } catch (InterruptedException e) {
      executor.shutdownNow();
      Thread.currentThread().interrupt();
    }
  }

  /** Whether the background thread has stopped. */
  public boolean isTerminated() {
    return executor.isTerminated();
  }

  private void pass() {
    try {
      DeliveryReport r = outbox.deliverDue(notifiers, clock.instant());
      if (r.attempted() > 0) {
        LOG.debug("outbox pass: {} sent, {} to retry, {} failed", r.sent(), r.retrying(), r.failed());
      }
    } catch (RuntimeException e) {
      LOG.error("outbox delivery pass failed; trying again at the next pass", e);
    } finally {
      passes.incrementAndGet();
    }
  }
}
