package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class AlertJsonTest {

  private static final ObjectMapper JSON = new ObjectMapper();

  @Test
  void roundTripKeepsEveryField() {
    Alert a = TestAlerts.raised(Optional.of(TestAlerts.png()));
    assertEquals(a, AlertJson.read(AlertJson.write(a)));
    Alert b = TestAlerts.raised(Optional.empty());
    assertEquals(b, AlertJson.read(AlertJson.write(b)));
  }

  @Test
  void repeatsAreByteIdentical() {
    // The signature covers the bytes, so a repeat (re-read from the outbox, written again) must match exactly.
    Alert a = TestAlerts.raised(Optional.of(TestAlerts.png()));
    byte[] first = AlertJson.write(a);
    assertArrayEquals(first, AlertJson.write(AlertJson.read(first)));
  }

  @Test
  void fieldsInDocumentedOrderWithThePictureAsBase64() throws Exception {
    byte[] png = TestAlerts.png();
    JsonNode n = JSON.readTree(AlertJson.write(TestAlerts.raised(Optional.of(png))));
    List<String> names = new java.util.ArrayList<>();
    n.fieldNames().forEachRemaining(names::add);
    assertEquals(List.of("format", "idempotency_key", "watch", "state", "severity", "step", "condition", "values", "caution",
        "raised_at", "png_base64"), names);
    assertArrayEquals(png, Base64.getDecoder().decode(n.get("png_base64").textValue()));
    assertEquals(Alert.CAUTION, n.get("caution").textValue());
  }

  @Test
  void readRefusesOtherFormatsAndMissingFields() {
    String good = new String(AlertJson.write(TestAlerts.raised(Optional.empty())), StandardCharsets.UTF_8);
    IllegalArgumentException f = assertThrows(IllegalArgumentException.class,
        () -> AlertJson.read(good.replace("slackwater.alert.v1", "slackwater.alert.v9").getBytes(StandardCharsets.UTF_8)));
    assertTrue(f.getMessage().contains("slackwater.alert.v9"), f.getMessage());
    IllegalArgumentException m = assertThrows(IllegalArgumentException.class,
        () -> AlertJson.read(good.replace("\"caution\"", "\"kaution\"").getBytes(StandardCharsets.UTF_8)));
    assertTrue(m.getMessage().contains("'caution'"), m.getMessage());
    IllegalArgumentException s = assertThrows(IllegalArgumentException.class,
        () -> AlertJson.read("{\"format\": ".getBytes(StandardCharsets.UTF_8)));
    assertTrue(s.getMessage().contains("line 1"), s.getMessage());
  }
}
