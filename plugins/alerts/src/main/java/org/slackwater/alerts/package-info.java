/**
 * Alert delivery for watches: notifiers for webhooks and e-mail, and a durable outbox that
 * delivers each alert at least once.
 *
 * <p><b>Caution.</b> Every alert carries it, in the webhook body and in every e-mail: a screening
 * aid built from remote and modelled data; confirm with sampling; follow local drinking-water
 * regulations and licensed operators ({@link org.slackwater.alerts.Alert#CAUTION}).
 *
 * <h2>How it fits together</h2>
 * The watch evaluator builds one {@link org.slackwater.alerts.Alert} per state transition of a watch
 * (quiet to raised, raised to ongoing, to cleared) with a key per transition
 * ({@link org.slackwater.alerts.Alert#transitionKey}), and calls
 * {@link org.slackwater.alerts.Outbox#enqueue} with the watch's {@link org.slackwater.alerts.Channel}s.
 * An {@link org.slackwater.alerts.OutboxWorker} sends due rows through the
 * {@link org.slackwater.alerts.Notifier} for each channel kind and retries failures with
 * exponential backoff. Rows are marked sent only after the notifier returned, so a crash or a lost
 * answer means a repeat, never a loss: <b>receivers must drop alerts whose key they have already
 * seen</b>.
 *
 * <h2>Webhook request</h2>
 * {@code POST} to the channel URL with these headers:
 * <pre>
 * Content-Type: application/json
 * Slackwater-Idempotency-Key: sw-2020-07-14-e5827167661fa5ee98c8daedcdad6166
 * Slackwater-Signature: sha256=&lt;64 hex digits&gt;
 * Slackwater-Timestamp: 2020-07-15T06:00:03Z
 * </pre>
 * The signature is the lower-case hex HMAC-SHA256 (RFC 2104) of the exact body bytes, keyed with
 * the UTF-8 bytes of the channel secret. A receiver computes it over the raw bytes it read (before
 * any JSON parsing), compares in constant time, and answers any 2xx once it has stored the alert;
 * any other answer, or none within the timeout, makes the outbox send the same body again later.
 * The timestamp says when this attempt was sent and is not signed; the signed body has
 * {@code raised_at}.
 *
 * <h2>Webhook body</h2>
 * One JSON object in UTF-8 with the fields in this order (written without whitespace; shown
 * indented). Example body, for the watch "North Intake bloom" over the region "North Intake" of
 * the fictional Wrenmouth estuary:
 * <pre>{@code
 * {
 *   "format": "slackwater.alert.v1",
 *   "idempotency_key": "sw-2020-07-14-e5827167661fa5ee98c8daedcdad6166",
 *   "watch": "North Intake bloom",
 *   "state": "raised",
 *   "severity": "warning",
 *   "step": "2020-07-14",
 *   "condition": "mean chlorophyll over \"North Intake\" above 10 mg/m3 for 3 days",
 *   "values": {
 *     "region": "North Intake",
 *     "mean chlorophyll": "12.6 mg/m3",
 *     "days above threshold": "3"
 *   },
 *   "caution": "Screening aid only: built from remote-sensing and model data, which can be wrong. Confirm with water sampling, and follow local drinking-water regulations and licensed operators before acting.",
 *   "raised_at": "2020-07-15T06:00:00Z",
 *   "png_base64": null
 * }
 * }</pre>
 * <ul>
 *   <li>{@code format}: always {@code slackwater.alert.v1} for this layout; a receiver refuses others.</li>
 *   <li>{@code idempotency_key}: names the transition; equal to the header. Drop a key already seen.</li>
 *   <li>{@code watch}, {@code state} ({@code raised}, {@code ongoing}, {@code cleared}), {@code severity}
 *       ({@code notice}, {@code warning}, {@code alert}): as the evaluator reports them.</li>
 *   <li>{@code step}: the day evaluated (ISO 8601 date); {@code raised_at}: when the evaluator
 *       produced the alert (ISO 8601 UTC instant).</li>
 *   <li>{@code condition}: the rule that held, as the server reads it; {@code values}: the numbers
 *       behind it, as strings with units, in the evaluator's order.</li>
 *   <li>{@code caution}: always present and non-blank; show it with the alert.</li>
 *   <li>{@code png_base64}: a map of the region for that day as base64 PNG, or {@code null}.</li>
 * </ul>
 *
 * <h2>E-mail</h2>
 * Subject {@code Slackwater watch "North Intake bloom": raised (warning) on 2020-07-14}; a
 * plain-text UTF-8 body with the caution, condition and values; the PNG attached when present;
 * {@code Message-ID: <idempotency key@sender's domain>} and a {@code Slackwater-Idempotency-Key}
 * header, so a repeat has the same Message-ID.
 *
 * <h2>Channels</h2>
 * Defined in JSON ({@link org.slackwater.alerts.ChannelCodec}); a bad URL, a missing or short
 * secret, a bad address or a login without STARTTLS is a {@link org.slackwater.alerts.ChannelException}
 * naming the file, line and column, channel and field.
 */
package org.slackwater.alerts;
