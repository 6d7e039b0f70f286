package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.net.InetSocketAddress;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CopyOnWriteArrayList;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.slackwater.core.Workspace;
import org.slackwater.core.query.WatchStatements;

/**
 * Watches on the full demo over HTTP: a watch near the North Intake written from the planted
 * drivers (a warm spell, clear sky, after a wet winter and spring of runoff) is backtested against
 * the ground-truth blooms, and evaluated with a webhook destination: every raised and cleared day
 * reaches a real loopback receiver once, signed, with the caution, and neither re-evaluating nor
 * restarting the server sends it again; an alert whose receiver was down is delivered after the
 * restart.
 */
class WatchAlertsTest {
  static final String NAME = "Alert test bloom risk";
  static final String WATCH = "watch \"" + NAME + "\" over \"North Intake\""
      + " when standardized anomaly of mean water_temperature over 5 days above 1 against 2006 to 2025"
      + " and mean cloud_fraction over 5 days below 0.25"
      + " and percentile of sum runoff over \"Harle Watershed\" over 150 days above 80 against 2006 to 2025 severity warning";
  static final String SECRET = "a-webhook-secret-of-at-least-32-bytes!";
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final org.slackwater.alerts.RetryPolicy RETRY = new org.slackwater.alerts.RetryPolicy(
      java.time.Duration.ofSeconds(1), java.time.Duration.ofSeconds(2), 20);
  private static final HttpClient HTTP = HttpClient.newHttpClient();

  private static DemoFixture demo;
  private static Workspace ws;
  private static HttpServer server;
  private static com.sun.net.httpserver.HttpServer receiver;
  private static final List<JsonNode> received = new CopyOnWriteArrayList<>();
  private static int receiverPort;

  @BeforeAll
  static void start() throws Exception {
    demo = DemoFixture.full();
    ws = demo.open();
    server = HttpServer.start(ws, config(), RETRY);
    receiverPort = startReceiver(0);
  }

  private static ServerConfig config() {
    return new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.of("tok"), Optional.empty());
  }

  private static int startReceiver(int port) throws Exception {
    receiver = com.sun.net.httpserver.HttpServer.create(new InetSocketAddress("127.0.0.1", port), 0);
    receiver.createContext("/hook", ex -> {
      byte[] body = ex.getRequestBody().readAllBytes();
      try {
        // The signature, recomputed here with the JDK's HMAC-SHA256 (RFC 2104), must match.
        Mac mac = Mac.getInstance("HmacSHA256");
        mac.init(new SecretKeySpec(SECRET.getBytes(StandardCharsets.UTF_8), "HmacSHA256"));
        String expected = "sha256=" + java.util.HexFormat.of().formatHex(mac.doFinal(body));
        JsonNode n = JSON.readTree(body);
        ((com.fasterxml.jackson.databind.node.ObjectNode) n).put("_signature_ok", expected.equals(ex.getRequestHeaders().getFirst("Slackwater-Signature")));
        ((com.fasterxml.jackson.databind.node.ObjectNode) n).put("_key_header", ex.getRequestHeaders().getFirst("Slackwater-Idempotency-Key"));
        received.add(n);
      } catch (Exception e) {
        throw new java.io.IOException(e);
      }
      ex.sendResponseHeaders(204, -1);
      ex.close();
    });
    receiver.start();
    return receiver.getAddress().getPort();
  }

  @AfterAll
  static void stop() throws Exception {
    if (server != null) {
      send("DELETE", server.url() + "/api/watches/" + enc(NAME), "", true);
      server.close();
    }
    if (receiver != null) {
      receiver.stop(0);
    }
    ws.close();
  }

  private static String enc(String s) {
    return URLEncoder.encode(s, StandardCharsets.UTF_8).replace("+", "%20");
  }

  private static HttpResponse<String> send(String method, String url, String body, boolean admin) throws Exception {
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(url)).method(method, HttpRequest.BodyPublishers.ofString(body));
    if (admin) {
      b.header("Authorization", "Bearer tok");
    }
    return HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
  }

  private static void awaitReceived(int n) throws InterruptedException {
    long end = System.nanoTime() + 20_000_000_000L;
    while (received.size() < n && System.nanoTime() < end) {
      Thread.sleep(100);
    }
  }

  @Test
  void theWatchCatchesThePlantedOuterBayBloomsWithLeadTimeAndFewFalseAlarms() throws Exception {
    assertEquals(201, send("POST", server.url() + "/api/watches", WATCH, true).statusCode());
    List<String> outerBay = new ArrayList<>(), all = new ArrayList<>();
    for (String line : Files.readAllLines(demo.manifest.groundTruth())) {
      String[] f = line.split(",", -1);
      if (line.startsWith("bloom-")) {
        all.add(f[2]);
        if (f[1].equals("Outer Bay")) {
          outerBay.add(f[2]);
        }
      }
    }
    HttpResponse<String> r = send("POST", server.url() + "/api/watches/" + enc(NAME) + "/backtest?lead=60&format=json", String.join("\n", all), false);
    assertEquals(200, r.statusCode(), r.body());
    JsonNode result = JSON.readTree(r.body()).path("results").get(0);
    JsonNode meta = result.path("metadata");
    assertEquals(WatchStatements.CAUTION, meta.path("caution").asText());
    // The North Intake lies in the Outer Bay: it must see that segment's planted blooms, each
    // at least a week ahead (the planted warm, clear spells last 16 to 25 days before onset).
    int caught = 0;
    for (JsonNode row : result.path("rows")) {
      if (row.get(0).asText().equals("event") && outerBay.contains(row.get(1).asText())) {
        assertEquals("caught", row.get(4).asText(), "the Outer Bay bloom of " + row.get(1).asText());
        assertTrue(row.get(6).asDouble() >= 7, "lead of " + row.get(6) + " days before " + row.get(1).asText());
        caught++;
      }
    }
    assertEquals(outerBay.size(), caught);
    // The decoy warm spells without a wet spring must not fire: few false alarms in 20 years.
    assertTrue(meta.path("false_alarms").asInt() <= 2, "false alarms: " + meta.path("false_alarms").asText());
    HttpResponse<byte[]> png = HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/watches/" + enc(NAME) + "/backtest?format=png"))
        .POST(HttpRequest.BodyPublishers.ofString(String.join("\n", all))).build(), HttpResponse.BodyHandlers.ofByteArray());
    assertTrue(png.statusCode() == 200 || png.statusCode() == 422, "a PNG timeline or a clear refusal, got " + png.statusCode());
    HttpResponse<String> bad = send("POST", server.url() + "/api/watches/" + enc(NAME) + "/backtest", "onset\n2014-06-20\nnot-a-date", false);
    assertEquals(400, bad.statusCode());
    assertEquals("line 3 of the event list: 'not-a-date' is not a date; give one YYYY-MM-DD per line (or as the first CSV column)",
        JSON.readTree(bad.body()).path("detail").asText());

    alertsAreDeliveredOnceThroughReEvaluationAndRestart();
  }

  @Test
  void presetsCarryTheirSourceAndHoldExactlyWhereTheCitedLevelIsReached() throws Exception {
    HttpResponse<String> r = send("GET", server.url() + "/api/watch-presets?region=" + enc("Outer Bay"), "", false);
    assertEquals(200, r.statusCode(), r.body());
    JsonNode preset = JSON.readTree(r.body()).path("presets").get(0);
    assertTrue(preset.path("source").asText().startsWith("WHO (2003) Guidelines for Safe Recreational Water Environments"));
    assertTrue(preset.path("limits").asText().contains("cyanobacteria"));
    String text = preset.path("text").asText().replace("Outer Bay chlorophyll-recreational", "Preset test");
    assertEquals(201, send("POST", server.url() + "/api/watches", text, true).statusCode());
    try {
      HttpResponse<String> run = send("POST", server.url() + "/api/watches/" + enc("Preset test") + "/evaluate?from=2014-06-01&to=2014-07-31&format=json", "", true);
      assertEquals(200, run.statusCode(), run.body());
      HttpResponse<String> mean = send("POST", server.url() + "/api/query?format=json",
          "mean chlorophyll over \"Outer Bay\" from 2014-06-01 to 2014-07-31 by day", false);
      JsonNode days = JSON.readTree(run.body()).path("results").get(0).path("rows");
      JsonNode means = JSON.readTree(mean.body()).path("results").get(0).path("rows");
      assertEquals(61, days.size());
      int notice = 0;
      for (int i = 0; i < 61; i++) {
        assertEquals(days.get(i).get(0).asText(), means.get(i).get(0).asText());
        JsonNode m = means.get(i).get(1);
        // 1 ug/L = 1 mg/m3 (SI Brochure, 9th ed.: 1 L = 1 dm3): the levels are 10 and 50 mg m-3.
        String expected = m.isNull() ? "none" : m.asDouble() >= 50 ? "warning" : m.asDouble() >= 10 ? "notice" : "none";
        assertEquals(expected, days.get(i).get(2).asText(), "day " + days.get(i).get(0).asText());
        notice += expected.equals("none") ? 0 : 1;
      }
      assertTrue(notice > 0, "the 2014 bloom reaches the first level over the Outer Bay");
    } finally {
      send("DELETE", server.url() + "/api/watches/" + enc("Preset test"), "", true);
    }
    assertEquals(422, send("GET", server.url() + "/api/watch-presets?region=" + enc("Nowhere Bay"), "", false).statusCode());
  }

  /** Runs after the watch is stored (JUnit gives no order between test methods). */
  private void alertsAreDeliveredOnceThroughReEvaluationAndRestart() throws Exception {
    String channels = "[{\"id\": \"test-hook\", \"kind\": \"webhook\", \"url\": \"http://127.0.0.1:" + receiverPort + "/hook\", \"secret\": \"" + SECRET + "\"}]";
    assertEquals(401, send("PUT", server.url() + "/api/watches/" + enc(NAME) + "/channels", channels, false).statusCode());
    HttpResponse<String> put = send("PUT", server.url() + "/api/watches/" + enc(NAME) + "/channels", channels, true);
    assertEquals(200, put.statusCode(), put.body());
    assertFalse(put.body().contains(SECRET), "the secret must not be echoed");
    HttpResponse<String> badChannels = send("PUT", server.url() + "/api/watches/" + enc(NAME) + "/channels", "[{\"id\": \"x\", \"kind\": \"webhook\"}]", true);
    assertEquals(400, badChannels.statusCode());

    String evaluate = server.url() + "/api/watches/" + enc(NAME) + "/evaluate?from=2014-05-01&to=2014-07-31&format=json";
    HttpResponse<String> run = send("POST", evaluate, "", true);
    assertEquals(200, run.statusCode(), run.body());
    JsonNode rows = JSON.readTree(run.body()).path("results").get(0).path("rows");
    int transitions = 0;
    for (JsonNode row : rows) {
      String state = row.get(1).asText();
      transitions += state.equals("raised") || state.equals("cleared") ? 1 : 0;
    }
    assertTrue(transitions >= 2, "the 2014 run-up raises and clears the watch");
    awaitReceived(transitions);
    assertEquals(transitions, received.size());
    for (JsonNode alert : received) {
      assertTrue(alert.path("_signature_ok").asBoolean(), "signature of " + alert);
      assertEquals(WatchStatements.CAUTION, alert.path("caution").asText());
      // The run's picture travels with the alert: a PNG (signature from the PNG specification, ISO/IEC 15948).
      byte[] png = java.util.Base64.getDecoder().decode(alert.path("png_base64").asText());
      assertEquals(0x89, png[0] & 0xff);
      assertEquals("PNG", new String(png, 1, 3, StandardCharsets.US_ASCII));
      assertEquals(alert.path("_key_header").asText(), alert.path("idempotency_key").asText());
    }

    // Re-evaluating the same days records nothing new and sends nothing.
    assertEquals(200, send("POST", evaluate, "", true).statusCode());
    Thread.sleep(1500);
    assertEquals(transitions, received.size());

    // The receiver goes down; a new period's alerts wait in the outbox across a server restart.
    receiver.stop(0);
    String later = server.url() + "/api/watches/" + enc(NAME) + "/evaluate?from=2018-05-01&to=2018-07-31&format=json";
    int before = received.size();
    assertEquals(200, send("POST", later, "", true).statusCode());
    server.close();
    startReceiver(receiverPort);
    server = HttpServer.start(ws, config(), RETRY);
    awaitReceived(before + 1);
    Thread.sleep(1500);
    int after = received.size();
    assertTrue(after > before, "the 2018 alerts arrive after the restart");
    // And re-evaluating both periods on the restarted server repeats none of them.
    assertEquals(200, send("POST", server.url() + "/api/watches/" + enc(NAME) + "/evaluate?from=2014-05-01&to=2014-07-31", "", true).statusCode());
    assertEquals(200, send("POST", server.url() + "/api/watches/" + enc(NAME) + "/evaluate?from=2018-05-01&to=2018-07-31", "", true).statusCode());
    Thread.sleep(1500);
    assertEquals(after, received.size());
    List<String> keys = received.stream().map(n -> n.path("_key_header").asText()).toList();
    assertEquals(keys.size(), keys.stream().distinct().count(), "no transition delivered twice");
    JsonNode shown = JSON.readTree(send("GET", server.url() + "/api/watches/" + enc(NAME), "", false).body());
    assertEquals(after, shown.path("transitions").size());
    assertTrue(LocalDate.parse(shown.path("transitions").get(0).path("day").asText()).getYear() == 2014);
  }
}
