package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.icegreen.greenmail.configuration.GreenMailConfiguration;
import com.icegreen.greenmail.util.GreenMail;
import com.icegreen.greenmail.util.ServerSetup;
import jakarta.mail.Address;
import jakarta.mail.Part;
import jakarta.mail.internet.MimeMessage;
import jakarta.mail.internet.MimeMultipart;
import java.io.InputStream;
import java.time.Duration;
import java.time.Instant;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** Real SMTP over the loopback interface to a GreenMail server on a free port. */
class MailNotifierTest {

  private GreenMail mail;
  private final MailNotifier notifier = new MailNotifier(Duration.ofSeconds(5),
      new MutableClock(Instant.parse("2020-07-15T06:00:03Z")));

  @BeforeEach
  void start() {
    mail = new GreenMail(new ServerSetup(0, "127.0.0.1", ServerSetup.PROTOCOL_SMTP))
        .withConfiguration(GreenMailConfiguration.aConfig().withUser("relay-user", "relay-password"));
    mail.start();
  }

  @AfterEach
  void stop() {
    mail.stop();
  }

  private Channel channel(Optional<String> user, Optional<String> password) {
    return Channel.email("north-intake-mail", "127.0.0.1", mail.getSmtp().getPort(), "Slackwater <slackwater@example.org>",
        List.of("operator@example.org", "lab@example.org"), user, password, false);
  }

  @Test
  void mailCarriesSubjectCautionValuesAndThePicture() throws Exception {
    byte[] png = TestAlerts.png();
    Alert a = TestAlerts.raised(Optional.of(png));
    notifier.send(a, channel(Optional.empty(), Optional.empty()));

    assertTrue(mail.waitForIncomingEmail(5000, 2), "one copy per recipient");
    MimeMessage m = mail.getReceivedMessages()[0];
    assertEquals("Slackwater watch \"North Intake bloom\": raised (warning) on 2020-07-14", m.getSubject());
    assertEquals("<" + a.idempotencyKey() + "@example.org>", m.getMessageID());
    assertEquals(a.idempotencyKey(), m.getHeader("Slackwater-Idempotency-Key", null));
    assertEquals("slackwater@example.org", ((jakarta.mail.internet.InternetAddress) m.getFrom()[0]).getAddress());
    assertEquals(List.of("operator@example.org", "lab@example.org"),
        Arrays.stream(m.getAllRecipients()).map(Address::toString).toList());
    assertEquals(Instant.parse("2020-07-15T06:00:03Z"), m.getSentDate().toInstant());

    MimeMultipart parts = (MimeMultipart) m.getContent();
    assertEquals(2, parts.getCount());
    String text = (String) parts.getBodyPart(0).getContent();
    assertTrue(parts.getBodyPart(0).isMimeType("text/plain"));
    assertTrue(text.contains(Alert.CAUTION), text);
    assertTrue(text.contains("mean chlorophyll: 12.6 mg/m3") && text.contains("region: North Intake")
        && text.contains("days above threshold: 3"), text);
    assertTrue(text.contains(a.condition()), text);
    Part picture = parts.getBodyPart(1);
    assertTrue(picture.isMimeType("image/png"), picture.getContentType());
    assertEquals(Part.ATTACHMENT, picture.getDisposition());
    assertEquals("north-intake-bloom-2020-07-14.png", picture.getFileName());
    try (InputStream in = picture.getInputStream()) {
      assertArrayEquals(png, in.readAllBytes());
    }
  }

  @Test
  void withoutPictureTheMailIsPlainText() throws Exception {
    notifier.send(TestAlerts.raised(Optional.empty()), channel(Optional.empty(), Optional.empty()));
    assertTrue(mail.waitForIncomingEmail(5000, 2));
    MimeMessage m = mail.getReceivedMessages()[0];
    assertTrue(m.isMimeType("text/plain"), m.getContentType());
    assertTrue(((String) m.getContent()).contains(Alert.CAUTION));
  }

  @Test
  void repeatsKeepTheMessageId() throws Exception {
    Alert a = TestAlerts.raised(Optional.empty());
    notifier.send(a, channel(Optional.empty(), Optional.empty()));
    notifier.send(a, channel(Optional.empty(), Optional.empty()));
    assertTrue(mail.waitForIncomingEmail(5000, 4));
    assertEquals(1, Arrays.stream(mail.getReceivedMessages()).map(m -> {
      try {
        return m.getMessageID();
      } catch (jakarta.mail.MessagingException e) {
        throw new IllegalStateException(e);
      }
    }).distinct().count());
  }

  @Test
  void logsInWhenTheChannelHasALogin() throws Exception {
    notifier.send(TestAlerts.raised(Optional.empty()), channel(Optional.of("relay-user"), Optional.of("relay-password")));
    assertTrue(mail.waitForIncomingEmail(5000, 2));
    DeliveryException e = assertThrows(DeliveryException.class,
        () -> notifier.send(TestAlerts.raised(Optional.empty()), channel(Optional.of("relay-user"), Optional.of("wrong"))));
    assertTrue(e.getMessage().contains("channel 'north-intake-mail'") && e.getMessage().contains("AuthenticationFailed"),
        e.getMessage());
  }

  @Test
  void requiredStartTlsIsNeverSkipped() {
    // This relay offers no STARTTLS over which the JVM could trust it: sending in clear instead would defeat the setting.
    Channel tls = Channel.email("tls", "127.0.0.1", mail.getSmtp().getPort(), "slackwater@example.org",
        List.of("operator@example.org"), Optional.empty(), Optional.empty(), true);
    DeliveryException e = assertThrows(DeliveryException.class, () -> notifier.send(TestAlerts.raised(Optional.empty()), tls));
    assertTrue(e.getMessage().contains("channel 'tls'"), e.getMessage());
    assertEquals(0, mail.getReceivedMessages().length);
  }

  @Test
  void relayDownIsAFailure() {
    int port = mail.getSmtp().getPort();
    mail.stop();
    Channel c = Channel.email("down", "127.0.0.1", port, "slackwater@example.org", List.of("operator@example.org"),
        Optional.empty(), Optional.empty(), false);
    DeliveryException e = assertThrows(DeliveryException.class, () -> notifier.send(TestAlerts.raised(Optional.empty()), c));
    assertTrue(e.getMessage().contains("smtp 127.0.0.1:" + port) && e.getMessage().contains("Connect"), e.getMessage());
  }
}
