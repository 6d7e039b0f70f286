package org.slackwater.alerts;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * The JSON form of an {@link Alert}: the webhook body and the outbox's stored copy (format in
 * {@code package-info}). Writing is deterministic (fixed field order, values in the alert's order,
 * UTF-8, no whitespace), so a repeated delivery of one alert carries the same bytes and the same
 * signature.
 *
 * <p>{@link #read} is strict: a missing field, a wrong type or another {@code format} is an
 * {@link IllegalArgumentException} naming the field.
 */
public final class AlertJson {

  /** The value of the {@code format} field; a receiver checks it before reading the rest. */
  public static final String FORMAT = "slackwater.alert.v1";

  private static final ObjectMapper JSON = new ObjectMapper();

  private AlertJson() {}

  public static byte[] write(Alert a) {
    ByteArrayOutputStream out = new ByteArrayOutputStream(512);
    try (JsonGenerator g = JSON.getFactory().createGenerator(out)) {
      g.writeStartObject();
      g.writeStringField("format", FORMAT);
      g.writeStringField("idempotency_key", a.idempotencyKey());
      g.writeStringField("watch", a.watch());
      g.writeStringField("state", a.state());
      g.writeStringField("severity", a.severity());
      g.writeStringField("step", a.step().toString());
      g.writeStringField("condition", a.condition());
      g.writeObjectFieldStart("values");
      for (Map.Entry<String, String> e : a.values().entrySet()) {
        g.writeStringField(e.getKey(), e.getValue());
      }
      g.writeEndObject();
      g.writeStringField("caution", a.caution());
      g.writeStringField("raised_at", a.raisedAt().toString());
      Optional<byte[]> png = a.png();
      if (png.isPresent()) {
        g.writeStringField("png_base64", Base64.getEncoder().encodeToString(png.get()));
      } else {
        g.writeNullField("png_base64");
      }
      g.writeEndObject();
    } catch (IOException e) {
      throw new UncheckedIOException("writing an alert to memory failed", e);
    }
    return out.toByteArray();
  }

  public static Alert read(byte[] json) {
    JsonNode n;
    try {
      n = JSON.readTree(json);
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException("alert JSON is not valid JSON at line " + e.getLocation().getLineNr() + ", column "
          + e.getLocation().getColumnNr() + ": " + e.getOriginalMessage());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    if (n == null || !n.isObject()) {
      throw new IllegalArgumentException("alert JSON must be an object");
    }
    String format = text(n, "format");
    if (!FORMAT.equals(format)) {
      throw new IllegalArgumentException("alert JSON has format '" + format + "', this reader knows '" + FORMAT + "'");
    }
    Map<String, String> values = new LinkedHashMap<>();
    JsonNode v = n.get("values");
    if (v == null || !v.isObject()) {
      throw new IllegalArgumentException("alert JSON field 'values' must be an object of strings");
    }
    for (Map.Entry<String, JsonNode> e : v.properties()) {
      if (!e.getValue().isTextual()) {
        throw new IllegalArgumentException("alert JSON value '" + e.getKey() + "' must be a string, found " + e.getValue());
      }
      values.put(e.getKey(), e.getValue().textValue());
    }
    JsonNode png = n.get("png_base64");
    Optional<byte[]> picture;
    if (png == null || png.isNull()) {
      picture = Optional.empty();
    } else if (png.isTextual()) {
      try {
        picture = Optional.of(Base64.getDecoder().decode(png.textValue()));
      } catch (IllegalArgumentException e) {
        throw new IllegalArgumentException("alert JSON field 'png_base64' is not base64: " + e.getMessage());
      }
    } else {
      throw new IllegalArgumentException("alert JSON field 'png_base64' must be a base64 string or null");
    }
    try {
      return new Alert(text(n, "idempotency_key"), text(n, "watch"), text(n, "state"), text(n, "severity"),
          LocalDate.parse(text(n, "step")), text(n, "condition"), values, text(n, "caution"),
          Instant.parse(text(n, "raised_at")), picture);
    } catch (DateTimeParseException e) {
      throw new IllegalArgumentException("alert JSON date '" + e.getParsedString() + "' is not ISO 8601: " + e.getMessage());
    }
  }

  private static String text(JsonNode n, String field) {
    JsonNode v = n.get(field);
    if (v == null || !v.isTextual()) {
      throw new IllegalArgumentException("alert JSON field '" + field + "' is missing or not a string");
    }
    return v.textValue();
  }
}
