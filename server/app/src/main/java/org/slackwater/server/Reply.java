package org.slackwater.server;

import io.netty.handler.codec.http.HttpResponseStatus;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.Objects;

/** A complete HTTP answer from an endpoint: status, content type, body, extra headers. */
record Reply(HttpResponseStatus status, String contentType, byte[] body, Map<String, String> headers) {
  Reply {
    Objects.requireNonNull(status);
    Objects.requireNonNull(contentType);
    Objects.requireNonNull(body);
    headers = Map.copyOf(headers);
  }

  static Reply of(HttpResponseStatus status, String contentType, byte[] body) {
    return new Reply(status, contentType, body, Map.of());
  }

  static Reply text(HttpResponseStatus status, String contentType, String body) {
    return of(status, contentType, body.getBytes(StandardCharsets.UTF_8));
  }
}
