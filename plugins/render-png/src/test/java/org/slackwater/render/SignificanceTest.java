package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.distribution.continuous.TDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slackwater.core.result.ResultTable;

class SignificanceTest {

  /**
   * Critical values of Pearson's r, two-tailed alpha 0.05, by degrees of freedom df = n - 2, as
   * printed to three decimals in the standard statistical tables (e.g. Fisher and Yates,
   * Statistical Tables for Biological, Agricultural and Medical Research, table VII; values from
   * memory). Our n_eff is N for independent values, so df = n_eff - 2.
   */
  @ParameterizedTest(name = "df {0}: r_crit {1}")
  @CsvSource({"1, 0.997", "2, 0.950", "3, 0.878", "5, 0.754", "10, 0.576", "20, 0.423", "30, 0.349", "50, 0.273", "100, 0.195"})
  void criticalRMatchesPublishedTable(int df, double table) {
    assertEquals(table, Significance.criticalR(df + 2, 0.05), 0.0006);
  }

  /** At r_crit the two-sided p-value of t = r sqrt(df / (1 - r^2)) is alpha (the definition, by Hipparchus' t CDF). */
  @Test
  void criticalRIsWhereThePValueIsAlpha() {
    for (double nEff : new double[] {7.5, 40, 368.47}) {
      for (double alpha : new double[] {0.01, 0.05, 0.1}) {
        double r = Significance.criticalR(nEff, alpha), df = nEff - 2;
        double t = r * Math.sqrt(df / (1 - r * r));
        double p = 2 * (1 - new TDistribution(df).cumulativeProbability(t));
        assertEquals(alpha, p, 1e-9, "n_eff " + nEff + ", alpha " + alpha);
      }
    }
  }

  /** The server's own significance (from its p-values, in the demo sample) agrees with the drawn thresholds. */
  @Test
  void thresholdsSeparateTheServersSignificantLags() {
    ResultTable t = Fixtures.correlation();
    double[] r = Tables.numbers(t, "r"), crit = CorrelationChart.thresholds(Tables.numbers(t, "n_effective"), 0.05);
    String[] sig = Tables.strings(t, "significant");
    for (int i = 0; i < r.length; i++) {
      assertEquals("yes".equals(sig[i]), Math.abs(r[i]) >= crit[i], "lag " + i + ": r " + r[i] + ", r_crit " + crit[i]);
    }
  }

  @Test
  void tooFewValuesHaveNoThreshold() {
    assertTrue(Double.isNaN(Significance.criticalR(2, 0.05)));
    assertTrue(Double.isNaN(Significance.criticalR(1.5, 0.05)));
  }

  @Test
  void alphaFromMetadata() {
    assertEquals(0.05, Significance.alpha("t", null));
    assertEquals(0.01, Significance.alpha("t", "0.01"));
    PlotException e = assertThrows(PlotException.class, () -> Significance.alpha("correlation of x", "five percent"));
    assertTrue(e.getMessage().contains("'five percent', not a number between 0 and 1"), e.getMessage());
  }
}
