package org.slackwater.alerts;

import jakarta.mail.MessagingException;
import jakarta.mail.Session;
import jakarta.mail.Transport;
import jakarta.mail.internet.MimeMessage;
import java.time.Clock;
import java.time.Duration;
import java.util.Objects;
import java.util.Properties;

/**
 * Delivers an alert as an e-mail through the channel's SMTP relay (Jakarta Mail, Angus
 * implementation); the message is composed by {@link AlertMail}. A return means the relay accepted
 * the message for every recipient. A refused connection, a timeout, a failed STARTTLS upgrade or
 * login, or a refused recipient is a {@link DeliveryException}; the repeat carries the same
 * Message-ID.
 *
 * <p>With STARTTLS on, the upgrade is required (never silently skipped) and the relay's
 * certificate must name its host.
 */
public final class MailNotifier implements Notifier {

  private final Duration timeout;
  private final Clock clock;

  /** 15 s for connecting and for each SMTP read and write, system clock. */
  public MailNotifier() {
    this(Duration.ofSeconds(15), Clock.systemUTC());
  }

  public MailNotifier(Duration timeout, Clock clock) {
    Objects.requireNonNull(timeout, "timeout");
    if (timeout.isNegative() || timeout.isZero()) {
      throw new IllegalArgumentException("timeout must be positive, got " + timeout);
    }
    this.timeout = timeout;
    this.clock = Objects.requireNonNull(clock, "clock");
  }

  @Override
  public void send(Alert a, Channel c) throws DeliveryException {
    if (!(c.destination() instanceof Channel.Email e)) {
      throw new DeliveryException("channel '" + c.id() + "' is a " + c.kind().wireName()
          + " channel; the mail notifier sends to email channels only (check the notifier map given to the outbox)");
    }
    Session session = Session.getInstance(properties(e));
    String where = "channel '" + c.id() + "' (smtp " + e.smtpHost() + ":" + e.port() + ")";
    try {
      MimeMessage m = AlertMail.compose(session, a, e, clock.instant());
      if (e.username().isPresent()) {
        Transport.send(m, e.username().get(), e.password().orElseThrow());
      } else {
        Transport.send(m);
      }
    } catch (MessagingException ex) {
      Throwable root = ex;
      while (root.getCause() != null && root.getCause() != root) {
        root = root.getCause();
      }
      throw new DeliveryException(where + ": " + DeliveryException.describe(ex)
          + (root == ex ? "" : " (" + DeliveryException.describe(root) + ")"), ex);
    }
  }

  private Properties properties(Channel.Email e) {
    String ms = Long.toString(timeout.toMillis());
    Properties p = new Properties();
    p.setProperty("mail.transport.protocol", "smtp");
    p.setProperty("mail.smtp.host", e.smtpHost());
    p.setProperty("mail.smtp.port", Integer.toString(e.port()));
    p.setProperty("mail.smtp.connectiontimeout", ms);
    p.setProperty("mail.smtp.timeout", ms);
    p.setProperty("mail.smtp.writetimeout", ms);
    p.setProperty("mail.smtp.auth", Boolean.toString(e.username().isPresent()));
    p.setProperty("mail.smtp.starttls.enable", Boolean.toString(e.startTls()));
    p.setProperty("mail.smtp.starttls.required", Boolean.toString(e.startTls()));
    if (e.startTls()) {
      p.setProperty("mail.smtp.ssl.checkserveridentity", "true");
    }
    return p;
  }
}
