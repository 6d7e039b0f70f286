package org.slackwater.demo;

/**
 * Bilinear interpolation of a field defined on every cell of its grid, at fixed target points.
 * Points outside the ring of cell centres take the nearest edge value (clamping), which is what a
 * model coupling two slightly different boxes needs.
 *
 * <p>The weights are computed once per target, so sampling a day costs four reads per point.
 */
final class GridSampler {

  private final Field source;
  private final int[][] index;
  private final double[][] weight;

  /**
   * @throws IllegalArgumentException when the source field does not cover its whole grid
   */
  GridSampler(Field source, double[] lons, double[] lats) {
    if (source.cellCount() != source.grid().cells()) {
      throw new IllegalArgumentException("can only interpolate a field defined on all cells of grid "
          + source.grid().name());
    }
    this.source = source;
    GridSpec g = source.grid();
    index = new int[lons.length][4];
    weight = new double[lons.length][4];
    for (int p = 0; p < lons.length; p++) {
      double r = clamp(g.rowOf(lats[p]), g.nLat() - 1);
      double c = clamp(g.colOf(lons[p]), g.nLon() - 1);
      int r0 = Math.min((int) Math.floor(r), Math.max(0, g.nLat() - 2));
      int c0 = Math.min((int) Math.floor(c), Math.max(0, g.nLon() - 2));
      int r1 = Math.min(r0 + 1, g.nLat() - 1);
      int c1 = Math.min(c0 + 1, g.nLon() - 1);
      double fr = r - r0;
      double fc = c - c0;
      index[p] = new int[] {r0 * g.nLon() + c0, r0 * g.nLon() + c1, r1 * g.nLon() + c0, r1 * g.nLon() + c1};
      weight[p] = new double[] {(1 - fr) * (1 - fc), (1 - fr) * fc, fr * (1 - fc), fr * fc};
    }
  }

  private static double clamp(double v, int max) {
    return Math.max(0, Math.min(max, v));
  }

  double sample(int day, int point) {
    double s = 0;
    for (int i = 0; i < 4; i++) {
      s += weight[point][i] * source.value(day, index[point][i]);
    }
    return s;
  }
}
