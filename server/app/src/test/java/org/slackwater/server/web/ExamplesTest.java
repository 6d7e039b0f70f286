package org.slackwater.server.web;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.slackwater.query.QueryParser;

/**
 * The page's examples (clients/web/examples.json) are copies of the documentation's {@code swq}
 * blocks, so they cannot drift from the language: each example's text must occur verbatim inside
 * one {@code swq} block of README.md or of the language reference (whose examples
 * DocumentationExamplesTest runs against the full demo).
 */
class ExamplesTest {
  private static final Pattern SWQ = Pattern.compile("(?m)^```swq[ \\t]*\\n(.*?)^```", Pattern.DOTALL);
  private static final List<Path> DOCS = List.of(Path.of("../../README.md"), Path.of("../../query-grammar/README.md"));

  static JsonNode examples() throws Exception {
    // Read from the classpath: the file as the server packs it into the jar.
    try (InputStream in = ExamplesTest.class.getClassLoader().getResourceAsStream("web/examples.json")) {
      assertNotNull(in, "web/examples.json is not on the classpath; see the <resource> for clients/web in server/app/pom.xml");
      return new ObjectMapper().readTree(in);
    }
  }

  static List<String> swqBlocks() throws Exception {
    List<String> blocks = new ArrayList<>();
    for (Path doc : DOCS) {
      Matcher m = SWQ.matcher(Files.readString(doc).replace("\r\n", "\n"));
      int before = blocks.size();
      while (m.find()) {
        blocks.add(m.group(1));
      }
      assertTrue(blocks.size() > before, doc + " has no swq block");
    }
    return blocks;
  }

  @Test
  void everyExampleIsCopiedVerbatimFromAnSwqBlock() throws Exception {
    JsonNode examples = examples();
    List<String> blocks = swqBlocks();
    assertTrue(examples.isArray() && examples.size() >= 10, "the picker offers a real choice");
    for (JsonNode ex : examples) {
      String text = ex.path("text").asText("");
      assertFalse(text.isBlank(), "an example without text: " + ex);
      assertTrue(blocks.stream().anyMatch(b -> b.contains(text)),
          "example '" + ex.path("label").asText() + "' does not occur verbatim in an swq block of README.md or query-grammar/README.md:\n" + text);
    }
  }

  @Test
  void everyExampleHasAGroupAUniqueLabelAndParses() throws Exception {
    Set<String> labels = new HashSet<>();
    for (JsonNode ex : examples()) {
      String label = ex.path("label").asText("");
      assertFalse(label.isBlank() || ex.path("group").asText("").isBlank(), ex.toString());
      assertTrue(labels.add(label), "label used twice: " + label);
      assertDoesNotThrow(() -> QueryParser.parse(ex.get("text").asText()), label);
    }
  }

  @Test
  void theBlockPatternFindsWhatTheDocumentsHold() throws Exception {
    // A pattern that matched nothing would make the verbatim check above pass vacuously for no
    // example; count the fences independently.
    int fences = 0;
    for (Path doc : DOCS) {
      for (String line : Files.readAllLines(doc)) {
        if (line.strip().equals("```swq")) {
          fences++;
        }
      }
    }
    assertEquals(fences, swqBlocks().size());
  }
}
