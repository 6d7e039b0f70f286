package org.slackwater.demo;

import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.function.IntToDoubleFunction;

/**
 * Measures each planted event on the generated true fields, so that ground_truth.csv states what is
 * in the files rather than what was intended.
 *
 * <p>Bloom: peak = the day with the highest true chlorophyll in the bloom's segment within 40 days of
 * onset; onset and drivers as planted. Turbidity event: the Upper Reach mean turbidity; onset = the
 * half-rise day (first day from the storm start above halfway between the pre-storm value and the
 * maximum within 20 days), peak = that maximum. The runoff lead is measured the same way on the
 * watershed-mean runoff.
 */
final class GroundTruth {

  static final List<String> BLOOM_DRIVERS = List.of("rainfall+", "runoff+", "water_temperature+",
      "cloud_fraction-", "turbidity-");
  static final List<String> STORM_DRIVERS = List.of("rainfall+", "runoff+");
  private static final int BLOOM_WINDOW = 40;
  private static final int STORM_WINDOW = 20;

  private GroundTruth() {
  }

  static List<GroundTruthRow> measure(EventPlan plan, DayAxis days, Field chlorophyll, Field turbidity,
                                      double[] runoffMean, WrenmouthGeography geo) {
    List<GroundTruthRow> rows = new ArrayList<>();
    for (BloomEvent e : plan.blooms()) {
      rows.add(bloom(e, days, chlorophyll, geo));
    }
    for (StormEvent s : plan.storms()) {
      rows.add(storm(s, days, turbidity, runoffMean, geo));
    }
    return List.copyOf(rows);
  }

  private static GroundTruthRow bloom(BloomEvent e, DayAxis days, Field chl, WrenmouthGeography geo) {
    int[] region = regionCells(chl, e.region(), geo);
    int onset = days.indexOf(e.onset());
    int bestDay = onset;
    double best = -1;
    for (int d = onset; d < Math.min(days.size(), onset + BLOOM_WINDOW); d++) {
      for (int k : region) {
        if (chl.value(d, k) > best) {
          best = chl.value(d, k);
          bestDay = d;
        }
      }
    }
    int wetLead = (int) ChronoUnit.DAYS.between(e.wetStart(), e.onset());
    int spellLead = (int) ChronoUnit.DAYS.between(e.spellStart(), e.onset());
    return new GroundTruthRow(e.id(), e.region(), e.onset(), days.date(bestDay), best, BLOOM_DRIVERS,
        List.of(wetLead, wetLead, spellLead, spellLead, spellLead));
  }

  private static GroundTruthRow storm(StormEvent s, DayAxis days, Field tur, double[] runoffMean,
                                      WrenmouthGeography geo) {
    int[] region = regionCells(tur, WrenmouthGeography.UPPER_REACH, geo);
    int start = days.indexOf(s.start());
    int end = Math.min(days.size(), start + STORM_WINDOW);
    IntToDoubleFunction turbidity = d -> mean(tur, d, region);
    IntToDoubleFunction runoff = d -> runoffMean[d];
    int onset = halfRise(start, end, turbidity);
    int runoffRise = halfRise(start, end, runoff);
    return new GroundTruthRow(s.id(), WrenmouthGeography.UPPER_REACH, days.date(onset),
        days.date(argMax(start, end, turbidity)), Double.NaN, STORM_DRIVERS,
        List.of(onset - start, Math.max(0, onset - runoffRise)));
  }

  /**
   * First day in [from, to) on which the series is above halfway between its value the day before
   * {@code from} and its maximum in the window: a rise time that noise cannot trigger early.
   */
  private static int halfRise(int from, int to, IntToDoubleFunction f) {
    double base = f.applyAsDouble(Math.max(0, from - 1));
    double level = base + 0.5 * (f.applyAsDouble(argMax(from, to, f)) - base);
    for (int d = from; d < to; d++) {
      if (f.applyAsDouble(d) > level) {
        return d;
      }
    }
    return from;
  }

  private static int argMax(int from, int to, IntToDoubleFunction f) {
    int best = from;
    for (int d = from; d < to; d++) {
      if (f.applyAsDouble(d) > f.applyAsDouble(best)) {
        best = d;
      }
    }
    return best;
  }

  private static double mean(Field f, int day, int[] ks) {
    double s = 0;
    for (int k : ks) {
      s += f.value(day, k);
    }
    return s / ks.length;
  }

  /**
   * Active cells of the field in the named segment. A grid too coarse to have a cell centre in the
   * segment (the narrow Upper Reach at a large divisor) gets the three water cells nearest the mouth.
   */
  static int[] regionCells(Field f, String segment, WrenmouthGeography geo) {
    List<Integer> in = new ArrayList<>();
    for (int k = 0; k < f.cellCount(); k++) {
      double lon = f.grid().cellLon(f.cell(k));
      double lat = f.grid().cellLat(f.cell(k));
      if (geo.segmentAt(lon, lat).map(segment::equals).orElse(false)) {
        in.add(k);
      }
    }
    if (!in.isEmpty()) {
      return in.stream().mapToInt(Integer::intValue).toArray();
    }
    Integer[] order = new Integer[f.cellCount()];
    for (int k = 0; k < order.length; k++) {
      order[k] = k;
    }
    java.util.Arrays.sort(order, java.util.Comparator.comparingDouble(
        k -> geo.alongKm(f.grid().cellLon(f.cell(k)), f.grid().cellLat(f.cell(k)))));
    int n = Math.min(3, order.length);
    int[] out = new int[n];
    for (int i = 0; i < n; i++) {
      out[i] = order[i];
    }
    return out;
  }
}
