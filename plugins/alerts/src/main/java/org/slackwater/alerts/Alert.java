package org.slackwater.alerts;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.Collections;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * One notification: a watch changed state on one day (quiet to raised, raised to ongoing, or to
 * cleared). Immutable: the values map and the PNG bytes are copied in and out.
 *
 * <p>The {@code idempotencyKey} names the transition, not the delivery: every delivery of this
 * alert, including repeats after a retry, carries the same key, so a receiver that has seen a key
 * drops the repeat. {@link #transitionKey} derives one from (watch, state, step). The key is
 * restricted to letters, digits, {@code _ -} and single dots, because it travels in an HTTP
 * header and as the left part of an e-mail Message-ID (RFC 5322 section 3.6.4, dot-atom-text).
 *
 * <p>{@code caution} is required and non-blank: every alert carries the screening caution
 * ({@link #CAUTION} is the text the server uses). {@code png}, when present, must be a PNG image
 * (it starts with the PNG signature).
 *
 * <p>Failure modes: {@link NullPointerException} for a missing component, {@link IllegalArgumentException}
 * (message naming the component and the fix) for a blank or malformed one.
 */
public record Alert(String idempotencyKey, String watch, String state, String severity, LocalDate step,
                    String condition, Map<String, String> values, String caution, Instant raisedAt,
                    Optional<byte[]> png) {

  /** The caution every alert carries; the same text as the server's watch results. */
  public static final String CAUTION = "Screening aid only: built from remote-sensing and model data, which can be wrong. "
      + "Confirm with water sampling, and follow local drinking-water regulations and licensed operators before acting.";

  private static final Pattern KEY = Pattern.compile("[A-Za-z0-9_-]+(\\.[A-Za-z0-9_-]+)*");
  private static final int MAX_KEY_LENGTH = 128;
  // PNG specification (ISO/IEC 15948, also RFC 2083 section 3.1): the first eight bytes of every PNG file.
  private static final byte[] PNG_SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

  public Alert {
    Objects.requireNonNull(idempotencyKey, "alert idempotencyKey is null");
    if (idempotencyKey.length() > MAX_KEY_LENGTH || !KEY.matcher(idempotencyKey).matches()) {
      throw new IllegalArgumentException("alert idempotency key '" + idempotencyKey + "' is not usable: it must be 1 to "
          + MAX_KEY_LENGTH + " letters, digits, '_' or '-', in parts joined by single dots; use Alert.transitionKey(watch, state, step)");
    }
    watch = text("watch", watch);
    state = text("state", state);
    severity = text("severity", severity);
    Objects.requireNonNull(step, "alert step (the day evaluated) is null");
    condition = text("condition", condition);
    Objects.requireNonNull(values, "alert values is null; pass an empty map when there are none");
    LinkedHashMap<String, String> copy = new LinkedHashMap<>();
    values.forEach((k, v) -> copy.put(Objects.requireNonNull(k, "alert values has a null name"),
        Objects.requireNonNull(v, () -> "alert value '" + k + "' is null")));
    values = Collections.unmodifiableMap(copy);
    Objects.requireNonNull(caution, "alert caution is null; every alert carries the screening caution (Alert.CAUTION)");
    if (caution.isBlank()) {
      throw new IllegalArgumentException("alert caution is blank; every alert carries the screening caution (Alert.CAUTION)");
    }
    Objects.requireNonNull(raisedAt, "alert raisedAt is null");
    Objects.requireNonNull(png, "alert png is null; pass Optional.empty() when there is no picture");
    png = png.map(Alert::checkedPng);
  }

  /** The PNG bytes, copied, so that no caller can change this alert. */
  @Override
  public Optional<byte[]> png() {
    return png.map(byte[]::clone);
  }

  /**
   * A stable key for one transition: the same (watch, state, step) always gives the same key, so
   * an evaluator that runs the same day again after a restart re-enqueues nothing new. Watch names
   * are compared without case, as the server stores them.
   */
  public static String transitionKey(String watch, String state, LocalDate step) {
    Objects.requireNonNull(watch, "watch");
    Objects.requireNonNull(state, "state");
    Objects.requireNonNull(step, "step");
    String identity = watch.strip().toLowerCase(Locale.ROOT) + '\u0000' + state.strip().toLowerCase(Locale.ROOT) + '\u0000' + step;
    try {
      byte[] digest = MessageDigest.getInstance("SHA-256").digest(identity.getBytes(StandardCharsets.UTF_8));
      return "sw-" + step + "-" + HexFormat.of().formatHex(digest, 0, 16);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("this Java runtime lacks SHA-256, which every Java SE platform must provide", e);
    }
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Alert a && idempotencyKey.equals(a.idempotencyKey) && watch.equals(a.watch) && state.equals(a.state)
        && severity.equals(a.severity) && step.equals(a.step) && condition.equals(a.condition) && values.equals(a.values)
        && caution.equals(a.caution) && raisedAt.equals(a.raisedAt)
        && png.isPresent() == a.png.isPresent() && (png.isEmpty() || Arrays.equals(png.get(), a.png.get()));
  }

  @Override
  public int hashCode() {
    return Objects.hash(idempotencyKey, watch, state, severity, step, condition, values, caution, raisedAt,
        png.map(Arrays::hashCode).orElse(0));
  }

  @Override
  public String toString() {
    return "Alert[" + idempotencyKey + ", watch=" + watch + ", state=" + state + ", severity=" + severity + ", step=" + step
        + ", values=" + values + ", png=" + png.map(p -> p.length + " bytes").orElse("none") + "]";
  }

  private static String text(String name, String value) {
    Objects.requireNonNull(value, () -> "alert " + name + " is null");
    if (value.isBlank()) {
      throw new IllegalArgumentException("alert " + name + " is blank; give the watch's " + name);
    }
    // A line break here would end the mail subject early and start a header of the sender's choosing.
    if (value.chars().anyMatch(Character::isISOControl)) {
      throw new IllegalArgumentException("alert " + name + " '" + value.replaceAll("\\p{Cntrl}", "?")
          + "' contains a control character (line break, tab, ...); write it on one line");
    }
    return value;
  }

  private static byte[] checkedPng(byte[] bytes) {
    Objects.requireNonNull(bytes, "alert png holds null; pass Optional.empty() when there is no picture");
    if (bytes.length < PNG_SIGNATURE.length || !Arrays.equals(bytes, 0, PNG_SIGNATURE.length, PNG_SIGNATURE, 0, PNG_SIGNATURE.length)) {
      throw new IllegalArgumentException("alert png (" + bytes.length + " bytes) is not a PNG image: it does not start with the"
          + " PNG signature; pass the bytes of a rendered .png file");
    }
    return bytes.clone();
  }
}
