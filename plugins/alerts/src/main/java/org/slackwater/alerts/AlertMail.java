package org.slackwater.alerts;

import jakarta.mail.Message;
import jakarta.mail.MessagingException;
import jakarta.mail.Part;
import jakarta.mail.Session;
import jakarta.mail.internet.InternetAddress;
import jakarta.mail.internet.MimeBodyPart;
import jakarta.mail.internet.MimeMessage;
import jakarta.mail.internet.MimeMultipart;
import jakarta.mail.util.ByteArrayDataSource;
import jakarta.activation.DataHandler;
import java.time.Instant;
import java.util.Date;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Composes the e-mail for an alert: subject naming watch, state, severity and day; a plain-text
 * UTF-8 body with the caution, the condition and the values; the PNG as an attachment when the
 * alert has one. The Message-ID is {@code <idempotency key@domain of the sender>}, the same for
 * every repeat, so that mail systems and readers that drop duplicate Message-IDs show it once
 * (RFC 5322 section 3.6.4: a Message-ID names one message, however often it is sent).
 */
final class AlertMail {

  private AlertMail() {}

  static MimeMessage compose(Session session, Alert a, Channel.Email to, Instant sentAt) throws MessagingException {
    InternetAddress from = new InternetAddress(to.from(), true);
    String messageId = "<" + a.idempotencyKey() + "@" + from.getAddress().substring(from.getAddress().lastIndexOf('@') + 1) + ">";
    MimeMessage m = new FixedIdMessage(session, messageId);
    m.setFrom(from);
    for (String r : to.to()) {
      m.addRecipient(Message.RecipientType.TO, new InternetAddress(r, true));
    }
    m.setSubject(subject(a), "UTF-8");
    m.setSentDate(Date.from(sentAt));
    m.setHeader(WebhookNotifier.IDEMPOTENCY_HEADER, a.idempotencyKey());
    Optional<byte[]> png = a.png();
    if (png.isEmpty()) {
      m.setText(body(a, Optional.empty()), "UTF-8");
    } else {
      String fileName = attachmentName(a);
      MimeBodyPart text = new MimeBodyPart();
      text.setText(body(a, Optional.of(fileName)), "UTF-8");
      MimeBodyPart picture = new MimeBodyPart();
      picture.setDataHandler(new DataHandler(new ByteArrayDataSource(png.get(), "image/png")));
      picture.setFileName(fileName);
      picture.setDisposition(Part.ATTACHMENT);
      m.setContent(new MimeMultipart("mixed", text, picture));
    }
    m.saveChanges();
    return m;
  }

  static String subject(Alert a) {
    return "Slackwater watch \"" + a.watch() + "\": " + a.state() + " (" + a.severity() + ") on " + a.step();
  }

  static String body(Alert a, Optional<String> attachment) {
    StringBuilder b = new StringBuilder();
    b.append("Watch \"").append(a.watch()).append("\" is ").append(a.state()).append(" (severity ").append(a.severity())
        .append(") on ").append(a.step()).append(".\n\n");
    b.append("CAUTION: ").append(a.caution()).append("\n\n");
    b.append("Condition: ").append(a.condition()).append('\n');
    if (!a.values().isEmpty()) {
      b.append("Values:\n");
      for (Map.Entry<String, String> e : a.values().entrySet()) {
        b.append("  ").append(e.getKey()).append(": ").append(e.getValue()).append('\n');
      }
    }
    b.append("Raised at: ").append(a.raisedAt()).append('\n');
    attachment.ifPresent(f -> b.append("Map: attached as ").append(f).append('\n'));
    b.append("\nAlert key: ").append(a.idempotencyKey())
        .append(" (the same key on every copy of this alert; a second copy is a repeat, not a new alert)\n");
    return b.toString();
  }

  static String attachmentName(Alert a) {
    String slug = a.watch().toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("(^-|-$)", "");
    return (slug.isEmpty() ? "watch" : slug) + "-" + a.step() + ".png";
  }

  /** Jakarta Mail writes a fresh random Message-ID on every save unless the message says otherwise. */
  private static final class FixedIdMessage extends MimeMessage {
    private final String messageId;

    FixedIdMessage(Session session, String messageId) {
      super(session);
      this.messageId = messageId;
    }

    @Override
    protected void updateMessageID() throws MessagingException {
      setHeader("Message-ID", messageId);
    }
  }
}
