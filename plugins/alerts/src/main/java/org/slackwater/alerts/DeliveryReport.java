package org.slackwater.alerts;

/**
 * What one {@link Outbox#deliverDue} pass did: rows delivered, rows that failed and will be tried
 * again, rows that failed for the last time (now {@code failed}).
 */
public record DeliveryReport(int sent, int retrying, int failed) {

  public static final DeliveryReport NOTHING = new DeliveryReport(0, 0, 0);

  public int attempted() {
    return sent + retrying + failed;
  }
}
