package org.slackwater.core.analytics.correlation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.slackwater.core.analytics.TemporalStep;

/** The lag convention and date pairing, checked on dates written out by hand. */
class AlignmentTest {

  @Test
  void positiveLagPairsTheEarlierDriverWithTheLaterTarget() {
    // Convention of the brief: lag k pairs driver(d - k) with target(d); positive = driver leads.
    DatedSeries target = Fixtures.monthly(LocalDate.of(2010, 1, 1), new double[] {10, 11, 12, 13});
    DatedSeries driver = Fixtures.monthly(LocalDate.of(2009, 11, 1), new double[] {1, 2, 3, 4, 5, 6});
    LaggedPairs pairs = Alignment.pairsAt(target, driver, 2);
    // By hand: target 2010-01 pairs with driver 2009-11 (= 1), 2010-02 with 2009-12 (= 2), ...
    assertArrayEquals(new LocalDate[] {LocalDate.of(2010, 1, 1), LocalDate.of(2010, 2, 1), LocalDate.of(2010, 3, 1),
        LocalDate.of(2010, 4, 1)}, pairs.targetDates());
    assertArrayEquals(new LocalDate[] {LocalDate.of(2009, 11, 1), LocalDate.of(2009, 12, 1), LocalDate.of(2010, 1, 1),
        LocalDate.of(2010, 2, 1)}, pairs.driverDates());
    assertArrayEquals(new double[] {1, 2, 3, 4}, pairs.driver());
    assertArrayEquals(new double[] {10, 11, 12, 13}, pairs.target());
    // Negative lag: target leads; target 2010-01 pairs with driver 2010-02 (= 4).
    LaggedPairs back = Alignment.pairsAt(target, driver, -1);
    assertArrayEquals(new double[] {4, 5, 6}, back.driver());
    assertArrayEquals(new double[] {10, 11, 12}, back.target());
  }

  @Test
  void monthsAreCalendarStepsAndGapsStayGaps() {
    // A monthly driver lacking 2010-03: the target of 2010-04 at lag 1 has no partner instead of
    // borrowing 2010-02 (pairing by date, not by position in the array).
    DatedSeries target = Fixtures.monthly(LocalDate.of(2010, 2, 1), new double[] {1, 2, 3, 4});
    DatedSeries driver = new DatedSeries(TemporalStep.MONTH,
        new LocalDate[] {LocalDate.of(2010, 1, 1), LocalDate.of(2010, 2, 1), LocalDate.of(2010, 4, 1)},
        new double[] {100, 200, 400});
    LaggedPairs pairs = Alignment.pairsAt(target, driver, 1);
    assertArrayEquals(new double[] {100, 200, 400}, pairs.driver());
    assertArrayEquals(new double[] {1, 2, 4}, pairs.target());
    assertArrayEquals(new LocalDate[] {LocalDate.of(2010, 2, 1), LocalDate.of(2010, 3, 1), LocalDate.of(2010, 5, 1)},
        pairs.targetDates());
  }

  @Test
  void missingValuesDropThePair() {
    DatedSeries target = Fixtures.daily(LocalDate.of(2012, 2, 27), new double[] {1, Double.NaN, 3, 4});
    DatedSeries driver = Fixtures.daily(LocalDate.of(2012, 2, 27), new double[] {5, 6, 7, Double.NaN});
    LaggedPairs pairs = Alignment.pairsAt(target, driver, 0);
    assertArrayEquals(new double[] {1, 3}, pairs.target());
    // Daily steps run through 29 February 2012: index 2 is 2012-02-29.
    assertEquals(LocalDate.of(2012, 2, 29), pairs.targetDates()[1]);
  }

  @Test
  void weeksAreIsoWeeksStartingOnMonday() {
    LocalDate monday = LocalDate.of(2015, 12, 28); // a Monday (ISO 2015-W53)
    DatedSeries target = new DatedSeries(TemporalStep.WEEK,
        new LocalDate[] {monday, monday.plusWeeks(1), monday.plusWeeks(2)}, new double[] {1, 2, 3});
    LaggedPairs pairs = Alignment.pairsAt(target, target, 1);
    assertArrayEquals(new LocalDate[] {monday.plusWeeks(1), monday.plusWeeks(2)}, pairs.targetDates());
    assertArrayEquals(new double[] {1, 2}, pairs.driver());
  }

  @Test
  void differentStepsAreRefused() {
    DatedSeries monthly = Fixtures.monthly(LocalDate.of(2010, 1, 1), new double[] {1, 2, 3});
    DatedSeries daily = Fixtures.daily(LocalDate.of(2010, 1, 1), new double[] {1, 2, 3});
    CorrelationInputException e = assertThrows(CorrelationInputException.class, () -> Alignment.align(monthly, daily));
    assertEquals(CorrelationInputException.Kind.STEP_MISMATCH, e.kind());
    assertTrue(e.getMessage().contains("monthly") && e.getMessage().contains("daily"), e.getMessage());
  }

  @Test
  void datesMustBePeriodStartsAndIncreasing() {
    CorrelationInputException mid = assertThrows(CorrelationInputException.class, () -> new DatedSeries(
        TemporalStep.MONTH, new LocalDate[] {LocalDate.of(2014, 7, 15)}, new double[] {1}));
    assertEquals(CorrelationInputException.Kind.BAD_DATES, mid.kind());
    assertTrue(mid.getMessage().contains("2014-07-01"), mid.getMessage());
    CorrelationInputException order = assertThrows(CorrelationInputException.class, () -> new DatedSeries(
        TemporalStep.DAY, new LocalDate[] {LocalDate.of(2014, 7, 2), LocalDate.of(2014, 7, 2)}, new double[] {1, 2}));
    assertTrue(order.getMessage().contains("strictly increasing"), order.getMessage());
  }

  @Test
  void seriesAreCopiedInAndOut() {
    LocalDate[] dates = Fixtures.days(LocalDate.of(2020, 1, 1), 3);
    double[] values = {1, 2, 3};
    DatedSeries s = new DatedSeries(TemporalStep.DAY, dates, values);
    values[0] = 99;
    dates[0] = LocalDate.of(1999, 1, 1);
    s.values()[1] = 99;
    assertArrayEquals(new double[] {1, 2, 3}, s.values());
    assertEquals(LocalDate.of(2020, 1, 1), s.date(0));
  }
}
