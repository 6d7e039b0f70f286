package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Bad input gets a one-line message and an exit status, never a stack trace. */
class DemoScenarioCliTest {

  private final ByteArrayOutputStream out = new ByteArrayOutputStream();
  private final ByteArrayOutputStream err = new ByteArrayOutputStream();

  private int run(String... args) {
    return DemoScenario.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
  }

  private String errText() {
    return err.toString(StandardCharsets.UTF_8);
  }

  @Test
  void missingDirectoryIsExplained() {
    assertEquals(2, run());
    assertTrue(errText().startsWith("missing output directory; usage: DemoScenario OUT_DIR [--small]"), errText());
  }

  @Test
  void unknownOptionIsNamed() {
    assertEquals(2, run("out", "--tiny"));
    assertTrue(errText().startsWith("unknown option '--tiny'"), errText());
  }

  @Test
  void unwritableDirectoryIsReportedWithItsPath(@TempDir Path dir) throws Exception {
    Path file = Files.writeString(dir.resolve("not-a-dir"), "x");
    assertEquals(1, run(file.resolve("sub").toString(), "--small"));
    assertTrue(errText().startsWith("demo generation failed: cannot create output directory " + file.resolve("sub")),
        errText());
    assertFalse(errText().contains("\tat "), "no stack trace");
  }

  @Test
  void smallRunPrintsEveryFileWithItsSize(@TempDir Path dir) {
    assertEquals(0, run(dir.toString(), "--small"));
    String text = out.toString(StandardCharsets.UTF_8);
    for (String f : new String[] {"rainfall.nc", "runoff.nc", "water_temperature.nc", "cloud_fraction.nc",
        "turbidity.nc", "chlorophyll.nc", "regions.geojson", "stations.csv", "ground_truth.csv", "README.md"}) {
      assertTrue(text.contains(f), f + " listed");
    }
    assertTrue(text.contains("generated in"), text);
  }

  @Test
  void optionsAreValidatedWithTheOffendingValue() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new DemoOptions(2014, 2013, 1, 1));
    assertEquals("lastYear 2013 must be between firstYear 2014 and 2100", e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> new DemoOptions(2013, 2014, 0, 1));
    assertTrue(e.getMessage().startsWith("resolutionDivisor 0 is outside 1..16"), e.getMessage());
  }

  @Test
  void presetsAreTheDocumentedOnes() {
    assertEquals(new DemoOptions(2006, 2025, 1, 20060101L), DemoOptions.full());
    assertEquals(new DemoOptions(2013, 2014, 4, 20060101L), DemoOptions.small());
  }
}
