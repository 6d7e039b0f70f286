package org.slackwater.alerts;

/**
 * Sends one alert to one channel of the kind it handles. A return means the destination accepted
 * the alert; any doubt (refused, timed out, answer lost) is a {@link DeliveryException}, after which
 * the outbox sends the same alert, with the same idempotency key, again later. Implementations
 * are safe for use by one thread at a time and hold no per-alert state.
 */
public interface Notifier {

  void send(Alert a, Channel c) throws DeliveryException;
}
