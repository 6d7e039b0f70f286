package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** The little JSON the client reads and writes, against the escapes of RFC 8259 section 7. */
class FlatJsonTest {

  @Test
  void quoteEscapesWhatRfc8259Requires() {
    // RFC 8259 section 7: quotation mark, reverse solidus and the control characters U+0000..U+001F
    // must be escaped; \t and \n have two-character forms.
    assertEquals("\"a\\\"b\\\\c\\td\\ne\\u0001\"", FlatJson.quote("a\"b\\c\td\ne\u0001"));
    assertEquals("\"Harle/caf\u00e9.nc\"", FlatJson.quote("Harle/caf\u00e9.nc"));
  }

  @Test
  void stringsAreUnescaped() {
    String problem = "{\"type\":\"about:blank\",\"detail\":\"unknown region \\\"Outer Bya\\\"\","
        + "\"excerpt\":\"over \\\"Outer Bya\\\"\\n     ^\",\"hint\":\"caf\\u00e9\"}";
    assertEquals(Optional.of("unknown region \"Outer Bya\""), FlatJson.string(problem, "detail"));
    assertEquals(Optional.of("over \"Outer Bya\"\n     ^"), FlatJson.string(problem, "excerpt"));
    assertEquals(Optional.of("caf\u00e9"), FlatJson.string(problem, "hint"));
    assertEquals(Optional.empty(), FlatJson.string(problem, "line"));
  }

  @Test
  void numbersAndArraysOfFlatObjects() {
    String receipt = "[{\"cube\":\"rainfall\",\"version\":2,\"values\":6570,\"seconds\":4.2E-2},"
        + "{\"cube\":\"odd } name\",\"version\":1,\"values\":-1,\"seconds\":0.5}]";
    List<String> objects = FlatJson.objects(receipt);
    assertEquals(2, objects.size());
    assertEquals(Optional.of("4.2E-2"), FlatJson.number(objects.get(0), "seconds"));
    assertEquals(Optional.of("odd } name"), FlatJson.string(objects.get(1), "cube"));
    assertEquals(Optional.of("-1"), FlatJson.number(objects.get(1), "values"));
    assertEquals("ingested rainfall version 2: 6,570 values in 0.04 s", IngestCommand.receipt(Json.parse(objects.get(0))));
  }
}
