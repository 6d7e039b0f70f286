package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ChannelTest {

  private static final String SECRET = TestAlerts.SECRET;

  private static String list(String... channels) {
    return "[\n" + String.join(",\n", channels) + "\n]";
  }

  private static String webhook(String url, String secret) {
    return "  {\"id\": \"north-intake-ops\", \"kind\": \"webhook\", \"url\": " + url + (secret == null ? "" : ", \"secret\": " + secret) + "}";
  }

  private static ChannelException parseError(String text) {
    return assertThrows(ChannelException.class, () -> ChannelCodec.parseList(text, "channels.json"));
  }

  private static void assertMentions(Exception e, String... parts) {
    for (String p : parts) {
      assertTrue(e.getMessage().contains(p), () -> "expected '" + p + "' in: " + e.getMessage());
    }
  }

  @Test
  void parsesWebhookAndEmailChannels() {
    List<Channel> cs = ChannelCodec.parseList(list(
        webhook("\"https://alerts.example.org/slackwater?team=intake\"", "\"" + SECRET + "\""),
        "  {\"id\": \"north-intake-mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\", \"smtp_port\": 587,"
            + " \"from\": \"Slackwater <slackwater@example.org>\", \"to\": [\"operator@example.org\", \"lab@example.org\"],"
            + " \"username\": \"slackwater\", \"password\": \"pw\"}"), "channels.json");
    assertEquals(2, cs.size());
    Channel.Webhook w = (Channel.Webhook) cs.get(0).destination();
    assertEquals(Channel.Kind.WEBHOOK, cs.get(0).kind());
    assertEquals("alerts.example.org", w.url().getHost());
    assertEquals(SECRET, w.secret());
    Channel.Email m = (Channel.Email) cs.get(1).destination();
    assertEquals(Channel.Kind.EMAIL, cs.get(1).kind());
    assertEquals(List.of("operator@example.org", "lab@example.org"), m.to());
    assertTrue(m.startTls(), "starttls defaults to true");
    assertEquals(Optional.of("slackwater"), m.username());
  }

  @Test
  void storedFormReadsBackToTheSameChannel() {
    Channel w = Channel.webhook("ops", "https://alerts.example.org/hook", SECRET);
    Channel m = Channel.email("mail", "127.0.0.1", 2525, "slackwater@example.org", List.of("operator@example.org"),
        Optional.of("u"), Optional.of("p"), false);
    assertEquals(w, ChannelCodec.fromJson(ChannelCodec.toJson(w)));
    assertEquals(m, ChannelCodec.fromJson(ChannelCodec.toJson(m)));
  }

  @Test
  void secretsStayOutOfToString() {
    Channel w = Channel.webhook("ops", "https://alerts.example.org/hook", SECRET);
    Channel m = Channel.email("mail", "smtp.example.org", 587, "slackwater@example.org", List.of("operator@example.org"),
        Optional.of("user"), Optional.of("hunter2-password"), true);
    assertFalse(w.toString().contains(SECRET), w.toString());
    assertFalse(m.toString().contains("hunter2-password"), m.toString());
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      "'\"not a url\"'                        | 'is not a URL'",
      "'\"ftp://alerts.example.org/x\"'       | 'is not an http or https URL'",
      "'\"alerts.example.org/hook\"'          | 'is not an http or https URL'",
      "'\"https:///hook\"'                    | 'has no host name'",
      "'\"https://user:pw@alerts.example.org\"' | 'carries a user name or password'",
      "'\"https://alerts.example.org/a#frag\"' | 'fragment'",
      "'42'                                   | 'must be a string'",
  })
  void badUrlsAreNamed(String url, String expected) {
    ChannelException e = parseError(list(webhook(url, "\"" + SECRET + "\"")));
    assertMentions(e, "channels.json line 2, column 3", "channel 'north-intake-ops'", "field 'url'", expected);
    assertFalse(e.getMessage().contains("user:pw"), "a password in a URL is not echoed: " + e.getMessage());
  }

  @Test
  void missingUrlSaysWhatToWrite() {
    ChannelException e = assertThrows(ChannelException.class, () -> Channel.webhook("ops", "  ", SECRET));
    assertMentions(e, "channel 'ops'", "field 'url' is missing", "https://");
  }

  @Test
  void webhookNeedsALongEnoughSecret() {
    ChannelException missing = parseError(list(webhook("\"https://alerts.example.org/hook\"", null)));
    assertMentions(missing, "line 2", "channel 'north-intake-ops'", "field 'secret' is missing", "32 bytes");
    ChannelException blank = assertThrows(ChannelException.class, () -> Channel.webhook("ops", "https://alerts.example.org/hook", " "));
    assertMentions(blank, "field 'secret' is missing");
    // RFC 2104 section 3: keys shorter than the hash output (32 bytes for SHA-256) are discouraged.
    ChannelException shortOne = assertThrows(ChannelException.class,
        () -> Channel.webhook("ops", "https://alerts.example.org/hook", "x".repeat(31)));
    assertMentions(shortOne, "31 bytes", "RFC 2104");
    Channel.webhook("ops", "https://alerts.example.org/hook", "x".repeat(32));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      "operator@              | to[0]",
      "operator               | to[0]",
      "'op erator@example.org' | to[0]",
      "'@example.org'         | to[0]",
      "'a@b@example.org'      | to[0]",
  })
  void badAddressesAreNamed(String address, String field) {
    ChannelException e = assertThrows(ChannelException.class, () -> Channel.email("mail", "smtp.example.org", 587,
        "slackwater@example.org", List.of(address), Optional.empty(), Optional.empty(), true));
    assertMentions(e, "channel 'mail'", "field '" + field + "'", "'" + address + "' is not an e-mail address", "name@example.org");
  }

  @Test
  void badSenderAndRecipientListInJson() {
    ChannelException from = parseError(list("  {\"id\": \"mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\","
        + " \"smtp_port\": 587, \"from\": \"slackwater.example.org\", \"to\": [\"operator@example.org\"]}"));
    assertMentions(from, "channels.json line 2", "channel 'mail'", "field 'from'", "not an e-mail address");
    ChannelException empty = parseError(list("  {\"id\": \"mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\","
        + " \"smtp_port\": 587, \"from\": \"slackwater@example.org\", \"to\": []}"));
    assertMentions(empty, "field 'to' is empty");
    ChannelException notList = parseError(list("  {\"id\": \"mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\","
        + " \"smtp_port\": 587, \"from\": \"slackwater@example.org\", \"to\": \"operator@example.org\"}"));
    assertMentions(notList, "field 'to' must be a list");
    ChannelException port = parseError(list("  {\"id\": \"mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\","
        + " \"smtp_port\": 70000, \"from\": \"slackwater@example.org\", \"to\": [\"operator@example.org\"]}"));
    assertMentions(port, "field 'smtp_port': 70000 is not a TCP port");
    ChannelException portText = parseError(list("  {\"id\": \"mail\", \"kind\": \"email\", \"smtp_host\": \"smtp.example.org\","
        + " \"smtp_port\": \"587\", \"from\": \"slackwater@example.org\", \"to\": [\"operator@example.org\"]}"));
    assertMentions(portText, "field 'smtp_port' must be a whole number");
  }

  @Test
  void loginRules() {
    ChannelException half = assertThrows(ChannelException.class, () -> Channel.email("mail", "smtp.example.org", 587,
        "slackwater@example.org", List.of("operator@example.org"), Optional.of("user"), Optional.empty(), true));
    assertMentions(half, "field 'password' is missing", "both");
    ChannelException clear = assertThrows(ChannelException.class, () -> Channel.email("mail", "smtp.example.org", 25,
        "slackwater@example.org", List.of("operator@example.org"), Optional.of("user"), Optional.of("pw"), false));
    assertMentions(clear, "clear text", "\"starttls\": true");
    // On the loopback interface the password never crosses a network.
    Channel.email("mail", "127.0.0.1", 2525, "slackwater@example.org", List.of("operator@example.org"),
        Optional.of("user"), Optional.of("pw"), false);
  }

  @Test
  void structuralMistakes() {
    assertMentions(parseError("{\"id\": \"x\"}"), "channels.json line 1, column 1", "JSON array");
    assertMentions(parseError("[\n  {\"id\": \"ops\", \"kind\": \"webhook\",\n   \"url\": \"https://alerts.example.org\" \"secret\": 1}\n]"),
        "channels.json line 3", "not valid JSON");
    assertMentions(parseError(list("  {\"id\": \"ops\", \"kind\": \"pager\"}")), "channel 'ops'", "'pager' is not a channel kind");
    assertMentions(parseError(list("  {\"kind\": \"webhook\"}")), "field 'id' is missing");
    assertMentions(parseError(list("  {\"id\": \"north intake\", \"kind\": \"webhook\"}")), "field 'id'", "is not a channel id");
    assertMentions(parseError(list(webhook("\"https://alerts.example.org\"", "\"" + SECRET + "\"").replace("\"secret\"", "\"secert\""))),
        "unknown field 'secert'", "[id, kind, secret, url]");
    assertMentions(parseError(list(webhook("\"https://alerts.example.org\"", "\"" + SECRET + "\""),
        webhook("\"https://alerts.example.org/2\"", "\"" + SECRET + "\""))), "line 3", "'north-intake-ops' is defined twice");
    assertMentions(parseError(list("  42")), "channel 0 is not a JSON object");
  }
}
