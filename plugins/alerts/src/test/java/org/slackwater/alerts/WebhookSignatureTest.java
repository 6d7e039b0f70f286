package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;

/**
 * HMAC-SHA256 as defined by RFC 2104 (the HMAC construction) with SHA-256, checked against the
 * published test vectors of RFC 4231 ("Identifiers and Test Vectors for HMAC-SHA-224, HMAC-SHA-256,
 * HMAC-SHA-384, and HMAC-SHA-512"), section 4.
 */
class WebhookSignatureTest {

  private static final HexFormat HEX = HexFormat.of();

  @Test
  void rfc4231TestCase1() {
    // RFC 4231 section 4.2, Test Case 1: Key = 0x0b repeated 20 times, Data = "Hi There".
    byte[] key = new byte[20];
    Arrays.fill(key, (byte) 0x0b);
    byte[] mac = WebhookSignature.hmacSha256(key, "Hi There".getBytes(StandardCharsets.US_ASCII));
    assertEquals("b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7", HEX.formatHex(mac));
  }

  @Test
  void rfc4231TestCase2KeyShorterThanOutput() {
    // RFC 4231 section 4.3, Test Case 2: Key = "Jefe", Data = "what do ya want for nothing?".
    byte[] mac = WebhookSignature.hmacSha256("Jefe".getBytes(StandardCharsets.US_ASCII),
        "what do ya want for nothing?".getBytes(StandardCharsets.US_ASCII));
    assertEquals("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843", HEX.formatHex(mac));
  }

  @Test
  void rfc4231TestCase6KeyLongerThanBlock() {
    // RFC 4231 section 4.7, Test Case 6: Key = 0xaa repeated 131 times (hashed first, RFC 2104 section 2),
    // Data = "Test Using Larger Than Block-Size Key - Hash Key First".
    byte[] key = new byte[131];
    Arrays.fill(key, (byte) 0xaa);
    byte[] mac = WebhookSignature.hmacSha256(key,
        "Test Using Larger Than Block-Size Key - Hash Key First".getBytes(StandardCharsets.US_ASCII));
    assertEquals("60e431591ee0b67f0d8a26aacbf5b77f8e0bc6213728c5140546040f0ee37f54", HEX.formatHex(mac));
  }

  @Test
  void headerIsPrefixedLowerCaseHexOfTheSecretsUtf8Bytes() {
    // Test Case 2 again through the header form: the secret's UTF-8 bytes are the key.
    String header = WebhookSignature.header("Jefe", "what do ya want for nothing?".getBytes(StandardCharsets.US_ASCII));
    assertEquals("sha256=5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843", header);
    assertTrue(WebhookSignature.matches("Jefe", "what do ya want for nothing?".getBytes(StandardCharsets.US_ASCII), header));
  }

  @Test
  void anyChangeToBodyOrSecretBreaksTheMatch() {
    byte[] body = AlertJson.write(TestAlerts.raised(java.util.Optional.empty()));
    String header = WebhookSignature.header(TestAlerts.SECRET, body);
    byte[] tampered = body.clone();
    tampered[tampered.length / 2] ^= 1;
    assertFalse(WebhookSignature.matches(TestAlerts.SECRET, tampered, header));
    assertFalse(WebhookSignature.matches(TestAlerts.SECRET + "x", body, header));
    assertFalse(WebhookSignature.matches(TestAlerts.SECRET, body, null));
    assertFalse(WebhookSignature.matches(TestAlerts.SECRET, body, header.substring(0, header.length() - 1)));
  }
}
