package org.slackwater.core.analytics;

import java.util.ArrayList;
import java.util.List;
import org.slackwater.core.cube.LatLonGrid;

/**
 * First-order conservative regridding between two regular lat/lon grids: each target cell gets
 * the area-weighted mean of the source cells it overlaps, weighted by the overlap area. On a
 * sphere the overlap of two lat/lon cells is R² · (overlap in λ, radians) · (overlap in sin φ),
 * so the weights are exact and separable: one 1-D overlap table per axis. The area integral of a
 * field over the region both grids cover is preserved (up to rounding) when no value is missing.
 *
 * <p>Missing source values are left out and the remaining weights renormalised, so a target cell
 * is the mean of its valid overlapping area; a target cell with no valid overlap is missing.
 * Longitudes must be in the same convention on both grids (rotate first if one is 0..360).
 */
public final class ConservativeRegrid {
  /** Overlaps along one axis: for target index t, the source indices and overlap lengths. */
  private record Axis(int[][] source, double[][] overlap) {}

  private final LatLonGrid from, to;
  private final Axis lat, lon;

  public ConservativeRegrid(LatLonGrid from, LatLonGrid to) {
    this.from = from;
    this.to = to;
    this.lat = axis(sines(from.latLower()), sines(from.latUpper()), sines(to.latLower()), sines(to.latUpper()));
    this.lon = axis(radians(from.lonLower()), radians(from.lonUpper()), radians(to.lonLower()), radians(to.lonUpper()));
  }

  /** Regrids one time step: {@code src} in (row, column) order of the source grid, NaN = missing. */
  public double[] apply(double[] src) {
    int tny = to.ny(), tnx = to.nx(), snx = from.nx();
    double[] out = new double[tny * tnx];
    for (int ty = 0; ty < tny; ty++) {
      int[] sy = lat.source()[ty];
      double[] wy = lat.overlap()[ty];
      for (int tx = 0; tx < tnx; tx++) {
        int[] sx = lon.source()[tx];
        double[] wx = lon.overlap()[tx];
        double w = 0, wv = 0;
        for (int a = 0; a < sy.length; a++) {
          for (int b = 0; b < sx.length; b++) {
            double v = src[sy[a] * snx + sx[b]];
            if (!Double.isNaN(v)) {
              double ww = wy[a] * wx[b];
              w += ww;
              wv += ww * v;
            }
          }
        }
        out[ty * tnx + tx] = w > 0 ? wv / w : Double.NaN;
      }
    }
    return out;
  }

  /** Fraction of each target cell's area covered by source cells (1 inside the source grid). */
  public double coveredFraction(int ty, int tx) {
    double cy = 0, cx = 0;
    for (double v : lat.overlap()[ty]) cy += v;
    for (double v : lon.overlap()[tx]) cx += v;
    double h = Math.sin(Math.toRadians(to.latUpper(ty))) - Math.sin(Math.toRadians(to.latLower(ty)));
    double wdt = Math.toRadians(to.lonUpper(tx) - to.lonLower(tx));
    return (cy / h) * (cx / wdt);
  }

  private static Axis axis(double[] sLo, double[] sHi, double[] tLo, double[] tHi) {
    int n = tLo.length;
    int[][] src = new int[n][];
    double[][] ov = new double[n][];
    for (int t = 0; t < n; t++) {
      List<int[]> idx = new ArrayList<>();
      List<Double> len = new ArrayList<>();
      for (int s = 0; s < sLo.length; s++) {
        double o = Math.min(sHi[s], tHi[t]) - Math.max(sLo[s], tLo[t]);
        if (o > 0) {
          idx.add(new int[] {s});
          len.add(o);
        }
      }
      src[t] = idx.stream().mapToInt(a -> a[0]).toArray();
      ov[t] = len.stream().mapToDouble(Double::doubleValue).toArray();
    }
    return new Axis(src, ov);
  }

  private static double[] sines(double[] deg) {
    double[] out = new double[deg.length];
    for (int i = 0; i < deg.length; i++) {
      out[i] = Math.sin(Math.toRadians(deg[i]));
    }
    return out;
  }

  private static double[] radians(double[] deg) {
    double[] out = new double[deg.length];
    for (int i = 0; i < deg.length; i++) {
      out[i] = Math.toRadians(deg[i]);
    }
    return out;
  }
}
