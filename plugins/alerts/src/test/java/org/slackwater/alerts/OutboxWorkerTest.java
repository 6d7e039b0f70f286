package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.BooleanSupplier;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OutboxWorkerTest {

  @TempDir Path dir;
  private final WebhookReceiver receiver = new WebhookReceiver();
  private final Map<Channel.Kind, Notifier> notifiers = Map.of(Channel.Kind.WEBHOOK, new WebhookNotifier());

  @AfterEach
  void stop() {
    receiver.close();
  }

  private static void waitFor(BooleanSupplier condition, String what) throws InterruptedException {
    long deadline = System.nanoTime() + 10_000_000_000L;
    while (!condition.getAsBoolean()) {
      if (System.nanoTime() > deadline) {
        throw new AssertionError("timed out waiting for " + what);
      }
      Thread.sleep(10);
    }
  }

  @Test
  void deliversInTheBackgroundAndStopsCleanly() throws Exception {
    try (Outbox o = Outbox.open(dir.resolve("outbox.sqlite"))) {
      // A long period: the first pass runs at once, later alerts arrive through wake().
      OutboxWorker w = OutboxWorker.start(o, notifiers, Clock.systemUTC(), Duration.ofHours(1), Duration.ofSeconds(5));
      waitFor(() -> w.passes() >= 1, "the first pass");
      o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
      w.wake();
      waitFor(() -> o.sent().size() == 1, "the alert to be marked sent");
      assertEquals(1, receiver.requests().size());

      w.close();
      assertTrue(w.isTerminated(), "the worker thread has stopped");
      o.enqueue(TestAlerts.raised(TestAlerts.STEP.plusDays(1), Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
      w.wake();
      Thread.sleep(100);
      assertEquals(1, receiver.requests().size(), "nothing is sent after close");
      assertEquals(1, o.pending().size(), "the new alert waits in the file for the next start");
      w.close();
    }
  }

  @Test
  void periodicPassesPickUpRowsLeftByAnEarlierRun() throws Exception {
    Path file = dir.resolve("outbox.sqlite");
    try (Outbox o = Outbox.open(file)) {
      o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
    }
    try (Outbox o = Outbox.open(file);
         OutboxWorker w = OutboxWorker.start(o, notifiers, Duration.ofMillis(50))) {
      waitFor(() -> receiver.requests().size() == 1, "the left-over alert");
      long seen = w.passes();
      waitFor(() -> w.passes() >= seen + 3, "further periodic passes");
      assertEquals(1, receiver.requests().size());
    }
  }

  @Test
  void aFailingPassDoesNotStopTheWorker() throws Exception {
    Outbox o = Outbox.open(dir.resolve("outbox.sqlite"));
    o.close(); // every pass now throws OutboxException
    try (OutboxWorker w = OutboxWorker.start(o, notifiers, Clock.systemUTC(), Duration.ofMillis(20), Duration.ofSeconds(5))) {
      waitFor(() -> w.passes() >= 3, "passes after a failing one");
    }
  }
}
