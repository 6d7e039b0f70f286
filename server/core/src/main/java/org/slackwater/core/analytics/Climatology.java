package org.slackwater.core.analytics;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

/**
 * The distribution of a series' values in each period-of-year class over a baseline, and the
 * comparisons against it: anomaly (value − class mean), standardized anomaly (anomaly / class
 * standard deviation, n − 1 in the denominator) and percentile rank within the baseline.
 *
 * <p>Classes follow the step: calendar month for monthly values, the season for seasonal, the
 * ISO week (week 53 pooled with week 52) for weekly, one class for yearly and water-year values.
 * Daily values are classed by day of year on a 365-day year (29 February shares 28 February's
 * class) and pooled over a centred window of ±{@code dayWindow} days, so a 20-year baseline gives
 * each day about 20 x (2 x 15 + 1) values rather than 20.
 *
 * <p>Percentile rank is the mid-rank definition: 100 x (count below + ½ count equal) / n, so the
 * baseline median has rank 50 and a value above every baseline value approaches but never
 * reaches 100.
 */
public final class Climatology {
  /** The default half-width of the daily pooling window, in days. */
  public static final int DEFAULT_DAY_WINDOW = 15;

  private final TemporalStep step;
  private final BaselineStats[] classes;

  private Climatology(TemporalStep step, BaselineStats[] classes) {
    this.step = step;
    this.classes = classes;
  }

  public static Climatology of(StepSeries baseline, int dayWindow) {
    TemporalStep step = baseline.step();
    int classes = PeriodOfYear.classCount(step);
    List<List<Double>> pools = new ArrayList<>();
    for (int c = 0; c < classes; c++) {
      pools.add(new ArrayList<>());
    }
    for (int i = 0; i < baseline.size(); i++) {
      double v = baseline.value()[i];
      if (Double.isNaN(v)) {
        continue;
      }
      int c = classOf(step, baseline.start()[i]);
      if (step == TemporalStep.DAY) {
        for (int d = -dayWindow; d <= dayWindow; d++) {
          pools.get(Math.floorMod(c + d, 365)).add(v);
        }
      } else {
        pools.get(c).add(v);
      }
    }
    BaselineStats[] stats = new BaselineStats[classes];
    for (int c = 0; c < classes; c++) {
      stats[c] = BaselineStats.of(pools.get(c).stream().mapToDouble(Double::doubleValue).toArray());
    }
    return new Climatology(step, stats);
  }

  /** The class of the period starting on {@code start}: 0-based (see {@link PeriodOfYear}). */
  public static int classOf(TemporalStep step, LocalDate start) {
    return PeriodOfYear.classOf(step, start);
  }

  public TemporalStep step() {
    return step;
  }

  public double mean(LocalDate start) {
    return classes[classOf(step, start)].mean();
  }

  public double sd(LocalDate start) {
    return classes[classOf(step, start)].sd();
  }

  public int n(LocalDate start) {
    return classes[classOf(step, start)].n();
  }

  public double anomaly(LocalDate start, double v) {
    return classes[classOf(step, start)].anomaly(v);
  }

  public double standardizedAnomaly(LocalDate start, double v) {
    return classes[classOf(step, start)].standardizedAnomaly(v);
  }

  public double percentileRank(LocalDate start, double v) {
    return classes[classOf(step, start)].percentileRank(v);
  }
}
