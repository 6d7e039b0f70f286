package org.slackwater.core.analytics.correlation;

import org.slackwater.core.analytics.PeriodOfYear;
import java.time.LocalDate;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Removes the mean seasonal cycle from a series: each value minus the climatological mean of its
 * {@linkplain PeriodOfYear period-of-year class}, optionally divided by the class standard
 * deviation (standardized anomalies). Correlating raw series that share a seasonal cycle mostly
 * measures the cycle; anomalies measure whether departures go together.
 *
 * <p>The climatology is computed from the values dated within the baseline {@code [baselineFrom,
 * baselineTo]} (inclusive; null = open end, so by default all values). For daily series each class
 * pools the baseline values of the classes within ±{@code halfWindowDays} (default {@value
 * #DEFAULT_HALF_WINDOW_DAYS}, wrapping from 31 December to 1 January), which smooths the
 * climatology; a pure cycle is then reproduced up to the window's smoothing (its curvature), and
 * exactly with a half-window of 0. Weekly and coarser series use their classes unsmoothed. The
 * standard deviation is the sample one (n - 1) about the pooled class mean.
 *
 * <p>A value whose class has no baseline value becomes NaN (for standardized anomalies also when
 * the class has fewer than 2 values or zero spread); missing values stay NaN. Fails with {@code
 * BAD_SETTING} for a half-window outside 0..182 or a baseline holding no value of the series.
 *
 * <p>Cost O(n + classes x window) per series; {@link #prepare} splits off the date work so a
 * correlation map can reuse it for every cell of a grid.
 *
 * @param baselineFrom first date of the baseline, or null for the first date of the series
 * @param baselineTo last date of the baseline (inclusive), or null for the last
 * @param halfWindowDays half-width of the daily pooling window, 0..182
 * @param standardize divide by the class standard deviation
 */
public record Deseasonalize(LocalDate baselineFrom, LocalDate baselineTo, int halfWindowDays, boolean standardize) {
  public static final int DEFAULT_HALF_WINDOW_DAYS = 15;
  /** A larger half-window would count some classes twice around the circular year. */
  public static final int MAX_HALF_WINDOW_DAYS = (PeriodOfYear.DAYS - 1) / 2;

  public Deseasonalize {
    if (halfWindowDays < 0 || halfWindowDays > MAX_HALF_WINDOW_DAYS) {
      throw bad("the smoothing half-window must be 0 to " + MAX_HALF_WINDOW_DAYS + " days (got " + halfWindowDays + ")");
    }
    if (baselineFrom != null && baselineTo != null && baselineTo.isBefore(baselineFrom)) {
      throw bad("the baseline ends (" + baselineTo + ") before it starts (" + baselineFrom + ")");
    }
  }

  /** Anomalies against a climatology of all values, ±15-day daily window. */
  public static Deseasonalize anomalies() {
    return new Deseasonalize(null, null, DEFAULT_HALF_WINDOW_DAYS, false);
  }

  /** Standardized anomalies against a climatology of all values, ±15-day daily window. */
  public static Deseasonalize standardizedAnomalies() {
    return new Deseasonalize(null, null, DEFAULT_HALF_WINDOW_DAYS, true);
  }

  public Deseasonalize withBaseline(LocalDate from, LocalDate to) {
    return new Deseasonalize(from, to, halfWindowDays, standardize);
  }

  public Deseasonalize withHalfWindowDays(int days) {
    return new Deseasonalize(baselineFrom, baselineTo, days, standardize);
  }

  public Deseasonalize standardized(boolean on) {
    return new Deseasonalize(baselineFrom, baselineTo, halfWindowDays, on);
  }

  public DatedSeries apply(DatedSeries series) {
    Prepared prepared = prepare(series.step(), series.dates());
    return series.withValues(prepared.apply(series.values()));
  }

  /** The class statistics {@link #apply} would use for this series. */
  public ClassClimatology climatology(DatedSeries series) {
    return prepare(series.step(), series.dates()).climatology(series.values());
  }

  /** Classes and baseline membership of these dates, for applying to many value arrays. */
  public Prepared prepare(TemporalStep step, LocalDate[] dates) {
    int[] classes = new int[dates.length];
    boolean[] inBaseline = new boolean[dates.length];
    for (int i = 0; i < dates.length; i++) {
      classes[i] = PeriodOfYear.classOf(step, dates[i]);
      inBaseline[i] = (baselineFrom == null || !dates[i].isBefore(baselineFrom))
          && (baselineTo == null || !dates[i].isAfter(baselineTo));
    }
    int window = step == TemporalStep.DAY ? halfWindowDays : 0;
    return new Prepared(step, classes, inBaseline, window, this);
  }

  private static CorrelationInputException bad(String message) {
    return new CorrelationInputException(CorrelationInputException.Kind.BAD_SETTING, message);
  }

  /** Deseasonalizing bound to one set of dates. Immutable; {@link #apply} may run concurrently. */
  public static final class Prepared {
    private final TemporalStep step;
    private final int[] classes;
    private final boolean[] inBaseline;
    private final int window;
    private final Deseasonalize settings;

    private Prepared(TemporalStep step, int[] classes, boolean[] inBaseline, int window, Deseasonalize settings) {
      this.step = step;
      this.classes = classes;
      this.inBaseline = inBaseline;
      this.window = window;
      this.settings = settings;
    }

    public int size() {
      return classes.length;
    }

    /** Anomalies of {@code values} (one per prepared date), as a new array. */
    public double[] apply(double[] values) {
      Pooled c = pool(values);
      double[] out = new double[values.length];
      for (int i = 0; i < values.length; i++) {
        int k = classes[i];
        double a = values[i] - c.mean[k];
        if (settings.standardize()) {
          double sd = c.sd[k];
          a = sd > 0 ? a / sd : Double.NaN;
        }
        out[i] = a;
      }
      return out;
    }

    /** The class statistics for {@code values} (one per prepared date). */
    public ClassClimatology climatology(double[] values) {
      Pooled p = pool(values);
      return new ClassClimatology(step, p.count, p.mean, p.sd);
    }

    private Pooled pool(double[] values) {
      if (values.length != classes.length) {
        throw new IllegalArgumentException(
            "expected " + classes.length + " values (one per prepared date), got " + values.length);
      }
      int k = PeriodOfYear.classCount(step);
      // Per class: count, mean, sum of squared deviations (Welford), combined below with Chan's
      // formula so that the window pooling never revisits the values.
      double[] count = new double[k];
      double[] mean = new double[k];
      double[] m2 = new double[k];
      long total = 0;
      for (int i = 0; i < values.length; i++) {
        double v = values[i];
        if (!inBaseline[i] || Double.isNaN(v)) {
          continue;
        }
        int c = classes[i];
        double n = ++count[c];
        double d = v - mean[c];
        mean[c] += d / n;
        m2[c] += d * (v - mean[c]);
        total++;
      }
      if (total == 0) {
        throw bad("the baseline " + (settings.baselineFrom() == null ? "start of the series" : settings.baselineFrom())
            + " to " + (settings.baselineTo() == null ? "end of the series" : settings.baselineTo())
            + " holds no value of the series; choose a baseline within the dates that have values");
      }
      int[] pooledCount = new int[k];
      double[] pooledMean = new double[k];
      double[] pooledSd = new double[k];
      for (int c = 0; c < k; c++) {
        double n = 0;
        double mu = 0;
        double ss = 0;
        for (int w = -window; w <= window; w++) {
          int j = Math.floorMod(c + w, k);
          double nj = count[j];
          if (nj == 0) {
            continue;
          }
          double combined = n + nj;
          double delta = mean[j] - mu;
          mu += delta * nj / combined;
          ss += m2[j] + delta * delta * n * nj / combined;
          n = combined;
        }
        pooledCount[c] = (int) n;
        pooledMean[c] = n > 0 ? mu : Double.NaN;
        pooledSd[c] = n > 1 ? Math.sqrt(ss / (n - 1)) : Double.NaN;
      }
      return new Pooled(pooledCount, pooledMean, pooledSd);
    }
  }

  private record Pooled(int[] count, double[] mean, double[] sd) {}
}
