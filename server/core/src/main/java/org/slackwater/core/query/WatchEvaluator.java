package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.Climatology;
import org.slackwater.core.analytics.IntegralUnits;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.watch.WatchDay;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.core.watch.WatchState;
import org.slackwater.query.QueryException;
import org.slackwater.query.QueryPrinter;
import org.slackwater.query.ast.AllOf;
import org.slackwater.query.ast.AnyOf;
import org.slackwater.query.ast.ComparisonCondition;
import org.slackwater.query.ast.Condition;
import org.slackwater.query.ast.Duration;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.Not;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.Threshold;
import org.slackwater.query.ast.ThresholdCondition;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.WatchRule;
import org.slackwater.query.ast.WatchSeries;

/**
 * Evaluates a watch day by day. Every series of the watch is computed daily over the whole record
 * of its variable up to the last evaluated day (so windows, persistence and the day before the
 * first evaluated day are known, and a day's state depends only on the data, not on when it was
 * evaluated); then:
 *
 * <ul>
 *   <li><b>windows</b> ({@code over 30 days}): the series' statistic over the last n days, the day
 *       included: a sum is the total over the window (every day needed, units times day); a mean,
 *       minimum, maximum or percentile uses the days with a value and needs at least half of them;
 *   <li><b>thresholds</b> are converted to the series' unit ({@code above}: greater than, {@code at
 *       least}: greater or equal ...); anomaly thresholds convert as differences (no offset);
 *   <li><b>comparisons</b> against a baseline (default: the variable's complete years) use the
 *       day-of-year climatology pooled over +/-{@value Climatology#DEFAULT_DAY_WINDOW} days of the
 *       windowed series;
 *   <li><b>persistence</b> ({@code for 3 days}): the condition on each of the last n days;
 *   <li><b>logic</b> is three-valued (Kleene): a condition on a day without data is unknown, {@code
 *       not} unknown is unknown, and a rule holds only when its condition is true, so missing data
 *       never raise a watch and never hold one up through {@code not}.
 * </ul>
 *
 * The level of a day is the highest severity among the rules holding (notice 1, warning 2, alert
 * 3); its {@link WatchState} follows from that level and the level of the day before.
 */
final class WatchEvaluator {
  private static final byte FALSE = 0, TRUE = 1, UNKNOWN = 2;

  /** A daily series on the evaluation's day axis. */
  private record Series(double[] value, String unit, CubeEntry cube) {}

  private final Watch watch;
  private final SeriesPlanner planner;
  private final ChunkSource cache;
  private final LocalDate start;
  private final int days;
  private final Map<String, Series> series = new LinkedHashMap<>();
  private final Map<String, double[]> shown = new LinkedHashMap<>();

  private WatchEvaluator(Watch watch, SeriesPlanner planner, ChunkSource cache, LocalDate start, LocalDate end) {
    this.watch = watch;
    this.planner = planner;
    this.cache = cache;
    this.start = start;
    this.days = (int) ChronoUnit.DAYS.between(start, end) + 1;
  }

  /**
   * The watch over {@code [from, to]}, clipped to the days every variable of the watch has data
   * for (a warning says so).
   *
   * @throws QueryException when the range holds no day with data for all variables
   */
  /** The first and last day every variable of the watch has data for (first after last if none). */
  static LocalDate[] span(Watch w, SeriesPlanner planner) {
    LocalDate first = LocalDate.MIN, last = LocalDate.MAX;
    for (WatchSeries s : seriesOf(w)) {
      TimeAxis t = planner.cube(s.variable()).descriptor().time();
      first = max(first, t.date(0));
      last = min(last, t.date(t.size() - 1));
    }
    return new LocalDate[] {first, last};
  }

  static WatchRun evaluate(Watch w, String text, SeriesPlanner planner, ChunkSource cache, LocalDate from, LocalDate to) throws IOException {
    List<String> warnings = new ArrayList<>();
    LocalDate[] span = span(w, planner);
    LocalDate first = span[0], last = span[1], earliest = LocalDate.MAX;
    for (WatchSeries s : seriesOf(w)) {
      earliest = min(earliest, planner.cube(s.variable()).descriptor().time().date(0));
    }
    LocalDate a = max(from, first), b = min(to, last);
    if (a.isAfter(b)) {
      throw QueryException.at(w, text, "the watch's variables have data together from " + first + " to " + last
          + ", which misses " + from + " to " + to, "evaluate within " + first + " to " + last);
    }
    if (!a.equals(from) || !b.equals(to)) {
      warnings.add("evaluated from " + a + " to " + b + ", the days with data for every variable of the watch");
    }
    // Series run to the end of the common data, not to 'to': a baseline (and the climatology built
    // from it) must not depend on which days are asked for.
    WatchEvaluator e = new WatchEvaluator(w, planner, cache, earliest, last);
    return e.run(text, a, b, warnings);
  }

  private WatchRun run(String text, LocalDate from, LocalDate to, List<String> warnings) throws IOException {
    List<byte[]> rules = new ArrayList<>();
    for (WatchRule r : watch.rules()) {
      rules.add(truth(r.condition()));
    }
    int[] severity = watch.rules().stream().mapToInt(r -> r.severity().ordinal() + 1).toArray();
    int i0 = index(from), i1 = index(to);
    List<WatchDay> out = new ArrayList<>();
    int previous = i0 > 0 ? level(rules, severity, i0 - 1) : 0;
    int unknownDays = 0;
    for (int i = i0; i <= i1; i++) {
      int level = level(rules, severity, i);
      List<Integer> holding = new ArrayList<>();
      boolean unknown = false;
      for (int r = 0; r < rules.size(); r++) {
        if (rules.get(r)[i] == TRUE) {
          holding.add(r + 1);
        }
        unknown |= rules.get(r)[i] == UNKNOWN;
      }
      unknownDays += unknown && level == 0 ? 1 : 0;
      Map<String, Double> values = new LinkedHashMap<>();
      for (Map.Entry<String, double[]> s : shown.entrySet()) {
        values.put(s.getKey(), s.getValue()[i]);
      }
      out.add(new WatchDay(start.plusDays(i), level, WatchState.of(previous, level), holding, values));
      previous = level;
    }
    if (unknownDays > 0) {
      warnings.add(unknownDays + " of " + (i1 - i0 + 1) + " days had no data for at least one condition and raised nothing");
    }
    return new WatchRun(watch.name(), text, from, to, List.copyOf(shown.keySet()), out, warnings);
  }

  private static int level(List<byte[]> rules, int[] severity, int i) {
    int level = 0;
    for (int r = 0; r < rules.size(); r++) {
      if (rules.get(r)[i] == TRUE) {
        level = Math.max(level, severity[r]);
      }
    }
    return level;
  }

  private byte[] truth(Condition c) throws IOException {
    if (c instanceof AnyOf any) {
      byte[] out = filled(FALSE);
      for (Condition o : any.operands()) {
        byte[] t = truth(o);
        for (int i = 0; i < days; i++) {
          out[i] = out[i] == TRUE || t[i] == TRUE ? TRUE : out[i] == UNKNOWN || t[i] == UNKNOWN ? UNKNOWN : FALSE;
        }
      }
      return out;
    }
    if (c instanceof AllOf all) {
      byte[] out = filled(TRUE);
      for (Condition o : all.operands()) {
        byte[] t = truth(o);
        for (int i = 0; i < days; i++) {
          out[i] = out[i] == FALSE || t[i] == FALSE ? FALSE : out[i] == UNKNOWN || t[i] == UNKNOWN ? UNKNOWN : TRUE;
        }
      }
      return out;
    }
    if (c instanceof Not n) {
      byte[] t = truth(n.operand());
      byte[] out = new byte[days];
      for (int i = 0; i < days; i++) {
        out[i] = t[i] == UNKNOWN ? UNKNOWN : t[i] == TRUE ? FALSE : TRUE;
      }
      return out;
    }
    if (c instanceof ThresholdCondition t) {
      Series s = series(t.series());
      double limit = limit(t.threshold(), s.unit(), false);
      shown.put(label(t.series(), s.unit()), s.value());
      return persist(compare(s.value(), t.threshold(), limit), t.persistence());
    }
    ComparisonCondition cc = (ComparisonCondition) c;
    Series s = series(cc.series());
    double[] q = compared(cc, s);
    String kind = switch (cc.kind()) {
      case ANOMALY -> "anomaly of ";
      case STANDARDIZED_ANOMALY -> "standardized anomaly of ";
      case PERCENTILE_RANK -> "percentile of ";
    };
    String unit = switch (cc.kind()) {
      case ANOMALY -> s.unit();
      case STANDARDIZED_ANOMALY -> "1";
      case PERCENTILE_RANK -> "%";
    };
    shown.put(kind + label(cc.series(), unit), q);
    double limit = limit(cc.threshold(), s.unit(), cc.kind() == org.slackwater.query.ast.ComparisonKind.ANOMALY);
    return persist(compare(q, cc.threshold(), limit), cc.persistence());
  }

  /** The compared quantity of a baseline comparison, day by day. */
  private double[] compared(ComparisonCondition cc, Series s) {
    TimeAxis time = s.cube().descriptor().time();
    int[] steps = planner.baselineRange(time, cc.baseline(), cc, s.cube().name());
    LocalDate b0 = time.date(steps[0]), b1 = time.date(steps[1] - 1);
    int j0 = Math.max(0, index(b0)), j1 = Math.min(days - 1, index(b1));
    int n = Math.max(0, j1 - j0 + 1);
    LocalDate[] dates = new LocalDate[n];
    double[] v = new double[n], frac = new double[n], cells = new double[n];
    int[] with = new int[n], expected = new int[n];
    for (int k = 0; k < n; k++) {
      dates[k] = start.plusDays(j0 + k);
      v[k] = s.value()[j0 + k];
      expected[k] = 1;
      with[k] = Double.isNaN(v[k]) ? 0 : 1;
      frac[k] = with[k];
      cells[k] = with[k];
    }
    Climatology clim = Climatology.of(new StepSeries(TemporalStep.DAY, dates, v, frac, cells, with, expected), Climatology.DEFAULT_DAY_WINDOW);
    double[] q = new double[days];
    for (int i = 0; i < days; i++) {
      double x = s.value()[i];
      LocalDate d = start.plusDays(i);
      q[i] = Double.isNaN(x) ? Double.NaN : switch (cc.kind()) {
        case ANOMALY -> clim.anomaly(d, x);
        case STANDARDIZED_ANOMALY -> clim.standardizedAnomaly(d, x);
        case PERCENTILE_RANK -> clim.percentileRank(d, x);
      };
    }
    return q;
  }

  private Series series(WatchSeries s) throws IOException {
    String key = SeriesPlanner.statName(s.statistic()) + "|" + s.variable().name() + "|" + QueryPrinter.print(s.region().orElse(watch.region()))
        + "|" + s.window().map(d -> d.amount() + " " + d.unit()).orElse("");
    Series known = series.get(key);
    if (known != null) {
      return known;
    }
    CubeEntry cube = planner.cube(s.variable());
    LocalDate end = start.plusDays(days - 1);
    TimeAxis t = cube.descriptor().time();
    LocalDate first = t.date(0);
    Period all = new Period(day(first, s), day(end, s), s.position());
    SeriesPlan plan = planner.plan(s.statistic(), s.variable(), s.region().orElse(watch.region()), all, StepKind.DAY, Optional.empty(),
        SeriesPlanner.DEFAULT_COVERAGE_PERCENT);
    StepSeries daily = plan.compute(cache);
    double[] v = new double[days];
    Arrays.fill(v, Double.NaN);
    for (int k = 0; k < daily.size(); k++) {
      int i = index(daily.start()[k]);
      if (i >= 0 && i < days) {
        v[i] = daily.value()[k];
      }
    }
    String unit = plan.unit();
    if (s.window().isPresent()) {
      int n = days(s.window().get());
      SpatialStatistic stat = SeriesPlanner.statistic(s.statistic());
      double factor = 1;
      if (stat.kind() == SpatialStatistic.Kind.SUM) {
        IntegralUnits total = IntegralUnits.times(unit, "day");
        unit = total.unit();
        factor = total.factor();
      }
      v = window(v, n, stat, factor);
    }
    Series out = new Series(v, unit, cube);
    series.put(key, out);
    return out;
  }

  /** The statistic over the last {@code n} days, the day included. */
  private static double[] window(double[] v, int n, SpatialStatistic stat, double factor) {
    double[] out = new double[v.length];
    Arrays.fill(out, Double.NaN);
    double[] buf = new double[n];
    for (int i = n - 1; i < v.length; i++) {
      int k = 0;
      for (int j = i - n + 1; j <= i; j++) {
        if (!Double.isNaN(v[j])) {
          buf[k++] = v[j];
        }
      }
      if (stat.kind() == SpatialStatistic.Kind.SUM) {
        if (k == n) {
          double sum = 0;
          for (int j = 0; j < k; j++) {
            sum += buf[j];
          }
          out[i] = sum * factor;
        }
        continue;
      }
      if (2 * k < n || k == 0) {
        continue;
      }
      double[] x = Arrays.copyOf(buf, k);
      out[i] = switch (stat.kind()) {
        case MEAN -> Arrays.stream(x).average().getAsDouble();
        case MIN -> Arrays.stream(x).min().getAsDouble();
        case MAX -> Arrays.stream(x).max().getAsDouble();
        default -> {
          Arrays.sort(x);
          int rank = (int) Math.ceil(stat.percentile() / 100.0 * k - 1e-9);
          yield x[Math.max(0, Math.min(k - 1, rank - 1))];
        }
      };
    }
    return out;
  }

  private double limit(Threshold th, String seriesUnit, boolean difference) {
    if (th.unit().isEmpty()) {
      return th.value();
    }
    UnitConversion c;
    try {
      c = UnitConversion.between(th.unit().get().unit(), seriesUnit);
    } catch (UnitConversion.UnitMismatchException e) {
      throw QueryException.at(th.unit().get(), planner.source(), "the threshold's unit does not fit the data: " + e.getMessage(),
          "the data are in '" + seriesUnit + "'");
    }
    return difference ? c.applyToDifference(th.value()) : c.apply(th.value());
  }

  private byte[] compare(double[] v, Threshold th, double limit) {
    byte[] out = new byte[days];
    for (int i = 0; i < days; i++) {
      double x = v[i];
      out[i] = Double.isNaN(x) ? UNKNOWN : switch (th.operator()) {
        case ABOVE -> x > limit ? TRUE : FALSE;
        case BELOW -> x < limit ? TRUE : FALSE;
        case AT_LEAST -> x >= limit ? TRUE : FALSE;
        case AT_MOST -> x <= limit ? TRUE : FALSE;
      };
    }
    return out;
  }

  /** True on a day when true on it and the n - 1 days before; false if any of them is false. */
  private byte[] persist(byte[] t, Optional<Duration> persistence) {
    if (persistence.isEmpty()) {
      return t;
    }
    int n = days(persistence.get());
    byte[] out = new byte[days];
    for (int i = 0; i < days; i++) {
      if (i < n - 1) {
        out[i] = UNKNOWN;
        continue;
      }
      byte r = TRUE;
      for (int j = i - n + 1; j <= i; j++) {
        if (t[j] == FALSE) {
          r = FALSE;
          break;
        }
        if (t[j] == UNKNOWN) {
          r = UNKNOWN;
        }
      }
      out[i] = r;
    }
    return out;
  }

  private int days(Duration d) {
    if (d.unit() == DurationUnit.DAY) {
      return d.amount();
    }
    if (d.unit() == DurationUnit.WEEK) {
      return 7 * d.amount();
    }
    throw QueryException.at(d, planner.source(), "watch windows and persistence are whole days or weeks", "write e.g. 'over 30 days' or 'for 2 weeks'");
  }

  private String label(WatchSeries s, String unit) {
    String region = s.region().map(r -> " over " + QueryPrinter.print(r)).orElse("");
    String window = s.window().map(d -> " over " + d.amount() + " " + d.unit().name().toLowerCase(java.util.Locale.ROOT) + (d.amount() == 1 ? "" : "s")).orElse("");
    return SeriesPlanner.statName(s.statistic()) + " " + s.variable().name() + region + window + " [" + unit + "]";
  }

  private static List<WatchSeries> seriesOf(Watch w) {
    List<WatchSeries> out = new ArrayList<>();
    for (WatchRule r : w.rules()) {
      collect(r.condition(), out);
    }
    return out;
  }

  private static void collect(Condition c, List<WatchSeries> out) {
    if (c instanceof AnyOf a) {
      a.operands().forEach(o -> collect(o, out));
    } else if (c instanceof AllOf a) {
      a.operands().forEach(o -> collect(o, out));
    } else if (c instanceof Not n) {
      collect(n.operand(), out);
    } else if (c instanceof ThresholdCondition t) {
      out.add(t.series());
    } else {
      out.add(((ComparisonCondition) c).series());
    }
  }

  private byte[] filled(byte b) {
    byte[] out = new byte[days];
    Arrays.fill(out, b);
    return out;
  }

  private int index(LocalDate d) {
    return (int) ChronoUnit.DAYS.between(start, d);
  }

  private static PartialDate day(LocalDate d, WatchSeries s) {
    return PartialDate.ofDay(d.getYear(), d.getMonthValue(), d.getDayOfMonth(), s.position());
  }

  private static LocalDate max(LocalDate a, LocalDate b) {
    return a.isAfter(b) ? a : b;
  }

  private static LocalDate min(LocalDate a, LocalDate b) {
    return a.isBefore(b) ? a : b;
  }
}
