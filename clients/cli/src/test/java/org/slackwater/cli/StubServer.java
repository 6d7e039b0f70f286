package org.slackwater.cli;

import com.sun.net.httpserver.HttpExchange;
import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;

/**
 * A stand-in for the Slackwater server on an ephemeral loopback port (the JDK's built-in HTTP
 * server), for the endpoints a test needs: it answers what the test told it to for a method and a
 * raw (still percent-encoded) path, and records every request as it arrived, so a test can check
 * the method, path, query, headers and body the client sent. Anything else gets a 404 problem.
 */
final class StubServer implements AutoCloseable {
  /** A request as it arrived; header names lower-cased. */
  record Request(String method, String rawPath, String rawQuery, Map<String, List<String>> headers, byte[] body) {
    Request {
      headers = Map.copyOf(headers);
      body = body.clone();
    }

    @Override
    public byte[] body() {
      return body.clone();
    }

    Optional<String> header(String name) {
      List<String> v = headers.get(name.toLowerCase(Locale.ROOT));
      return v == null || v.isEmpty() ? Optional.empty() : Optional.of(v.get(0));
    }

    String text() {
      return new String(body, StandardCharsets.UTF_8);
    }
  }

  /** What to answer, after an optional delay (to make the client wait). */
  record Reply(int status, String contentType, byte[] body, Duration delay) {
    Reply {
      body = body.clone();
    }

    static Reply json(int status, String json) {
      return new Reply(status, status >= 400 ? "application/problem+json" : "application/json",
          json.getBytes(StandardCharsets.UTF_8), Duration.ZERO);
    }

    static Reply of(int status, String contentType, byte[] body) {
      return new Reply(status, contentType, body, Duration.ZERO);
    }

    Reply after(Duration d) {
      return new Reply(status, contentType, body, d);
    }
  }

  private final HttpServer server;
  private final Map<String, Reply> replies = new ConcurrentHashMap<>();
  private final List<Request> requests = Collections.synchronizedList(new ArrayList<>());

  private StubServer(HttpServer server) {
    this.server = server;
  }

  static StubServer start() throws IOException {
    HttpServer s = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
    StubServer stub = new StubServer(s);
    s.createContext("/", stub::handle);
    s.start();
    return stub;
  }

  String url() {
    return "http://127.0.0.1:" + server.getAddress().getPort();
  }

  void on(String method, String rawPath, Reply reply) {
    replies.put(method + " " + rawPath, reply);
  }

  List<Request> requests() {
    synchronized (requests) {
      return List.copyOf(requests);
    }
  }

  /** The only request so far (fails the test if there was not exactly one). */
  Request only() {
    List<Request> all = requests();
    if (all.size() != 1) {
      throw new AssertionError("expected one request, got " + all.size() + ": " + all.stream().map(r -> r.method() + " " + r.rawPath()).toList());
    }
    return all.get(0);
  }

  private void handle(HttpExchange ex) throws IOException {
    byte[] body = ex.getRequestBody().readAllBytes();
    Map<String, List<String>> headers = new TreeMap<>();
    ex.getRequestHeaders().forEach((k, v) -> headers.put(k.toLowerCase(Locale.ROOT), List.copyOf(v)));
    String rawPath = ex.getRequestURI().getRawPath();
    requests.add(new Request(ex.getRequestMethod(), rawPath, ex.getRequestURI().getRawQuery(), headers, body));
    Reply r = replies.getOrDefault(ex.getRequestMethod() + " " + rawPath,
        Reply.json(404, "{\"type\":\"about:blank\",\"title\":\"No such endpoint\",\"status\":404,\"detail\":\"the stub has no "
            + ex.getRequestMethod() + " " + rawPath + "\"}"));
    if (!r.delay().isZero()) {
      try {
        Thread.sleep(r.delay().toMillis());
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
    ex.getResponseHeaders().set("Content-Type", r.contentType());
    byte[] out = r.body();
    ex.sendResponseHeaders(r.status(), out.length == 0 ? -1 : out.length);
    if (out.length > 0) {
      try (OutputStream o = ex.getResponseBody()) {
        o.write(out);
      }
    }
    ex.close();
  }

  @Override
  public void close() {
    server.stop(0);
  }
}
