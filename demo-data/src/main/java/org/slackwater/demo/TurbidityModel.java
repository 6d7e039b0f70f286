package org.slackwater.demo;

/**
 * Daily "true" turbidity (FNU) on the water cells, before any satellite gap.
 *
 * <p>Three parts: a background that is high in the Upper Reach and decays seaward (e-folding 14 km,
 * a little higher in winter); a river plume driven by the watershed-mean runoff after a two-day
 * transit and a 2.5-day response, whose strength saturates and whose reach grows with the flow; and
 * wind resuspension, which the planted calm spells suppress. A smooth and a small cell-by-cell
 * log-normal factor add texture. Values are kept within 0.1..320 FNU, inside the int16 packing range.
 */
final class TurbidityModel {

  static final double MIN_FNU = 0.1;
  static final double MAX_FNU = 320;
  private static final int TRANSIT_DAYS = 2;

  private TurbidityModel() {
  }

  static Field generate(GridSpec grid, int[] waterCells, DayAxis days, RegionalWeather weather,
                        double[] runoffMean, WrenmouthGeography geo, long seed) {
    int n = waterCells.length;
    double[] s = new double[n];
    for (int k = 0; k < n; k++) {
      s[k] = Math.max(0, geo.alongKm(grid.cellLon(waterCells[k]), grid.cellLat(waterCells[k])));
    }
    double[][] pos = SmoothNoise.cellPositionsKm(grid, waterCells);
    SmoothNoise smooth = new SmoothNoise(pos[0], pos[1], 6, 8, 60, 0.7, Rng.stream(seed, "turbidity-texture"));
    Rng cellNoise = Rng.stream(seed, "turbidity-cells");
    float[] values = new float[days.size() * n];
    double supply = runoffMean[0];
    for (int d = 0; d < days.size(); d++) {
      supply += (runoffMean[Math.max(0, d - TRANSIT_DAYS)] - supply) / 2.5;
      double season = 1 + 0.15 * Seasons.winter(days.dayOfYear(d));
      double plume = 300 * supply / (supply + 25);
      double reach = 6 + 14 * supply / (supply + 10);
      double wind = weather.wind(d);
      float[] z = smooth.next();
      for (int k = 0; k < n; k++) {
        double background = (2 + 22 * Math.exp(-s[k] / 14)) * season;
        double total = background + plume * Math.exp(-s[k] / reach) + 5 * wind * Math.exp(-s[k] / 30);
        double texture = Math.exp(0.18 * z[k] + 0.05 * cellNoise.normal());
        values[d * n + k] = (float) Math.max(MIN_FNU, Math.min(MAX_FNU, total * texture));
      }
    }
    return new Field(grid, waterCells, values, days.size());
  }
}
