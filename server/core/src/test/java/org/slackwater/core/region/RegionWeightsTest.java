package org.slackwater.core.region;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import org.locationtech.jts.io.WKTReader;
import org.slackwater.core.cube.LatLonGrid;

class RegionWeightsTest {
  private static final GeometryFactory GF = new GeometryFactory();
  private final LatLonGrid grid = LatLonGrid.regular(43.5, -32, 0.1, 0.1, 10, 20);

  @Test
  void aRegionOfWholeCellsWeighsExactlyTheirAreas() throws Exception {
    // Cells rows 2..4, columns 3..7: lon -31.7..-31.2, lat 43.7..44.0.
    Geometry r = new WKTReader().read("POLYGON((-31.7 43.7, -31.2 43.7, -31.2 44.0, -31.7 44.0, -31.7 43.7))");
    CellWeights w = RegionWeights.compute(grid, r);
    assertEquals(15, w.size());
    for (int i = 0; i < w.size(); i++) {
      int y = w.row(i), x = w.column(i);
      assertEquals(SphericalArea.cell(grid.latLower(y), grid.latUpper(y), grid.lonLower(x), grid.lonUpper(x)), w.area(i), 1e-6);
      assertEquals(1.0, w.fraction(i), 1e-12);
    }
    assertEquals(w.regionAreaM2(), w.totalArea(), 1e-3);
  }

  @Test
  void onTheEllipsoidWholeCellsWeighTheirEllipsoidalArea() throws Exception {
    Geometry r = new WKTReader().read("POLYGON((-31.7 43.7, -31.2 43.7, -31.2 44.0, -31.7 44.0, -31.7 43.7))");
    CellWeights w = RegionWeights.compute(grid, r, AreaModel.WGS84);
    for (int i = 0; i < w.size(); i++) {
      int y = w.row(i), x = w.column(i);
      assertEquals(EllipsoidalArea.cell(grid.latLower(y), grid.latUpper(y), grid.lonLower(x), grid.lonUpper(x)), w.area(i), 1e-6);
    }
    // The region's area on the ellipsoid (GeographicLib agrees with EllipsoidalArea to 1e-7, EllipsoidalAreaTest).
    assertEquals(EllipsoidalArea.cell(43.7, 44.0, -31.7, -31.2), w.regionAreaM2(), 1e-5 * w.regionAreaM2());
  }

  @Test
  void weightsSumToTheRegionAreaForAnIrregularPolygonInsideTheGrid() throws Exception {
    Geometry r = new WKTReader().read("POLYGON((-31.83 43.61, -30.27 43.72, -30.55 44.31, -31.12 44.43, -31.9 44.1, -31.83 43.61))");
    CellWeights w = RegionWeights.compute(grid, r);
    assertEquals(w.regionAreaM2(), w.totalArea(), 1e-9 * w.regionAreaM2());
  }

  /**
   * Brute force: sub-sample every cell on a 200 x 200 lattice, count the points inside the polygon,
   * and weight each point by the spherical area of its sub-cell. The area-weighted mean of a
   * field over the region must agree with the exact weights to about the boundary error of the
   * lattice (1/200 of a cell along the outline), here 1e-3 relative.
   */
  @Test
  void meanAgreesWithAFineSubSampling() throws Exception {
    Geometry r = new WKTReader().read("POLYGON((-31.83 43.61, -30.27 43.72, -30.55 44.31, -31.12 44.43, -31.9 44.1, -31.83 43.61))");
    CellWeights w = RegionWeights.compute(grid, r);
    double[] field = new double[grid.cells()];
    SplittableRandom rnd = new SplittableRandom(7);
    for (int i = 0; i < field.length; i++) {
      field[i] = 5 + 10 * rnd.nextDouble();
    }
    double exact = 0, exactW = 0;
    for (int i = 0; i < w.size(); i++) {
      exact += w.area(i) * field[w.index(i)];
      exactW += w.area(i);
    }
    PreparedGeometry pg = PreparedGeometryFactory.prepare(r);
    int k = 200;
    double brute = 0, bruteW = 0;
    for (int y = 0; y < grid.ny(); y++) {
      for (int x = 0; x < grid.nx(); x++) {
        double dLat = (grid.latUpper(y) - grid.latLower(y)) / k, dLon = (grid.lonUpper(x) - grid.lonLower(x)) / k;
        for (int i = 0; i < k; i++) {
          double lat0 = grid.latLower(y) + i * dLat;
          double sub = SphericalArea.cell(lat0, lat0 + dLat, 0, dLon);
          for (int j = 0; j < k; j++) {
            double lon = grid.lonLower(x) + (j + 0.5) * dLon;
            if (pg.contains(GF.createPoint(new Coordinate(lon, lat0 + 0.5 * dLat)))) {
              brute += sub * field[y * grid.nx() + x];
              bruteW += sub;
            }
          }
        }
      }
    }
    assertEquals(bruteW, exactW, 1e-3 * exactW);
    assertEquals(brute / bruteW, exact / exactW, 1e-3 * (exact / exactW));
  }

  @Test
  void aGeodesicCircleHasTheAreaOfASphericalCap() {
    // Spherical cap of angular radius d: A = 2 pi R^2 (1 - cos d) (textbook). The inscribed
    // 128-gon falls short by about (2 pi / 128)^2 / 6 = 0.04 % of the area (chord sagitta).
    double radius = 5000, rr = SphericalArea.EARTH_RADIUS_M;
    Geometry c = GeodesicCircle.around(44.1, -31.2, radius, GF);
    double cap = 2 * Math.PI * rr * rr * (1 - Math.cos(radius / rr));
    double ratio = SphericalArea.of(c) / cap;
    assertTrue(ratio < 1 && ratio > 1 - 6e-4, "ratio " + ratio);
  }

  @Test
  void aRegionOffTheGridIsAClearError() throws Exception {
    Geometry r = new WKTReader().read("POLYGON((10 10, 11 10, 11 11, 10 11, 10 10))");
    RegionException e = assertThrows(RegionException.class, () -> RegionWeights.compute(grid, r));
    assertTrue(e.getMessage().startsWith("the region touches no cell of the grid"), e.getMessage());
  }

  @Test
  void aGridInZeroTo360LongitudesTakesARegionInMinus180To180() throws Exception {
    LatLonGrid east = LatLonGrid.regular(43.5, 328, 0.1, 0.1, 10, 20);
    Geometry r = new WKTReader().read("POLYGON((-31.7 43.7, -31.2 43.7, -31.2 44.0, -31.7 44.0, -31.7 43.7))");
    CellWeights w = RegionWeights.compute(east, r);
    assertEquals(15, w.size());
    assertEquals(SphericalArea.of(r), w.totalArea(), 1e-3);
  }
}
