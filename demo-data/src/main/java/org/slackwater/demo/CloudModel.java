package org.slackwater.demo;

/**
 * Daily cloud area fraction (0..1) on every cell: the logistic of a latent variable made of the
 * regional latent (AR(1) persistence, cloudier in winter, much cloudier on wet days, strongly reduced
 * in planted clear spells), a smooth persistent local anomaly, and a term for the local rainfall.
 */
final class CloudModel {

  private CloudModel() {
  }

  static Field generate(GridSpec grid, DayAxis days, RegionalWeather weather, Field rainfall, long seed) {
    int[] cells = RainfallModel.allCells(grid);
    double[][] pos = SmoothNoise.cellPositionsKm(grid, cells);
    double[] lons = new double[cells.length];
    double[] lats = new double[cells.length];
    for (int k = 0; k < cells.length; k++) {
      lons[k] = grid.cellLon(cells[k]);
      lats[k] = grid.cellLat(cells[k]);
    }
    GridSampler rain = new GridSampler(rainfall, lons, lats);
    SmoothNoise local = new SmoothNoise(pos[0], pos[1], 8, 40, 250, 0.6, Rng.stream(seed, "cloud-local"));
    float[] values = new float[days.size() * cells.length];
    for (int d = 0; d < days.size(); d++) {
      float[] z = local.next();
      for (int k = 0; k < cells.length; k++) {
        double mm = RainfallModel.toMmPerDay(rain.sample(d, k));
        double latent = weather.cloudLatent(d) + 0.8 * z[k] + 0.9 * Math.min(mm, 15) / 15;
        values[d * cells.length + k] = (float) RegionalWeather.logistic(latent);
      }
    }
    return new Field(grid, cells, values, days.size());
  }
}
