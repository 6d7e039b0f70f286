package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class ClimatologyTest {

  private static StepSeries monthly(int firstYear, int years, double[] values) {
    List<LocalDate> starts = new ArrayList<>();
    for (int y = 0; y < years; y++) {
      for (int m = 1; m <= 12; m++) {
        starts.add(LocalDate.of(firstYear + y, m, 1));
      }
    }
    int n = starts.size();
    return new StepSeries(TemporalStep.MONTH, starts.toArray(LocalDate[]::new), values, new double[n], new double[n], new int[n], new int[n]);
  }

  @Test
  void monthlyClassesUseTheSampleStandardDeviationAndMidRanks() {
    // Januaries 1, 2, 3, 4, 10 (other months 0): mean 4; sample variance
    // ((-3)^2 + (-2)^2 + (-1)^2 + 0^2 + 6^2) / (5 - 1) = 50 / 4 = 12.5 (n - 1 denominator, textbook).
    double[] v = new double[60];
    double[] jan = {1, 2, 3, 4, 10};
    for (int y = 0; y < 5; y++) {
      v[12 * y] = jan[y];
    }
    Climatology c = Climatology.of(monthly(2001, 5, v), 15);
    LocalDate january = LocalDate.of(2030, 1, 1);
    assertEquals(4.0, c.mean(january), 1e-12);
    assertEquals(Math.sqrt(12.5), c.sd(january), 1e-12);
    assertEquals(5, c.n(january));
    assertEquals(6.0, c.anomaly(january, 10), 1e-12);
    assertEquals(6.0 / Math.sqrt(12.5), c.standardizedAnomaly(january, 10), 1e-12);
    // Mid-rank percentile: 3 is above 2 values and equals 1 of 5 -> 100 (2 + 0.5) / 5 = 50.
    assertEquals(50.0, c.percentileRank(january, 3), 1e-12);
    assertEquals(100.0, c.percentileRank(january, 11), 1e-12);
    assertEquals(0.0, c.percentileRank(january, 0.5), 1e-12);
    // A month whose baseline is constant has no spread: no standardized anomaly.
    assertEquals(Double.NaN, c.standardizedAnomaly(LocalDate.of(2030, 2, 1), 1));
  }

  @Test
  void dailyClassesPoolAWindowAndFoldTheLeapDay() {
    List<LocalDate> days = new ArrayList<>();
    for (LocalDate d = LocalDate.of(2004, 1, 1); d.isBefore(LocalDate.of(2006, 1, 1)); d = d.plusDays(1)) {
      days.add(d);
    }
    double[] v = new double[days.size()];
    for (int i = 0; i < v.length; i++) {
      v[i] = days.get(i).getDayOfYear() <= 59 ? 1 : 0; // January and February: 1
    }
    int n = v.length;
    StepSeries s = new StepSeries(TemporalStep.DAY, days.toArray(LocalDate[]::new), v, new double[n], new double[n], new int[n], new int[n]);
    Climatology c = Climatology.of(s, 2);
    assertEquals(Climatology.classOf(TemporalStep.DAY, LocalDate.of(2004, 2, 28)), Climatology.classOf(TemporalStep.DAY, LocalDate.of(2004, 2, 29)));
    // 15 January: every value within +/-2 days in both years is 1; 2 years x 5 days.
    assertEquals(1.0, c.mean(LocalDate.of(2010, 1, 15)), 1e-12);
    assertEquals(10, c.n(LocalDate.of(2010, 1, 15)));
    assertEquals(0.0, c.mean(LocalDate.of(2010, 7, 15)), 1e-12);
  }
}
