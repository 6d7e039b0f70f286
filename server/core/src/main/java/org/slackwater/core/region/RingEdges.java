package org.slackwater.core.region;

import java.util.Arrays;
import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.Polygon;

/**
 * The edges of a polygonal region in lon/lat degrees, oriented so that the region lies on their
 * left: shells counter-clockwise, holes clockwise. With that orientation the boundary integrals of
 * {@link RowSweep} add up to the region's area whatever orientation the input rings had.
 * Zero-length edges (repeated vertices) are dropped; points and lines contribute no edges.
 *
 * <p>Fails with a {@link RegionException} naming the vertex if a coordinate is not finite.
 */
final class RingEdges {
  private double[] x1 = new double[64], y1 = new double[64], x2 = new double[64], y2 = new double[64];
  private int size;

  private RingEdges() {}

  static RingEdges of(Geometry region) {
    RingEdges e = new RingEdges();
    e.addAll(region);
    return e;
  }

  int size() {
    return size;
  }

  double x1(int i) {
    return x1[i];
  }

  double y1(int i) {
    return y1[i];
  }

  double x2(int i) {
    return x2[i];
  }

  double y2(int i) {
    return y2[i];
  }

  double latMin(int i) {
    return Math.min(y1[i], y2[i]);
  }

  double latMax(int i) {
    return Math.max(y1[i], y2[i]);
  }

  /**
   * Longitude where edge {@code i} meets the parallel {@code lat}, which must lie within the
   * edge's latitude range; an end vertex on the parallel gives its own longitude exactly.
   */
  double lonAt(int i, double lat) {
    if (y1[i] == lat) {
      return x1[i];
    }
    if (y2[i] == lat) {
      return x2[i];
    }
    return x1[i] + (lat - y1[i]) * (x2[i] - x1[i]) / (y2[i] - y1[i]);
  }

  private void addAll(Geometry g) {
    for (int i = 0; i < g.getNumGeometries(); i++) {
      Geometry part = g.getGeometryN(i);
      if (part instanceof Polygon p) {
        ring(p.getExteriorRing(), true);
        for (int h = 0; h < p.getNumInteriorRing(); h++) {
          ring(p.getInteriorRingN(h), false);
        }
      } else if (part != g) {
        addAll(part);
      }
    }
  }

  private void ring(LineString ring, boolean shell) {
    Coordinate[] c = ring.getCoordinates();
    for (int k = 0; k < c.length; k++) {
      if (!Double.isFinite(c[k].x) || !Double.isFinite(c[k].y)) {
        throw new RegionException("the region's outline has a coordinate that is not a number at vertex " + (k + 1)
            + " (" + c[k].x + ", " + c[k].y + "); give every position as finite [longitude, latitude] degrees");
      }
    }
    if (c.length < 4) {
      return; // an empty or degenerate ring encloses nothing
    }
    boolean reverse = Orientation.isCCW(c) != shell;
    for (int k = 0; k + 1 < c.length; k++) {
      Coordinate a = reverse ? c[c.length - 1 - k] : c[k], b = reverse ? c[c.length - 2 - k] : c[k + 1];
      if (a.x == b.x && a.y == b.y) {
        continue;
      }
      if (size == x1.length) {
        int n = 2 * size;
        x1 = Arrays.copyOf(x1, n);
        y1 = Arrays.copyOf(y1, n);
        x2 = Arrays.copyOf(x2, n);
        y2 = Arrays.copyOf(y2, n);
      }
      x1[size] = a.x;
      y1[size] = a.y;
      x2[size] = b.x;
      y2[size] = b.y;
      size++;
    }
  }
}
