package org.slackwater.server;

import io.netty.handler.codec.http.HttpResponseStatus;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.Objects;

/**
 * An HTTP answer from an endpoint: status, content type, extra headers, and either a body held
 * whole or a {@link Streamer} that writes a long body as it is produced (sent chunked; see
 * {@link ChunkedBody}).
 *
 * @param streamer null for a body held whole
 */
record Reply(HttpResponseStatus status, String contentType, byte[] body, Map<String, String> headers, Streamer streamer) {
  /** Writes a body that is produced while it is sent; it owns what it reads and closes it, even on failure. */
  @FunctionalInterface
  interface Streamer {
    void writeTo(OutputStream out) throws IOException;
  }

  Reply {
    Objects.requireNonNull(status);
    Objects.requireNonNull(contentType);
    Objects.requireNonNull(body);
    headers = Map.copyOf(headers);
  }

  Reply(HttpResponseStatus status, String contentType, byte[] body, Map<String, String> headers) {
    this(status, contentType, body, headers, null);
  }

  static Reply of(HttpResponseStatus status, String contentType, byte[] body) {
    return new Reply(status, contentType, body, Map.of());
  }

  static Reply text(HttpResponseStatus status, String contentType, String body) {
    return of(status, contentType, body.getBytes(StandardCharsets.UTF_8));
  }

  /** A 200 whose body {@code streamer} writes while it is sent. */
  static Reply streamed(String contentType, Streamer streamer) {
    return new Reply(HttpResponseStatus.OK, contentType, new byte[0], Map.of(), Objects.requireNonNull(streamer));
  }
}
