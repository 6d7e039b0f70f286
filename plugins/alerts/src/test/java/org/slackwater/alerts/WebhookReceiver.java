package org.slackwater.alerts;

import com.sun.net.httpserver.Headers;
import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.Executors;

/**
 * A webhook receiver on the loopback interface: the JDK's HttpServer on an ephemeral port. It
 * records every request and answers with the next queued status (200 when none is queued).
 * {@link #stop} and {@link #restart} model a receiver that goes down and comes back on its port.
 */
final class WebhookReceiver implements AutoCloseable {

  record Request(String method, String path, Headers headers, byte[] body) {
    String header(String name) {
      return headers.getFirst(name);
    }
  }

  private final List<Request> requests = new CopyOnWriteArrayList<>();
  private final Deque<Integer> statuses = new ArrayDeque<>();
  private volatile long delayMillis;
  private int port;
  private HttpServer server;
  private java.util.concurrent.ExecutorService executor;

  WebhookReceiver() {
    start(0);
  }

  int port() {
    return port;
  }

  /** The next answers, in order; afterwards 200 again. */
  synchronized void answer(Integer... codes) {
    statuses.addAll(List.of(codes));
  }

  void delayAnswers(long millis) {
    delayMillis = millis;
  }

  List<Request> requests() {
    return List.copyOf(requests);
  }

  /** What a deduplicating receiver keeps: distinct idempotency keys in order of arrival. */
  Set<String> distinctKeys() {
    Set<String> keys = new LinkedHashSet<>();
    for (Request r : requests) {
      keys.add(r.header(WebhookNotifier.IDEMPOTENCY_HEADER));
    }
    return keys;
  }

  void stop() {
    server.stop(0);
    executor.shutdownNow();
  }

  void restart() {
    start(port);
  }

  @Override
  public void close() {
    stop();
  }

  private synchronized Integer nextStatus() {
    Integer s = statuses.poll();
    return s == null ? 200 : s;
  }

  private void start(int onPort) {
    try {
      server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), onPort), 16);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    executor = Executors.newCachedThreadPool(r -> {
      Thread t = new Thread(r, "test-webhook-receiver");
      t.setDaemon(true);
      return t;
    });
    server.setExecutor(executor);
    server.createContext("/", exchange -> {
      try (exchange; InputStream in = exchange.getRequestBody()) {
        byte[] body = in.readAllBytes();
        requests.add(new Request(exchange.getRequestMethod(), exchange.getRequestURI().getPath(), exchange.getRequestHeaders(), body));
        if (delayMillis > 0) {
          try {
            Thread.sleep(delayMillis);
          } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
          }
        }
        int status = nextStatus();
        if (status == 302) {
          exchange.getResponseHeaders().add("Location", "http://127.0.0.1:" + port + "/elsewhere");
        }
        byte[] answer = (status >= 200 && status < 300 ? "stored" : "receiver says no: status " + status).getBytes(StandardCharsets.UTF_8);
        if (status == 204) {
          exchange.sendResponseHeaders(status, -1); // 204 carries no body (RFC 9110 section 15.3.5)
        } else {
          exchange.sendResponseHeaders(status, answer.length);
          try (OutputStream out = exchange.getResponseBody()) {
            out.write(answer);
          }
        }
      }
    });
    server.start();
    port = server.getAddress().getPort();
  }

  static List<String> keys(List<Request> rs) {
    List<String> k = new ArrayList<>();
    rs.forEach(r -> k.add(r.header(WebhookNotifier.IDEMPOTENCY_HEADER)));
    return k;
  }
}
