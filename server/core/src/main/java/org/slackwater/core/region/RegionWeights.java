package org.slackwater.core.region;

import java.util.List;
import java.util.stream.IntStream;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.util.AffineTransformation;
import org.slackwater.core.cube.LatLonGrid;

/**
 * Exact area weights of a polygonal region on a lat/lon grid: for every cell, the spherical area
 * of (cell ∩ region), the cell area itself for cells wholly inside. Cells outside the region's
 * envelope are never looked at.
 *
 * <p>The areas come from boundary integrals swept row by row ({@link RowSweep}): only the cells
 * an edge passes through get per-cell work, a few clipped edge pieces each, and every other cell
 * of a row is inside or outside by one sorted list of edge crossings. The result is the area of
 * the exact intersection, equal to a per-cell polygon overlay to rounding (about 1e-15 of a cell;
 * tested against JTS's overlay cell by cell); rows are swept in parallel blocks.
 *
 * <p>The region is given in lon/lat degrees and must be a valid polygon or multipolygon (rings
 * closed and not crossing, as {@link GeoJsonRegions} checks). If the grid uses 0..360 longitudes
 * the region is shifted by +360° where that brings it onto the grid. A region that touches no
 * cell, or whose outline has a non-finite coordinate, is a {@link RegionException}.
 */
public final class RegionWeights {
  /** Rows per parallel task: enough work to outweigh scheduling, enough tasks to balance two cores. */
  private static final int BLOCK_ROWS = 16;

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
    Envelope env = shape.getEnvelopeInternal();
    int y0 = firstUpperAbove(grid.latUpper(), env.getMinY());
    int y1 = Math.min(grid.ny() - 1, lastLowerBelow(grid.latLower(), env.getMaxY()));
    int x0 = firstUpperAbove(grid.lonUpper(), env.getMinX());
    int x1 = Math.min(grid.nx() - 1, lastLowerBelow(grid.lonLower(), env.getMaxX()));

    int n = 0;
    int[] idx = new int[0];
    double[] area = new double[0], frac = new double[0];
    if (y0 <= y1 && x0 <= x1) {
      RowSweep sweep = new RowSweep(grid, model, RingEdges.of(shape), y0, y1, x0, x1);
      int blocks = (y1 - y0 + BLOCK_ROWS) / BLOCK_ROWS;
      List<RowSweep.Block> parts = IntStream.range(0, blocks).parallel()
          .mapToObj(b -> sweep.rows(y0 + b * BLOCK_ROWS, Math.min(y1 + 1, y0 + (b + 1) * BLOCK_ROWS)))
          .toList();
      for (RowSweep.Block b : parts) {
        n += b.size();
      }
      idx = new int[n];
      area = new double[n];
      frac = new double[n];
      int k = 0;
      for (RowSweep.Block b : parts) {
        System.arraycopy(b.index(), 0, idx, k, b.size());
        System.arraycopy(b.area(), 0, area, k, b.size());
        System.arraycopy(b.fraction(), 0, frac, k, b.size());
        k += b.size();
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
    return new CellWeights(grid.nx(), idx, area, frac, regionArea);
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
