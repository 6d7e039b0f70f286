package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class PlotOptionsTest {

  @Test
  void defaultsAreALandscapeScreenPlot() {
    PlotOptions d = PlotOptions.defaults();
    assertEquals(1000, d.width());
    assertEquals(600, d.height());
    assertEquals(1.0, d.scale());
  }

  @Test
  void pixelSizeIsLayoutSizeTimesScale() {
    PlotOptions o = new PlotOptions(801, 333, 1.5);
    assertEquals(1202, o.pixelWidth()); // 1201.5 rounds half up
    assertEquals(500, o.pixelHeight()); // 499.5
  }

  @ParameterizedTest(name = "{0} x {1} at {2}: {3}")
  @CsvSource(delimiter = ';', value = {
      "199; 600; 1; width 199 is out of range: give 200 to 4000 pixels",
      "4001; 600; 1; width 4001 is out of range",
      "1000; 150; 1; height 150 is out of range: give 200 to 4000 pixels",
      "1000; 600; 0.5; scale 0.5 is out of range: give 1 to 4 (2 for print)",
      "1000; 600; 4.5; scale 4.5 is out of range",
      "1000; 600; NaN; scale NaN is out of range",
      "4000; 4000; 2; more than 36000000: lower the scale or the size"})
  void badOptionsSayWhatAndWhatIsAllowed(int w, int h, double scale, String message) {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new PlotOptions(w, h, scale));
    assertTrue(e.getMessage().contains(message), e.getMessage());
  }

  @Test
  void limitsAreAllowed() {
    new PlotOptions(200, 200, 1);
    new PlotOptions(4000, 4000, 1);
    new PlotOptions(1500, 1000, 4);
  }
}
