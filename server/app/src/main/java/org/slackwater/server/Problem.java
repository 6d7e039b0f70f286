package org.slackwater.server;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import io.netty.handler.codec.http.HttpResponseStatus;
import org.slackwater.query.QueryException;

/**
 * Error bodies as problem details (RFC 9457, {@code application/problem+json}): {@code type},
 * {@code title}, {@code status}, {@code detail}; query errors add {@code line}, {@code column}
 * (1-based), {@code excerpt} (the line with a caret under the column) and {@code hint}.
 */
final class Problem {
  static final String CONTENT_TYPE = "application/problem+json";
  private static final ObjectMapper JSON = new ObjectMapper();

  private Problem() {}

  static Reply of(HttpResponseStatus status, String title, String detail) {
    return Reply.text(status, CONTENT_TYPE, base(status, title, detail).toString());
  }

  static Reply query(QueryException e) {
    ObjectNode o = base(HttpResponseStatus.BAD_REQUEST, "The query cannot be run", e.detail());
    o.put("line", e.line());
    o.put("column", e.column());
    o.put("excerpt", e.excerpt());
    if (!e.hint().isEmpty()) {
      o.put("hint", e.hint());
    }
    return Reply.text(HttpResponseStatus.BAD_REQUEST, CONTENT_TYPE, o.toString());
  }

  private static ObjectNode base(HttpResponseStatus status, String title, String detail) {
    ObjectNode o = JSON.createObjectNode();
    o.put("type", "about:blank");
    o.put("title", title);
    o.put("status", status.code());
    o.put("detail", detail);
    return o;
  }
}
