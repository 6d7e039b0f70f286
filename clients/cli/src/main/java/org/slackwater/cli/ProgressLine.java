package org.slackwater.cli;

import java.io.PrintStream;
import java.time.Duration;
import java.time.Instant;
import java.time.InstantSource;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;

/**
 * An indeterminate progress line on standard error while the client waits for a long answer
 * (the server says nothing until an ingest is done, so there is no fraction to show): a spinner,
 * what is going on and the seconds elapsed, redrawn in place with a carriage return, e.g.
 * {@code / ingesting rainfall.nc (12 s)}. Closing it erases the line, so what is printed next
 * starts at the left margin on a clean line.
 *
 * <p>Drawn only when standard error is a terminal ({@link Terminal#stderr()}); otherwise {@link
 * #start} returns a line that draws nothing, so logs and pipes get no carriage returns. The clock
 * is injected so that tests can check the elapsed seconds. A daemon thread redraws the line; it
 * never outlives {@link #close()}.
 */
final class ProgressLine implements AutoCloseable {
  static final Duration PERIOD = Duration.ofMillis(250);
  private static final String SPINNER = "|/-\\";

  private final PrintStream err;
  private final String label;
  private final InstantSource clock;
  private final Instant start;
  private final ScheduledExecutorService timer;
  private int ticks;
  private int drawnWidth;
  private boolean closed;

  private ProgressLine(PrintStream err, String label, InstantSource clock, boolean draw) {
    this.err = err;
    this.label = label;
    this.clock = clock;
    this.start = clock.instant();
    if (draw) {
      timer = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "slackwater-cli-progress");
        t.setDaemon(true);
        return t;
      });
      timer.scheduleAtFixedRate(this::draw, 0, PERIOD.toMillis(), TimeUnit.MILLISECONDS);
    } else {
      timer = null;
    }
  }

  /** Starts a line that is redrawn until closed, or one that draws nothing if standard error is no terminal. */
  static ProgressLine start(String label, Terminal terminal, PrintStream err, InstantSource clock) {
    return new ProgressLine(err, label, clock, terminal.stderr());
  }

  /** One frame, without the carriage return: the spinner's {@code tick}-th position, the label, whole seconds elapsed. */
  static String frame(int tick, String label, Duration elapsed) {
    long seconds = Math.max(0, elapsed.toSeconds());
    return SPINNER.charAt(Math.floorMod(tick, SPINNER.length())) + " " + label + " (" + seconds + " s)";
  }

  private synchronized void draw() {
    if (closed) {
      return;
    }
    String f = frame(ticks++, label, Duration.between(start, clock.instant()));
    // Pad over a longer previous frame (the seconds only grow, but be safe).
    String pad = " ".repeat(Math.max(0, drawnWidth - f.length()));
    err.print("\r" + f + pad);
    err.flush();
    drawnWidth = f.length();
  }

  @Override
  public void close() {
    if (timer == null) {
      return;
    }
    timer.shutdownNow();
    try {
      timer.awaitTermination(1, TimeUnit.SECONDS);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    synchronized (this) {
      if (closed) {
        return;
      }
      closed = true;
      if (drawnWidth > 0) {
        err.print("\r" + " ".repeat(drawnWidth) + "\r");
        err.flush();
      }
    }
  }
}
