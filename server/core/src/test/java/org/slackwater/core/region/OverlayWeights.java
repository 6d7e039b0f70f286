package org.slackwater.core.region;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import org.slackwater.core.cube.LatLonGrid;

/**
 * Reference for {@link RegionWeights}: the inside area of every cell of a grid from JTS's polygon
 * overlay of that cell with the region (OverlayNG), measured with {@link SphericalArea#of}; cells
 * the prepared region covers take the whole cell area. This is how weights were computed before
 * the row sweep: slow (one overlay per boundary cell, one prepared test per cell), but built on an
 * independent intersection algorithm.
 */
final class OverlayWeights {
  private OverlayWeights() {}

  /** Inside area (m²) of each cell, row-major; 0 outside. */
  static double[] areas(LatLonGrid grid, Geometry region, AreaModel model) {
    GeometryFactory gf = region.getFactory();
    PreparedGeometry prepared = PreparedGeometryFactory.prepare(region);
    double[] out = new double[grid.cells()];
    for (int y = 0; y < grid.ny(); y++) {
      for (int x = 0; x < grid.nx(); x++) {
        double s = grid.latLower(y), n = grid.latUpper(y), w = grid.lonLower(x), e = grid.lonUpper(x);
        Polygon cell = gf.createPolygon(new Coordinate[] {
          new Coordinate(w, s), new Coordinate(e, s), new Coordinate(e, n), new Coordinate(w, n), new Coordinate(w, s)});
        double sphere = SphericalArea.cell(s, n, w, e);
        double full = model.cell(s, n, w, e);
        if (prepared.covers(cell)) {
          out[y * grid.nx() + x] = full;
        } else if (prepared.intersects(cell)) {
          out[y * grid.nx() + x] = Math.min(full, SphericalArea.of(region.intersection(cell)) * (full / sphere));
        }
      }
    }
    return out;
  }
}
