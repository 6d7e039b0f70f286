package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * Missing-days rules for periods built from daily values. The cases follow the "3/5 rule" as
 * WMO practice for monthly normals states it (WMO/TD-No. 341, 1989, "Calculation of monthly and
 * annual 30-year standard normals", as quoted in WMO-derived guidance): a monthly mean is not
 * computed when more than 5 daily values in all, or more than 3 consecutive daily values, are
 * missing; totals such as precipitation allow no missing day.
 */
class GapRuleTest {
  private static final GapRule THREE_FIVE = GapRule.atMost(5, OptionalInt.of(3));

  /** July 2014, 31 days of value 10 + day index, with the given days (1-based) missing. */
  private static DailySeries july(int... missingDays) {
    int n = 31;
    long[] secs = new long[n];
    double[] v = new double[n], frac = new double[n];
    int[] cells = new int[n];
    for (int d = 0; d < n; d++) {
      secs[d] = LocalDate.of(2014, 7, d + 1).toEpochDay() * 86_400L;
      v[d] = 10 + d;
      frac[d] = 1;
      cells[d] = 1;
    }
    for (int d : missingDays) {
      v[d - 1] = Double.NaN;
      frac[d - 1] = 0;
      cells[d - 1] = 0;
    }
    return new DailySeries(secs, v, frac, cells);
  }

  private static double monthly(DailySeries s, SpatialStatistic stat, GapRule rule) {
    StepSeries m = TemporalAggregation.aggregate(s, TemporalStep.MONTH, stat, rule);
    assertEquals(1, m.value().length);
    return m.value()[0];
  }

  @Test
  void fiveScatteredMissingDaysKeepTheMonthlyMeanSixDoNot() {
    double mean = monthly(july(2, 9, 15, 22, 30), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE);
    double expected = Arrays.stream(july(2, 9, 15, 22, 30).value()).filter(x -> !Double.isNaN(x)).average().getAsDouble();
    assertEquals(expected, mean, 1e-12);
    assertTrue(Double.isNaN(monthly(july(2, 9, 15, 22, 30, 31), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE)));
  }

  @Test
  void fourConsecutiveMissingDaysDropTheMonthThreeDoNot() {
    assertFalse(Double.isNaN(monthly(july(10, 11, 12), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE)));
    assertTrue(Double.isNaN(monthly(july(10, 11, 12, 13), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE)));
    // two runs of three are five in all... plus one: six in all is over the total
    assertTrue(Double.isNaN(monthly(july(1, 2, 3, 20, 21, 22), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE)));
  }

  @Test
  void aTotalNeedsEveryDayByDefaultAndIsScaledWhenGapsAreAllowed() {
    assertTrue(Double.isNaN(monthly(july(17), SpatialStatistic.of(SpatialStatistic.Kind.SUM), GapRule.defaultFor(SpatialStatistic.of(SpatialStatistic.Kind.SUM)))));
    double full = monthly(july(), SpatialStatistic.of(SpatialStatistic.Kind.SUM), GapRule.defaultFor(SpatialStatistic.of(SpatialStatistic.Kind.SUM)));
    assertEquals(31 * 10 + 30 * 31 / 2.0, full, 1e-9); // 10 + 11 + ... + 40
    // one day (value 26) missing: mean of the other 30 days times 31
    double scaled = monthly(july(17), SpatialStatistic.of(SpatialStatistic.Kind.SUM), GapRule.atMost(2, OptionalInt.empty()));
    assertEquals((full - 26) / 30 * 31, scaled, 1e-9);
  }

  @Test
  void aMeanNeedsOneValueByDefault() {
    int[] all = new int[31];
    for (int d = 0; d < 31; d++) {
      all[d] = d + 1;
    }
    int[] allButOne = Arrays.copyOf(all, 30);
    assertEquals(40, monthly(july(allButOne), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), GapRule.ONE_VALUE), 0);
    assertTrue(Double.isNaN(monthly(july(all), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), GapRule.ONE_VALUE)));
    assertTrue(Double.isNaN(monthly(july(allButOne), SpatialStatistic.of(SpatialStatistic.Kind.MEAN), THREE_FIVE)));
  }

  @Test
  void rulesDescribeThemselves() {
    assertEquals("a month is missing when more than 5 of its days are missing or more than 3 consecutive days are missing",
        THREE_FIVE.describe("month"));
  }
}
