package org.slackwater.alerts;

import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.MessageDigest;
import java.util.HexFormat;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;

/**
 * The {@code Slackwater-Signature} header: {@code sha256=} and the lower-case hex HMAC-SHA256
 * (RFC 2104 with SHA-256) of the exact body bytes, keyed with the channel secret's UTF-8 bytes.
 * A receiver recomputes it over the bytes it read, before parsing them, and compares with
 * {@link #matches} (constant time, so timing does not reveal how much of a guess was right).
 */
public final class WebhookSignature {

  public static final String PREFIX = "sha256=";

  private WebhookSignature() {}

  /** HMAC-SHA256 of {@code data} under {@code key}. */
  public static byte[] hmacSha256(byte[] key, byte[] data) {
    try {
      Mac mac = Mac.getInstance("HmacSHA256");
      mac.init(new SecretKeySpec(key, "HmacSHA256"));
      return mac.doFinal(data);
    } catch (GeneralSecurityException e) {
      throw new IllegalStateException("this Java runtime lacks HmacSHA256, which every Java SE platform must provide", e);
    }
  }

  /** The header value for {@code body} signed with {@code secret}. */
  public static String header(String secret, byte[] body) {
    return PREFIX + HexFormat.of().formatHex(hmacSha256(secret.getBytes(StandardCharsets.UTF_8), body));
  }

  /** Whether {@code headerValue} is the signature of {@code body} under {@code secret}. */
  public static boolean matches(String secret, byte[] body, String headerValue) {
    if (headerValue == null) {
      return false;
    }
    return MessageDigest.isEqual(header(secret, body).getBytes(StandardCharsets.US_ASCII),
        headerValue.strip().getBytes(StandardCharsets.US_ASCII));
  }
}
