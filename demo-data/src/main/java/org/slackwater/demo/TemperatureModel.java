package org.slackwater.demo;

/**
 * Daily water temperature (K) on the water cells: the regional temperature (seasonal 9-23 deg C,
 * AR(1) weather anomalies, planted warm spells) plus a river influence that widens the seasonal range
 * towards the mouth, plus a small smooth local anomaly.
 */
final class TemperatureModel {

  static final double KELVIN = 273.15;

  private TemperatureModel() {
  }

  static Field generate(GridSpec grid, int[] waterCells, DayAxis days, RegionalWeather weather,
                        WrenmouthGeography geo, long seed) {
    double[][] pos = SmoothNoise.cellPositionsKm(grid, waterCells);
    SmoothNoise local = new SmoothNoise(pos[0], pos[1], 6, 20, 120, 0.8, Rng.stream(seed, "temperature-local"));
    double[] river = new double[waterCells.length];
    for (int k = 0; k < waterCells.length; k++) {
      double f = geo.alongKm(grid.cellLon(waterCells[k]), grid.cellLat(waterCells[k])) / geo.lengthKm();
      river[k] = 1.0 * (1 - Math.max(0, Math.min(1, f)));
    }
    float[] values = new float[days.size() * waterCells.length];
    for (int d = 0; d < days.size(); d++) {
      float[] z = local.next();
      double season = Seasons.warmth(days.dayOfYear(d));
      for (int k = 0; k < waterCells.length; k++) {
        double c = weather.tempC(d) + river[k] * season + 0.3 * z[k];
        values[d * waterCells.length + k] = (float) (c + KELVIN);
      }
    }
    return new Field(grid, waterCells, values, days.size());
  }
}
