package org.slackwater.core.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.FakeSource;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.region.Region;
import org.slackwater.core.region.RegionWeights;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.query.QueryException;

class QueryEngineTest {
  @TempDir Path dir;
  private Workspace ws;
  private Region box;

  @BeforeEach
  void setUp() throws Exception {
    ws = Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, new ChunkLayout(40, 4, 4));
    ws.ingestor().ingest(FakeSource.write(dir.resolve("t.fake"), "temp", 9, 7, 120, 0), Optional.empty());
    box = GeoJsonRegions.parseNamed("Test Box", """
        {"type":"Polygon","coordinates":[[[-31.93,43.56],[-31.41,43.61],[-31.48,44.27],[-31.87,44.2],[-31.93,43.56]]]}""");
    ws.catalog().putRegion(box);
  }

  @AfterEach
  void tearDown() {
    ws.close();
  }

  @Test
  void dailyAreaMeanEqualsTheWeightedMeanOfTheValidCells() {
    ResultTable t = ws.engine().run("mean temp over \"test box\" from 2014-01-01 to 2014-03-31 by day with coverage at least 10 %").get(0);
    CellWeights w = RegionWeights.compute(FakeSource.grid(9, 7), box.geometry());
    Column.Doubles mean = (Column.Doubles) t.column("mean_temp");
    Column.Dates time = (Column.Dates) t.column("time");
    assertEquals(90, t.rowCount());
    assertEquals("degC", mean.unit());
    for (int day = 0; day < 90; day++) {
      double sw = 0, swv = 0;
      for (int i = 0; i < w.size(); i++) {
        float v = FakeSource.value(day, w.row(i), w.column(i));
        if (!Float.isNaN(v)) {
          sw += w.area(i);
          swv += w.area(i) * v;
        }
      }
      assertEquals(LocalDate.of(2014, 1, 1).plusDays(day), time.get(day));
      assertEquals(swv / sw, mean.get(day), 1e-9, "day " + day);
      assertEquals(sw / w.totalArea(), ((Column.Doubles) t.column("valid_fraction")).get(day), 1e-12);
    }
  }

  @Test
  void monthlyMeansAverageTheDailyValuesAndConvertUnits() {
    ResultTable daily = ws.engine().run("mean temp over \"Test Box\" from 2014-02 to 2014-02 by day").get(0);
    ResultTable monthly = ws.engine().run("mean temp over \"Test Box\" during 2014-02 by month in degF").get(0);
    double s = 0;
    Column.Doubles d = (Column.Doubles) daily.column("mean_temp");
    for (int i = 0; i < d.size(); i++) {
      s += d.get(i);
    }
    double meanC = s / d.size();
    // degF = degC x 9/5 + 32 (the definition of the Fahrenheit scale).
    assertEquals(meanC * 9 / 5 + 32, ((Column.Doubles) monthly.column("mean_temp")).get(0), 1e-6);
    assertEquals("degF", monthly.column("mean_temp").unit());
    assertEquals("2014-02", ((Column.Strings) monthly.column("period")).get(0));
    assertEquals(28L, ((Column.Longs) monthly.column("steps")).get(0));
  }

  @Test
  void aPeriodReachingPastTheDataIsClippedWithAWarning() {
    ResultTable t = ws.engine().run("max temp over \"Test Box\" from 2014-04 to 2014-12 by month").get(0);
    assertEquals(1, t.rowCount()); // 120 days from 1 January 2014 end on 30 April.
    assertTrue(t.warnings().get(0).startsWith("the period was clipped to the data: temp covers 2014-01-01 to 2014-04-30"), t.warnings().toString());
  }

  @Test
  void anAnomalyIsTheValueMinusTheBaselineMeanOfItsClass() {
    // Weekly anomaly of week 2014-W10 against a baseline of the same weeks: value - mean(baseline weeks of that class).
    ResultTable plain = ws.engine().run("mean temp over \"Test Box\" from 2014-01-06 to 2014-04-27 by week").get(0);
    ResultTable anom = ws.engine().run("mean temp over \"Test Box\" from 2014-01-06 to 2014-04-27 by week as anomaly against 2014-01-06 to 2014-04-27").get(0);
    Column.Doubles v = (Column.Doubles) plain.column("mean_temp");
    Column.Doubles a = (Column.Doubles) anom.column("anomaly_mean_temp");
    // One year of baseline: each ISO week is its own class, so every anomaly is 0.
    for (int i = 0; i < v.size(); i++) {
      assertEquals(0.0, a.get(i), 1e-9);
      assertEquals(v.get(i), ((Column.Doubles) anom.column("baseline_mean")).get(i), 1e-9);
    }
    ResultTable pct = ws.engine().run("mean temp over \"Test Box\" during 2014-02 by day as percentile against 2014-01-01 to 2014-04-30").get(0);
    assertEquals("%", pct.column("percentile_rank_mean_temp").unit());
  }

  @Test
  void aBaselineOutsideTheDataIsAnError() {
    QueryException e = assertThrows(QueryException.class,
        () -> ws.engine().run("mean temp over \"Test Box\" during 2014-02 by month as anomaly against 2006 to 2020"));
    assertEquals("the baseline 2006-01-01 to 2020-12-31 reaches outside the temp data", e.detail());
    assertEquals("temp covers 2014-01-01 to 2014-04-30; choose baseline years within it", e.hint());
  }

  @Test
  void aDerivedVariableIsComputedCellByCell() {
    List<ResultTable> r = ws.engine().run("let doubled = 2 * temp + 1 degC; mean doubled over \"Test Box\" during 2014-02 by day; "
        + "mean temp over \"Test Box\" during 2014-02 by day");
    Column.Doubles d = (Column.Doubles) r.get(1).column("mean_doubled");
    Column.Doubles t = (Column.Doubles) r.get(2).column("mean_temp");
    assertEquals("degC", d.unit());
    for (int i = 0; i < t.size(); i++) {
      // The area mean is linear: mean(2 x + 1) = 2 mean(x) + 1.
      assertEquals(2 * t.get(i) + 1, d.get(i), 1e-4);
    }
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().run("let bad = temp + 1 mg/L; list variables"));
    assertEquals("cannot add 'mg/L' to 'degC'", e.detail());
    QueryException taken = assertThrows(QueryException.class, () -> ws.engine().run("let temp = 2 * 1 degC; list variables"));
    assertEquals("'temp' is already a stored variable", taken.detail());
  }

  @Test
  void aDerivedVariableRegridsInputsOfAnotherGridAndMatchesStepsByDate() throws Exception {
    // A 0.2-degree cube from the same origin: each 0.1-degree cell of temp lies inside exactly one
    // of its cells, so conservative regridding (Jones 1999, Mon. Wea. Rev. 127, 2204-2210: the
    // overlap-area weighted mean) gives that cell's value unchanged. It starts on 2014-01-10, so
    // its step t is temp's step t + 9.
    ws.ingestor().ingest(FakeSource.writeOnGrid(dir.resolve("c.fake"), "coarse", 5, 4, 100, 0.2, LocalDate.of(2014, 1, 10)), Optional.empty());
    List<ResultTable> r = ws.engine().run("let both = temp + coarse; "
        + "map mean both over box(43.5 N, 32 W, 44.4 N, 31.3 W) during 2014-02-01; "
        + "map mean both over box(43.5 N, 32 W, 44.4 N, 31.3 W) during 2014-01-05");
    assertEquals("coarse (conservatively onto the grid and steps of temp)", ((Column.Strings) r.get(0).column("regridded")).get(0));
    ResultTable day = r.get(1);
    Column.Longs rows = (Column.Longs) day.column("row"), cols = (Column.Longs) day.column("column");
    Column.Doubles v = (Column.Doubles) day.column("mean_both");
    int t = 31; // 2014-02-01 in temp; 22 in coarse
    int checked = 0, missing = 0;
    for (int i = 0; i < v.size(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      double expected = (double) FakeSource.value(t, y, x) + FakeSource.value(t - 9, y / 2, x / 2);
      if (Double.isNaN(expected)) {
        assertTrue(Double.isNaN(v.get(i)), "cell " + y + "," + x + " should be missing");
        missing++;
      } else {
        assertEquals(expected, v.get(i), 1e-5, "cell " + y + "," + x);
        checked++;
      }
    }
    assertEquals(63, checked + missing);
    assertTrue(checked > 40 && missing > 0, checked + " checked, " + missing + " missing");
    // Before the coarse cube starts, the sum has no value anywhere.
    Column.Doubles early = (Column.Doubles) r.get(2).column("mean_both");
    for (int i = 0; i < early.size(); i++) {
      assertTrue(Double.isNaN(early.get(i)));
    }
    ws.ingestor().ingest(FakeSource.writeOnGrid(dir.resolve("l.fake"), "later", 5, 4, 30, 0.2, LocalDate.of(2016, 1, 1)), Optional.empty());
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().run("let x = temp - later; list variables"));
    assertEquals("'later' has no time step at the instants of 'temp' (2016-01-01 to 2016-01-30 against 2014-01-01 to 2014-04-30)", e.detail());
    assertEquals(16, e.column());
  }

  /** The daily area mean the watches below read, from the area-series statement. */
  private double[] dailyMean() {
    return daily("mean");
  }

  private double[] daily(String statistic) {
    ResultTable t = ws.engine().run(statistic + " temp over \"Test Box\" from 2014-01-01 to 2014-04-30 by day").get(0);
    return ((Column.Doubles) t.column(statistic + "_temp")).values();
  }

  @Test
  void aWatchHoldsOnTheDaysItsPersistentThresholdHoldsAndRecordsEachRiseAndClearOnce() {
    double[] m = dailyMean();
    org.slackwater.core.watch.WatchRun run = ws.engine().evaluateWatch(
        "watch \"w\" over \"Test Box\" when mean temp above 10.5 degC for 3 days severity alert",
        LocalDate.of(2014, 1, 1), LocalDate.of(2014, 4, 30));
    assertEquals(120, run.days().size());
    int previous = 0, raised = 0;
    for (int i = 0; i < 120; i++) {
      // Hand-written rule: above on this day and the two before (a missing day never holds).
      boolean holds = i >= 2 && m[i] > 10.5 && m[i - 1] > 10.5 && m[i - 2] > 10.5;
      int level = holds ? 3 : 0;
      var day = run.days().get(i);
      assertEquals(level, day.level(), "day " + day.day());
      org.slackwater.core.watch.WatchState expected = level == 0 ? (previous == 0 ? org.slackwater.core.watch.WatchState.QUIET
          : org.slackwater.core.watch.WatchState.CLEARED) : previous == 0 ? org.slackwater.core.watch.WatchState.RAISED
          : org.slackwater.core.watch.WatchState.ONGOING;
      assertEquals(expected, day.state(), "day " + day.day());
      raised += expected == org.slackwater.core.watch.WatchState.RAISED ? 1 : 0;
      assertEquals(m[i], day.values().get("mean temp [degC]"), 1e-12);
      previous = level;
    }
    assertTrue(raised >= 1, "the threshold should be crossed in the test field");
    // The same threshold in kelvin (10.5 degC = 283.65 K, SI Brochure 9th ed. 2.3.1) gives the same days.
    org.slackwater.core.watch.WatchRun kelvin = ws.engine().evaluateWatch(
        "watch \"w\" over \"Test Box\" when mean temp above 283.65 K for 3 days severity alert",
        LocalDate.of(2014, 1, 1), LocalDate.of(2014, 4, 30));
    for (int i = 0; i < 120; i++) {
      assertEquals(run.days().get(i).level(), kelvin.days().get(i).level());
    }
    ResultTable table = org.slackwater.core.watch.WatchTables.of(run, true);
    assertEquals(org.slackwater.core.query.WatchStatements.CAUTION, ((Column.Strings) table.column("caution")).get(0));
    assertEquals(run.transitions().size(), table.rowCount());
  }

  @Test
  void windowsAndThreeValuedLogicFollowTheirDefinitions() {
    double[] m = dailyMean();
    org.slackwater.core.watch.WatchRun run = ws.engine().evaluateWatch(
        "watch \"w\" over \"Test Box\" when not (mean temp over 5 days below 10.2 degC) severity notice"
            + " when max temp over 1 week at least 10.9 degC and mean temp above 10 degC severity warning",
        LocalDate.of(2014, 1, 1), LocalDate.of(2014, 4, 30));
    double[] max = daily("max");
    for (int i = 0; i < 120; i++) {
      // 'max temp over 1 week' is the largest daily regional maximum of the last 7 days.
      Double w5 = window(m, i, 5, false), w7 = window(max, i, 7, true);
      // Kleene logic: an unknown (no window value) never holds, and 'not unknown' is unknown.
      boolean r1 = w5 != null && !(w5 < 10.2);
      boolean r2 = w7 != null && w7 >= 10.9 && !Double.isNaN(m[i]) && m[i] > 10;
      int level = r2 ? 2 : r1 ? 1 : 0;
      assertEquals(level, run.days().get(i).level(), "day " + run.days().get(i).day());
    }
  }

  /** Mean (or max) of the days with a value over the last n days; null if fewer than half have one. */
  private static Double window(double[] m, int i, int n, boolean max) {
    if (i < n - 1) {
      return null;
    }
    double acc = max ? Double.NEGATIVE_INFINITY : 0;
    int k = 0;
    for (int j = i - n + 1; j <= i; j++) {
      if (!Double.isNaN(m[j])) {
        acc = max ? Math.max(acc, m[j]) : acc + m[j];
        k++;
      }
    }
    if (2 * k < n || k == 0) {
      return null;
    }
    return max ? acc : acc / k;
  }

  @Test
  void aDaysValuesDoNotDependOnWhichDaysAreEvaluated() {
    String w = "watch \"w\" over \"Test Box\" when standardized anomaly of mean temp over 3 days above 0.5 against 2014-01-01 to 2014-04-30";
    var shortRun = ws.engine().evaluateWatch(w, LocalDate.of(2014, 2, 1), LocalDate.of(2014, 2, 5));
    var longRun = ws.engine().evaluateWatch(w, LocalDate.of(2014, 1, 20), LocalDate.of(2014, 4, 30));
    var a = shortRun.days().get(2);
    var b = longRun.days().stream().filter(d -> d.day().equals(a.day())).findFirst().orElseThrow();
    assertEquals(a.values(), b.values());
    assertEquals(a.state(), b.state());
    assertTrue(a.values().values().stream().noneMatch(v -> v.isNaN()));
  }

  @Test
  void aWatchOutsideItsDataIsAnError() {
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().evaluateWatch(
        "watch \"w\" over \"Test Box\" when mean temp above 10.5 degC", LocalDate.of(2015, 1, 1), LocalDate.of(2015, 2, 1)));
    assertEquals("the watch's variables have data together from 2014-01-01 to 2014-04-30, which misses 2015-01-01 to 2015-02-01", e.detail());
  }

  @Test
  void catalogStatementsListWhatIsLoaded() {
    List<ResultTable> r = ws.engine().run("list variables; list regions; describe temp");
    assertEquals("temp", ((Column.Strings) r.get(0).column("variable")).get(0));
    assertEquals("Test Box", ((Column.Strings) r.get(1).column("region")).get(0));
    assertEquals("variable", ((Column.Strings) r.get(2).column("property")).get(0));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
    "mean tmep over \"Test Box\" during 2014 by day|1|6|unknown variable 'tmep'|did you mean 'temp'?",
    "mean temp over \"Test Bx\" during 2014 by day|1|16|unknown region \"Test Bx\"|did you mean \"Test Box\"?",
    "mean temp over \"Test Box\" during 2016 by day|1|27|no temp data from 2016-01-01 to 2016-12-31|temp covers 2014-01-01 to 2014-04-30",
    "mean temp over \"Test Box\" during 2014 by day in mg/m3|1|46|values in 'degC' cannot be converted to 'mg/m3'|the data are in 'degC'",
    "mean temp over box(10, 10, 11, 11) during 2014 by day|1|16|box 10.0000..11.0000 N, 10.0000..11.0000 E: the region touches no cell of the grid LatLonGrid[9 x 7, lat 43.5..44.4, lon -32.0..-31.3]; check that the region lies within the data's extent (coordinates are longitude, latitude)|",
  })
  void semanticErrorsArePositionedWithHints(String query, int line, int column, String detail, String hint) {
    QueryException e = assertThrows(QueryException.class, () -> ws.engine().run(query));
    assertEquals(detail, e.detail());
    assertEquals(line, e.line());
    assertEquals(column, e.column());
    assertEquals(hint == null ? "" : hint, e.hint());
  }
}
