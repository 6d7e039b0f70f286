package org.slackwater.alerts;

import jakarta.mail.internet.AddressException;
import jakarta.mail.internet.InternetAddress;
import java.net.URI;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * A destination for alerts: a webhook or an e-mail recipient list, under an id that is unique
 * among a watch's channels (the outbox keeps one row per alert and channel id).
 *
 * <p>Every constructor validates; a wrong definition is a {@link ChannelException} naming the
 * channel, the field and the fix. {@code toString} never shows a secret or a password.
 *
 * <p>The outbox stores channel definitions, secrets included, so that deliveries survive a
 * restart; see {@link Outbox} for how that file is protected.
 */
public record Channel(String id, Destination destination) {

  private static final Pattern ID = Pattern.compile("[A-Za-z0-9][A-Za-z0-9_.-]{0,63}");

  /** The kinds of destination; {@link #wireName} is the spelling in channel definitions and the outbox. */
  public enum Kind {
    WEBHOOK("webhook"), EMAIL("email");

    private final String wireName;

    Kind(String wireName) {
      this.wireName = wireName;
    }

    public String wireName() {
      return wireName;
    }

    /** The kind spelt {@code name}, or a {@link ChannelException} listing the kinds there are. */
    public static Kind ofWireName(String name) {
      for (Kind k : values()) {
        if (k.wireName.equals(name)) {
          return k;
        }
      }
      throw new ChannelException("field 'kind': '" + name + "' is not a channel kind; write \"webhook\" or \"email\"");
    }
  }

  public Channel {
    checkId(id);
    Objects.requireNonNull(destination, () -> "channel '" + id + "' has no destination");
  }

  static void checkId(String id) {
    Objects.requireNonNull(id, "channel id is null");
    if (!ID.matcher(id).matches()) {
      throw new ChannelException("field 'id': '" + id + "' is not a channel id; use 1 to 64 letters, digits, '_', '-' or '.',"
          + " starting with a letter or digit (for example \"north-intake-ops\")");
    }
  }

  public Kind kind() {
    return destination.kind();
  }

  /** A webhook channel; see {@link Webhook} for the rules. */
  public static Channel webhook(String id, String url, String secret) {
    try {
      return new Channel(id, new Webhook(Webhook.parseUrl(url), secret));
    } catch (ChannelException e) {
      throw e.at("channel '" + id + "'");
    }
  }

  /** An e-mail channel; see {@link Email} for the rules. */
  public static Channel email(String id, String smtpHost, int port, String from, List<String> to,
                              Optional<String> username, Optional<String> password, boolean startTls) {
    try {
      return new Channel(id, new Email(smtpHost, port, from, to, username, password, startTls));
    } catch (ChannelException e) {
      throw e.at("channel '" + id + "'");
    }
  }

  /** Where alerts go: one of the permitted records. */
  public sealed interface Destination permits Webhook, Email {
    Kind kind();
  }

  /**
   * An HTTP(S) endpoint that receives a signed JSON POST per alert. The URL is absolute http or
   * https with a host and no user name or password in it (credentials in a URL end up in logs; the
   * secret authenticates instead). The secret keys the HMAC-SHA256 signature and must be at least
   * 32 bytes: RFC 2104 section 3 discourages HMAC keys shorter than the hash output (32 bytes for
   * SHA-256).
   */
  public record Webhook(URI url, String secret) implements Destination {

    static final int MIN_SECRET_BYTES = 32;

    public Webhook {
      Objects.requireNonNull(url, "webhook url is null");
      checkUrl(url, url.toString());
      if (secret == null || secret.isBlank()) {
        throw new ChannelException("field 'secret' is missing; a webhook needs a shared secret of at least " + MIN_SECRET_BYTES
            + " bytes to sign each body, for example 64 random hex digits (openssl rand -hex 32)");
      }
      int bytes = secret.getBytes(StandardCharsets.UTF_8).length;
      if (bytes < MIN_SECRET_BYTES) {
        throw new ChannelException("field 'secret' is " + bytes + " bytes long, shorter than the " + MIN_SECRET_BYTES
            + " bytes of an HMAC-SHA256 output (RFC 2104 section 3); use a longer random secret, for example 64 random hex digits");
      }
    }

    @Override
    public Kind kind() {
      return Kind.WEBHOOK;
    }

    @Override
    public String toString() {
      return "Webhook[url=" + url + ", secret=(hidden)]";
    }

    static URI parseUrl(String text) {
      if (text == null || text.isBlank()) {
        throw new ChannelException("field 'url' is missing; give the receiver's address, such as https://alerts.example.org/slackwater");
      }
      URI uri;
      try {
        uri = new URI(text.strip());
      } catch (URISyntaxException e) {
        throw new ChannelException("field 'url': '" + text + "' is not a URL (" + e.getReason() + " at index " + e.getIndex()
            + "); write it as https://host[:port]/path, with spaces encoded as %20");
      }
      checkUrl(uri, text);
      return uri;
    }

    private static void checkUrl(URI uri, String text) {
      String scheme = uri.getScheme() == null ? "" : uri.getScheme().toLowerCase(Locale.ROOT);
      if (!scheme.equals("http") && !scheme.equals("https")) {
        throw new ChannelException("field 'url': '" + text + "' is not an http or https URL"
            + (scheme.isEmpty() ? "" : " (scheme '" + scheme + "')") + "; write it as https://host[:port]/path");
      }
      if (uri.getHost() == null || uri.getHost().isBlank()) {
        throw new ChannelException("field 'url': '" + text + "' has no host name; write it as https://host[:port]/path");
      }
      if (uri.getRawUserInfo() != null) {
        throw new ChannelException("field 'url': '" + uri.getScheme() + "://...@" + uri.getHost()
            + "' carries a user name or password; remove it (the shared secret authenticates the sender)");
      }
      if (uri.getRawFragment() != null) {
        throw new ChannelException("field 'url': '" + text + "' has a fragment ('#...'), which is never sent; remove it");
      }
    }
  }

  /**
   * An SMTP relay and the recipients. The host is a name or address, the port 1 to 65535, the
   * addresses are RFC 5322 addresses (checked strictly by Jakarta Mail, and each must have a
   * domain). User name and password come together or not at all. With STARTTLS on, the connection
   * must upgrade to TLS before anything is sent; credentials without STARTTLS are refused unless
   * the relay is on the loopback interface, since they would cross the network in clear text.
   */
  public record Email(String smtpHost, int port, String from, List<String> to, Optional<String> username,
                      Optional<String> password, boolean startTls) implements Destination {

    public Email {
      if (smtpHost == null || smtpHost.isBlank()) {
        throw new ChannelException("field 'smtp_host' is missing; give the SMTP relay's host name, such as smtp.example.org");
      }
      smtpHost = smtpHost.strip();
      if (!smtpHost.matches("[A-Za-z0-9.:\\[\\]_-]+")) {
        throw new ChannelException("field 'smtp_host': '" + smtpHost + "' is not a host name or address; write a name such as"
            + " smtp.example.org or an address such as 127.0.0.1");
      }
      if (port < 1 || port > 65535) {
        throw new ChannelException("field 'smtp_port': " + port + " is not a TCP port; use 1 to 65535 (587 for submission with STARTTLS)");
      }
      from = address("from", from);
      Objects.requireNonNull(to, "field 'to' is null");
      if (to.isEmpty()) {
        throw new ChannelException("field 'to' is empty; list at least one recipient, such as [\"operator@example.org\"]");
      }
      String[] checked = new String[to.size()];
      for (int i = 0; i < checked.length; i++) {
        checked[i] = address("to[" + i + "]", to.get(i));
      }
      to = List.of(checked);
      Objects.requireNonNull(username, "username is null; pass Optional.empty()");
      Objects.requireNonNull(password, "password is null; pass Optional.empty()");
      username = username.filter(u -> !u.isBlank());
      password = password.filter(p -> !p.isEmpty());
      if (username.isPresent() != password.isPresent()) {
        throw new ChannelException("field '" + (username.isPresent() ? "password" : "username") + "' is missing; give both"
            + " 'username' and 'password' for a relay that needs a login, or neither");
      }
      if (username.isPresent() && !startTls && !isLoopback(smtpHost)) {
        throw new ChannelException("a login to '" + smtpHost + "' without STARTTLS would send the password in clear text; set"
            + " \"starttls\": true (port 587), or drop the login for a relay that accepts this server without one");
      }
    }

    @Override
    public Kind kind() {
      return Kind.EMAIL;
    }

    @Override
    public String toString() {
      return "Email[smtp=" + smtpHost + ":" + port + ", from=" + from + ", to=" + to + ", username=" + username.orElse("(none)")
          + ", password=" + (password.isPresent() ? "(hidden)" : "(none)") + ", starttls=" + startTls + "]";
    }

    static boolean isLoopback(String host) {
      String h = host.toLowerCase(Locale.ROOT);
      return h.equals("localhost") || h.equals("::1") || h.equals("[::1]") || h.matches("127\\.\\d{1,3}\\.\\d{1,3}\\.\\d{1,3}");
    }

    private static String address(String field, String text) {
      if (text == null || text.isBlank()) {
        throw new ChannelException("field '" + field + "' is missing; give an e-mail address such as operator@example.org");
      }
      try {
        InternetAddress parsed = new InternetAddress(text.strip(), true);
        String addr = parsed.getAddress();
        int at = addr.lastIndexOf('@');
        if (at <= 0 || at == addr.length() - 1) {
          throw new AddressException("no '@domain' part", text);
        }
        return parsed.toUnicodeString();
      } catch (AddressException e) {
        throw new ChannelException("field '" + field + "': '" + text + "' is not an e-mail address (" + e.getMessage()
            + "); write it as name@example.org or \"Name <name@example.org>\"");
      }
    }
  }
}
