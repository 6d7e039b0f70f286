package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class AlertTest {

  @Test
  void valuesAndPictureAreCopiedInAndOut() {
    Map<String, String> values = new LinkedHashMap<>(TestAlerts.values());
    byte[] png = TestAlerts.png();
    byte[] original = png.clone();
    Alert a = new Alert("k1", "North Intake bloom", "raised", "warning", TestAlerts.STEP, "c", values, Alert.CAUTION,
        TestAlerts.RAISED_AT, Optional.of(png));
    values.put("injected", "x");
    png[20] ^= 0x7f;
    assertEquals(TestAlerts.values(), a.values());
    assertArrayEquals(original, a.png().orElseThrow());
    a.png().orElseThrow()[20] ^= 0x7f;
    assertArrayEquals(original, a.png().orElseThrow());
    assertThrows(UnsupportedOperationException.class, () -> a.values().put("x", "y"));
    // Order is the evaluator's: the body and the e-mail list values as given.
    assertEquals(List.of("region", "mean chlorophyll", "days above threshold"), List.copyOf(a.values().keySet()));
  }

  @Test
  void equalityComparesPictureBytes() {
    Alert a = TestAlerts.raised(Optional.of(TestAlerts.png()));
    Alert b = TestAlerts.raised(Optional.of(TestAlerts.png()));
    assertEquals(a, b);
    assertEquals(a.hashCode(), b.hashCode());
    assertNotEquals(a, TestAlerts.raised(Optional.empty()));
  }

  @Test
  void cautionIsRequired() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new Alert("k1", "w", "raised", "warning",
        TestAlerts.STEP, "c", Map.of(), "   ", TestAlerts.RAISED_AT, Optional.empty()));
    assertTrue(e.getMessage().contains("caution is blank"), e.getMessage());
    assertTrue(e.getMessage().contains("Alert.CAUTION"), e.getMessage());
    NullPointerException n = assertThrows(NullPointerException.class, () -> new Alert("k1", "w", "raised", "warning",
        TestAlerts.STEP, "c", Map.of(), null, TestAlerts.RAISED_AT, Optional.empty()));
    assertTrue(n.getMessage().contains("caution"), n.getMessage());
  }

  @Test
  void pictureMustBeAPng() {
    // PNG specification (RFC 2083 section 3.1): a PNG file starts with 89 50 4E 47 0D 0A 1A 0A.
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new Alert("k1", "w", "raised", "warning",
        TestAlerts.STEP, "c", Map.of(), Alert.CAUTION, TestAlerts.RAISED_AT, Optional.of("GIF89a....".getBytes())));
    assertTrue(e.getMessage().contains("not a PNG image"), e.getMessage());
  }

  @Test
  void lineBreaksCannotReachTheMailHeaders() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new Alert("k1",
        "North Intake bloom\r\nBcc: someone@example.org", "raised", "warning", TestAlerts.STEP, "c", Map.of(), Alert.CAUTION,
        TestAlerts.RAISED_AT, Optional.empty()));
    assertTrue(e.getMessage().contains("watch") && e.getMessage().contains("control character"), e.getMessage());
  }

  @Test
  void keysMustFitAHeaderAndAMessageId() {
    for (String bad : List.of("", "has space", "a..b", ".lead", "trail.", "<angle>", "x@y", "x".repeat(129))) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new Alert(bad, "w", "raised", "warning",
          TestAlerts.STEP, "c", Map.of(), Alert.CAUTION, TestAlerts.RAISED_AT, Optional.empty()), bad);
      assertTrue(e.getMessage().contains("Alert.transitionKey"), e.getMessage());
    }
  }

  @Test
  void transitionKeyNamesOneTransition() {
    String k = Alert.transitionKey("North Intake bloom", "raised", TestAlerts.STEP);
    assertEquals(k, Alert.transitionKey("north intake BLOOM ", "Raised", TestAlerts.STEP), "watch names ignore case, as the server stores them");
    assertNotEquals(k, Alert.transitionKey("North Intake bloom", "ongoing", TestAlerts.STEP));
    assertNotEquals(k, Alert.transitionKey("North Intake bloom", "raised", LocalDate.of(2020, 7, 15)));
    assertNotEquals(k, Alert.transitionKey("Harle Intake turbidity", "raised", TestAlerts.STEP));
    assertTrue(k.startsWith("sw-2020-07-14-"), k);
    // Usable as a key (the constructor accepts it).
    assertEquals(k, TestAlerts.raised(Optional.empty()).idempotencyKey());
  }
}
