package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.IntegralUnits;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationResult;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.Coverage;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.Node;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.SeriesTerm;
import org.slackwater.query.ast.StepKind;

/**
 * The statements that explain an event by its drivers: lagged correlation, driver ranking and
 * windows before events. Each is analysed into a plan (all names, regions, dates, lags checked)
 * and executed later; the computations are {@link CorrelationTables} and {@link EventWindows}.
 *
 * <p>Significance level: 0.05, two-sided. Lags are given in time units and must be whole steps
 * of the series (3 weeks on a weekly series, 21 days on a daily one).
 */
final class DriverStatements {
  static final double ALPHA = 0.05;

  private DriverStatements() {}

  record CorrelationPlan(Correlation query, SeriesPlan target, SeriesPlan driver, CorrelationSettings settings,
      Optional<Deseasonalize> deseasonalize) {}

  record RankingPlan(DriverRanking query, SeriesPlan target, List<SeriesPlan> drivers, List<SeriesTerm> terms,
      CorrelationSettings settings, Deseasonalize deseasonalize) {}

  record WindowPlan(EventWindow query, List<LocalDate> events, int days, List<EventWindows.Driver> drivers, int firstYear, int lastYear) {}

  static CorrelationPlan analyze(Correlation q, SeriesPlanner planner) {
    double cov = coverage(q.coverage());
    SeriesPlan target = planner.withGaps(planner.plan(q.series().statistic(), q.series().variable(), q.series().regionOr(q.region()), q.period(), q.step().kind(), Optional.empty(), cov), q.gaps());
    SeriesPlan driver = planner.withGaps(planner.plan(q.driver().statistic(), q.driver().variable(), q.driver().regionOr(q.region()), q.period(), q.step().kind(), Optional.empty(), cov), q.gaps());
    CorrelationSettings settings = settings(q.lags(), q.method(), target.step(), planner.source(), q);
    Optional<Deseasonalize> ds = q.deseasonalized().map(d -> baseline(Deseasonalize.anomalies(), d.baseline()));
    return new CorrelationPlan(q, target, driver, settings, ds);
  }

  static ResultTable execute(CorrelationPlan p, ChunkSource cache, String source) throws IOException {
    DatedSeries t = CorrelationTables.prepared(p.target(), cache, p.deseasonalize());
    DatedSeries d = CorrelationTables.prepared(p.driver(), cache, p.deseasonalize());
    CorrelationResult res = correlate(t, d, p.settings(), p.query().lags().map(l -> (Node) l).orElse(p.query()), source);
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("target", p.target().statName() + " " + p.target().cube().name() + " [" + p.target().unit() + "] over " + p.target().regionLabel());
    meta.put("driver", p.driver().statName() + " " + p.driver().cube().name() + " [" + p.driver().unit() + "] over " + p.driver().regionLabel());
    meta.put("deseasonalized", p.deseasonalize().isPresent() ? "yes (anomalies from a climatology by period of year)" : "no");
    List<String> warnings = new ArrayList<>(p.target().warnings());
    warnings.addAll(p.driver().warnings());
    String title = "correlation of " + p.target().statName() + " " + p.target().cube().name() + " over " + p.target().regionLabel()
        + " with " + p.driver().statName() + " " + p.driver().cube().name() + " over " + p.driver().regionLabel()
        + ", by " + SeriesPlanner.stepName(p.target().step());
    return CorrelationTables.lags(title, res, p.target().step(), meta, warnings);
  }

  static RankingPlan analyze(DriverRanking q, SeriesPlanner planner) {
    double cov = coverage(q.coverage());
    SeriesPlan target = planner.withGaps(planner.plan(q.series().statistic(), q.series().variable(), q.series().regionOr(q.region()), q.period(), q.step().kind(), Optional.empty(), cov), q.gaps());
    List<SeriesPlan> drivers = new ArrayList<>();
    for (SeriesTerm term : q.drivers()) {
      drivers.add(planner.withGaps(planner.plan(term.statistic(), term.variable(), term.regionOr(q.region()), q.period(), q.step().kind(), Optional.empty(), cov), q.gaps()));
    }
    CorrelationSettings settings = settings(q.lags(), q.method(), target.step(), planner.source(), q);
    return new RankingPlan(q, target, drivers, q.drivers(), settings, baseline(Deseasonalize.anomalies(), q.baseline()));
  }

  static ResultTable execute(RankingPlan p, ChunkSource cache, String source) throws IOException {
    DatedSeries t = CorrelationTables.prepared(p.target(), cache, Optional.of(p.deseasonalize()));
    List<CorrelationTables.Ranked> ranked = new ArrayList<>();
    List<String> warnings = new ArrayList<>(p.target().warnings());
    for (int i = 0; i < p.drivers().size(); i++) {
      SeriesPlan dp = p.drivers().get(i);
      DatedSeries d = CorrelationTables.prepared(dp, cache, Optional.of(p.deseasonalize()));
      Node at = p.terms().get(i);
      ranked.add(new CorrelationTables.Ranked(dp.cube().name(), dp.regionLabel(), dp.statName(), correlate(t, d, p.settings(), at, source)));
      warnings.addAll(dp.warnings());
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("target", p.target().statName() + " " + p.target().cube().name());
    meta.put("region", p.target().regionLabel());
    meta.put("lags", p.settings().minLag() + " to " + p.settings().maxLag() + " step " + p.settings().lagStep());
    meta.put("method", p.settings().method().name().toLowerCase(Locale.ROOT));
    String title = "drivers of " + p.target().statName() + " " + p.target().cube().name() + " over " + p.target().regionLabel()
        + ", by " + SeriesPlanner.stepName(p.target().step());
    return CorrelationTables.ranking(title, ranked, p.target().step(), meta, warnings);
  }

  static WindowPlan analyze(EventWindow q, SeriesPlanner planner) {
    int days = switch (q.length().unit()) {
      case DAY -> q.length().amount();
      case WEEK -> 7 * q.length().amount();
      default -> throw QueryException.at(q.length(), planner.source(), "a window before an event is given in days or weeks",
          "e.g. 'window 60 days before ...'");
    };
    List<LocalDate> events = q.events().stream().map(PartialDate::first).toList();
    double cov = coverage(q.coverage());
    List<EventWindows.Driver> drivers = new ArrayList<>();
    int first = Integer.MIN_VALUE, last = Integer.MAX_VALUE;
    for (SeriesTerm term : q.drivers()) {
      TimeAxis time = planner.cube(term.variable()).descriptor().time();
      LocalDate a = time.date(0), b = time.date(time.size() - 1);
      for (LocalDate e : events) {
        if (e.minusDays(days).isBefore(a) || e.isAfter(b.plusDays(1))) {
          throw QueryException.at(q.events().get(events.indexOf(e)), planner.source(), "the " + days + " days before " + e
              + " are not all within the " + term.variable().name() + " data", term.variable().name() + " covers " + a + " to " + b);
        }
      }
      int[] years = baselineYears(q.baseline(), a, b, term, planner.source());
      first = Math.max(first, years[0]);
      last = Math.min(last, years[1]);
      Period span = new Period(PartialDate.ofYear(a.getYear(), q.position()), PartialDate.ofYear(b.getYear(), q.position()), q.position());
      SeriesPlan daily = planner.plan(term.statistic(), term.variable(), term.regionOr(q.region()), span, StepKind.DAY, Optional.empty(), cov);
      boolean total = daily.stat().kind() == SpatialStatistic.Kind.SUM;
      String unit = total ? IntegralUnits.times(daily.unit(), "day").unit() : daily.unit();
      drivers.add(new EventWindows.Driver(daily.cube().name(), daily.regionLabel(), daily.statName(), unit, daily, total));
    }
    if (last - first < 1) {
      throw QueryException.at(q, planner.source(), "the drivers' data share fewer than two baseline years",
          "give a baseline with 'against <from> to <to>' that all drivers cover");
    }
    return new WindowPlan(q, events, days, drivers, first, last);
  }

  static ResultTable execute(WindowPlan p, ChunkSource cache, String source) throws IOException {
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    List<String> warnings = new ArrayList<>();
    for (EventWindows.Driver d : p.drivers()) {
      warnings.addAll(d.daily().warnings().stream().filter(w -> !w.startsWith("the period was clipped")).toList());
    }
    return EventWindows.compute(p.events(), p.days(), p.drivers(), p.firstYear(), p.lastYear(), cache, meta, warnings);
  }

  /** Complete calendar years of the baseline (as given, which must lie within the data) or of the data. */
  private static int[] baselineYears(Optional<Period> baseline, LocalDate a, LocalDate b, SeriesTerm term, String source) {
    if (baseline.isPresent()) {
      Period p = baseline.get();
      if (p.start().isBefore(a) || p.endInclusive().isAfter(b)) {
        throw QueryException.at(p, source, "the baseline " + p.start() + " to " + p.endInclusive() + " reaches outside the "
            + term.variable().name() + " data", term.variable().name() + " covers " + a + " to " + b);
      }
      return new int[] {p.start().getYear(), p.endInclusive().getYear()};
    }
    int y0 = a.getDayOfYear() == 1 ? a.getYear() : a.getYear() + 1;
    int y1 = b.getMonthValue() == 12 && b.getDayOfMonth() == 31 ? b.getYear() : b.getYear() - 1;
    return new int[] {y0, y1};
  }

  private static CorrelationResult correlate(DatedSeries t, DatedSeries d, CorrelationSettings s, Node at, String source) {
    try {
      return CorrelationTables.correlate(t, d, s);
    } catch (CorrelationInputException e) {
      throw QueryException.at(at, source, e.getMessage(), e.kind() == CorrelationInputException.Kind.LAG_RANGE_TOO_LONG
          ? "use a shorter lag range or a longer period" : "");
    }
  }

  private static Deseasonalize baseline(Deseasonalize d, Optional<Period> baseline) {
    return baseline.map(b -> d.withBaseline(b.start(), b.endInclusive())).orElse(d);
  }

  private static double coverage(Optional<Coverage> c) {
    return c.map(Coverage::percent).orElse(SeriesPlanner.DEFAULT_COVERAGE_PERCENT);
  }

  private static CorrelationSettings settings(Optional<LagRange> lags, org.slackwater.query.ast.CorrelationMethod method,
      TemporalStep step, String source, Node statement) {
    CorrelationMethod m = method == org.slackwater.query.ast.CorrelationMethod.SPEARMAN ? CorrelationMethod.SPEARMAN : CorrelationMethod.PEARSON;
    if (lags.isEmpty()) {
      return CorrelationSettings.of(m, 0, 0, 1, ALPHA);
    }
    LagRange l = lags.get();
    return CorrelationSettings.of(m, inSteps(l.first(), l.unit(), step, l, source), inSteps(l.last(), l.unit(), step, l, source),
        Math.max(1, inSteps(l.step(), l.unit(), step, l, source)), ALPHA);
  }

  /** A lag of {@code amount} time units in steps of a series by {@code step}; it must be whole steps. */
  static int inSteps(int amount, DurationUnit unit, TemporalStep step, Node at, String source) {
    int per = stepsPer(unit, step, at, source);
    if (per > 0) {
      return amount * per;
    }
    if (amount % -per != 0) {
      throw QueryException.at(at, source, "lags must be whole " + SeriesPlanner.stepName(step) + "s of the series",
          "on a " + SeriesPlanner.stepName(step) + "ly series give lags in " + SeriesPlanner.stepName(step) + "s");
    }
    return amount / -per;
  }

  /** Series steps per lag unit (positive), or minus the lag units per step when a step holds several (days on a weekly series). */
  private static int stepsPer(DurationUnit unit, TemporalStep step, Node at, String source) {
    int r = switch (step) {
      case DAY -> unit == DurationUnit.DAY ? 1 : unit == DurationUnit.WEEK ? 7 : 0;
      case WEEK -> unit == DurationUnit.WEEK ? 1 : unit == DurationUnit.DAY ? -7 : 0;
      case MONTH -> unit == DurationUnit.MONTH ? 1 : unit == DurationUnit.SEASON ? 3 : unit == DurationUnit.YEAR ? 12 : 0;
      case SEASON -> unit == DurationUnit.SEASON ? 1 : unit == DurationUnit.YEAR ? 4 : 0;
      case YEAR, WATER_YEAR -> unit == DurationUnit.YEAR ? 1 : 0;
    };
    if (r == 0) {
      throw QueryException.at(at, source, "lags in " + unit.name().toLowerCase(Locale.ROOT) + "s do not fit a series by "
          + SeriesPlanner.stepName(step), "lags must be whole steps of the series");
    }
    return r;
  }
}
