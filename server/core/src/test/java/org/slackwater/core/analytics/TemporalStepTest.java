package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TemporalStepTest {

  @ParameterizedTest
  @CsvSource({
    // ISO 8601 week dates: 2014-01-01 is a Wednesday in week 2014-W01; 2010-01-03 is a Sunday in 2009-W53.
    "WEEK, 2014-01-01, 2013-12-30, 2014-01-05, 2014-W01",
    "WEEK, 2010-01-03, 2009-12-28, 2010-01-03, 2009-W53",
    "MONTH, 2016-02-17, 2016-02-01, 2016-02-29, 2016-02",
    // Meteorological seasons; December belongs to the following year's winter (our documented rule).
    "SEASON, 2013-12-05, 2013-12-01, 2014-02-28, 2014-DJF",
    "SEASON, 2014-02-28, 2013-12-01, 2014-02-28, 2014-DJF",
    "SEASON, 2016-01-10, 2015-12-01, 2016-02-29, 2016-DJF",
    "SEASON, 2014-05-31, 2014-03-01, 2014-05-31, 2014-MAM",
    "SEASON, 2014-08-01, 2014-06-01, 2014-08-31, 2014-JJA",
    "SEASON, 2014-11-30, 2014-09-01, 2014-11-30, 2014-SON",
    "YEAR, 2014-07-04, 2014-01-01, 2014-12-31, 2014",
    // Water year from 1 October, named after the year it ends in.
    "WATER_YEAR, 2013-10-01, 2013-10-01, 2014-09-30, WY2014",
    "WATER_YEAR, 2014-09-30, 2013-10-01, 2014-09-30, WY2014",
    "DAY, 2014-03-09, 2014-03-09, 2014-03-09, 2014-03-09",
  })
  void periodsStartEndAndLabel(TemporalStep step, LocalDate day, LocalDate start, LocalDate end, String label) {
    assertEquals(start, step.start(day));
    assertEquals(end, step.end(step.start(day)));
    assertEquals(label, step.label(step.start(day)));
  }
}
