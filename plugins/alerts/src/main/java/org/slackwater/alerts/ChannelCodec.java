package org.slackwater.alerts;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Channel definitions as JSON: the form an operator writes and the form the outbox stores.
 *
 * <pre>{@code
 * [
 *   {"id": "north-intake-ops", "kind": "webhook",
 *    "url": "https://alerts.example.org/slackwater", "secret": "<at least 32 bytes>"},
 *   {"id": "north-intake-mail", "kind": "email",
 *    "smtp_host": "smtp.example.org", "smtp_port": 587, "starttls": true,
 *    "from": "Slackwater <slackwater@example.org>", "to": ["operator@example.org"],
 *    "username": "slackwater", "password": "..."}
 * ]
 * }</pre>
 *
 * <p>{@code starttls} defaults to {@code true}; {@code username} and {@code password} are optional.
 * Unknown fields are errors (a misspelt {@code "secert"} must not leave a webhook unsigned), as are
 * two channels with one id. Every error is a {@link ChannelException} naming the source, the line
 * and column of the channel, its id and the field.
 */
public final class ChannelCodec {

  private static final ObjectMapper JSON = new ObjectMapper();
  private static final Set<String> WEBHOOK_FIELDS = Set.of("id", "kind", "url", "secret");
  private static final Set<String> EMAIL_FIELDS =
      Set.of("id", "kind", "smtp_host", "smtp_port", "starttls", "from", "to", "username", "password");

  private ChannelCodec() {}

  /** Reads a JSON array of channel definitions; {@code source} names the text in errors (a file name). */
  public static List<Channel> parseList(String text, String source) {
    List<Channel> channels = new ArrayList<>();
    Set<String> ids = new HashSet<>();
    try (JsonParser p = JSON.createParser(text)) {
      if (p.nextToken() != JsonToken.START_ARRAY) {
        throw new ChannelException("expected a JSON array of channel definitions, [ {...}, ... ]")
            .at(where(source, p.currentTokenLocation()));
      }
      int index = 0;
      while (p.nextToken() != JsonToken.END_ARRAY) {
        JsonLocation start = p.currentTokenLocation();
        if (p.currentToken() != JsonToken.START_OBJECT) {
          throw new ChannelException("channel " + index + " is not a JSON object; write each channel as {\"id\": ..., \"kind\": ...}")
              .at(where(source, start));
        }
        JsonNode node = p.readValueAsTree();
        Channel c;
        try {
          c = fromJson(node);
        } catch (ChannelException e) {
          throw e.at(where(source, start));
        }
        if (!ids.add(c.id())) {
          throw new ChannelException("channel '" + c.id() + "' is defined twice; give each channel its own id")
              .at(where(source, start));
        }
        channels.add(c);
        index++;
      }
      if (p.nextToken() != null) {
        throw new ChannelException("text after the closing ']' of the channel list; remove it").at(where(source, p.currentTokenLocation()));
      }
    } catch (JsonProcessingException e) {
      throw new ChannelException("not valid JSON: " + e.getOriginalMessage() + "; check quotes, commas and brackets")
          .at(where(source, e.getLocation()));
    } catch (IOException e) {
      throw new ChannelException("could not read the channel definitions: " + e.getMessage()).at(source);
    }
    return List.copyOf(channels);
  }

  /** One channel from its JSON object. */
  public static Channel fromJson(JsonNode node) {
    if (node == null || !node.isObject()) {
      throw new ChannelException("a channel must be a JSON object with \"id\" and \"kind\"");
    }
    String id = requiredText(node, "id");
    Channel.checkId(id);
    try {
      Channel.Kind kind = Channel.Kind.ofWireName(requiredText(node, "kind"));
      checkFields(node, kind == Channel.Kind.WEBHOOK ? WEBHOOK_FIELDS : EMAIL_FIELDS, kind);
      Channel.Destination d = switch (kind) {
        case WEBHOOK -> new Channel.Webhook(Channel.Webhook.parseUrl(optionalText(node, "url").orElse(null)),
            optionalText(node, "secret").orElse(null));
        case EMAIL -> new Channel.Email(optionalText(node, "smtp_host").orElse(null), requiredPort(node),
            optionalText(node, "from").orElse(null), recipients(node), optionalText(node, "username"),
            optionalText(node, "password"), optionalBoolean(node, "starttls").orElse(true));
      };
      return new Channel(id, d);
    } catch (ChannelException e) {
      throw e.at("channel '" + id + "'");
    }
  }

  /** The JSON object {@link #fromJson} reads back, secrets included (for the outbox, not for logs). */
  public static ObjectNode toJson(Channel c) {
    ObjectNode o = JSON.createObjectNode();
    o.put("id", c.id());
    o.put("kind", c.kind().wireName());
    // Pattern matching over the sealed type needs a newer Java than 17; two instanceof tests say the same.
    if (c.destination() instanceof Channel.Webhook w) {
      o.put("url", w.url().toString());
      o.put("secret", w.secret());
    } else if (c.destination() instanceof Channel.Email m) {
      o.put("smtp_host", m.smtpHost());
      o.put("smtp_port", m.port());
      o.put("starttls", m.startTls());
      o.put("from", m.from());
      ArrayNode to = o.putArray("to");
      m.to().forEach(to::add);
      m.username().ifPresent(u -> o.put("username", u));
      m.password().ifPresent(p -> o.put("password", p));
    }
    return o;
  }

  private static String where(String source, JsonLocation at) {
    return at == null || at.getLineNr() < 1 ? source : source + " line " + at.getLineNr() + ", column " + at.getColumnNr();
  }

  private static void checkFields(JsonNode node, Set<String> known, Channel.Kind kind) {
    for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
      String f = it.next();
      if (!known.contains(f)) {
        throw new ChannelException("unknown field '" + f + "' for a " + kind.wireName() + " channel; the fields are "
            + known.stream().sorted().toList());
      }
    }
  }

  private static String requiredText(JsonNode node, String field) {
    return optionalText(node, field).orElseThrow(() -> new ChannelException("field '" + field + "' is missing"
        + (field.equals("kind") ? "; write \"kind\": \"webhook\" or \"kind\": \"email\"" : "; give the channel an id, such as \"north-intake-ops\"")));
  }

  private static Optional<String> optionalText(JsonNode node, String field) {
    JsonNode v = node.get(field);
    if (v == null || v.isNull()) {
      return Optional.empty();
    }
    if (!v.isTextual()) {
      throw new ChannelException("field '" + field + "' must be a string in quotes, found " + v.getNodeType().name().toLowerCase(java.util.Locale.ROOT)
          + " " + v);
    }
    return Optional.of(v.textValue());
  }

  private static Optional<Boolean> optionalBoolean(JsonNode node, String field) {
    JsonNode v = node.get(field);
    if (v == null || v.isNull()) {
      return Optional.empty();
    }
    if (!v.isBoolean()) {
      throw new ChannelException("field '" + field + "' must be true or false (no quotes), found " + v);
    }
    return Optional.of(v.booleanValue());
  }

  private static int requiredPort(JsonNode node) {
    JsonNode v = node.get("smtp_port");
    if (v == null || v.isNull()) {
      throw new ChannelException("field 'smtp_port' is missing; give the relay's port, usually 587 (submission with STARTTLS)");
    }
    if (!v.isIntegralNumber() || !v.canConvertToInt()) {
      throw new ChannelException("field 'smtp_port' must be a whole number such as 587, found " + v);
    }
    return v.intValue();
  }

  private static List<String> recipients(JsonNode node) {
    JsonNode v = node.get("to");
    if (v == null || v.isNull()) {
      throw new ChannelException("field 'to' is missing; list the recipients, such as [\"operator@example.org\"]");
    }
    if (!v.isArray()) {
      throw new ChannelException("field 'to' must be a list of addresses in brackets, such as [\"operator@example.org\"], found " + v);
    }
    List<String> to = new ArrayList<>();
    for (int i = 0; i < v.size(); i++) {
      JsonNode a = v.get(i);
      if (!a.isTextual()) {
        throw new ChannelException("field 'to[" + i + "]' must be an address in quotes, found " + a);
      }
      to.add(a.textValue());
    }
    return to;
  }
}
