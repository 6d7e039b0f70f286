package org.slackwater.core.region;

import java.util.Arrays;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.util.AffineTransformation;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import org.slackwater.core.cube.LatLonGrid;

/**
 * Exact area weights of a polygonal region on a lat/lon grid: for every cell, the spherical area
 * of (cell ∩ region), computed with {@link SphericalArea} on the JTS overlay of the cell rectangle
 * and the region. Cells wholly inside the region (prepared-geometry test) take the cell area
 * directly; cells outside the region's envelope are never looked at.
 *
 * <p>The region is given in lon/lat degrees. If the grid uses 0..360 longitudes the region is
 * shifted by +360° where that brings it onto the grid. Overlay robustness is JTS's (snap-rounding
 * overlay, OverlayNG); a cell whose intersection fails is reported as an error rather than
 * silently dropped.
 */
public final class RegionWeights {

  private RegionWeights() {}

  public static CellWeights compute(LatLonGrid grid, Geometry region) {
    return compute(grid, region, AreaModel.SPHERE);
  }

  /** Weights with cell areas on the given figure of the Earth (see {@link AreaModel}). */
  public static CellWeights compute(LatLonGrid grid, Geometry region, AreaModel model) {
    if (region.isEmpty()) {
      throw new RegionException("the region is empty");
    }
    Geometry shape = onGridLongitudes(grid, region);
    GeometryFactory gf = shape.getFactory();
    PreparedGeometry prepared = PreparedGeometryFactory.prepare(shape);
    Envelope env = shape.getEnvelopeInternal();

    int ny = grid.ny(), nx = grid.nx();
    int y0 = firstUpperAbove(grid.latUpper(), env.getMinY());
    int y1 = lastLowerBelow(grid.latLower(), env.getMaxY());
    int x0 = firstUpperAbove(grid.lonUpper(), env.getMinX());
    int x1 = lastLowerBelow(grid.lonLower(), env.getMaxX());

    int capacity = Math.max(0, (y1 - y0 + 1)) * Math.max(0, (x1 - x0 + 1));
    int[] idx = new int[capacity];
    double[] area = new double[capacity];
    double[] frac = new double[capacity];
    int n = 0;
    for (int y = y0; y <= y1 && y < ny; y++) {
      for (int x = x0; x <= x1 && x < nx; x++) {
        double s = grid.latLower(y), nN = grid.latUpper(y), w = grid.lonLower(x), e = grid.lonUpper(x);
        Polygon cell = gf.createPolygon(new org.locationtech.jts.geom.Coordinate[] {
          new org.locationtech.jts.geom.Coordinate(w, s), new org.locationtech.jts.geom.Coordinate(e, s),
          new org.locationtech.jts.geom.Coordinate(e, nN), new org.locationtech.jts.geom.Coordinate(w, nN),
          new org.locationtech.jts.geom.Coordinate(w, s)});
        double sphere = SphericalArea.cell(s, nN, w, e);
        double full = model == AreaModel.SPHERE ? sphere : model.cell(s, nN, w, e);
        double inside;
        if (prepared.covers(cell)) {
          inside = full;
        } else if (!prepared.intersects(cell)) {
          continue;
        } else {
          try {
            inside = Math.min(full, SphericalArea.of(shape.intersection(cell)) * (full / sphere));
          } catch (RuntimeException ex) {
            throw new RegionException("the region's outline could not be intersected with grid cell (row " + y
                + ", column " + x + "): " + ex.getMessage() + "; check the polygon for self-intersections");
          }
        }
        if (inside <= 0) {
          continue;
        }
        idx[n] = y * nx + x;
        area[n] = inside;
        frac[n] = inside / full;
        n++;
      }
    }
    if (n == 0) {
      throw new RegionException("the region touches no cell of the grid " + grid
          + "; check that the region lies within the data's extent (coordinates are longitude, latitude)");
    }
    double regionArea = SphericalArea.of(region);
    if (model != AreaModel.SPHERE) {
      // The region's own area on the ellipsoid, by the same ratio at its centroid's latitude.
      double lat = region.getCentroid().getY();
      regionArea *= model.cell(lat - 0.05, lat + 0.05, 0, 1) / SphericalArea.cell(lat - 0.05, lat + 0.05, 0, 1);
    }
    return new CellWeights(nx, Arrays.copyOf(idx, n), Arrays.copyOf(area, n), Arrays.copyOf(frac, n), regionArea);
  }

  private static Geometry onGridLongitudes(LatLonGrid grid, Geometry region) {
    double gridWest = grid.lonLower(0), gridEast = grid.lonUpper(grid.nx() - 1);
    Envelope env = region.getEnvelopeInternal();
    if (gridEast > 180 && env.getMaxX() < gridWest) {
      return AffineTransformation.translationInstance(360, 0).transform(region);
    }
    return region;
  }

  /** Index of the first cell whose upper bound exceeds v (bounds ascending). */
  private static int firstUpperAbove(double[] upper, double v) {
    int lo = 0, hi = upper.length;
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (upper[mid] <= v) lo = mid + 1; else hi = mid;
    }
    return lo;
  }

  /** Index of the last cell whose lower bound is below v. */
  private static int lastLowerBelow(double[] lower, double v) {
    int lo = 0, hi = lower.length;
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (lower[mid] < v) lo = mid + 1; else hi = mid;
    }
    return lo - 1;
  }
}
