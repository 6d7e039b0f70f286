package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import org.junit.jupiter.api.Test;

class ColourMapTest {

  /**
   * Viridis end and middle entries as published: matplotlib's _cm_listed.py (_viridis_data; van der
   * Walt and Smith, 2015, CC0) gives entry 0 = (0.267004, 0.004874, 0.329415) = #440154, entry 128 =
   * (0.127568, 0.566949, 0.550556) = #21918c and entry 255 = (0.993248, 0.906157, 0.143936) = #fde725.
   */
  @Test
  void viridisEndsAndMiddleArePublishedValues() {
    assertEquals(256, ViridisTable.RGB.length);
    assertEquals(Pixels.hex("#440154"), ColourMap.viridis().at(0));
    assertEquals(Pixels.hex("#21918c"), ColourMap.viridis().at(0.5));
    assertEquals(Pixels.hex("#fde725"), ColourMap.viridis().at(1));
    assertEquals(Pixels.hex("#fde725"), ColourMap.viridis().at(1.7), "clamped above");
  }

  /** A listed map of N entries takes entry floor(N f) (the lookup of matplotlib's ListedColormap). */
  @Test
  void viridisLookupIsFloorOf256f() {
    assertEquals(ColourMap.viridisEntry(0), ColourMap.viridis().at(0.9 / 256));
    assertEquals(ColourMap.viridisEntry(1), ColourMap.viridis().at(1.0 / 256));
    assertEquals(ColourMap.viridisEntry(200), ColourMap.viridis().at(200.5 / 256));
  }

  /**
   * ColorBrewer RdBu, 11 classes (colorbrewer2.org, C. A. Brewer): #67001f ... #f7f7f7 ... #053061;
   * reversed here so that low is blue. The centre class is the colour of zero.
   */
  @Test
  void divergingCentreAndEndsArePublishedRdBu() {
    assertEquals(Pixels.hex("#053061"), ColourMap.diverging().at(0));
    assertEquals(Pixels.hex("#f7f7f7"), ColourMap.diverging().at(0.5));
    assertEquals(Pixels.hex("#67001f"), ColourMap.diverging().at(1));
    assertEquals(Pixels.hex("#d1e5f0"), ColourMap.diverging().at(0.4));
    assertEquals(Pixels.hex("#fddbc7"), ColourMap.diverging().at(0.6));
  }

  /** Halfway between two classes is their sRGB average (linear interpolation in sRGB, as documented). */
  @Test
  void divergingInterpolatesLinearlyInSrgb() {
    Color c = ColourMap.diverging().at(0.55); // between #f7f7f7 and #fddbc7
    assertEquals(new Color(Math.round((0xf7 + 0xfd) / 2f), Math.round((0xf7 + 0xdb) / 2f), Math.round((0xf7 + 0xc7) / 2f)), c);
  }

  /** The missing-data grey must not be readable as a value: far from every colour of both maps. */
  @Test
  void missingColourIsInNeitherMap() {
    for (int i = 0; i <= 1000; i++) {
      double f = i / 1000.0;
      assertFalse(Pixels.close(Style.MISSING, ColourMap.viridis().at(f), 40), "viridis at " + f);
      assertFalse(Pixels.close(Style.MISSING, ColourMap.diverging().at(f), 40), "diverging at " + f);
    }
    assertTrue(!Pixels.close(Style.MISSING, Color.WHITE, 40), "missing cells differ from the background");
  }

  @Test
  void symmetricLimitsForDivergingData() {
    ColourScale s = ColourScale.of(new double[] {-0.2, 0.9, Double.NaN, 0.1}, true);
    assertEquals(-0.9, s.low());
    assertEquals(0.9, s.high());
    assertEquals(0.5, s.fraction(0));
    ColourScale q = ColourScale.of(new double[] {3, Double.NaN, 7}, false);
    assertEquals(3, q.low());
    assertEquals(7, q.high());
  }
}
