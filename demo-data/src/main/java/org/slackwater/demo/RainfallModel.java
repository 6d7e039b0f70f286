package org.slackwater.demo;

/**
 * Gridded daily rainfall (kg m-2 s-1) from the regional series: on a regional wet day a cell is wet
 * where a smooth occurrence field exceeds a threshold (about 85 % of the area), and its amount is the
 * regional amount times an orographic factor (wetter towards the north-west uplands of the watershed)
 * times a smooth log-normal field, which makes neighbouring cells correlated. Storm days are wet
 * everywhere.
 */
final class RainfallModel {

  private static final double SECONDS_PER_DAY = 86400;
  private static final double OCCURRENCE_THRESHOLD = -1.05;
  private static final double AMOUNT_SIGMA = 0.45;

  private RainfallModel() {
  }

  static Field generate(GridSpec grid, DayAxis days, RegionalWeather weather, long seed) {
    int[] cells = allCells(grid);
    double[][] pos = SmoothNoise.cellPositionsKm(grid, cells);
    SmoothNoise occurrence = new SmoothNoise(pos[0], pos[1], 6, 60, 300, 0.3, Rng.stream(seed, "rain-occurrence"));
    SmoothNoise amount = new SmoothNoise(pos[0], pos[1], 6, 50, 250, 0.2, Rng.stream(seed, "rain-amount"));
    double[] orography = new double[cells.length];
    for (int k = 0; k < cells.length; k++) {
      double uplands = (grid.cellLat(cells[k]) - 44.0) / 0.9 + (-31.0 - grid.cellLon(cells[k])) / 1.2;
      orography[k] = 1 + 0.25 * Math.max(0, Math.min(1, uplands));
    }
    float[] values = new float[days.size() * cells.length];
    // Log-normal mean correction, so the field does not change the regional mean amount.
    double bias = -AMOUNT_SIGMA * AMOUNT_SIGMA / 2;
    for (int d = 0; d < days.size(); d++) {
      float[] zo = occurrence.next();
      float[] za = amount.next();
      for (int k = 0; k < cells.length; k++) {
        double mm = 0;
        if (weather.wet(d) && (weather.storm(d) || zo[k] > OCCURRENCE_THRESHOLD)) {
          mm = weather.rainMm(d) * orography[k] * Math.exp(AMOUNT_SIGMA * za[k] + bias);
        }
        values[d * cells.length + k] = (float) (mm / SECONDS_PER_DAY);
      }
    }
    return new Field(grid, cells, values, days.size());
  }

  static double toMmPerDay(double kgPerM2PerS) {
    return kgPerM2PerS * SECONDS_PER_DAY;
  }

  static int[] allCells(GridSpec grid) {
    int[] all = new int[grid.cells()];
    for (int i = 0; i < all.length; i++) {
      all[i] = i;
    }
    return all;
  }
}
