package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.junit.jupiter.api.Test;

/** The client's JSON reader against RFC 8259 and against Jackson reading the same text. */
class JsonTest {

  @Test
  void rfc8259Section13ObjectExample() {
    // The first example of RFC 8259 section 13 (text recalled from memory).
    String text = """
        {
          "Image": {
              "Width":  800,
              "Height": 600,
              "Title":  "View from 15th Floor",
              "Thumbnail": {
                  "Url":    "http://www.example.com/image/481989943",
                  "Height": 125,
                  "Width":  100
              },
              "Animated" : false,
              "IDs": [116, 943, 234, 38793]
            }
        }
        """;
    Object image = Json.member(Json.parse(text), "Image").orElseThrow();
    assertEquals(new BigDecimal(800), Json.member(image, "Width").orElseThrow());
    assertEquals("View from 15th Floor", Json.text(image, "Title"));
    assertEquals("125", Json.text(Json.member(image, "Thumbnail").orElseThrow(), "Height"));
    assertEquals(Boolean.FALSE, Json.member(image, "Animated").orElseThrow());
    assertEquals(List.of(new BigDecimal(116), new BigDecimal(943), new BigDecimal(234), new BigDecimal(38793)), Json.array(image, "IDs"));
    assertEquals(List.of("Width", "Height", "Title", "Thumbnail", "Animated", "IDs"), List.copyOf(((Map<?, ?>) image).keySet()));
  }

  @Test
  void scalarsAreJsonTextsAndEscapesAreDecoded() {
    // RFC 8259 section 13: "Hello world!", 42 and true are JSON texts too.
    assertEquals("Hello world!", Json.parse("\"Hello world!\""));
    assertEquals(new BigDecimal(42), Json.parse(" 42 "));
    assertEquals(Boolean.TRUE, Json.parse("true"));
    assertNull(Json.parse("null"));
    // RFC 8259 section 7: the G clef U+1D11E as the surrogate pair \uD834\uDD1E; the short escapes.
    assertEquals("\uD834\uDD1E", Json.parse("\"\\uD834\\uDD1E\""));
    assertEquals("a\"b\\c/d\be\ff\ng\rh\ti", Json.parse("\"a\\\"b\\\\c\\/d\\be\\ff\\ng\\rh\\ti\""));
    // Section 6: minus, fraction and exponent.
    assertEquals(new BigDecimal("-1.5E+3"), Json.parse("-1.5e+3"));
    assertEquals("0.042", Json.scalar(Json.parse("4.2E-2")));
  }

  @Test
  void agreesWithJacksonOnAWatchDocumentFromTheServer() throws Exception {
    String doc = new String(Objects.requireNonNull(getClass().getResourceAsStream("watch_show.json")).readAllBytes(), StandardCharsets.UTF_8);
    same(new ObjectMapper().readTree(doc), Json.parse(doc), "$");
  }

  private static void same(JsonNode ref, Object ours, String where) {
    if (ref.isObject()) {
      Map<?, ?> m = (Map<?, ?>) ours;
      assertEquals(ref.size(), m.size(), where);
      Iterator<Map.Entry<String, JsonNode>> it = ref.fields();
      List<?> keys = List.copyOf(m.keySet());
      int i = 0;
      while (it.hasNext()) {
        Map.Entry<String, JsonNode> e = it.next();
        assertEquals(e.getKey(), keys.get(i++), where + " member order");
        same(e.getValue(), m.get(e.getKey()), where + "." + e.getKey());
      }
    } else if (ref.isArray()) {
      List<?> l = (List<?>) ours;
      assertEquals(ref.size(), l.size(), where);
      for (int i = 0; i < l.size(); i++) {
        same(ref.get(i), l.get(i), where + "[" + i + "]");
      }
    } else if (ref.isNumber()) {
      assertEquals(0, ref.decimalValue().compareTo((BigDecimal) ours), where);
    } else if (ref.isNull()) {
      assertNull(ours, where);
    } else if (ref.isBoolean()) {
      assertEquals(ref.booleanValue(), ours, where);
    } else {
      assertEquals(ref.textValue(), ours, where);
    }
  }

  @Test
  void mistakesAreReportedWithLineAndColumn() {
    assertEquals("line 1, column 6: expected ':' after the member name \"a\"", error("{\"a\" 1}"));
    assertEquals("line 2, column 3: expected a value (object, array, string, number, true, false or null), found ']'", error("[1,\n  ]"));
    assertEquals("line 1, column 1: a string is not closed; add the closing '\"'", error("\"open"));
    assertEquals("line 1, column 2: text after the end of the JSON value", error("01"), "RFC 8259 section 6: no leading zeros");
    assertEquals("line 1, column 3: a control character inside a string; write it as an escape such as \\n or \\u0009", error("\"a\tb\""));
    assertEquals("line 1, column 2: unknown escape '\\x'; JSON has \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX", error("\"\\x\""));
    assertEquals("line 1, column 1: expected a value; did you mean 'true'?", error("tru"));
    assertEquals("line 1, column 2: the text ends where a value was expected", error("["));
    assertTrue(error("{\"a\":1,}").startsWith("line 1, column 8: expected a member name"), error("{\"a\":1,}"));
  }

  private static String error(String text) {
    return assertThrows(IllegalArgumentException.class, () -> Json.parse(text)).getMessage();
  }
}
