package org.slackwater.cli;

import java.io.IOException;
import java.net.ConnectException;
import java.net.URI;
import java.net.URISyntaxException;
import java.net.http.HttpClient;
import java.net.http.HttpConnectTimeoutException;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Where the server is and how to talk to it: the base URL ({@code --server}, else {@code
 * SLACKWATER_URL}, else {@code http://127.0.0.1:8080}), the admin token ({@code SLACKWATER_TOKEN},
 * sent as {@code Authorization: Bearer} on admin requests only), one HTTP/1.1 exchange per call.
 *
 * <p>Paths are appended to the base URL, so a server behind a reverse proxy at {@code
 * https://host/slackwater} works. Failure modes: {@link CliFailure} with {@link Cli#LOCAL} for a
 * base URL that is not http(s), {@link Cli#UNREACHABLE} when no answer arrives (refused, unknown
 * host, timeout, broken connection). An answer with an error status is returned, not thrown.
 */
final class ServerConnection {
  static final String DEFAULT_URL = "http://127.0.0.1:8080";
  static final String URL_VARIABLE = "SLACKWATER_URL";
  static final String TOKEN_VARIABLE = "SLACKWATER_TOKEN";
  private static final Duration CONNECT_TIMEOUT = Duration.ofSeconds(10);

  private final String base;
  private final Optional<String> token;
  private final HttpClient http;

  private ServerConnection(String base, Optional<String> token) {
    this.base = base;
    this.token = token;
    this.http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).connectTimeout(CONNECT_TIMEOUT).build();
  }

  static ServerConnection of(String serverOption, Map<String, String> env) throws CliFailure {
    String given = serverOption;
    String origin = "--server";
    if (given == null || given.isBlank()) {
      given = env.get(URL_VARIABLE);
      origin = URL_VARIABLE;
    }
    if (given == null || given.isBlank()) {
      given = DEFAULT_URL;
      origin = "the default";
    }
    String trimmed = given.strip().replaceAll("/+$", "");
    try {
      URI uri = new URI(trimmed);
      String scheme = uri.getScheme() == null ? "" : uri.getScheme().toLowerCase(Locale.ROOT);
      if (!(scheme.equals("http") || scheme.equals("https")) || uri.getHost() == null || uri.getQuery() != null) {
        throw new URISyntaxException(trimmed, "not an http(s) URL with a host");
      }
    } catch (URISyntaxException e) {
      throw new CliFailure(Cli.LOCAL, origin + " '" + given + "' is not a server URL; write it like " + DEFAULT_URL);
    }
    Optional<String> token = Optional.ofNullable(env.get(TOKEN_VARIABLE)).map(String::strip).filter(s -> !s.isEmpty());
    return new ServerConnection(trimmed, token);
  }

  String base() {
    return base;
  }

  boolean hasToken() {
    return token.isPresent();
  }

  /** A request for {@code path} (starting with '/', already percent-encoded where needed). */
  HttpRequest.Builder request(String path) {
    return HttpRequest.newBuilder(URI.create(base + path));
  }

  /** A request for an admin endpoint: with the bearer token when there is one. */
  HttpRequest.Builder adminRequest(String path) {
    HttpRequest.Builder b = request(path);
    token.ifPresent(t -> b.header("Authorization", "Bearer " + t));
    return b;
  }

  Answer exchange(HttpRequest.Builder request) throws CliFailure {
    return send(request, HttpResponse.BodyHandlers.ofByteArray(), r -> new Answer(r.statusCode(),
        r.headers().firstValue("Content-Type").orElse(""), r.body()));
  }

  /**
   * An answer whose body is read as it arrives: a streamed one (chunked, e.g. a cell export) is
   * handed over as an open stream, which the caller closes; any other is read whole into an
   * {@link Answer}.
   */
  Arrival exchangeStreaming(HttpRequest.Builder request) throws CliFailure {
    return this.<java.io.InputStream, Arrival>send(request, HttpResponse.BodyHandlers.ofInputStream(), r -> {
      // A cell export comes chunked and may be far larger than this client's heap: pass it on.
      String type = r.headers().firstValue("Content-Type").orElse("");
      boolean chunked = r.headers().firstValue("Transfer-Encoding").orElse("").equalsIgnoreCase("chunked");
      if (chunked && r.statusCode() == 200) {
        return new Streamed(type, r.body());
      }
      try (java.io.InputStream in = r.body()) {
        return new Answer(r.statusCode(), type, in.readAllBytes());
      }
    });
  }

  /** A 200 answer still arriving: its content type and its body as a stream. */
  record Streamed(String contentType, java.io.InputStream body) implements Arrival {}

  @FunctionalInterface
  private interface Reading<T, R> {
    R read(HttpResponse<T> response) throws IOException;
  }

  private <T, R> R send(HttpRequest.Builder request, HttpResponse.BodyHandler<T> handler, Reading<T, R> reading) throws CliFailure {
    try {
      return reading.read(http.send(request.build(), handler));
    } catch (HttpConnectTimeoutException e) {
      throw unreachable("no answer within " + CONNECT_TIMEOUT.toSeconds() + " s", e);
    } catch (ConnectException e) {
      throw unreachable(e.getMessage() == null ? "connection refused" : e.getMessage(), e);
    } catch (IOException e) {
      throw new CliFailure(Cli.UNREACHABLE, "talking to the server at " + base + " failed ("
          + (e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage()) + ")", e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new CliFailure(Cli.UNREACHABLE, "interrupted while waiting for the server at " + base, e);
    }
  }

  private CliFailure unreachable(String why, Exception e) {
    return new CliFailure(Cli.UNREACHABLE, "cannot reach the server at " + base + " (" + why + "); is it running?"
        + " Point the client at it with --server URL or " + URL_VARIABLE, e);
  }
}
