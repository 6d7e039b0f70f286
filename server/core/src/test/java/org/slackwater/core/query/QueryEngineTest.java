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
