package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.util.Base64;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/** Real HTTP over the loopback interface to the JDK's HttpServer. */
class WebhookNotifierTest {

  private final WebhookReceiver receiver = new WebhookReceiver();
  private final MutableClock clock = new MutableClock(Instant.parse("2020-07-15T06:00:03.250Z"));
  private final WebhookNotifier notifier = new WebhookNotifier(Duration.ofSeconds(2), Duration.ofSeconds(5), clock);

  @AfterEach
  void stop() {
    receiver.close();
  }

  @Test
  void postsSignedJsonWithAllFields() throws Exception {
    byte[] png = TestAlerts.png();
    Alert a = TestAlerts.raised(Optional.of(png));
    notifier.send(a, TestAlerts.webhook("ops", receiver.port()));

    assertEquals(1, receiver.requests().size());
    WebhookReceiver.Request r = receiver.requests().get(0);
    assertEquals("POST", r.method());
    assertEquals("/hooks/slackwater", r.path());
    assertEquals("application/json", r.header("Content-Type"));
    assertEquals(a.idempotencyKey(), r.header("Slackwater-Idempotency-Key"));
    assertEquals("2020-07-15T06:00:03Z", r.header("Slackwater-Timestamp"));

    // Recomputed here with javax.crypto.Mac directly (HMAC per RFC 2104, SHA-256), over the bytes the receiver read.
    Mac mac = Mac.getInstance("HmacSHA256");
    mac.init(new SecretKeySpec(TestAlerts.SECRET.getBytes(StandardCharsets.UTF_8), "HmacSHA256"));
    String expected = "sha256=" + HexFormat.of().formatHex(mac.doFinal(r.body()));
    assertEquals(expected, r.header("Slackwater-Signature"));

    JsonNode body = new ObjectMapper().readTree(r.body());
    assertEquals("slackwater.alert.v1", body.get("format").textValue());
    assertEquals(a.idempotencyKey(), body.get("idempotency_key").textValue());
    assertEquals("North Intake bloom", body.get("watch").textValue());
    assertEquals("raised", body.get("state").textValue());
    assertEquals("warning", body.get("severity").textValue());
    assertEquals("2020-07-14", body.get("step").textValue());
    assertEquals(a.condition(), body.get("condition").textValue());
    assertEquals("12.6 mg/m3", body.get("values").get("mean chlorophyll").textValue());
    assertEquals("North Intake", body.get("values").get("region").textValue());
    assertEquals(Alert.CAUTION, body.get("caution").textValue());
    assertEquals("2020-07-15T06:00:00Z", body.get("raised_at").textValue());
    assertArrayEquals(png, Base64.getDecoder().decode(body.get("png_base64").textValue()));
  }

  @Test
  void non2xxIsAFailureWithTheStatus() {
    receiver.answer(503);
    DeliveryException e = assertThrows(DeliveryException.class,
        () -> notifier.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", receiver.port())));
    assertEquals(503, e.status().orElseThrow());
    assertTrue(e.getMessage().contains("channel 'ops'") && e.getMessage().contains("HTTP 503")
        && e.getMessage().contains("receiver says no"), e.getMessage());
  }

  @Test
  void anyTwoHundredCounts() throws Exception {
    receiver.answer(202, 204);
    notifier.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", receiver.port()));
    notifier.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", receiver.port()));
    assertEquals(2, receiver.requests().size());
  }

  @Test
  void redirectsAreNotFollowed() {
    receiver.answer(302);
    DeliveryException e = assertThrows(DeliveryException.class,
        () -> notifier.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", receiver.port())));
    assertEquals(302, e.status().orElseThrow());
    assertEquals(List.of("/hooks/slackwater"), receiver.requests().stream().map(WebhookReceiver.Request::path).toList());
  }

  @Test
  void slowReceiverTimesOut() {
    receiver.delayAnswers(3000);
    WebhookNotifier impatient = new WebhookNotifier(Duration.ofSeconds(2), Duration.ofMillis(300), clock);
    long t0 = System.nanoTime();
    DeliveryException e = assertThrows(DeliveryException.class,
        () -> impatient.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", receiver.port())));
    assertTrue(e.getMessage().contains("no answer within 300 ms"), e.getMessage());
    assertTrue(System.nanoTime() - t0 < 2_500_000_000L, "gave up before the receiver answered");
  }

  @Test
  void receiverDownIsAFailure() {
    int port = receiver.port();
    receiver.stop();
    DeliveryException e = assertThrows(DeliveryException.class,
        () -> notifier.send(TestAlerts.raised(Optional.empty()), TestAlerts.webhook("ops", port)));
    assertTrue(e.getMessage().contains("could not connect") && e.getMessage().contains("127.0.0.1:" + port), e.getMessage());
    receiver.restart();
  }

  @Test
  void wrongKindOfChannel() {
    Channel mail = Channel.email("mail", "127.0.0.1", 2525, "slackwater@example.org", List.of("operator@example.org"),
        Optional.empty(), Optional.empty(), false);
    DeliveryException e = assertThrows(DeliveryException.class, () -> notifier.send(TestAlerts.raised(Optional.empty()), mail));
    assertTrue(e.getMessage().contains("webhook channels only"), e.getMessage());
  }
}
