package org.slackwater.core.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.hipparchus.distribution.continuous.TDistribution;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.analytics.TemporalStep;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.ingest.FakeSource;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.CorrelationMethod;
import org.slackwater.query.ast.DurationUnit;
import org.slackwater.query.ast.LagRange;
import org.slackwater.query.ast.Position;

/**
 * {@code map correlation} from query text to table: the one-lag table as before, the many-lag
 * table ({@code lags a to b}), the conversion of lags to steps and the errors. r is checked
 * against Hipparchus on pairs built here from the fake source's own values and the engine's area
 * series. Planted lags and the errors of the lag clause: {@link CorrelationMapLagsTest}.
 */
class CorrelationMapStatementTest {
  private static final String BOX = "Test Box";
  private static final String MAP = "map correlation of temp over \"" + BOX + "\" with temp over \"" + BOX + "\""
      + " from 2014-01-01 to 2014-04-30 by day";
  private static final int DAYS = 120;

  @TempDir Path dir;
  private Workspace ws;

  @BeforeEach
  void setUp() throws Exception {
    ws = Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, new ChunkLayout(40, 4, 4));
    ws.ingestor().ingest(FakeSource.write(dir.resolve("t.fake"), "temp", 9, 7, DAYS, 0), Optional.empty());
    ws.catalog().putRegion(GeoJsonRegions.parseNamed(BOX, """
        {"type":"Polygon","coordinates":[[[-31.93,43.56],[-31.41,43.61],[-31.48,44.27],[-31.87,44.2],[-31.93,43.56]]]}"""));
  }

  @AfterEach
  void tearDown() {
    ws.close();
  }

  private double[] areaMean() {
    ResultTable series = ws.engine().run("mean temp over \"" + BOX + "\" from 2014-01-01 to 2014-04-30 by day").get(0);
    Column.Doubles mean = (Column.Doubles) series.column("mean_temp");
    assertEquals(DAYS, mean.size());
    double[] d = new double[DAYS];
    for (int t = 0; t < DAYS; t++) {
      d[t] = mean.get(t);
    }
    return d;
  }

  /** Hipparchus' r of a cell's values (from the fake source) with the area mean lag days earlier. */
  private static double hipparchusR(int y, int x, double[] driver, int lag) {
    List<double[]> pairs = new ArrayList<>();
    for (int t = Math.max(0, lag); t < Math.min(DAYS, DAYS + lag); t++) {
      double v = FakeSource.value(t, y, x);
      if (!Double.isNaN(v) && !Double.isNaN(driver[t - lag])) {
        pairs.add(new double[] {v, driver[t - lag]});
      }
    }
    return new PearsonsCorrelation().correlation(pairs.stream().mapToDouble(p -> p[0]).toArray(),
        pairs.stream().mapToDouble(p -> p[1]).toArray());
  }

  private static List<String> names(ResultTable t) {
    return t.columns().stream().map(Column::name).toList();
  }

  @Test
  void oneLagGivesTheColumnsAndValuesOfToday() {
    ResultTable t = ws.engine().run(MAP + " at lag 2 days").get(0);
    assertEquals(List.of("row", "column", "lat", "lon", "fraction_inside", "r", "n", "n_effective", "p_value", "significant"),
        names(t));
    assertEquals("2 day (positive: the driver leads)", t.metadata().get("lag"));
    double[] driver = areaMean();
    Column.Longs rows = (Column.Longs) t.column("row"), cols = (Column.Longs) t.column("column");
    Column.Doubles r = (Column.Doubles) t.column("r");
    assertTrue(t.rowCount() >= 10, "cells in the box: " + t.rowCount());
    for (int i = 0; i < t.rowCount(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      assertEquals(hipparchusR(y, x, driver, 2), r.get(i), 1e-9, "cell (" + y + ", " + x + ")");
    }
  }

  @Test
  void manyLagsGiveEachCellItsBestLagWithBonferroni() {
    ResultTable t = ws.engine().run(MAP + " lags -3 to 6 days").get(0);
    assertEquals(List.of("row", "column", "lat", "lon", "fraction_inside", "best_lag", "r", "n", "n_effective", "p_value",
        "significant", "significant_after_bonferroni", "valid_lags"), names(t));
    assertEquals("-3 to 6 day step 1, 10 lags (positive: the driver leads)", t.metadata().get("lags"));
    double[] driver = areaMean();
    Column.Longs rows = (Column.Longs) t.column("row"), cols = (Column.Longs) t.column("column");
    Column.Longs best = (Column.Longs) t.column("best_lag"), valid = (Column.Longs) t.column("valid_lags");
    Column.Doubles r = (Column.Doubles) t.column("r"), p = (Column.Doubles) t.column("p_value");
    Column.Doubles neff = (Column.Doubles) t.column("n_effective");
    Column.Strings bonferroni = (Column.Strings) t.column("significant_after_bonferroni");
    for (int i = 0; i < t.rowCount(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      String where = "cell (" + y + ", " + x + ")";
      // The best lag is the largest |r| among the lags, each r by Hipparchus.
      int argmax = -3;
      for (int lag = -3; lag <= 6; lag++) {
        if (Math.abs(hipparchusR(y, x, driver, lag)) > Math.abs(hipparchusR(y, x, driver, argmax))) {
          argmax = lag;
        }
      }
      assertEquals(argmax, best.get(i), where);
      assertEquals(hipparchusR(y, x, driver, argmax), r.get(i), 1e-9, where);
      assertEquals(10, valid.get(i), where);
      // The p-value is Student's t with N_eff - 2 degrees of freedom (Hipparchus), Bonferroni p <= 0.05 / 10.
      double tStat = r.get(i) * Math.sqrt((neff.get(i) - 2) / (1 - r.get(i) * r.get(i)));
      assertEquals(2 * new TDistribution(neff.get(i) - 2).cumulativeProbability(-Math.abs(tStat)), p.get(i),
          1e-12 + 1e-9 * p.get(i), where);
      assertEquals(p.get(i) <= 0.05 / 10 ? "yes" : "no", bonferroni.get(i), where);
    }
  }

  @Test
  void lagsBecomeStepsOfTheSeries() {
    Position at = new Position(1, 1);
    CorrelationSettings weeks = CorrelationMapStatement.settings(Optional.of(new LagRange(-2, 4, 2, DurationUnit.WEEK, at)),
        CorrelationMethod.SPEARMAN, TemporalStep.DAY, MAP);
    // 1 week = 7 days: lags -14, 0, 14, 28 days.
    assertEquals(List.of(-14, 0, 14, 28), java.util.Arrays.stream(weeks.lags()).boxed().toList());
    assertEquals(org.slackwater.core.analytics.correlation.CorrelationMethod.SPEARMAN, weeks.method());
    CorrelationSettings days = CorrelationMapStatement.settings(Optional.of(new LagRange(-14, 14, 7, DurationUnit.DAY, at)),
        CorrelationMethod.PEARSON, TemporalStep.WEEK, MAP);
    assertEquals(List.of(-2, -1, 0, 1, 2), java.util.Arrays.stream(days.lags()).boxed().toList());
    CorrelationSettings none = CorrelationMapStatement.settings(Optional.empty(), CorrelationMethod.PEARSON, TemporalStep.MONTH, MAP);
    assertEquals(1, none.lagCount());
    assertEquals(0, none.minLag());

    QueryException partial = assertThrows(QueryException.class, () -> CorrelationMapStatement.settings(
        Optional.of(new LagRange(0, 10, 1, DurationUnit.DAY, at)), CorrelationMethod.PEARSON, TemporalStep.WEEK, MAP));
    assertTrue(partial.detail().contains("whole weeks"), partial.detail());
    QueryException tooMany = assertThrows(QueryException.class, () -> CorrelationMapStatement.settings(
        Optional.of(new LagRange(-100_000, 100_000, 1, DurationUnit.DAY, at)), CorrelationMethod.PEARSON, TemporalStep.DAY, MAP));
    assertTrue(tooMany.detail().contains("more than " + CorrelationSettings.MAX_LAGS + " lags"), tooMany.detail());
    assertTrue(tooMany.hint().contains("larger lag step"), tooMany.hint());
  }

  @Test
  void aLagBeyondTheDriversDaysPointsAtTheLagClause() {
    String text = MAP + " at lag 200 days";
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().run(text));
    assertTrue(e.detail().startsWith("lag range too long for the driver: lag 200 reaches 200 days"), e.detail());
    assertTrue(e.detail().contains("(" + LocalDate.of(2014, 1, 1) + " to "), e.detail());
    assertEquals("use smaller lags or a longer period", e.hint());
    assertEquals(1, e.line());
    // At the clause, as correlate reports it ('at lag' is a lag range of one lag).
    assertEquals(text.indexOf("at lag 200") + 1, e.column());
  }
}
