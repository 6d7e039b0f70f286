package org.slackwater.cli;

import java.nio.charset.StandardCharsets;
import java.util.Objects;

/**
 * A complete answer from the server.
 *
 * @param status the HTTP status code
 * @param contentType the Content-Type header, or empty
 * @param body the body's bytes, exactly as sent (defensively copied)
 */
record Answer(int status, String contentType, byte[] body) implements Arrival {
  Answer {
    Objects.requireNonNull(contentType);
    body = body.clone();
  }

  @Override
  public byte[] body() {
    return body.clone();
  }

  boolean ok() {
    return status >= 200 && status < 300;
  }

  /** The body as UTF-8 text (all of the server's text answers are UTF-8). */
  String text() {
    return new String(body, StandardCharsets.UTF_8);
  }
}
