package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.icegreen.greenmail.util.GreenMail;
import com.icegreen.greenmail.util.ServerSetup;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Faults between the outbox and a real receiver: the receiver down, a crash before the send, a
 * crash or a lost answer after the send, a re-run of the evaluator after a restart. The promise
 * checked: every alert arrives, and what arrives more than once carries the same key.
 */
class OutboxFaultTest {

  private static final Instant T0 = Instant.parse("2020-07-15T06:00:00Z");

  @TempDir Path dir;
  private final MutableClock clock = new MutableClock(T0);
  private final RetryPolicy policy = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), 8);
  private final WebhookReceiver receiver = new WebhookReceiver();
  private final WebhookNotifier webhook = new WebhookNotifier(Duration.ofSeconds(2), Duration.ofSeconds(5), clock);
  private final Map<Channel.Kind, Notifier> notifiers = Map.of(Channel.Kind.WEBHOOK, webhook);

  /** Thrown past the outbox like a process dying: nothing after it runs. */
  private static final class SimulatedCrash extends Error {
    SimulatedCrash() {
      super("simulated crash after the send");
    }
  }

  @AfterEach
  void stop() {
    receiver.close();
  }

  private Outbox open() {
    return Outbox.open(dir.resolve("outbox.sqlite"), policy, clock);
  }

  @Test
  void receiverDownThenUpGetsTheAlertOnce() {
    int port = receiver.port();
    receiver.stop();
    try (Outbox o = open()) {
      Alert a = TestAlerts.raised(Optional.empty());
      o.enqueue(a, List.of(TestAlerts.webhook("ops", port)));
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(notifiers, clock.instant()));
      assertTrue(o.pending().get(0).lastError().orElseThrow().contains("could not connect"));

      receiver.restart();
      assertEquals(port, receiver.port());
      clock.advance(Duration.ofSeconds(29));
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, clock.instant()), "still backing off");
      clock.advance(Duration.ofSeconds(1));
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, clock.instant()));
      clock.advance(Duration.ofHours(2));
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, clock.instant()));
      assertEquals(1, receiver.requests().size(), "exactly once");
      assertEquals(a.idempotencyKey(), receiver.requests().get(0).header(WebhookNotifier.IDEMPOTENCY_HEADER));
    }
  }

  @Test
  void crashBetweenWriteAndSendDeliversAfterRestart() {
    Alert a = TestAlerts.raised(Optional.of(TestAlerts.png()));
    try (Outbox o = open()) {
      assertTrue(o.enqueue(a, List.of(TestAlerts.webhook("ops", receiver.port()))));
    } // closed without any delivery: the process "died" here
    assertEquals(0, receiver.requests().size());
    try (Outbox o = open()) {
      assertEquals(1, o.pending().size());
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, clock.instant()));
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, clock.instant().plusSeconds(3600)));
    }
    assertEquals(1, receiver.requests().size(), "exactly once");
    assertEquals(a, AlertJson.read(receiver.requests().get(0).body()), "the stored alert is the alert, picture included");
  }

  @Test
  void crashAfterSendBeforeMarkRepeatsWithTheSameKey() {
    Alert a = TestAlerts.raised(Optional.empty());
    Notifier sendThenDie = (alert, channel) -> {
      webhook.send(alert, channel);
      throw new SimulatedCrash();
    };
    try (Outbox o = open()) {
      o.enqueue(a, List.of(TestAlerts.webhook("ops", receiver.port())));
      assertThrows(SimulatedCrash.class, () -> o.deliverDue(Map.of(Channel.Kind.WEBHOOK, sendThenDie), clock.instant()));
    }
    try (Outbox o = open()) {
      assertEquals(1, o.pending().size(), "the row was never marked sent");
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, clock.instant()));
    }
    assertRepeatedOnceWithSameKeyAndBody(a);
  }

  @Test
  void lostAnswerAfterSendRepeatsWithTheSameKey() {
    Alert a = TestAlerts.raised(Optional.empty());
    Notifier sendThenLoseAnswer = (alert, channel) -> {
      webhook.send(alert, channel);
      throw new DeliveryException("connection reset before the answer arrived");
    };
    try (Outbox o = open()) {
      o.enqueue(a, List.of(TestAlerts.webhook("ops", receiver.port())));
      assertEquals(new DeliveryReport(0, 1, 0), o.deliverDue(Map.of(Channel.Kind.WEBHOOK, sendThenLoseAnswer), clock.instant()));
      clock.advance(policy.delayAfter(1));
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, clock.instant()));
    }
    assertRepeatedOnceWithSameKeyAndBody(a);
  }

  private void assertRepeatedOnceWithSameKeyAndBody(Alert a) {
    List<WebhookReceiver.Request> got = receiver.requests();
    // At least once: the receiver sees the repeat, and drops it by key.
    assertEquals(2, got.size());
    assertEquals(List.of(a.idempotencyKey()), List.copyOf(receiver.distinctKeys()));
    assertArrayEquals(got.get(0).body(), got.get(1).body());
    assertEquals(got.get(0).header(WebhookNotifier.SIGNATURE_HEADER), got.get(1).header(WebhookNotifier.SIGNATURE_HEADER));
  }

  @Test
  void reEnqueueAfterRestartAddsNothingAndSendsNothing() {
    Alert a = TestAlerts.raised(Optional.empty());
    Channel ops = TestAlerts.webhook("ops", receiver.port());
    try (Outbox o = open()) {
      o.enqueue(a, List.of(ops));
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(notifiers, clock.instant()));
    }
    clock.advance(Duration.ofMinutes(5));
    try (Outbox o = open()) {
      // The evaluator runs the same day again after the restart and produces the same transition.
      Alert again = TestAlerts.raised(Optional.empty());
      assertFalse(o.enqueue(again, List.of(ops)));
      assertEquals(DeliveryReport.NOTHING, o.deliverDue(notifiers, clock.instant()));
      assertEquals(1, o.sent().size());
      assertEquals(List.of(), o.pending());
    }
    assertEquals(1, receiver.requests().size());
  }

  @Test
  void oneChannelDownDoesNotHoldBackTheOthers() throws Exception {
    GreenMail mail = new GreenMail(new ServerSetup(0, "127.0.0.1", ServerSetup.PROTOCOL_SMTP));
    mail.start();
    try (Outbox o = open()) {
      Alert a = TestAlerts.raised(Optional.of(TestAlerts.png()));
      Channel email = Channel.email("north-intake-mail", "127.0.0.1", mail.getSmtp().getPort(), "slackwater@example.org",
          List.of("operator@example.org"), Optional.empty(), Optional.empty(), false);
      receiver.answer(503);
      Map<Channel.Kind, Notifier> both = Map.of(Channel.Kind.WEBHOOK, webhook,
          Channel.Kind.EMAIL, new MailNotifier(Duration.ofSeconds(5), clock));
      o.enqueue(a, List.of(TestAlerts.webhook("ops", receiver.port()), email));
      assertEquals(new DeliveryReport(1, 1, 0), o.deliverDue(both, clock.instant()));
      assertEquals(List.of("north-intake-mail"), o.sent().stream().map(OutboxEntry::channelId).toList());
      clock.advance(policy.delayAfter(1));
      assertEquals(new DeliveryReport(1, 0, 0), o.deliverDue(both, clock.instant()));
      assertTrue(mail.waitForIncomingEmail(5000, 1));
      assertEquals(1, mail.getReceivedMessages().length, "mail sent once");
      assertEquals(1, receiver.distinctKeys().size());
      assertEquals(2, receiver.requests().size(), "one refused, one accepted");
    } finally {
      mail.stop();
    }
  }
}
