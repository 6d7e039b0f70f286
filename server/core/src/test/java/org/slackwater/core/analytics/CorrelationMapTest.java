package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.hipparchus.stat.correlation.SpearmansCorrelation;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slackwater.core.Workspace;
import org.slackwater.core.analytics.correlation.Alignment;
import org.slackwater.core.analytics.correlation.CorrelationInputException;
import org.slackwater.core.analytics.correlation.CorrelationMethod;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagCorrelator;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.LaggedCorrelation;
import org.slackwater.core.analytics.correlation.LaggedPairs;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.ingest.Ingestor;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.store.ChunkLayout;

/**
 * The correlation map against its definition: for every cell, {@link LaggedCorrelation} on the
 * cell's own series, built here from the values the source delivered (not from the store) through
 * {@link TemporalAggregation} and {@link Deseasonalize}; Hipparchus' correlation of the paired
 * values as a second, independent reference for r.
 *
 * <p>The field is the invented Wrenmouth estuary's chlorophyll on a 9 x 7 grid, 1100 days from
 * 2014-01-01 with three days absent from the time axis, against the Harle River discharge (an
 * AR(1) series). Cells follow the discharge 3 or 7 days later plus noise, or are unrelated, or
 * are special (land, constant, too few values, values over too few days); an 80-day outage leaves
 * two time chunks without any value. Chunks are 40 days x 4 x 4 cells, so periods and the lag cross
 * chunk and tile edges.
 */
class CorrelationMapTest {
  private static final ChunkLayout LAYOUT = new ChunkLayout(40, 4, 4);
  private static final LocalDate START = LocalDate.of(2014, 1, 1);
  private static final int NY = 9;
  private static final int NX = 7;
  private static final int NT = 1100;
  /** Native steps at and after this index are 3 days later: 2014-10-28 to 2014-10-30 are absent. */
  private static final int GAP_AT = 300;
  private static final int GAP_DAYS = 3;
  /** Native steps [OUTAGE_FROM, OUTAGE_TO) have no value anywhere: two whole time chunks hold nothing. */
  private static final int OUTAGE_FROM = 800;
  private static final int OUTAGE_TO = 880;
  /** The discharge series starts this many days before the cube. */
  private static final int LEAD = 60;

  @TempDir Path dir;
  private Workspace ws;
  private ChunkCache cache;

  @BeforeEach
  void open() throws Exception {
    ws = Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, LAYOUT);
    cache = new ChunkCache(ws.store(), 64L << 20);
  }

  @AfterEach
  void close() {
    ws.close(); // closes the allocator last: a leaked Arrow buffer fails the test
  }

  // ---------------------------------------------------------------------------------------------
  // The field

  enum Kind { LAND, CONSTANT, SPARSE, SHORT, LAG3, LAG7, UNRELATED }

  static Kind kind(int y, int x) {
    if ((y * 3 + x) % 5 == 2) {
      return Kind.LAND;
    }
    if (y == 0 && x == 0) {
      return Kind.CONSTANT;
    }
    if (y == 0 && x == 1) {
      return Kind.SPARSE;
    }
    if (y == 8 && x == 6) {
      return Kind.SHORT;
    }
    return switch ((y + x) % 3) {
      case 0 -> Kind.LAG3;
      case 1 -> Kind.LAG7;
      default -> Kind.UNRELATED;
    };
  }

  /** Days after START of native step t. */
  static int day(int t) {
    return t < GAP_AT ? t : t + GAP_DAYS;
  }

  /** Discharge (index = day + LEAD) and chlorophyll (t, y, x), seeded. */
  record Field(double[] discharge, float[] values, boolean seasonal) {
    float value(int t, int y, int x) {
      return values[(t * NY + y) * NX + x];
    }

    static Field make(boolean seasonal) {
      Random random = new Random(20140101);
      int days = day(NT - 1) + 1;
      double[] q = new double[LEAD + days + LEAD];
      q[0] = random.nextGaussian();
      for (int i = 1; i < q.length; i++) {
        q[i] = 0.3 * q[i - 1] + random.nextGaussian(); // AR(1), phi = 0.3
      }
      double[] unrelated = new double[NY * NX];
      float[] v = new float[NT * NY * NX];
      for (int t = 0; t < NT; t++) {
        int d = day(t);
        double cycle = seasonal ? 3 * Math.sin(2 * Math.PI * d / 365.25) : 0;
        for (int y = 0; y < NY; y++) {
          for (int x = 0; x < NX; x++) {
            int c = y * NX + x;
            unrelated[c] = 0.5 * unrelated[c] + random.nextGaussian();
            boolean gap = y % 2 == 0 && random.nextDouble() < 0.1; // even rows lose about 10 % of their days
            double value = t >= OUTAGE_FROM && t < OUTAGE_TO ? Double.NaN : switch (kind(y, x)) {
              case LAND -> Double.NaN;
              case CONSTANT -> 5;
              case SPARSE -> d == 200 || d == 205 || d == 210 ? 6 + d % 2 : Double.NaN;
              case SHORT -> d >= 500 && d < 505 ? 6 + random.nextGaussian() : Double.NaN;
              case LAG3 -> gap ? Double.NaN : 8 + 2 * q[LEAD + d - 3] + random.nextGaussian() + cycle;
              case LAG7 -> gap ? Double.NaN : 8 + 2 * q[LEAD + d - 7] + random.nextGaussian() + cycle;
              case UNRELATED -> gap ? Double.NaN : 8 + unrelated[c] + cycle;
            };
            v[(t * NY + y) * NX + x] = (float) value;
          }
        }
      }
      if (seasonal) {
        for (int i = 0; i < q.length; i++) {
          q[i] += 3 * Math.sin(2 * Math.PI * (i - LEAD) / 365.25);
        }
      }
      return new Field(q, v, seasonal);
    }

    /**
     * The discharge as a daily series from {@code START + first} to {@code START + last} days, every
     * {@code gapEvery}-th value missing (0: none).
     */
    DatedSeries driver(int first, int last, int gapEvery) {
      int n = last - first + 1;
      LocalDate[] dates = new LocalDate[n];
      double[] values = new double[n];
      for (int i = 0; i < n; i++) {
        dates[i] = START.plusDays(first + i);
        values[i] = gapEvery > 0 && i % gapEvery == gapEvery - 1 ? Double.NaN : discharge[LEAD + first + i];
      }
      return new DatedSeries(TemporalStep.DAY, dates, values);
    }
  }

  /** Serves one {@link Field} for any file whose name ends in {@code .field}. */
  static final class FieldSource implements CubeSource {
    private final Field field;

    FieldSource(Field field) {
      this.field = field;
    }

    @Override
    public String name() {
      return "field";
    }

    @Override
    public boolean accepts(Path file) {
      return file.getFileName().toString().endsWith(".field");
    }

    @Override
    public List<String> variables(Path file) {
      return List.of("chl");
    }

    @Override
    public SourceCube open(Path file, String variable) {
      long[] secs = new long[NT];
      for (int t = 0; t < NT; t++) {
        secs[t] = START.plusDays(day(t)).toEpochDay() * 86_400L;
      }
      CubeDescriptor d = new CubeDescriptor("chl", "mass_concentration_of_chlorophyll_in_sea_water", "chlorophyll",
          "mg m-3", "mg m-3", LatLonGrid.regular(43.9, -31.2, 0.05, 0.05, NY, NX),
          new TimeAxis("standard", "days since 2014-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
      return new SourceCube() {
        @Override
        public CubeDescriptor descriptor() {
          return d;
        }

        @Override
        public void read(int t0, int nt, int y0, int ny, int x0, int nx, float[] dest) {
          int i = 0;
          for (int t = t0; t < t0 + nt; t++) {
            for (int y = y0; y < y0 + ny; y++) {
              for (int x = x0; x < x0 + nx; x++) {
                dest[i++] = field.value(t, y, x);
              }
            }
          }
        }

        @Override
        public void close() {}
      };
    }
  }

  private CubeEntry ingest(Field field) throws Exception {
    Path file = Files.writeString(dir.resolve("wrenmouth.field"), "chlorophyll\n");
    new Ingestor(List.of(new FieldSource(field)), ws.catalog(), ws.store(), LAYOUT).ingest(file, Optional.empty());
    return ws.catalog().cube("chl").orElseThrow();
  }

  /** Every cell of the grid, unit areas. */
  private static CellWeights allCells() {
    return cells(IntStream.range(0, NY * NX).toArray());
  }

  private static CellWeights cells(int[] indices) {
    double[] ones = new double[indices.length];
    Arrays.fill(ones, 1);
    return new CellWeights(NX, indices, ones, ones, indices.length);
  }

  // ---------------------------------------------------------------------------------------------
  // The reference: a cell's own series through the classes the map must agree with

  /** The cell's native values from the source's field, aggregated by TemporalAggregation (mean). */
  private static DatedSeries cellSeries(Field field, CubeEntry cube, int y, int x, int from, int to, TemporalStep step) {
    long[] secs = Arrays.copyOfRange(cube.descriptor().time().epochSeconds(), from, to);
    int n = to - from;
    double[] v = new double[n];
    double[] frac = new double[n];
    int[] cells = new int[n];
    for (int t = from; t < to; t++) {
      v[t - from] = field.value(t, y, x);
      boolean valid = !Double.isNaN(v[t - from]);
      frac[t - from] = valid ? 1 : 0;
      cells[t - from] = valid ? 1 : 0;
    }
    return DatedSeries.of(TemporalAggregation.aggregate(new DailySeries(secs, v, frac, cells), step,
        SpatialStatistic.of(SpatialStatistic.Kind.MEAN)));
  }

  /** The row LaggedCorrelation gives, or the invalid row carrying its refusal. */
  private static LagRow expected(DatedSeries cell, DatedSeries driver, CorrelationSettings settings,
      Optional<Deseasonalize> deseasonalize) {
    try {
      DatedSeries target = deseasonalize.isPresent() ? deseasonalize.get().apply(cell) : cell;
      return LaggedCorrelation.compute(target, driver, settings).rows().get(0);
    } catch (CorrelationInputException e) {
      return new LagRow(settings.minLag(), 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
          false, e.getMessage());
    }
  }

  /** Field by field; doubles compared exactly (same formulas in the same order give the same bits). */
  private static void assertSameRow(LagRow expected, LagRow actual, String where) {
    assertEquals(expected.lag(), actual.lag(), where + " lag");
    assertEquals(expected.n(), actual.n(), where + " n");
    assertEquals(expected.r(), actual.r(), 0.0, where + " r");
    assertEquals(expected.r1Target(), actual.r1Target(), 0.0, where + " r1 target");
    assertEquals(expected.r1Driver(), actual.r1Driver(), 0.0, where + " r1 driver");
    assertEquals(expected.nEffective(), actual.nEffective(), 0.0, where + " n_effective");
    assertEquals(expected.t(), actual.t(), 0.0, where + " t");
    assertEquals(expected.pValue(), actual.pValue(), 0.0, where + " p");
    assertEquals(expected.significant(), actual.significant(), where + " significant");
    assertEquals(expected.note(), actual.note(), where + " note");
  }

  /**
   * Computes the map and checks every cell against the reference; returns how many rows were
   * valid, so callers can make sure the comparison was not vacuous.
   */
  private int checkEveryCell(Field field, CubeEntry cube, CellWeights weights, int from, int to, TemporalStep step,
      DatedSeries driver, CorrelationSettings settings, Optional<Deseasonalize> deseasonalize) throws Exception {
    List<LagRow> rows = CorrelationMap.compute(cache, cube, weights, from, to, step, driver, settings, deseasonalize);
    assertEquals(weights.size(), rows.size(), "one row per weight entry");
    int valid = 0;
    for (int i = 0; i < weights.size(); i++) {
      int y = weights.row(i), x = weights.column(i);
      String where = "cell (" + y + ", " + x + ") " + kind(y, x);
      DatedSeries cell = cellSeries(field, cube, y, x, from, to, step);
      LagRow want = expected(cell, driver, settings, deseasonalize);
      LagRow got = rows.get(i);
      // Reference 1: LaggedCorrelation on the cell's own series (the definition of the map).
      assertSameRow(want, got, where);
      if (got.valid()) {
        valid++;
        // Reference 2: Hipparchus on the complete pairs at this lag, as Alignment pairs them.
        DatedSeries target = deseasonalize.isPresent() ? deseasonalize.get().apply(cell) : cell;
        LaggedPairs pairs = Alignment.pairsAt(target, driver, settings.minLag());
        assertEquals(pairs.size(), got.n(), where + " pairs");
        double r = settings.method() == CorrelationMethod.PEARSON
            ? new PearsonsCorrelation().correlation(pairs.target(), pairs.driver())
            : new SpearmansCorrelation().correlation(pairs.target(), pairs.driver());
        assertEquals(r, got.r(), 1e-9, where + " r against Hipparchus");
      }
    }
    return valid;
  }

  // ---------------------------------------------------------------------------------------------
  // Tests

  static Stream<Arguments> dailyCases() {
    return Stream.of(
        // lag, driver gaps every n days (0 = none), autocorrelation correction, native steps [from, to):
        // from 17 the period holds the cube's absent days (the cells' days are not consecutive on the
        // axis), from 310 it does not; both hold the outage.
        Arguments.of(3, 0, true, 17, 1013),
        Arguments.of(7, 37, true, 310, NT),
        Arguments.of(0, 11, true, 17, 1013),
        Arguments.of(-2, 0, true, 310, 1013),
        Arguments.of(3, 0, false, 310, NT),
        Arguments.of(7, 37, false, 17, 1013));
  }

  @ParameterizedTest(name = "lag {0}, driver gap every {1}, correction {2}, steps {3} to {4}")
  @MethodSource("dailyCases")
  void dailyPearsonMatchesLaggedCorrelationCellByCell(int lag, int gapEvery, boolean correct, int from, int to)
      throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    // The driver starts before and ends before the cube; the periods cut chunks.
    DatedSeries driver = field.driver(-30, day(NT - 1) - 50, gapEvery);
    CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, lag, lag, 1, 0.05, correct);
    int valid = checkEveryCell(field, cube, allCells(), from, to, TemporalStep.DAY, driver, settings, Optional.empty());
    assertTrue(valid >= 40, "most cells are correlated: " + valid);
  }

  static Stream<Arguments> aggregatedCases() {
    return Stream.of(
        // step, method, deseasonalize (null = none), lag
        Arguments.of(TemporalStep.WEEK, CorrelationMethod.SPEARMAN, null, 1),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.PEARSON, null, 1),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.PEARSON, Deseasonalize.anomalies(), 1),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.SPEARMAN, Deseasonalize.standardizedAnomalies(), 2),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.PEARSON, Deseasonalize.anomalies(), 3),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.PEARSON,
            Deseasonalize.anomalies().withBaseline(START, START.plusDays(700)), 7),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.SPEARMAN, Deseasonalize.anomalies().withHalfWindowDays(0), 7));
  }

  @ParameterizedTest(name = "{0} {1} deseasonalized {2} lag {3}")
  @MethodSource("aggregatedCases")
  void aggregatedAndDeseasonalizedMapsMatchCellByCell(TemporalStep step, CorrelationMethod method, Deseasonalize des,
      int lag) throws Exception {
    Field field = Field.make(true);
    CubeEntry cube = ingest(field);
    // The caller's side: the daily discharge aggregated to the step like any series, then deseasonalized.
    DatedSeries daily = field.driver(-LEAD, day(NT - 1) + 10, 0);
    long[] secs = new long[daily.size()];
    for (int i = 0; i < secs.length; i++) {
      secs[i] = daily.date(i).toEpochDay() * 86_400L;
    }
    double[] ones = new double[secs.length];
    Arrays.fill(ones, 1);
    DatedSeries driver = DatedSeries.of(TemporalAggregation.aggregate(
        new DailySeries(secs, daily.values(), ones, new int[secs.length]), step, SpatialStatistic.of(SpatialStatistic.Kind.MEAN)));
    Optional<Deseasonalize> deseasonalize = Optional.ofNullable(des);
    if (des != null) {
      driver = des.apply(driver);
    }
    CorrelationSettings settings = CorrelationSettings.of(method, lag, lag, 1, 0.05);
    // Steps [17, 1013) start and end inside a week and a month: partial periods at both ends.
    int valid = checkEveryCell(field, cube, allCells(), 17, 1013, step, driver, settings, deseasonalize);
    assertTrue(valid >= 40, "most cells are correlated: " + valid);
  }

  @Test
  void missingAndDegenerateCellsGiveTheReferenceInvalidRows() throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    DatedSeries driver = field.driver(-LEAD, day(NT - 1), 0);
    CorrelationSettings settings = CorrelationSettings.of(CorrelationMethod.PEARSON, 7, 7, 1, 0.05);
    // A region of some cells only, in three tiles, the land and special cells among them.
    int[] indices = {0, 1, 2, 5, 9, 12, 16, 23, 30, 40, 61, 62};
    CellWeights weights = cells(indices);
    for (int[] period : new int[][] {{0, NT}, {600, NT}}) {
      List<LagRow> rows = CorrelationMap.compute(cache, cube, weights, period[0], period[1], TemporalStep.DAY, driver,
          settings, Optional.empty());
      for (int i = 0; i < indices.length; i++) {
        int y = indices[i] / NX, x = indices[i] % NX;
        LagRow want = expected(cellSeries(field, cube, y, x, period[0], period[1], TemporalStep.DAY), driver,
            settings, Optional.empty());
        LagRow got = rows.get(i);
        String where = "cell (" + y + ", " + x + ") " + kind(y, x) + " from step " + period[0];
        assertSameRow(want, got, where);
        switch (kind(y, x)) {
          // Land never holds a value (outside the footprint); the short cell has none after step 600.
          case LAND -> assertAllMissing(got, where);
          case SHORT -> {
            if (period[0] == 600) {
              assertAllMissing(got, where);
            } else {
              // Values over 5 days only: lag 7 reaches beyond them (LagCorrelator: |lag| below the span).
              assertFalse(got.valid(), where);
              assertEquals(0, got.n(), where);
              assertTrue(got.note().startsWith("lag range too long"), got.note());
            }
          }
          // Constant: r undefined; sparse: 3 values on days 200, 205 and 210, 3 pairs (fewer than MIN_PAIRS).
          case CONSTANT, SPARSE -> assertFalse(got.valid(), where);
          default -> assertTrue(got.valid(), where);
        }
      }
    }
    // Deseasonalizing an empty cell fails in the baseline, before any correlation: its note says so.
    List<LagRow> rows = CorrelationMap.compute(cache, cube, cells(new int[] {2}), 0, NT, TemporalStep.DAY, driver,
        settings, Optional.of(Deseasonalize.anomalies()));
    assertFalse(rows.get(0).valid());
    assertTrue(rows.get(0).note().contains("baseline"), rows.get(0).note());
  }

  /** The invalid row of a cell without a single value: n = 0 and LaggedCorrelation's refusal. */
  private static void assertAllMissing(LagRow row, String where) {
    assertFalse(row.valid(), where);
    assertEquals(0, row.n(), where);
    CorrelationInputException e = assertThrows(CorrelationInputException.class, () -> new LagCorrelator(
        CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 0, 1, 0.05)).compute(new double[] {Double.NaN, Double.NaN},
            new double[] {1, 2}));
    assertEquals(CorrelationInputException.Kind.EMPTY_SERIES, e.kind());
    assertEquals(e.getMessage(), row.note(), where);
  }

  @Test
  void thePlantedLagIsFoundOnlyInThePlantedCells() throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    DatedSeries driver = field.driver(-LEAD, day(NT - 1), 0);
    CellWeights weights = allCells();
    int lags = 11;
    double[][] r = new double[lags][];
    boolean[][] significant = new boolean[lags][];
    for (int lag = 0; lag < lags; lag++) {
      List<LagRow> rows = CorrelationMap.compute(cache, cube, weights, 0, NT, TemporalStep.DAY, driver,
          CorrelationSettings.of(CorrelationMethod.PEARSON, lag, lag, 1, 0.05), Optional.empty());
      r[lag] = rows.stream().mapToDouble(LagRow::r).toArray();
      significant[lag] = new boolean[rows.size()];
      for (int i = 0; i < rows.size(); i++) {
        significant[lag][i] = rows.get(i).significant();
      }
    }
    int checked = 0;
    for (int i = 0; i < weights.size(); i++) {
      Kind kind = kind(weights.row(i), weights.column(i));
      if (kind != Kind.LAG3 && kind != Kind.LAG7 && kind != Kind.UNRELATED) {
        continue;
      }
      checked++;
      int planted = kind == Kind.LAG3 ? 3 : kind == Kind.LAG7 ? 7 : -1;
      for (int lag = 0; lag < lags; lag++) {
        String where = "cell " + i + " " + kind + " at lag " + lag + ": r = " + r[lag][i];
        if (lag == planted) {
          // Constructed: cell = 2 q(d - lag) + e, var(2q) = 4 / (1 - 0.3^2) = 4.40, var(e) = 1,
          // so r = sqrt(4.40 / 5.40) = 0.90; 0.8 leaves room for sampling error.
          assertTrue(r[lag][i] > 0.8 && significant[lag][i], where);
        } else {
          // Elsewhere r = 0.90 x 0.3^|lag - planted| (AR(1) autocorrelation), at most 0.27 one day off,
          // or about 0 for unrelated cells (standard error about 1 / sqrt(1100) = 0.03).
          assertTrue(Math.abs(r[lag][i]) < 0.35, where);
        }
      }
    }
    assertTrue(checked >= 40, "planted and unrelated cells checked: " + checked);
  }

  @Test
  void requestsThatNoCellCouldAnswerFailBeforeReading() throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    CellWeights weights = allCells();
    DatedSeries driver = field.driver(-LEAD, day(NT - 1), 0);
    CorrelationSettings one = CorrelationSettings.of(CorrelationMethod.PEARSON, 3, 3, 1, 0.05);

    CorrelationInputException many = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(cache,
        cube, weights, 0, NT, TemporalStep.DAY, driver, CorrelationSettings.of(CorrelationMethod.PEARSON, 0, 5, 1, 0.05),
        Optional.empty()));
    assertEquals(CorrelationInputException.Kind.BAD_SETTING, many.kind());
    assertTrue(many.getMessage().contains("single lag"), many.getMessage());

    DatedSeries monthly = new DatedSeries(TemporalStep.MONTH, new LocalDate[] {START, START.plusMonths(1)},
        new double[] {1, 2});
    CorrelationInputException step = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(cache,
        cube, weights, 0, NT, TemporalStep.DAY, monthly, one, Optional.empty()));
    assertEquals(CorrelationInputException.Kind.STEP_MISMATCH, step.kind());

    DatedSeries empty = new DatedSeries(TemporalStep.DAY, new LocalDate[] {START, START.plusDays(1)},
        new double[] {Double.NaN, Double.NaN});
    CorrelationInputException none = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(cache,
        cube, weights, 0, NT, TemporalStep.DAY, empty, one, Optional.empty()));
    assertEquals(CorrelationInputException.Kind.EMPTY_SERIES, none.kind());
    assertTrue(none.getMessage().contains("driver"), none.getMessage());

    // Values over 3 days cannot be paired at lag 3 (LagCorrelator's rule: |lag| below the span).
    DatedSeries shortDriver = field.driver(100, 102, 0);
    CorrelationInputException range = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(cache,
        cube, weights, 0, NT, TemporalStep.DAY, shortDriver, one, Optional.empty()));
    assertEquals(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG, range.kind());
    assertTrue(range.getMessage().contains("2014-04-11 to 2014-04-13"), range.getMessage());

    CorrelationInputException noSteps = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(
        cache, cube, weights, 50, 50, TemporalStep.DAY, driver, one, Optional.empty()));
    assertEquals(CorrelationInputException.Kind.EMPTY_SERIES, noSteps.kind());

    assertThrows(IllegalArgumentException.class, () -> CorrelationMap.compute(cache, cube, weights, 0, NT + 1,
        TemporalStep.DAY, driver, one, Optional.empty()));
    CellWeights otherGrid = new CellWeights(NX + 1, new int[] {0}, new double[] {1}, new double[] {1}, 1);
    assertThrows(IllegalArgumentException.class, () -> CorrelationMap.compute(cache, cube, otherGrid, 0, NT,
        TemporalStep.DAY, driver, one, Optional.empty()));
  }

  /**
   * The shared-driver kernel alone against LagCorrelator on the same axis arrays, over both of its
   * paths (gap-free windows and windows with gaps), negative and positive lags and both settings
   * of the correction. Where the kernel defers (returns null) the reference row must be one it is
   * not meant to produce: invalid, with a note, or a refusal.
   */
  @Test
  void kernelEqualsLagCorrelatorOnBothPaths() {
    Random random = new Random(31);
    int n = 400;
    long[] secs = new long[n];
    for (int t = 0; t < n; t++) {
      secs[t] = START.plusDays(t).toEpochDay() * 86_400L;
    }
    MapPeriods periods = MapPeriods.of(secs, 0, n, TemporalStep.DAY);
    int fast = 0, deferred = 0, completeWindows = 0;
    for (int trial = 0; trial < 60; trial++) {
      boolean targetGaps = trial % 2 == 1, driverGaps = trial % 4 >= 2;
      int lag = new int[] {-5, 0, 1, 4, 30, 250}[trial % 6];
      boolean correct = trial % 5 != 0;
      CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, lag, lag, 1, 0.05, correct);
      // The driver covers days -20 .. 379, the target 0 .. 399 with, in some trials, a few values only.
      double[] d = new double[n];
      LocalDate[] dDates = new LocalDate[n];
      double phi = random.nextDouble() * 0.9;
      for (int i = 0; i < n; i++) {
        dDates[i] = START.plusDays(i - 20);
        d[i] = (i > 0 ? phi * d[i - 1] : 0) + random.nextGaussian();
      }
      double[] target = new double[n];
      int keep = trial % 7 == 6 ? 3 : n; // a few trials with only three values
      for (int i = 0; i < n; i++) {
        int partner = Math.max(0, Math.min(n - 1, i + 20 - lag)); // the driver value lag days earlier
        target[i] = i < keep ? 0.5 * d[partner] + random.nextGaussian() : Double.NaN;
        if (targetGaps && random.nextDouble() < 0.05) {
          target[i] = Double.NaN;
        }
        if (driverGaps && random.nextDouble() < 0.05) {
          d[i] = Double.NaN;
        }
      }
      DatedSeries driverSeries = new DatedSeries(TemporalStep.DAY, dDates, d);
      MapDriver driver;
      try {
        driver = MapDriver.prepare(periods, TemporalStep.DAY, driverSeries, settings);
      } catch (CorrelationInputException e) {
        continue;
      }
      double[] axis = driver.blankAxis();
      for (int p = 0; p < n; p++) {
        axis[driver.axisIndex(p)] = target[p];
      }
      double[] axisCopy = axis.clone();
      LagRow reference;
      try {
        reference = new LagCorrelator(settings).compute(axisCopy, driver.raw()).rows().get(0);
      } catch (CorrelationInputException e) {
        reference = null;
      }
      LagRow row = MapLagKernel.pearson(axis, driver, settings);
      if (row == null) {
        deferred++;
        assertTrue(reference == null || !reference.valid() || !reference.note().isEmpty(), "trial " + trial);
      } else {
        fast++;
        assertNotNull(reference, "trial " + trial);
        // Reference: LagCorrelator on the same arrays (the kernel claims its formulas, term for term).
        assertSameRow(reference, row, "trial " + trial);
        if (!targetGaps && !driverGaps) {
          completeWindows++;
        }
      }
    }
    assertTrue(fast >= 30 && deferred >= 5 && completeWindows >= 8,
        "fast " + fast + ", deferred " + deferred + ", gap-free " + completeWindows);
  }

  /** The native step to period cut, against TemporalAggregation's own cut on the same axis. */
  @Test
  void periodsAreTemporalAggregationsPeriods() {
    long[] secs = new long[NT];
    for (int t = 0; t < NT; t++) {
      secs[t] = START.plusDays(day(t)).toEpochDay() * 86_400L;
    }
    for (TemporalStep step : TemporalStep.values()) {
      MapPeriods periods = MapPeriods.of(secs, 17, 1013, step);
      long[] part = Arrays.copyOfRange(secs, 17, 1013);
      double[] counting = new double[part.length];
      Arrays.fill(counting, 1);
      StepSeries reference = TemporalAggregation.aggregate(new DailySeries(part, counting, counting,
          new int[part.length]), step, SpatialStatistic.of(SpatialStatistic.Kind.SUM));
      assertEquals(reference.size(), periods.size(), step.name());
      List<LocalDate> starts = new ArrayList<>(Arrays.asList(periods.dates()));
      assertEquals(Arrays.asList(reference.start()), starts, step.name());
      for (int p = 0; p < periods.size(); p++) {
        // Reference: stepsExpected, the native steps TemporalAggregation put in the period.
        assertEquals(reference.stepsExpected()[p], periods.endStep(p) - periods.firstStep(p), step + " period " + p);
      }
    }
  }
}
