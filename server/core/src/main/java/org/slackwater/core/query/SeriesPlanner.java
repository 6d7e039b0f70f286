package org.slackwater.core.query;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.slackwater.core.analytics.IntegralUnits;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionException;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.Node;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.Statistic;
import org.slackwater.query.ast.StepKind;
import org.slackwater.query.ast.UnitRef;

/**
 * The semantic analysis shared by every statement that computes an area series: resolves the
 * variable, the region (and its weights on the cube's grid), the period (clipped to the data with
 * a warning, an error if wholly outside), the statistic and step, and the reported unit. Every
 * error is a {@link QueryException} at the node that caused it, with a hint.
 *
 * <p>Rules: native steps with less valid data area than the coverage threshold (default {@value
 * #DEFAULT_COVERAGE_PERCENT} %) are missing; sums are area integrals (unit x m²) and, over a step
 * longer than the native one, time integrals too (see {@link IntegralUnits}).
 */
final class SeriesPlanner {
  static final double DEFAULT_COVERAGE_PERCENT = 50;

  private final Catalog catalog;
  private final WeightsCache weights;
  private final String source;
  private final DerivedVariables derived;

  SeriesPlanner(Catalog catalog, WeightsCache weights, String source, DerivedVariables derived) {
    this.catalog = catalog;
    this.weights = weights;
    this.source = source;
    this.derived = derived;
  }

  String source() {
    return source;
  }

  SeriesPlan plan(Statistic statistic, Identifier variable, RegionRef regionRef, Period period, StepKind stepKind,
      Optional<UnitRef> unitRef, double coveragePercent) {
    CubeEntry cube = cube(variable);
    List<String> warnings = new ArrayList<>();
    OnGrid on = onGrid(cube, regionRef);
    RegionResolver.Resolved region = on.region();
    CellWeights w = on.weights();
    if (!hasData(w, cube)) {
      throw QueryException.at(regionRef, source, "no cell of " + cube.name() + " inside " + region.label()
          + " ever holds a value (all are fill values, e.g. land)", "choose a region over the data, or a finer grid");
    }
    if (w.totalArea() < 0.98 * w.regionAreaM2()) {
      warnings.add(String.format(Locale.ROOT, "only %.0f %% of %s lies on the grid of %s", 100 * w.totalArea() / w.regionAreaM2(), region.label(), cube.name()));
    }
    TimeAxis time = cube.descriptor().time();
    int[] range = stepRange(time, period, cube.name(), warnings);
    SpatialStatistic stat = statistic(statistic);
    TemporalStep step = TemporalStep.valueOf(stepKind.name());

    String unit = cube.descriptor().units();
    double factor = 1;
    if (stat.kind() == SpatialStatistic.Kind.SUM) {
      IntegralUnits area = IntegralUnits.times(unit, "m2");
      unit = area.unit();
      factor = area.factor();
      double days = nativeStepDays(time);
      if (step != TemporalStep.DAY || days != 1) {
        IntegralUnits overTime = IntegralUnits.times(unit, "day");
        unit = overTime.unit();
        factor *= overTime.factor() * days;
        warnings.add("sums integrate over each " + stepName(step) + " (value x " + fmt(days)
            + " day per step); a period with any step missing is left empty");
      }
    }
    UnitConversion conv = UnitConversion.between(unit, unit);
    if (unitRef.isPresent()) {
      String want = unitRef.get().unit();
      try {
        conv = UnitConversion.between(unit, want);
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(unitRef.get(), source, e.getMessage(), "the data are in '" + unit + "'");
      }
      unit = want;
    }
    return new SeriesPlan(cube, w, region.label(), stat, statName(statistic), step, range[0], range[1], coveragePercent, factor, conv, unit,
        warnings, weights.model() == org.slackwater.core.region.AreaModel.SPHERE ? "sphere of radius 6371000 m" : "WGS84 ellipsoid",
        org.slackwater.core.analytics.GapRule.defaultFor(stat));
  }

  /**
   * The statement's missing-days clause applied to a planned series. The clause counts days, so
   * the cube must have daily native steps.
   */
  SeriesPlan withGaps(SeriesPlan plan, java.util.Optional<org.slackwater.query.ast.GapAllowance> clause) {
    if (clause.isEmpty()) {
      return plan;
    }
    org.slackwater.query.ast.GapAllowance g = clause.get();
    double days = nativeStepDays(plan.cube().descriptor().time());
    if (Math.abs(days - 1) > 1e-9) {
      throw QueryException.at(g, source, "the missing-days rule counts days, but '" + plan.cube().name() + "' has native steps of "
          + fmt(days * 24) + " hours", "leave the clause out; the steps and steps_expected columns show how many steps had a value");
    }
    return plan.withGaps(org.slackwater.core.analytics.GapRule.atMost(g.missingDays(), g.consecutiveDays()));
  }

  /** A region resolved and weighed on a cube's grid. */
  record OnGrid(RegionResolver.Resolved region, CellWeights weights) {}

  /** Resolves a region reference and its weights on the cube's grid, with errors at the reference. */
  OnGrid onGrid(CubeEntry cube, RegionRef regionRef) {
    RegionResolver.Resolved region = new RegionResolver(catalog, source).resolve(regionRef);
    try {
      return new OnGrid(region, weights.get(cube.descriptor().grid(), region.geometry()));
    } catch (RegionException e) {
      throw QueryException.at(regionRef, source, region.label() + ": " + e.getMessage(), "");
    }
  }

  /** A stored cube, or a derived variable defined earlier in the request. */
  CubeEntry cube(Identifier variable) {
    return derived.cube(variable.name()).orElseThrow(() -> unknownVariable(catalog, variable, source));
  }

  /** Native step range of a baseline period, which must lie within the data; or the cube's complete years. */
  int[] baselineRange(TimeAxis time, Optional<Period> baseline, Node at, String cube) {
    LocalDate first = time.date(0), last = time.date(time.size() - 1);
    LocalDate start, end;
    if (baseline.isPresent()) {
      Period b = baseline.get();
      start = b.start();
      end = b.endInclusive();
      if (start.isBefore(first) || end.isAfter(last)) {
        throw QueryException.at(b, source, "the baseline " + start + " to " + end + " reaches outside the " + cube + " data",
            cube + " covers " + first + " to " + last + "; choose baseline years within it");
      }
    } else {
      int y0 = first.getDayOfYear() == 1 ? first.getYear() : first.getYear() + 1;
      int y1 = last.getMonthValue() == 12 && last.getDayOfMonth() == 31 ? last.getYear() : last.getYear() - 1;
      if (y1 < y0) {
        throw QueryException.at(at, source, "the " + cube + " data hold no complete year to use as a baseline",
            "give one with 'against <from> to <to>'");
      }
      start = LocalDate.of(y0, 1, 1);
      end = LocalDate.of(y1, 12, 31);
    }
    return new int[] {time.firstAtOrAfter(start.toEpochDay() * 86_400L), time.firstAtOrAfter(end.plusDays(1).toEpochDay() * 86_400L)};
  }

  /** The native step range of a period: clipped to the data with a warning; an error if wholly outside. */
  int[] range(TimeAxis time, Period p, String cube, List<String> warnings) {
    return stepRange(time, p, cube, warnings);
  }

  private int[] stepRange(TimeAxis time, Period p, String cube, List<String> warnings) {
    if (time.size() == 0) {
      throw QueryException.at(p, source, "the cube " + cube + " has no time steps", "");
    }
    LocalDate first = time.date(0), last = time.date(time.size() - 1);
    LocalDate start = p.start(), end = p.endInclusive();
    if (end.isBefore(first) || start.isAfter(last)) {
      throw QueryException.at(p, source, "no " + cube + " data from " + start + " to " + end, cube + " covers " + first + " to " + last);
    }
    if (start.isBefore(first) || end.isAfter(last)) {
      warnings.add("the period was clipped to the data: " + cube + " covers " + first + " to " + last);
    }
    int from = time.firstAtOrAfter(start.toEpochDay() * 86_400L);
    int to = time.firstAtOrAfter(end.plusDays(1).toEpochDay() * 86_400L);
    if (from >= to) {
      throw QueryException.at(p, source, "no " + cube + " time step falls between " + start + " and " + end, "");
    }
    return new int[] {from, to};
  }

  static SpatialStatistic statistic(Statistic s) {
    return switch (s.kind()) {
      case MEAN -> SpatialStatistic.of(SpatialStatistic.Kind.MEAN);
      case SUM -> SpatialStatistic.of(SpatialStatistic.Kind.SUM);
      case MIN -> SpatialStatistic.of(SpatialStatistic.Kind.MIN);
      case MAX -> SpatialStatistic.of(SpatialStatistic.Kind.MAX);
      case MEDIAN -> SpatialStatistic.percentile(50);
      case PERCENTILE -> SpatialStatistic.percentile(s.percentile());
    };
  }

  static String statName(Statistic s) {
    return switch (s.kind()) {
      case PERCENTILE -> "p" + fmt(s.percentile());
      default -> s.kind().name().toLowerCase(Locale.ROOT);
    };
  }

  static String stepName(TemporalStep step) {
    return step.name().toLowerCase(Locale.ROOT).replace('_', ' ');
  }

  private static boolean hasData(CellWeights w, CubeEntry cube) {
    for (int i = 0; i < w.size(); i++) {
      if (cube.footprint().contains(w.index(i))) {
        return true;
      }
    }
    return false;
  }

  /** The median spacing of the cube's steps in days (1 for daily data), robust to gaps. */
  static double nativeStepDays(TimeAxis time) {
    if (time.size() < 2) {
      return 1;
    }
    long[] d = new long[time.size() - 1];
    for (int i = 0; i < d.length; i++) {
      d[i] = time.epochSecond(i + 1) - time.epochSecond(i);
    }
    java.util.Arrays.sort(d);
    return Math.round(d[d.length / 2] / 864.0) / 100.0;
  }

  static QueryException unknownVariable(Catalog catalog, Identifier id, String source) {
    List<String> names = catalog.cubes().stream().map(CubeEntry::name).toList();
    return CatalogStatements.unknown("variable", id.name(), names, id, source);
  }

  static String fmt(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
