package org.slackwater.core.region;

import java.util.Arrays;
import org.slackwater.core.cube.LatLonGrid;

/**
 * Exact area of (cell ∩ region) for every cell of a block of grid rows, by boundary integrals
 * instead of one polygon overlay per cell.
 *
 * <p>On the sphere, area = −R² ∮ sin φ dλ around the boundary of (cell ∩ region), counter-clockwise
 * ({@link SphericalArea}). That boundary is made of the region's edges inside the cell and of the
 * parts of the cell's own sides inside the region. The cell's meridian sides add nothing (dλ = 0),
 * so only two kinds of term remain: the region's edges clipped to the cell (at most a few per
 * boundary cell), and the length of the cell's parallels that lies inside the region, which one
 * sorted list of edge crossings per parallel gives for the whole row. Integrating sin φ − sin φ₀
 * with φ₀ the row's southern latitude (the same value around a closed loop) makes the southern
 * parallel's term vanish and keeps every term as small as the cell, so nothing cancels:
 * area / R² = (sin φ_N − sin φ_S) · L_N − Σ ∫ (sin φ − sin φ_S) dλ over the clipped edges.
 *
 * <p>Points on a cell side are decided as if the grid were shifted north-east by an infinitesimal
 * amount: a cell owns the half-open box (south, north] x (west, east], an edge lying on a parallel
 * belongs to the row below it, and a parallel is crossed by an edge whose latitudes satisfy
 * {@code min <= lat < max}. Each cell's area is then that of a cell shifted by nothing at all, and
 * outlines that run along grid lines (a region made of whole cells) come out exact.
 *
 * <p>The region must be a valid polygon (non-crossing rings, as {@link GeoJsonRegions} ensures):
 * inside is then both "odd number of crossings" and "winding number one", which the two kinds of
 * term rely on. A cell whose computed inside area is at most {@link #EMPTY} of its own area is
 * outside: rounding leaves about 1e-15 of a cell where an outline only touches it.
 */
final class RowSweep {
  /** Inside areas at or below this fraction of the cell are rounding, not overlap. */
  static final double EMPTY = 1e-12;

  private final LatLonGrid grid;
  private final AreaModel model;
  private final RingEdges edges;
  private final int y0, x0, x1;
  /** Edges per row (CSR): edge ids of row y are rowEdges[rowStart[y - y0], rowStart[y - y0 + 1]). */
  private final int[] rowStart, rowEdges;

  /** Rows y0..y1 and columns x0..x1 (inclusive, within the grid) hold the region's envelope. */
  RowSweep(LatLonGrid grid, AreaModel model, RingEdges edges, int y0, int y1, int x0, int x1) {
    this.grid = grid;
    this.model = model;
    this.edges = edges;
    this.y0 = y0;
    this.x0 = x0;
    this.x1 = x1;
    int rows = y1 - y0 + 1;
    int[] first = new int[edges.size()], last = new int[edges.size()];
    int[] count = new int[rows + 1];
    for (int e = 0; e < edges.size(); e++) {
      // Row y needs edge e if e reaches into (south, north] or crosses the row's north parallel:
      // latMin <= north and latMax > south.
      first[e] = Math.max(y0, firstUpperAtLeast(grid, edges.latMin(e)));
      last[e] = Math.min(y1, lastLowerBelow(grid, edges.latMax(e)));
      for (int y = first[e]; y <= last[e]; y++) {
        count[y - y0 + 1]++;
      }
    }
    for (int r = 0; r < rows; r++) {
      count[r + 1] += count[r];
    }
    rowStart = count.clone();
    rowEdges = new int[count[rows]];
    for (int e = 0; e < edges.size(); e++) {
      for (int y = first[e]; y <= last[e]; y++) {
        rowEdges[count[y - y0]++] = e;
      }
    }
  }

  /** The cells of one block of rows, in row-major order. */
  record Block(int[] index, double[] area, double[] fraction, int size) {}

  /** Rows {@code [ya, yb)}. */
  Block rows(int ya, int yb) {
    int cols = x1 - x0 + 1;
    Scratch s = new Scratch(cols);
    int cap = Math.max(16, (yb - ya) * cols / 2);
    int[] idx = new int[cap];
    double[] area = new double[cap], frac = new double[cap];
    int n = 0;
    double r2 = SphericalArea.EARTH_RADIUS_M * SphericalArea.EARTH_RADIUS_M;
    for (int y = ya; y < yb; y++) {
      double south = grid.latLower(y), north = grid.latUpper(y);
      s.reset();
      coverNorth(y, north, s);
      clipEdges(y, south, north, s);
      double modelBand = model.band(south, north), sphereBand = SphericalArea.band(south, north);
      // sin φ_N − sin φ_S as the pieces' integrand gives it, so an edge along the north side cancels.
      double northBand = SphericalArea.sinDifference(Math.toRadians(north), Math.toRadians(south));
      for (int c = 0; c < cols; c++) {
        int x = x0 + c;
        double cover = s.cover[c];
        if (!s.touched[c] && cover == 0) {
          continue;
        }
        double west = grid.lonLower(x), east = grid.lonUpper(x);
        double full = model.cellFromBand(modelBand, west, east);
        double inside;
        if (!s.touched[c] && s.whole[c]) {
          inside = full;
        } else {
          double sphereInside = r2 * (northBand * Math.toRadians(cover) - s.piece[c]);
          double sphere = SphericalArea.cellFromBand(sphereBand, west, east);
          inside = Math.min(full, sphereInside * (full / sphere));
          if (inside <= EMPTY * full) {
            continue;
          }
        }
        if (n == idx.length) {
          idx = Arrays.copyOf(idx, 2 * n);
          area = Arrays.copyOf(area, 2 * n);
          frac = Arrays.copyOf(frac, 2 * n);
        }
        idx[n] = y * grid.nx() + x;
        area[n] = inside;
        frac[n] = inside / full;
        n++;
      }
    }
    return new Block(idx, area, frac, n);
  }

  /** Per-row work arrays over the columns x0..x1. */
  private static final class Scratch {
    final double[] piece, cover;
    final boolean[] touched, whole;
    double[] crossings = new double[16];

    Scratch(int cols) {
      piece = new double[cols];
      cover = new double[cols];
      touched = new boolean[cols];
      whole = new boolean[cols];
    }

    void reset() {
      Arrays.fill(piece, 0);
      Arrays.fill(cover, 0);
      Arrays.fill(touched, false);
      Arrays.fill(whole, false);
    }
  }

  /**
   * Length (degrees of longitude) of each cell's north side inside the region, from the sorted
   * crossings of the parallel just north of it: inside between the first and second crossing,
   * the third and fourth, and so on.
   */
  private void coverNorth(int y, double north, Scratch s) {
    int k = 0;
    for (int j = rowStart[y - y0]; j < rowStart[y - y0 + 1]; j++) {
      int e = rowEdges[j];
      if (edges.latMin(e) <= north && north < edges.latMax(e)) {
        if (k == s.crossings.length) {
          s.crossings = Arrays.copyOf(s.crossings, 2 * k);
        }
        s.crossings[k++] = edges.lonAt(e, north);
      }
    }
    if ((k & 1) != 0) {
      throw new RegionException("the region's outline is not closed: the parallel " + north
          + " crosses it an odd number of times; every ring must end where it starts");
    }
    Arrays.sort(s.crossings, 0, k);
    for (int i = 0; i < k; i += 2) {
      double lo = s.crossings[i], hi = s.crossings[i + 1];
      for (int x = Math.max(x0, firstUpperAbove(grid, lo)); x <= x1 && grid.lonLower(x) < hi; x++) {
        double west = grid.lonLower(x), east = grid.lonUpper(x);
        int c = x - x0;
        if (lo <= west && hi >= east) {
          s.cover[c] = east - west;
          s.whole[c] = true;
        } else {
          s.cover[c] += Math.min(east, hi) - Math.max(west, lo);
        }
      }
    }
  }

  /** Adds ∫ (sin φ − sin φ_S) dλ of every edge piece inside each cell of the row. */
  private void clipEdges(int y, double south, double north, Scratch s) {
    double ref = Math.toRadians(south);
    for (int j = rowStart[y - y0]; j < rowStart[y - y0 + 1]; j++) {
      int e = rowEdges[j];
      double ax = edges.x1(e), ay = edges.y1(e), bx = edges.x2(e), by = edges.y2(e);
      if (ax == bx) {
        continue; // along a meridian: dλ = 0
      }
      if (ay == by) {
        if (!(south < ay && ay <= north)) {
          continue; // on the south parallel: it belongs to the row below
        }
      } else {
        if (edges.latMin(e) >= north) {
          continue; // only touches the north parallel (it still counts there as a crossing)
        }
        // Clip to the row's latitudes; the clipped ends lie exactly on the parallels.
        if (ay < south || ay > north) {
          double lat = ay < south ? south : north;
          ax = edges.lonAt(e, lat);
          ay = lat;
        }
        if (by < south || by > north) {
          double lat = by < south ? south : north;
          bx = edges.lonAt(e, lat);
          by = lat;
        }
        if (ax == bx) {
          continue;
        }
      }
      double lo = Math.min(ax, bx), hi = Math.max(ax, bx);
      for (int x = Math.max(x0, firstUpperAbove(grid, lo)); x <= x1 && grid.lonLower(x) < hi; x++) {
        double qa = Math.max(grid.lonLower(x), lo), qb = Math.min(grid.lonUpper(x), hi);
        double latA = latAt(ax, ay, bx, by, qa), latB = latAt(ax, ay, bx, by, qb);
        // Along the edge's own direction, which keeps the region on the left.
        double v = ax < bx ? SphericalArea.edgeIntegral(qa, latA, qb, latB, ref)
            : SphericalArea.edgeIntegral(qb, latB, qa, latA, ref);
        s.piece[x - x0] += v;
        s.touched[x - x0] = true;
      }
    }
  }

  /** Latitude at longitude q on the segment (ax, ay)-(bx, by); its ends exactly. */
  private static double latAt(double ax, double ay, double bx, double by, double q) {
    if (q == ax) {
      return ay;
    }
    if (q == bx) {
      return by;
    }
    return ay + (q - ax) * (by - ay) / (bx - ax);
  }

  /** First row whose north bound is at least lat. */
  private static int firstUpperAtLeast(LatLonGrid grid, double lat) {
    int lo = 0, hi = grid.ny();
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (grid.latUpper(mid) < lat) lo = mid + 1; else hi = mid;
    }
    return lo;
  }

  /** Last row whose south bound is below lat. */
  private static int lastLowerBelow(LatLonGrid grid, double lat) {
    int lo = 0, hi = grid.ny();
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (grid.latLower(mid) < lat) lo = mid + 1; else hi = mid;
    }
    return lo - 1;
  }

  /** First column whose east bound exceeds lon. */
  private static int firstUpperAbove(LatLonGrid grid, double lon) {
    int lo = 0, hi = grid.nx();
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (grid.lonUpper(mid) <= lon) lo = mid + 1; else hi = mid;
    }
    return lo;
  }
}
