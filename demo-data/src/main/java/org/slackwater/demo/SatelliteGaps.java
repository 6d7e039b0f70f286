package org.slackwater.demo;

/**
 * What a satellite sees of a true field: the value where the cloud fraction at the cell (bilinear
 * from the cloud grid) is at most the threshold, NaN (written as _FillValue) where it is cloudier.
 */
final class SatelliteGaps {

  /** Cloud fraction above which the water is hidden (common practice for optical sensors: a
   *  conservative cloud screen; the exact value is ours). */
  static final double CLOUD_THRESHOLD = 0.7;

  private SatelliteGaps() {
  }

  static Field observe(Field truth, Field cloud) {
    GridSpec g = truth.grid();
    int n = truth.cellCount();
    double[] lons = new double[n];
    double[] lats = new double[n];
    for (int k = 0; k < n; k++) {
      lons[k] = g.cellLon(truth.cell(k));
      lats[k] = g.cellLat(truth.cell(k));
    }
    GridSampler sampler = new GridSampler(cloud, lons, lats);
    float[] seen = new float[truth.days() * n];
    for (int d = 0; d < truth.days(); d++) {
      for (int k = 0; k < n; k++) {
        seen[d * n + k] = sampler.sample(d, k) > CLOUD_THRESHOLD ? Float.NaN : truth.value(d, k);
      }
    }
    return new Field(g, truth.cells(), seen, truth.days());
  }
}
