package org.slackwater.alerts;

import java.io.IOException;
import java.io.InputStream;
import java.net.ConnectException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpConnectTimeoutException;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.net.http.HttpTimeoutException;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Duration;
import java.time.temporal.ChronoUnit;
import java.util.Objects;
import java.util.OptionalInt;

/**
 * Delivers an alert as an HTTP POST of its JSON form ({@link AlertJson}, format in
 * {@code package-info}) with the headers
 * <ul>
 *   <li>{@code Content-Type: application/json} (UTF-8, RFC 8259),</li>
 *   <li>{@code Slackwater-Idempotency-Key}: the alert's key, the same on every repeat,</li>
 *   <li>{@code Slackwater-Signature: sha256=<hex>}: HMAC-SHA256 of the exact body bytes with the
 *       channel secret ({@link WebhookSignature}),</li>
 *   <li>{@code Slackwater-Timestamp}: when this attempt was sent, ISO 8601 UTC to the second (not
 *       signed; the signed body carries {@code raised_at}).</li>
 * </ul>
 * Any 2xx answer means delivered. Anything else is a {@link DeliveryException}: another status
 * (with the code and the start of the answer), a redirect (not followed: a signed alert goes to
 * the configured address only), no connection, or no answer within the timeouts.
 */
public final class WebhookNotifier implements Notifier {

  public static final String IDEMPOTENCY_HEADER = "Slackwater-Idempotency-Key";
  public static final String SIGNATURE_HEADER = "Slackwater-Signature";
  public static final String TIMESTAMP_HEADER = "Slackwater-Timestamp";
  private static final int ANSWER_EXCERPT = 300;

  private final HttpClient http;
  private final Duration requestTimeout;
  private final Clock clock;

  /** Connect within 5 s, whole exchange within 15 s, system clock. */
  public WebhookNotifier() {
    this(Duration.ofSeconds(5), Duration.ofSeconds(15), Clock.systemUTC());
  }

  public WebhookNotifier(Duration connectTimeout, Duration requestTimeout, Clock clock) {
    requirePositive(connectTimeout, "connectTimeout");
    this.requestTimeout = requirePositive(requestTimeout, "requestTimeout");
    this.clock = Objects.requireNonNull(clock, "clock");
    // HTTP/1.1 so that a plain-http receiver never sees an h2c upgrade attempt.
    this.http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).followRedirects(HttpClient.Redirect.NEVER)
        .connectTimeout(connectTimeout).build();
  }

  @Override
  public void send(Alert a, Channel c) throws DeliveryException {
    if (!(c.destination() instanceof Channel.Webhook w)) {
      throw new DeliveryException("channel '" + c.id() + "' is an " + c.kind().wireName()
          + " channel; the webhook notifier sends to webhook channels only (check the notifier map given to the outbox)");
    }
    byte[] body = AlertJson.write(a);
    HttpRequest request = HttpRequest.newBuilder(w.url()).timeout(requestTimeout)
        .header("Content-Type", "application/json") // RFC 8259 section 11: UTF-8, no charset parameter
        .header("User-Agent", "Slackwater-Alerts/1")
        .header(IDEMPOTENCY_HEADER, a.idempotencyKey())
        .header(SIGNATURE_HEADER, WebhookSignature.header(w.secret(), body))
        .header(TIMESTAMP_HEADER, clock.instant().truncatedTo(ChronoUnit.SECONDS).toString())
        .POST(HttpRequest.BodyPublishers.ofByteArray(body)).build();
    String where = "channel '" + c.id() + "' (" + safe(w.url()) + ")";
    HttpResponse<InputStream> response;
    try {
      response = http.send(request, HttpResponse.BodyHandlers.ofInputStream());
    } catch (HttpConnectTimeoutException e) {
      throw new DeliveryException(where + ": no connection within the connect timeout; is the receiver running and reachable?", e);
    } catch (HttpTimeoutException e) {
      throw new DeliveryException(where + ": no answer within " + requestTimeout.toMillis() + " ms; the receiver may still have"
          + " processed the alert, so the repeat carries the same idempotency key", e);
    } catch (ConnectException e) {
      throw new DeliveryException(where + ": could not connect (" + DeliveryException.describe(e) + "); is the receiver running?", e);
    } catch (IOException e) {
      throw new DeliveryException(where + ": the exchange failed (" + DeliveryException.describe(e) + ")", e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new DeliveryException(where + ": interrupted while sending; the alert stays queued", e);
    }
    int status = response.statusCode();
    String answer = excerpt(response.body());
    if (status < 200 || status > 299) {
      throw new DeliveryException(where + ": the receiver answered HTTP " + status + (answer.isEmpty() ? "" : " \"" + answer + "\""),
          OptionalInt.of(status), null);
    }
  }

  private static String excerpt(InputStream in) {
    // Only the start of the answer: it goes into the outbox's error column, and a receiver's page can be large.
    try (in) {
      byte[] start = in.readNBytes(ANSWER_EXCERPT);
      return new String(start, StandardCharsets.UTF_8).replaceAll("\\s+", " ").strip();
    } catch (IOException e) {
      return "";
    }
  }

  private static String safe(URI url) {
    // The query string may hold a receiver's token; error rows and logs get scheme, host, port and path only.
    return url.getScheme() + "://" + url.getHost() + (url.getPort() < 0 ? "" : ":" + url.getPort())
        + (url.getRawPath() == null ? "" : url.getRawPath());
  }

  private static Duration requirePositive(Duration d, String name) {
    Objects.requireNonNull(d, name);
    if (d.isNegative() || d.isZero()) {
      throw new IllegalArgumentException(name + " must be positive, got " + d);
    }
    return d;
  }
}
