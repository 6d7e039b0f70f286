package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The outbox on a real SQLite file, delivering to a real webhook receiver on the loopback interface. */
class OutboxTest {

  private static final Instant T0 = Instant.parse("2020-07-15T06:00:00Z");

  @TempDir Path dir;
  private final MutableClock clock = new MutableClock(T0);
  private final RetryPolicy policy = new RetryPolicy(Duration.ofSeconds(10), Duration.ofSeconds(60), 6);
  private final WebhookReceiver receiver = new WebhookReceiver();
  private final Map<Channel.Kind, Notifier> notifiers = Map.of(Channel.Kind.WEBHOOK,
      new WebhookNotifier(Duration.ofSeconds(2), Duration.ofSeconds(5), clock));

  @AfterEach
  void stop() {
    receiver.close();
  }

  private Outbox open() {
    return Outbox.open(dir.resolve("outbox.sqlite"), policy, clock);
  }

  @Test
  void oneRowPerAlertAndChannelAndRepeatsAreNoOps() {
    try (Outbox o = open()) {
      Alert a = TestAlerts.raised(Optional.empty());
      Channel ops = TestAlerts.webhook("ops", receiver.port());
      Channel lab = TestAlerts.webhook("lab", receiver.port());
      assertTrue(o.enqueue(a, List.of(ops, lab)));
      assertFalse(o.enqueue(a, List.of(ops, lab)), "same key and channels again: nothing new");
      assertFalse(o.enqueue(a, List.of(lab)));
      assertEquals(2, o.pending().size());
      OutboxEntry e = o.pending().get(0);
      assertEquals(a.idempotencyKey(), e.idempotencyKey());
      assertEquals(OutboxEntry.Status.PENDING, e.status());
      assertEquals(0, e.attempts());
      assertEquals(T0, e.nextAttemptAt());
      assertEquals("North Intake bloom", e.watch());
      assertTrue(o.enqueue(a, List.of(lab, TestAlerts.webhook("field-team", receiver.port()))), "one channel is new");
      assertEquals(List.of("ops", "lab", "field-team"), o.pending().stream().map(OutboxEntry::channelId).toList());
    }
  }

  @Test
  void fileIsAPrivateWalDatabase() throws Exception {
    try (Outbox o = open()) {
      o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
      // A second, independent connection sees an ordinary SQLite file in WAL mode with the row committed.
      try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + o.file()); Statement s = c.createStatement()) {
        try (ResultSet r = s.executeQuery("PRAGMA journal_mode")) {
          assertEquals("wal", r.getString(1));
        }
        try (ResultSet r = s.executeQuery("SELECT status, channel_kind FROM alert_outbox")) {
          assertTrue(r.next());
          assertEquals("pending", r.getString(1));
          assertEquals("webhook", r.getString(2));
        }
      }
      // It holds channel secrets: owner read/write only.
      assertEquals("rw-------", PosixFilePermissions.toString(Files.getPosixFilePermissions(o.file())));
    }
  }

  @Test
  void waitsOutAShortLockByAnotherWriter() throws Exception {
    try (Outbox o = open()) {
      CountDownLatch locked = new CountDownLatch(1);
      AtomicLong releasing = new AtomicLong(Long.MAX_VALUE);
      Thread other = new Thread(() -> {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + o.file()); Statement s = c.createStatement()) {
          s.execute("BEGIN IMMEDIATE");
          locked.countDown();
          Thread.sleep(800);
          releasing.set(System.nanoTime());
          s.execute("COMMIT");
        } catch (Exception e) {
          throw new IllegalStateException(e);
        }
      });
      other.start();
      assertTrue(locked.await(5, TimeUnit.SECONDS));
      // Without the busy timeout SQLite would refuse at once (SQLITE_BUSY); with it the write goes through after the release.
      assertTrue(o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port()))));
      long done = System.nanoTime();
      other.join();
      assertTrue(done >= releasing.get(), "the enqueue waited for the other writer");
      assertEquals(1, o.pending().size());
    }
  }

  @Test
  void retriesWithCappedExponentialBackoffThenDelivers() throws Exception {
    receiver.answer(503, 503, 503, 503, 503);
    try (Outbox o = open()) {
      Alert a = TestAlerts.raised(Optional.empty());
      o.enqueue(a, List.of(TestAlerts.webhook("ops", receiver.port())));
      Instant now = T0;
      // base 10 s doubling, capped at 60 s: waits of 10, 20, 40, 60, 60 s after attempts 1..5.
      long[] waits = {10, 20, 40, 60, 60};
      for (int attempt = 1; attempt <= waits.length; attempt++) {
        assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(notifiers, now), "attempt " + attempt);
        OutboxEntry e = o.pending().get(0);
        assertEquals(attempt, e.attempts());
        assertEquals(now.plusSeconds(waits[attempt - 1]), e.nextAttemptAt(), "attempt " + attempt);
        assertTrue(e.lastError().orElseThrow().contains("HTTP 503"), e.lastError().toString());
        assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, e.nextAttemptAt().minusMillis(1)), "not due yet");
        now = e.nextAttemptAt();
      }
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, now));
      assertEquals(List.of(), o.pending());
      OutboxEntry sent = o.sent().get(0);
      assertEquals(6, sent.attempts());
      assertEquals(Optional.of(now), sent.sentAt());
      assertEquals(Optional.empty(), sent.lastError());
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, now.plus(Duration.ofDays(1))));
      assertEquals(6, receiver.requests().size());
      assertEquals(List.of(a.idempotencyKey()), List.copyOf(receiver.distinctKeys()), "every try carried the same key");
    }
  }

  @Test
  void givesUpAfterTheLastAttemptAndKeepsTheRow() throws Exception {
    RetryPolicy three = new RetryPolicy(Duration.ofSeconds(1), Duration.ofSeconds(4), 3);
    receiver.answer(500, 500, 500, 500);
    Path file = dir.resolve("outbox.sqlite");
    try (Outbox o = Outbox.open(file, three, clock)) {
      o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(notifiers, T0));
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(notifiers, T0.plusSeconds(1)));
      assertEquals(new DeliveryReport(0, 0, 1), o.deliverDue(notifiers, T0.plusSeconds(3)));
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, T0.plus(Duration.ofDays(30))));
      assertEquals(3, receiver.requests().size());
    }
    try (Outbox o = Outbox.open(file, three, clock)) {
      OutboxEntry f = o.failed().get(0);
      assertEquals(OutboxEntry.Status.FAILED, f.status());
      assertEquals(3, f.attempts());
      assertTrue(f.lastError().orElseThrow().contains("HTTP 500"), f.lastError().toString());
      assertEquals(List.of(), o.pending());
      assertEquals(List.of(), o.sent());
    }
  }

  @Test
  void missingOrBrokenNotifiersAreRecordedAsFailures() {
    try (Outbox o = open()) {
      o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port())));
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(Map.of(), T0));
      assertTrue(o.pending().get(0).lastError().orElseThrow().contains("no notifier for webhook channels"));
      Notifier broken = (a, c) -> {
        throw new IllegalStateException("bug in a notifier");
      };
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(Map.of(Channel.Kind.WEBHOOK, broken), T0.plusSeconds(10)));
      assertTrue(o.pending().get(0).lastError().orElseThrow().contains("IllegalStateException: bug in a notifier"));
      assertEquals(0, receiver.requests().size());
    }
  }

  @Test
  void enqueueRefusesAlertsWithNowhereToGo() {
    try (Outbox o = open()) {
      Alert a = TestAlerts.raised(Optional.empty());
      IllegalArgumentException none = assertThrows(IllegalArgumentException.class, () -> o.enqueue(a, List.of()));
      assertTrue(none.getMessage().contains("has no channels"), none.getMessage());
      Channel ops = TestAlerts.webhook("ops", receiver.port());
      IllegalArgumentException twice = assertThrows(IllegalArgumentException.class, () -> o.enqueue(a, List.of(ops, ops)));
      assertTrue(twice.getMessage().contains("'ops' appears twice"), twice.getMessage());
      assertEquals(List.of(), o.pending(), "nothing written");
    }
  }

  @Test
  void openErrorsNameTheFileAndTheFix() throws Exception {
    OutboxException isDir = assertThrows(OutboxException.class, () -> Outbox.open(dir, policy, clock));
    assertTrue(isDir.getMessage().contains(dir + " is a directory"), isDir.getMessage());

    Path missing = dir.resolve("no-such-dir").resolve("outbox.sqlite");
    OutboxException noDir = assertThrows(OutboxException.class, () -> Outbox.open(missing, policy, clock));
    assertTrue(noDir.getMessage().contains("does not exist; create it"), noDir.getMessage());

    Path text = dir.resolve("notes.sqlite");
    Files.writeString(text, "North Intake sampling notes, not a database\n".repeat(50));
    OutboxException notDb = assertThrows(OutboxException.class, () -> Outbox.open(text, policy, clock));
    assertTrue(notDb.getMessage().contains(text + " is not an SQLite database"), notDb.getMessage());

    Path newer = dir.resolve("newer.sqlite");
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + newer); Statement s = c.createStatement()) {
      s.execute("PRAGMA user_version = 99");
    }
    OutboxException future = assertThrows(OutboxException.class, () -> Outbox.open(newer, policy, clock));
    assertTrue(future.getMessage().contains("newer Slackwater (schema 99"), future.getMessage());
  }

  @Test
  void closedOutboxSaysSo() {
    Outbox o = open();
    o.close();
    OutboxException e = assertThrows(OutboxException.class,
        () -> o.enqueue(TestAlerts.raised(Optional.empty()), List.of(TestAlerts.webhook("ops", receiver.port()))));
    assertTrue(e.getMessage().contains("is closed"), e.getMessage());
    o.close();
  }
}
