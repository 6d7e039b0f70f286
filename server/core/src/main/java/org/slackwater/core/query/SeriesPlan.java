package org.slackwater.core.query;

import java.io.IOException;
import java.util.List;
import java.util.Objects;
import org.slackwater.core.analytics.AreaStatistics;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.DailySeries;
import org.slackwater.core.analytics.SpatialStatistic;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.analytics.GapRule;
import org.slackwater.core.analytics.TemporalAggregation;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.region.CellWeights;

/**
 * An analysed area series, ready to run: the cube version, the region's weights, the statistic,
 * the step, the native step range, the coverage rule and how values are scaled to the reported
 * unit. Everything a statement needs to compute its series; building blocks for area series,
 * correlations and event windows alike.
 *
 * @param from first native step (inclusive)
 * @param to last native step (exclusive)
 * @param factor integral factor applied before the unit conversion (1 unless a sum)
 * @param unit the unit values are reported in
 * @param warnings what analysis found worth telling (clipped periods ...)
 * @param areaModel the figure of the Earth cell areas are measured on, for the metadata
 * @param gaps when a period keeps a value despite native steps without one
 */
record SeriesPlan(CubeEntry cube, CellWeights weights, String regionLabel, SpatialStatistic stat, String statName,
    TemporalStep step, int from, int to, double coveragePercent, double factor, UnitConversion conversion, String unit,
    List<String> warnings, String areaModel, GapRule gaps) {

  SeriesPlan {
    Objects.requireNonNull(cube);
    Objects.requireNonNull(weights);
    Objects.requireNonNull(stat);
    Objects.requireNonNull(step);
    Objects.requireNonNull(conversion);
    Objects.requireNonNull(gaps);
    warnings = List.copyOf(warnings);
  }

  /** The same series over other native steps (e.g. a baseline). */
  SeriesPlan over(int newFrom, int newTo) {
    return new SeriesPlan(cube, weights, regionLabel, stat, statName, step, newFrom, newTo, coveragePercent, factor, conversion, unit, warnings, areaModel, gaps);
  }

  /** The same series with another missing-steps rule for its periods. */
  SeriesPlan withGaps(GapRule rule) {
    return new SeriesPlan(cube, weights, regionLabel, stat, statName, step, from, to, coveragePercent, factor, conversion, unit, warnings, areaModel, rule);
  }

  /** Computes the series; values are in {@link #unit}. */
  StepSeries compute(ChunkSource cache) throws IOException {
    DailySeries daily = AreaStatistics.compute(cache, cube, weights, stat, from, to, coveragePercent / 100.0);
    StepSeries s = TemporalAggregation.aggregate(daily, step, stat, gaps);
    double[] v = s.value().clone();
    for (int i = 0; i < v.length; i++) {
      if (!Double.isNaN(v[i])) {
        v[i] = conversion.apply(v[i] * factor);
      }
    }
    return new StepSeries(step, s.start(), v, s.validFraction(), s.meanValidCells(), s.stepsWithValue(), s.stepsExpected());
  }
}
