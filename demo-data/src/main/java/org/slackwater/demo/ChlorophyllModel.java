package org.slackwater.demo;

import java.time.temporal.ChronoUnit;
import java.util.List;

/**
 * Daily "true" chlorophyll-a (mg m-3) on the water cells, before any satellite gap.
 *
 * <p>Background (about 1-6 mg m-3): a small April maximum plus growth limited by temperature,
 * light (daylight and regional cloud) and a nutrient index that follows the watershed runoff with a
 * 20-day memory; highest in the Mid Reach. Its noise factor is bounded to 0.8..1.25, so without a
 * planted bloom no value exceeds about 8 mg m-3.
 *
 * <p>Planted blooms: a Gaussian patch around the bloom centre (snapped to the nearest water cell of
 * this grid inside the bloom's segment, so coarse grids still see the full peak) rising as sin^2 from
 * onset to peak and decaying with a 9-day e-folding time; the value is the larger of background and
 * bloom.
 */
final class ChlorophyllModel {

  private static final double DECAY_DAYS = 9;

  private ChlorophyllModel() {
  }

  static Field generate(GridSpec grid, int[] waterCells, DayAxis days, RegionalWeather weather,
                        double[] runoffMean, List<BloomEvent> blooms, WrenmouthGeography geo, long seed) {
    int n = waterCells.length;
    double[] habitat = new double[n];
    for (int k = 0; k < n; k++) {
      double s = geo.alongKm(grid.cellLon(waterCells[k]), grid.cellLat(waterCells[k]));
      habitat[k] = 0.75 + 0.35 * Math.exp(-Math.pow((s - 32) / 18, 2));
    }
    double[][] patch = new double[blooms.size()][];
    for (int e = 0; e < blooms.size(); e++) {
      patch[e] = patch(grid, waterCells, blooms.get(e), geo);
    }
    double[][] pos = SmoothNoise.cellPositionsKm(grid, waterCells);
    SmoothNoise smooth = new SmoothNoise(pos[0], pos[1], 6, 10, 80, 0.8, Rng.stream(seed, "chlorophyll-texture"));
    Rng cellNoise = Rng.stream(seed, "chlorophyll-cells");
    float[] values = new float[days.size() * n];
    double nutrients = runoffMean[0];
    for (int d = 0; d < days.size(); d++) {
      int doy = days.dayOfYear(d);
      nutrients += (runoffMean[Math.max(0, d - 3)] - nutrients) / 20;
      double temperature = Math.max(0, Math.min(1.1, (weather.tempC(d) - 8) / 14));
      double light = (0.35 + 0.65 * Seasons.daylight(doy)) * (1 - 0.5 * RegionalWeather.logistic(weather.cloudLatent(d)));
      double spring = Math.exp(-Math.pow((doy - 110) / 22.0, 2));
      double regional = 0.9 + 1.6 * spring + 4.0 * temperature * light * nutrients / (nutrients + 2);
      double[] shape = new double[blooms.size()];
      for (int e = 0; e < blooms.size(); e++) {
        shape[e] = shape(blooms.get(e), days, d);
      }
      float[] z = smooth.next();
      for (int k = 0; k < n; k++) {
        double noise = clamp(Math.exp(0.12 * z[k] + 0.04 * cellNoise.normal()), 0.8, 1.25);
        double v = regional * habitat[k] * noise;
        for (int e = 0; e < blooms.size(); e++) {
          if (shape[e] > 0) {
            double bloom = blooms.get(e).amplitude() * shape[e] * patch[e][k] * clamp(1 + 0.03 * cellNoise.normal(), 0.92, 1.08);
            v = Math.max(v, bloom);
          }
        }
        values[d * n + k] = (float) v;
      }
    }
    return new Field(grid, waterCells, values, days.size());
  }

  private static double clamp(double v, double lo, double hi) {
    return Math.max(lo, Math.min(hi, v));
  }

  /** 0 before onset, sin^2 rise to 1 at the planned peak, exponential decay after; 0 once negligible. */
  static double shape(BloomEvent e, DayAxis days, int day) {
    long t = ChronoUnit.DAYS.between(e.onset(), days.date(day));
    long rise = ChronoUnit.DAYS.between(e.onset(), e.plannedPeak());
    if (t < 0) {
      return 0;
    }
    if (t <= rise) {
      double x = Math.sin(Math.PI / 2 * t / rise);
      return x * x;
    }
    double decay = Math.exp(-(t - rise) / DECAY_DAYS);
    return decay < 0.01 ? 0 : decay;
  }

  /** Gaussian weight of each water cell around the bloom centre snapped to this grid. */
  private static double[] patch(GridSpec grid, int[] waterCells, BloomEvent e, WrenmouthGeography geo) {
    int best = -1;
    double bestDist = Double.MAX_VALUE;
    boolean bestInRegion = false;
    for (int k = 0; k < waterCells.length; k++) {
      double lon = grid.cellLon(waterCells[k]);
      double lat = grid.cellLat(waterCells[k]);
      boolean inRegion = geo.segmentAt(lon, lat).map(e.region()::equals).orElse(false);
      double dist = LocalProjection.distanceKm(lon, lat, e.lon(), e.lat());
      if ((inRegion && !bestInRegion) || (inRegion == bestInRegion && dist < bestDist)) {
        best = k;
        bestDist = dist;
        bestInRegion = inRegion;
      }
    }
    double cLon = grid.cellLon(waterCells[best]);
    double cLat = grid.cellLat(waterCells[best]);
    double[] w = new double[waterCells.length];
    for (int k = 0; k < waterCells.length; k++) {
      double dist = LocalProjection.distanceKm(grid.cellLon(waterCells[k]), grid.cellLat(waterCells[k]), cLon, cLat);
      w[k] = Math.exp(-Math.pow(dist / e.radiusKm(), 2));
    }
    return w;
  }
}
