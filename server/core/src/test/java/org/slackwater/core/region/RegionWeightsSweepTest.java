package org.slackwater.core.region;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.valid.IsValidOp;
import org.slackwater.core.cube.LatLonGrid;

/**
 * The row sweep of {@link RegionWeights} against an independent algorithm: JTS's polygon overlay
 * of each cell with the region ({@link OverlayWeights}), for every cell of the grid. Tolerance:
 * 1e-12 of the cell's own area. Each method rounds its own intersection points; coordinates near
 * 31 degrees carry about 3.5e-15 degrees of rounding, 3.5e-14 of a 0.1-degree cell, and the two
 * agree to about 1e-13 here. A cell present on one side only must have an inside area within the
 * tolerance of zero (the overlay keeps slivers of 1e-24 of a cell where an outline passes through a
 * grid corner; the sweep drops anything below 1e-12).
 */
class RegionWeightsSweepTest {
  private static final GeometryFactory GF = new GeometryFactory();
  private static final double TOLERANCE = 1e-12;
  private final LatLonGrid grid = LatLonGrid.regular(43.5, -32, 0.1, 0.1, 30, 40);

  @Test
  void randomStarPolygonsMatchTheOverlayInEveryCell() {
    SplittableRandom rnd = new SplittableRandom(2024);
    for (int k = 0; k < 8; k++) {
      Polygon p = GF.createPolygon(star(rnd, -30.0 + rnd.nextDouble(-0.4, 0.4), 45.0 + rnd.nextDouble(-0.3, 0.3),
          1.2, 0.35, 1.0, 20 + rnd.nextInt(130)));
      assertMatchesOverlay(grid, p, AreaModel.SPHERE);
    }
  }

  @Test
  void onTheEllipsoidTooAndWhateverTheRingOrientation() {
    SplittableRandom rnd = new SplittableRandom(11);
    Coordinate[] ring = star(rnd, -30.1, 44.9, 1.1, 0.3, 1.0, 150);
    Polygon ccw = GF.createPolygon(ring);
    Coordinate[] reversed = ring.clone();
    java.util.Collections.reverse(Arrays.asList(reversed));
    Polygon cw = GF.createPolygon(reversed);
    assertMatchesOverlay(grid, ccw, AreaModel.WGS84);
    CellWeights a = RegionWeights.compute(grid, ccw), b = RegionWeights.compute(grid, cw);
    assertTrue(Arrays.equals(a.cellIndex(), b.cellIndex()));
    for (int i = 0; i < a.size(); i++) {
      assertEquals(a.area(i), b.area(i), TOLERANCE * a.area(i) / a.fraction(i));
    }
  }

  @Test
  void holesAndSeveralPartsMatchTheOverlay() {
    SplittableRandom rnd = new SplittableRandom(5);
    LinearRing shell = GF.createLinearRing(star(rnd, -30.0, 45.0, 1.3, 0.75, 1.0, 120));
    LinearRing hole = GF.createLinearRing(star(rnd, -30.05, 44.95, 1.3, 0.2, 0.6, 60));
    Polygon withHole = GF.createPolygon(shell, new LinearRing[] {hole});
    assertTrue(new IsValidOp(withHole).isValid());
    assertMatchesOverlay(grid, withHole, AreaModel.SPHERE);

    Geometry parts = GF.createMultiPolygon(new Polygon[] {
      GF.createPolygon(star(rnd, -31.3, 44.2, 0.5, 0.4, 1.0, 40)), GF.createPolygon(star(rnd, -29.5, 45.6, 0.6, 0.4, 1.0, 70))});
    assertTrue(new IsValidOp(parts).isValid());
    assertMatchesOverlay(grid, parts, AreaModel.SPHERE);
  }

  /** Edges along parallels and meridians of the grid, vertices on grid corners and on cell sides. */
  @Test
  void outlinesRunningAlongGridLinesMatchTheOverlay() {
    Polygon staircase = GF.createPolygon(new Coordinate[] {
      corner(3, 2), corner(12, 2), corner(12, 6), new Coordinate(grid.lonLower(9) + 0.03, grid.latLower(6)),
      corner(9, 9), corner(7, 9), new Coordinate(grid.lonLower(7), grid.latLower(12) + 0.04), corner(5, 14),
      corner(3, 14), corner(3, 2)});
    assertTrue(new IsValidOp(staircase).isValid());
    assertMatchesOverlay(grid, staircase, AreaModel.SPHERE);
    // Cells that only share a side with the outline are not in the region.
    CellWeights w = RegionWeights.compute(grid, staircase);
    for (int i = 0; i < w.size(); i++) {
      assertTrue(w.row(i) >= 2 && w.row(i) < 14 && w.column(i) >= 3 && w.column(i) < 12, "cell " + w.row(i) + "," + w.column(i));
    }
    // A diagonal through grid corners.
    Polygon diagonal = GF.createPolygon(new Coordinate[] {corner(2, 2), corner(20, 2), corner(20, 20), corner(2, 2)});
    assertMatchesOverlay(grid, diagonal, AreaModel.SPHERE);
  }

  @Test
  void aRegionLeavingTheGridAndAnIrregularGridWithGapsMatchTheOverlay() {
    SplittableRandom rnd = new SplittableRandom(99);
    Polygon out = GF.createPolygon(star(rnd, -32.0, 44.0, 1.0, 0.4, 1.0, 90));
    assertMatchesOverlay(grid, out, AreaModel.SPHERE);

    double[] latLo = new double[25], latHi = new double[25], lonLo = new double[30], lonHi = new double[30];
    double lat = 43.6;
    for (int y = 0; y < latLo.length; y++) {
      latLo[y] = lat;
      latHi[y] = lat + 0.05 + 0.1 * rnd.nextDouble();
      lat = latHi[y] + (y % 3 == 0 ? 0.02 : 0);
    }
    double lon = -31.4;
    for (int x = 0; x < lonLo.length; x++) {
      lonLo[x] = lon;
      lonHi[x] = lon + 0.04 + 0.1 * rnd.nextDouble();
      lon = lonHi[x] + (x % 4 == 0 ? 0.03 : 0);
    }
    LatLonGrid irregular = new LatLonGrid(latLo, latHi, lonLo, lonHi);
    assertMatchesOverlay(irregular, GF.createPolygon(star(rnd, -30.0, 44.9, 1.0, 0.3, 1.0, 160)), AreaModel.WGS84);
  }

  @Test
  void aCoordinateThatIsNotANumberIsAClearError() {
    Polygon p = GF.createPolygon(new Coordinate[] {
      new Coordinate(-31, 44), new Coordinate(-30, 44), new Coordinate(Double.NaN, 44.5), new Coordinate(-31, 45), new Coordinate(-31, 44)});
    RegionException e = assertThrows(RegionException.class, () -> RegionWeights.compute(grid, p));
    assertTrue(e.getMessage().contains("not a number at vertex 3"), e.getMessage());
  }

  private Coordinate corner(int x, int y) {
    return new Coordinate(grid.lonLower(x), grid.latLower(y));
  }

  /**
   * A closed star-shaped ring (so never self-crossing): {@code n} vertices at increasing angles
   * around (lon, lat), at radii between {@code rMin} and {@code rMax} times {@code radius} degrees.
   */
  static Coordinate[] star(SplittableRandom rnd, double lon, double lat, double radius, double rMin, double rMax, int n) {
    Coordinate[] c = new Coordinate[n + 1];
    for (int i = 0; i < n; i++) {
      double angle = 2 * Math.PI * (i + 0.8 * rnd.nextDouble()) / n;
      double r = radius * (rMin + (rMax - rMin) * rnd.nextDouble());
      c[i] = new Coordinate(lon + r * Math.cos(angle), lat + 0.7 * r * Math.sin(angle));
    }
    c[n] = c[0].copy();
    return c;
  }

  private static void assertMatchesOverlay(LatLonGrid grid, Geometry region, AreaModel model) {
    CellWeights w = RegionWeights.compute(grid, region, model);
    double[] expected = OverlayWeights.areas(grid, region, model);
    double[] actual = new double[grid.cells()];
    int previous = -1;
    for (int i = 0; i < w.size(); i++) {
      assertTrue(w.index(i) > previous, "cells in ascending row-major order");
      previous = w.index(i);
      actual[w.index(i)] = w.area(i);
      double full = model.cell(grid.latLower(w.row(i)), grid.latUpper(w.row(i)), grid.lonLower(w.column(i)), grid.lonUpper(w.column(i)));
      assertEquals(w.area(i) / full, w.fraction(i), 1e-15);
    }
    int inside = 0;
    for (int y = 0; y < grid.ny(); y++) {
      for (int x = 0; x < grid.nx(); x++) {
        int i = y * grid.nx() + x;
        double full = model.cell(grid.latLower(y), grid.latUpper(y), grid.lonLower(x), grid.lonUpper(x));
        assertEquals(expected[i], actual[i], TOLERANCE * full, "cell (row " + y + ", column " + x + ")");
        if (expected[i] > 0) {
          inside++;
        }
      }
    }
    assertTrue(inside > 20, "the test region covers cells");
  }
}
