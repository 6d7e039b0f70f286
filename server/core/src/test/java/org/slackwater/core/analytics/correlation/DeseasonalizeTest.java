package org.slackwater.core.analytics.correlation;

import org.slackwater.core.analytics.PeriodOfYear;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.time.temporal.IsoFields;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.slackwater.core.analytics.TemporalStep;

class DeseasonalizeTest {

  @Test
  void monthlyPureCycleDeseasonalizesToZero() {
    double[] v = new double[120];
    for (int i = 0; i < v.length; i++) {
      double phase = 2 * Math.PI * (i % 12) / 12;
      v[i] = 12 + 4 * Math.sin(phase) + 1.5 * Math.cos(2 * phase);
    }
    DatedSeries anomalies = Deseasonalize.anomalies().apply(Fixtures.monthly(LocalDate.of(2001, 1, 1), v));
    // Definition: a value equal to its class mean has anomaly 0.
    for (double a : anomalies.values()) {
      assertEquals(0, a, 1e-12);
    }
  }

  @Test
  void weeklyPureCycleDeseasonalizesToZero() {
    // Weekly cycle written directly from the ISO week number (java.time IsoFields), week 53 as 52.
    List<LocalDate> mondays = new ArrayList<>();
    for (LocalDate d = LocalDate.of(2009, 12, 28); d.isBefore(LocalDate.of(2021, 1, 1)); d = d.plusWeeks(1)) {
      mondays.add(d);
    }
    double[] v = new double[mondays.size()];
    for (int i = 0; i < v.length; i++) {
      int week = Math.min(mondays.get(i).get(IsoFields.WEEK_OF_WEEK_BASED_YEAR), 52);
      v[i] = 5 + Math.sin(2 * Math.PI * week / 52.0);
    }
    DatedSeries s = new DatedSeries(TemporalStep.WEEK, mondays.toArray(LocalDate[]::new), v);
    for (double a : Deseasonalize.anomalies().apply(s).values()) {
      assertEquals(0, a, 1e-12);
    }
  }

  @Test
  void dailyCycleWithoutSmoothingDeseasonalizesToZeroAcrossLeapYears() {
    LocalDate first = LocalDate.of(2011, 1, 1);
    int n = (int) (LocalDate.of(2021, 1, 1).toEpochDay() - first.toEpochDay());
    double[] v = new double[n];
    for (int i = 0; i < n; i++) {
      LocalDate d = first.plusDays(i);
      // Day of year on a 365-day year, 29 February taking 28 February's value, written out by hand.
      int doy = d.isLeapYear() && d.getMonthValue() > 2 ? d.getDayOfYear() - 1
          : d.getMonthValue() == 2 && d.getDayOfMonth() == 29 ? 59 : d.getDayOfYear();
      v[i] = 20 + 8 * Math.sin(2 * Math.PI * doy / 365.0);
    }
    DatedSeries s = Fixtures.daily(first, v);
    for (double a : Deseasonalize.anomalies().withHalfWindowDays(0).apply(s).values()) {
      assertEquals(0, a, 1e-12);
    }
  }

  @Test
  void dailyWindowSmoothsASinusoidByTheDirichletFactor() {
    // Three non-leap years, value A sin(theta c) for day class c = 0..364, theta = 2 pi / 365. A centred
    // mean over 2h + 1 classes scales a sinusoid by sin((2h+1) theta / 2) / ((2h+1) sin(theta / 2))
    // (trigonometric identity for sum_{w=-h..h} cos(w theta), the Dirichlet kernel), so the anomaly
    // left by the smoothed climatology is A sin(theta c) (1 - that factor).
    double amplitude = 8;
    double theta = 2 * Math.PI / 365;
    int h = Deseasonalize.DEFAULT_HALF_WINDOW_DAYS;
    double factor = Math.sin((2 * h + 1) * theta / 2) / ((2 * h + 1) * Math.sin(theta / 2));
    double[] v = new double[3 * 365];
    for (int i = 0; i < v.length; i++) {
      v[i] = amplitude * Math.sin(theta * (i % 365));
    }
    DatedSeries anomalies = Deseasonalize.anomalies().apply(Fixtures.daily(LocalDate.of(2001, 1, 1), v));
    for (int i = 0; i < v.length; i++) {
      assertEquals(amplitude * Math.sin(theta * (i % 365)) * (1 - factor), anomalies.value(i), 1e-12, "day " + i);
    }
    assertTrue(1 - factor > 0.01, "the window must actually smooth for this check to mean anything");
  }

  @Test
  void leapDayFoldsOntoTheTwentyEighth() {
    // Classes documented in PeriodOfYear: 29 February shares 28 February's class; 1 March is the same in every year.
    assertEquals(PeriodOfYear.classOf(TemporalStep.DAY, LocalDate.of(2019, 2, 28)),
        PeriodOfYear.classOf(TemporalStep.DAY, LocalDate.of(2020, 2, 29)));
    assertEquals(PeriodOfYear.classOf(TemporalStep.DAY, LocalDate.of(2019, 3, 1)),
        PeriodOfYear.classOf(TemporalStep.DAY, LocalDate.of(2020, 3, 1)));
    assertEquals(364, PeriodOfYear.classOf(TemporalStep.DAY, LocalDate.of(2020, 12, 31)));
    // ISO 8601: 2015-12-28 lies in week 53 of 2015 (java.time IsoFields), pooled with week 52.
    assertEquals(51, PeriodOfYear.classOf(TemporalStep.WEEK, LocalDate.of(2015, 12, 28)));
    assertEquals(0, PeriodOfYear.classOf(TemporalStep.SEASON, LocalDate.of(2014, 12, 1)));
  }

  @Test
  void standardizedAnomaliesHaveUnitVarianceWithinClasses() {
    Random random = new Random(21);
    int years = 30;
    double[] v = new double[12 * years];
    for (int i = 0; i < v.length; i++) {
      int month = i % 12;
      v[i] = 10 * month + (1 + month) * random.nextGaussian(); // mean and spread differ by month
    }
    DatedSeries z = Deseasonalize.standardizedAnomalies().apply(Fixtures.monthly(LocalDate.of(1991, 1, 1), v));
    for (int month = 0; month < 12; month++) {
      double sum = 0;
      double squares = 0;
      for (int y = 0; y < years; y++) {
        double a = z.value(12 * y + month);
        sum += a;
        squares += a * a;
      }
      double mean = sum / years;
      // Standardized anomaly = (x - class mean) / class sample sd (n - 1): mean 0 and sample variance 1 per class.
      assertEquals(0, mean, 1e-12, "month " + (month + 1));
      assertEquals(1, (squares - years * mean * mean) / (years - 1), 1e-12, "month " + (month + 1));
    }
  }

  @Test
  void climatologyComesFromTheBaselineOnly() {
    double[] v = new double[15 * 12];
    for (int i = 0; i < v.length; i++) {
      v[i] = Math.cos(2 * Math.PI * (i % 12) / 12) + (i >= 120 ? 3 : 0); // a shift of +3 from 2011 on
    }
    DatedSeries s = Fixtures.monthly(LocalDate.of(2001, 1, 1), v);
    Deseasonalize d = Deseasonalize.anomalies().withBaseline(LocalDate.of(2001, 1, 1), LocalDate.of(2010, 12, 31));
    DatedSeries a = d.apply(s);
    for (int i = 0; i < v.length; i++) {
      assertEquals(i >= 120 ? 3 : 0, a.value(i), 1e-12, s.date(i).toString());
    }
    ClassClimatology c = d.climatology(s);
    assertEquals(10, c.count()[0]);
    CorrelationInputException e = assertThrows(CorrelationInputException.class,
        () -> Deseasonalize.anomalies().withBaseline(LocalDate.of(1961, 1, 1), LocalDate.of(1990, 12, 31)).apply(s));
    assertEquals(CorrelationInputException.Kind.BAD_SETTING, e.kind());
    assertTrue(e.getMessage().contains("1961-01-01"), e.getMessage());
  }

  @Test
  void missingValuesAndEmptyOrFlatClassesGiveNaN() {
    double[] v = new double[36];
    for (int i = 0; i < v.length; i++) {
      v[i] = i % 12 == 4 ? Double.NaN : i % 12 == 5 ? 7 : i;
    }
    DatedSeries s = Fixtures.monthly(LocalDate.of(2001, 1, 1), v);
    DatedSeries a = Deseasonalize.anomalies().apply(s);
    assertTrue(Double.isNaN(a.value(4)), "missing stays missing; May has no baseline value either");
    assertEquals(0, a.value(5), 0.0); // June is constant: anomaly 0 ...
    assertTrue(Double.isNaN(Deseasonalize.standardizedAnomalies().apply(s).value(5)), "... but cannot be standardized");
    assertThrows(CorrelationInputException.class, () -> Deseasonalize.anomalies().withHalfWindowDays(200));
  }

  @Test
  void deseasonalizingRemovesACorrelationMadeByTheSharedCycle() {
    // Two series with the same seasonal cycle and independent anomalies: the raw correlation is
    // the cycle's; after removing the climatology nothing is left (common practice in climate analysis).
    Random random = new Random(31);
    int n = 12 * 40;
    double[] a = new double[n];
    double[] b = new double[n];
    for (int i = 0; i < n; i++) {
      double cycle = 5 * Math.sin(2 * Math.PI * (i % 12) / 12);
      a[i] = cycle + random.nextGaussian();
      b[i] = 2 * cycle + random.nextGaussian();
    }
    DatedSeries target = Fixtures.monthly(LocalDate.of(1981, 1, 1), a);
    DatedSeries driver = Fixtures.monthly(LocalDate.of(1981, 1, 1), b);
    LagRow raw = LaggedCorrelation.compute(target, driver, CorrelationMethod.PEARSON, 0, 0, 1, 0.05).rows().get(0);
    Deseasonalize d = Deseasonalize.anomalies();
    LagRow anomalies = LaggedCorrelation.compute(d.apply(target), d.apply(driver), CorrelationMethod.PEARSON, 0, 0, 1, 0.05)
        .rows().get(0);
    assertTrue(raw.r() > 0.9, "raw r = " + raw.r());
    assertTrue(Math.abs(anomalies.r()) < 0.15, "anomaly r = " + anomalies.r());
  }
}
