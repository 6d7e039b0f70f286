package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** The body example in package-info is what the code writes for the same alert, key included. */
class PackageDocTest {

  @Test
  void documentedBodyIsTheWrittenBody() throws Exception {
    String doc = Files.readString(Path.of("src/main/java/org/slackwater/alerts/package-info.java"));
    int start = doc.indexOf("<pre>{@code", doc.indexOf("Example body"));
    int end = doc.indexOf("}</pre>", start);
    assertTrue(start > 0 && end > start, "the example body block is missing from package-info.java");
    String json = doc.substring(start + "<pre>{@code".length(), end).lines()
        .map(l -> l.replaceFirst("^\\s*\\* ?", "")).collect(Collectors.joining("\n"));
    ObjectMapper m = new ObjectMapper();
    JsonNode documented = m.readTree(json);
    JsonNode written = m.readTree(AlertJson.write(TestAlerts.raised(Optional.empty())));
    assertEquals(written, documented);
    assertTrue(doc.contains("Slackwater-Idempotency-Key: " + written.get("idempotency_key").textValue()), "header example key");
  }
}
