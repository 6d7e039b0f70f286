package org.slackwater.netcdf;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** The LatLonGrid orientation rules on axes without files. */
class AxisNormaliserTest {

  @Test
  void midpointBoundsClampAtThePoles() throws Problem {
    // Centres -80..80 every 40 degrees: edge cells extend half a spacing, to -100 and 100,
    // and are clamped to the poles.
    NormalisedAxis a = AxisNormaliser.latitude("lat", new double[] {-80, -40, 0, 40, 80}, null);
    assertArrayEquals(new double[] {-90, -60, -20, 20, 60}, a.lower(), 1e-12);
    assertArrayEquals(new double[] {-60, -20, 20, 60, 90}, a.upper(), 1e-12);
    assertArrayEquals(new int[] {0, 1, 2, 3, 4}, a.fileIndex());
  }

  @Test
  void descendingBoundsPairsAreSorted() throws Problem {
    // CF 7.1 lets the vertices of a descending axis run downward too.
    NormalisedAxis a = AxisNormaliser.latitude("lat", new double[] {44.5, 44.0}, new double[] {44.75, 44.25, 44.25, 43.75});
    assertArrayEquals(new double[] {43.75, 44.25}, a.lower(), 1e-12);
    assertArrayEquals(new double[] {44.25, 44.75}, a.upper(), 1e-12);
    assertArrayEquals(new int[] {1, 0}, a.fileIndex());
  }

  @Test
  void globalOneDegreeGridRotatesAt180() throws Problem {
    double[] c = new double[360];
    for (int i = 0; i < 360; i++) {
      c[i] = i + 0.5;
    }
    NormalisedAxis a = AxisNormaliser.longitude("lon", c, null);
    assertEquals(-180, a.lower()[0], 1e-12);
    assertEquals(180, a.upper()[359], 1e-12);
    assertEquals(180, a.fileIndex(0)); // the column centred at 180.5 E = 179.5 W leads
    assertEquals(179, a.fileIndex(359));
  }

  @Test
  void cellCentredOn180StaysAtTheEastEnd() throws Problem {
    double[] c = new double[360];
    for (int i = 0; i < 360; i++) {
      c[i] = i; // bounds -0.5..359.5
    }
    NormalisedAxis a = AxisNormaliser.longitude("lon", c, null);
    // LatLonGrid: bounds within [-180, 360). The column centred at 181 E (179 W) leads.
    assertEquals(-179.5, a.lower()[0], 1e-12);
    assertEquals(181, a.fileIndex(0));
    assertEquals(180, a.fileIndex(359));
    assertEquals(180.5, a.upper()[359], 1e-12);
    assertEquals("global grid rotated from 0..360 to -180..180", a.note());
  }

  @Test
  void descendingLongitudesAreFlippedThenShifted() throws Problem {
    NormalisedAxis a = AxisNormaliser.longitude("lon", new double[] {329.5, 329.0, 328.5}, null);
    assertArrayEquals(new double[] {-31.75, -31.25, -30.75}, a.lower(), 1e-12);
    assertArrayEquals(new int[] {2, 1, 0}, a.fileIndex());
  }

  @Test
  void refusals() {
    Problem single = assertThrows(Problem.class, () -> AxisNormaliser.latitude("lat", new double[] {44}, null));
    assertEquals("the latitude axis 'lat' has a single value and no bounds variable, so its cell size is unknown; add a"
        + " bounds variable (CF 7.1)", single.getMessage());
    Problem zigzag = assertThrows(Problem.class, () -> AxisNormaliser.longitude("lon", new double[] {1, 3, 2}, null));
    assertEquals("longitude values of 'lon' are not strictly monotonic at index 2 (2.0 after 3.0); coordinate variables"
        + " must be strictly increasing or decreasing (CF 1.3)", zigzag.getMessage());
    Problem wide = assertThrows(Problem.class,
        () -> AxisNormaliser.longitude("lon", new double[] {0, 90, 180, 270, 360}, null));
    assertEquals("longitudes of 'lon' span 450.0 degrees, more than a full circle; remove the repeated columns",
        wide.getMessage());
    assertThrows(Problem.class, () -> AxisNormaliser.latitude("lat", new double[] {80, 89}, new double[] {79, 85, 85, 95}));
  }
}
