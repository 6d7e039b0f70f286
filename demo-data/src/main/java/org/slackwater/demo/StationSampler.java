package org.slackwater.demo;

import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.List;

/**
 * Grab samples every 14 days at each station: the true field value (before satellite gaps) of the
 * water cell nearest the station, times a bounded measurement error (8 % for chlorophyll, 10 % for
 * turbidity, one standard deviation). Stations visit in order, 40 minutes apart, from 10:00 UTC.
 */
final class StationSampler {

  static final int INTERVAL_DAYS = 14;
  private static final int FIRST_DAY = 2;

  private StationSampler() {
  }

  static List<StationSample> sample(List<Station> stations, DayAxis days, Field chlorophyll, Field turbidity,
                                    long seed) {
    int[] chlCell = new int[stations.size()];
    int[] turCell = new int[stations.size()];
    for (int i = 0; i < stations.size(); i++) {
      chlCell[i] = nearest(chlorophyll, stations.get(i));
      turCell[i] = nearest(turbidity, stations.get(i));
    }
    Rng r = Rng.stream(seed, "station-errors");
    List<StationSample> out = new ArrayList<>();
    for (int d = FIRST_DAY; d < days.size(); d += INTERVAL_DAYS) {
      for (int i = 0; i < stations.size(); i++) {
        Station s = stations.get(i);
        LocalDateTime t = days.date(d).atTime(10, 0).plusMinutes(40L * i);
        double chl = chlorophyll.value(d, chlCell[i]) * error(r, 0.08);
        double tur = turbidity.value(d, turCell[i]) * error(r, 0.10);
        out.add(new StationSample(s, t, "chlorophyll", round2(chl), "mg m-3"));
        out.add(new StationSample(s, t, "turbidity", round2(tur), "FNU"));
      }
    }
    return List.copyOf(out);
  }

  private static double error(Rng r, double sigma) {
    return Math.max(1 - 3 * sigma, Math.min(1 + 3 * sigma, 1 + sigma * r.normal()));
  }

  private static double round2(double v) {
    return Math.round(v * 100) / 100.0;
  }

  /** Active cell of the field nearest to the station. */
  static int nearest(Field f, Station s) {
    int best = 0;
    double bestDist = Double.MAX_VALUE;
    for (int k = 0; k < f.cellCount(); k++) {
      double dist = LocalProjection.distanceKm(f.grid().cellLon(f.cell(k)), f.grid().cellLat(f.cell(k)), s.lon(), s.lat());
      if (dist < bestDist) {
        bestDist = dist;
        best = k;
      }
    }
    return best;
  }
}
