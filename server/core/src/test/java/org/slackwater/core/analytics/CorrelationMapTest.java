package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
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
import org.slackwater.core.analytics.correlation.CorrelationResult;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.DatedSeries;
import org.slackwater.core.analytics.correlation.Deseasonalize;
import org.slackwater.core.analytics.correlation.LagCorrelator;
import org.slackwater.core.analytics.correlation.LagRow;
import org.slackwater.core.analytics.correlation.LagStatistics;
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
 * {@link TemporalAggregation} and {@link Deseasonalize}, at every lag, with {@link
 * CorrelationResult}'s own choice of the best lag and its Bonferroni test; Hipparchus' correlation
 * of the paired values at the reported lag as a second, independent reference for r.
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

  // ---------------------------------------------------------------------------------------------
  // The reference: the cell's series through LaggedCorrelation, and the choice among its lags

  /**
   * Rows are formed from sums computed in a different order than LagCorrelator's (one pass over a
   * band for every lag, prefix differences, gap corrections), so agreement is to rounding, not to
   * the bit: 1e-12 relative (our tolerance; double rounding leaves about 1e-15). r, t and the lag-1
   * autocorrelations can lie arbitrarily close to 0, where a relative bound means nothing, so
   * they are compared relative to their scale 1 at least. A p-value far in the tail magnifies the
   * relative error of t by its condition number |t p'(t) / p| (about 2 |ln p| there, since p falls
   * like exp(-t^2 / 2)): p is compared relative to that.
   */
  private static final double TOLERANCE = 1e-12;

  /** LaggedCorrelation's result for the cell, or null where it refuses the cell (message in refusal[0]). */
  private static CorrelationResult reference(DatedSeries cell, DatedSeries driver, CorrelationSettings settings,
      Optional<Deseasonalize> deseasonalize, String[] refusal) {
    try {
      DatedSeries target = deseasonalize.isPresent() ? deseasonalize.get().apply(cell) : cell;
      return LaggedCorrelation.compute(target, driver, settings);
    } catch (CorrelationInputException e) {
      refusal[0] = e.getMessage();
      return null;
    }
  }

  /**
   * The row a map must report from a whole result, written out here from the documented rule:
   * CorrelationResult.best() (the rule of correlate and rank drivers), else the lag with the most
   * pairs, equal counts to the smaller |lag| and then the positive lag.
   */
  private static LagRow reported(CorrelationResult result) {
    Optional<LagRow> best = result.best();
    if (best.isPresent()) {
      return best.get();
    }
    LagRow pick = null;
    for (LagRow row : result.rows()) {
      if (pick == null || row.n() > pick.n() || (row.n() == pick.n() && (Math.abs(row.lag()) < Math.abs(pick.lag())
          || (Math.abs(row.lag()) == Math.abs(pick.lag()) && row.lag() > pick.lag())))) {
        pick = row;
      }
    }
    return pick;
  }

  private static void assertClose(double expected, double actual, double scale, String what) {
    assertClose(expected, actual, scale, 1, what);
  }

  private static void assertClose(double expected, double actual, double scale, double condition, String what) {
    if (Double.isNaN(expected)) {
      assertTrue(Double.isNaN(actual), what + ": expected NaN, got " + actual);
    } else {
      assertEquals(expected, actual, TOLERANCE * condition * Math.max(Math.abs(expected), scale), what);
    }
  }

  /** Field by field, counts and notes exactly, numbers within {@link #TOLERANCE}. */
  static void assertSameRow(LagRow expected, LagRow actual, String where) {
    assertEquals(expected.lag(), actual.lag(), where + " lag");
    assertEquals(expected.n(), actual.n(), where + " n");
    assertClose(expected.r(), actual.r(), 1, where + " r");
    assertClose(expected.r1Target(), actual.r1Target(), 1, where + " r1 target");
    assertClose(expected.r1Driver(), actual.r1Driver(), 1, where + " r1 driver");
    assertClose(expected.nEffective(), actual.nEffective(), 0, where + " n_effective");
    assertClose(expected.t(), actual.t(), 1, where + " t");
    double p = expected.pValue();
    double condition = p > 0 ? Math.max(1, 2 * Math.abs(Math.log(p))) : 1;
    assertClose(p, actual.pValue(), 0, condition, where + " p");
    assertEquals(expected.significant(), actual.significant(), where + " significant");
    assertEquals(expected.note(), actual.note(), where + " note");
  }

  /**
   * Computes the map and checks every cell against the reference; returns how many entries were
   * valid, so callers can make sure the comparison was not vacuous.
   */
  private int checkEveryCell(Field field, CubeEntry cube, CellWeights weights, int from, int to, TemporalStep step,
      DatedSeries driver, CorrelationSettings settings, Optional<Deseasonalize> deseasonalize) throws Exception {
    List<CellCorrelation> entries = CorrelationMap.compute(cache, cube, weights, from, to, step, driver, settings,
        deseasonalize);
    assertEquals(weights.size(), entries.size(), "one entry per weight entry");
    int valid = 0;
    for (int i = 0; i < weights.size(); i++) {
      int y = weights.row(i), x = weights.column(i);
      String where = "cell (" + y + ", " + x + ") " + kind(y, x);
      DatedSeries cell = cellSeries(field, cube, y, x, from, to, step);
      String[] refusal = new String[1];
      CorrelationResult result = reference(cell, driver, settings, deseasonalize, refusal);
      CellCorrelation got = entries.get(i);
      assertEquals(settings.lagCount(), got.lagsTested(), where + " lags tested");
      if (result == null) {
        // LaggedCorrelation refuses the cell: an invalid row at the first lag carrying its message.
        assertSameRow(new LagRow(settings.minLag(), 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
            Double.NaN, false, refusal[0]), got.row(), where);
        assertEquals(0, got.validLags(), where);
        assertFalse(got.significantAfterBonferroni(), where);
        continue;
      }
      // Reference 1: LaggedCorrelation on the cell's own series (the definition of the map) and
      // CorrelationResult's own best-lag and Bonferroni answers.
      assertSameRow(reported(result), got.row(), where);
      assertEquals(result.validLagCount(), got.validLags(), where + " valid lags");
      assertEquals(result.bestSignificantAfterBonferroni(), got.significantAfterBonferroni(), where + " Bonferroni");
      if (got.row().valid()) {
        valid++;
        // Reference 2: Hipparchus on the complete pairs at the reported lag, as Alignment pairs them.
        DatedSeries target = deseasonalize.isPresent() ? deseasonalize.get().apply(cell) : cell;
        LaggedPairs pairs = Alignment.pairsAt(target, driver, got.row().lag());
        assertEquals(pairs.size(), got.row().n(), where + " pairs");
        double r = settings.method() == CorrelationMethod.PEARSON
            ? new PearsonsCorrelation().correlation(pairs.target(), pairs.driver())
            : new SpearmansCorrelation().correlation(pairs.target(), pairs.driver());
        assertEquals(r, got.row().r(), 1e-9, where + " r against Hipparchus");
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
  void oneLagMatchesLaggedCorrelationCellByCell(int lag, int gapEvery, boolean correct, int from, int to)
      throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    // The driver starts before and ends before the cube; the periods cut chunks.
    DatedSeries driver = field.driver(-30, day(NT - 1) - 50, gapEvery);
    CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, lag, lag, 1, 0.05, correct);
    int valid = checkEveryCell(field, cube, allCells(), from, to, TemporalStep.DAY, driver, settings, Optional.empty());
    assertTrue(valid >= 40, "most cells are correlated: " + valid);
  }

  static Stream<Arguments> manyLagCases() {
    return Stream.of(
        // first lag, last lag, lag step, driver gaps every n days (0 = none: the shared pass; else
        // the exact path), correction, native steps [from, to)
        Arguments.of(-15, 15, 1, 0, true, 17, 1013),
        Arguments.of(0, 30, 3, 0, true, 310, NT),
        Arguments.of(-40, -10, 5, 0, false, 17, NT),
        Arguments.of(-5, 9, 2, 37, true, 310, 1013),
        Arguments.of(1, 64, 1, 0, true, 0, NT));
  }

  @ParameterizedTest(name = "lags {0} to {1} step {2}, driver gap every {3}, correction {4}, steps {5} to {6}")
  @MethodSource("manyLagCases")
  void manyLagsReportEachCellsBestLag(int first, int last, int by, int gapEvery, boolean correct, int from, int to)
      throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    DatedSeries driver = field.driver(-LEAD, day(NT - 1) - 20, gapEvery);
    CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, first, last, by, 0.05, correct);
    int valid = checkEveryCell(field, cube, allCells(), from, to, TemporalStep.DAY, driver, settings, Optional.empty());
    assertTrue(valid >= 40, "most cells are correlated: " + valid);
  }

  static Stream<Arguments> aggregatedCases() {
    return Stream.of(
        // step, method, deseasonalize (null = none), first lag, last lag
        Arguments.of(TemporalStep.WEEK, CorrelationMethod.SPEARMAN, null, 1, 1),
        Arguments.of(TemporalStep.WEEK, CorrelationMethod.SPEARMAN, null, -2, 4),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.PEARSON, null, 1, 1),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.PEARSON, Deseasonalize.anomalies(), 1, 1),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.PEARSON, Deseasonalize.anomalies(), 0, 3),
        Arguments.of(TemporalStep.MONTH, CorrelationMethod.SPEARMAN, Deseasonalize.standardizedAnomalies(), 2, 2),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.PEARSON, Deseasonalize.anomalies(), 3, 3),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.PEARSON,
            Deseasonalize.anomalies().withBaseline(START, START.plusDays(700)), 0, 10),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.SPEARMAN, Deseasonalize.anomalies().withHalfWindowDays(0), 7, 7),
        Arguments.of(TemporalStep.DAY, CorrelationMethod.SPEARMAN, null, 2, 8));
  }

  @ParameterizedTest(name = "{0} {1} deseasonalized {2} lags {3} to {4}")
  @MethodSource("aggregatedCases")
  void aggregatedAndDeseasonalizedMapsMatchCellByCell(TemporalStep step, CorrelationMethod method, Deseasonalize des,
      int first, int last) throws Exception {
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
    CorrelationSettings settings = CorrelationSettings.of(method, first, last, 1, 0.05);
    // Steps [17, 1013) start and end inside a week and a month: partial periods at both ends.
    int valid = checkEveryCell(field, cube, allCells(), 17, 1013, step, driver, settings, deseasonalize);
    assertTrue(valid >= 40, "most cells are correlated: " + valid);
  }

  @Test
  void missingAndDegenerateCellsGiveTheReferenceInvalidRows() throws Exception {
    Field field = Field.make(false);
    CubeEntry cube = ingest(field);
    DatedSeries driver = field.driver(-LEAD, day(NT - 1), 0);
    // A region of some cells only, in three tiles, the land and special cells among them.
    int[] indices = {0, 1, 2, 5, 9, 12, 16, 23, 30, 40, 61, 62};
    CellWeights weights = cells(indices);
    for (CorrelationSettings settings : List.of(CorrelationSettings.of(CorrelationMethod.PEARSON, 7, 7, 1, 0.05),
        CorrelationSettings.of(CorrelationMethod.PEARSON, 5, 9, 1, 0.05))) {
      for (int[] period : new int[][] {{0, NT}, {600, NT}}) {
        List<CellCorrelation> entries = CorrelationMap.compute(cache, cube, weights, period[0], period[1],
            TemporalStep.DAY, driver, settings, Optional.empty());
        for (int i = 0; i < indices.length; i++) {
          int y = indices[i] / NX, x = indices[i] % NX;
          String where = "cell (" + y + ", " + x + ") " + kind(y, x) + " from step " + period[0] + ", lags "
              + settings.minLag() + " to " + settings.maxLag();
          LagRow got = entries.get(i).row();
          String[] refusal = new String[1];
          CorrelationResult result = reference(cellSeries(field, cube, y, x, period[0], period[1], TemporalStep.DAY),
              driver, settings, Optional.empty(), refusal);
          if (result != null) {
            assertSameRow(reported(result), got, where);
          }
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
                assertEquals(refusal[0], got.note(), where);
                assertTrue(got.note().startsWith("lag range too long"), got.note());
              }
            }
            // Constant: r undefined; sparse: 3 values on days 200, 205 and 210, 3 pairs (fewer than MIN_PAIRS).
            case CONSTANT, SPARSE -> {
              assertFalse(got.valid(), where);
              assertEquals(0, entries.get(i).validLags(), where);
              assertFalse(got.note().isEmpty(), where);
            }
            default -> assertTrue(got.valid(), where);
          }
        }
      }
    }
    // Deseasonalizing an empty cell fails in the baseline, before any correlation: its note says so.
    List<CellCorrelation> entries = CorrelationMap.compute(cache, cube, cells(new int[] {2}), 0, NT, TemporalStep.DAY,
        driver, CorrelationSettings.of(CorrelationMethod.PEARSON, 7, 7, 1, 0.05), Optional.of(Deseasonalize.anomalies()));
    assertFalse(entries.get(0).row().valid());
    assertTrue(entries.get(0).row().note().contains("baseline"), entries.get(0).row().note());
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
      List<CellCorrelation> entries = CorrelationMap.compute(cache, cube, weights, 0, NT, TemporalStep.DAY, driver,
          CorrelationSettings.of(CorrelationMethod.PEARSON, lag, lag, 1, 0.05), Optional.empty());
      r[lag] = entries.stream().mapToDouble(e -> e.row().r()).toArray();
      significant[lag] = new boolean[entries.size()];
      for (int i = 0; i < entries.size(); i++) {
        significant[lag][i] = entries.get(i).row().significant();
      }
    }
    List<CellCorrelation> all = CorrelationMap.compute(cache, cube, weights, 0, NT, TemporalStep.DAY, driver,
        CorrelationSettings.of(CorrelationMethod.PEARSON, 0, lags - 1, 1, 0.05), Optional.empty());
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
      // All eleven lags in one map: the planted lag wins, with the r the one-lag map gives there,
      // and survives the Bonferroni correction over the 11 lags (r = 0.9 over ~1000 pairs).
      LagRow best = all.get(i).row();
      if (planted >= 0) {
        assertEquals(planted, best.lag(), "cell " + i);
        assertTrue(all.get(i).significantAfterBonferroni(), "cell " + i);
      }
      assertEquals(11, all.get(i).validLags(), "cell " + i);
      assertClose(r[best.lag()][i], best.r(), 1, "cell " + i + " r of the best lag");
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
    // With many lags the largest |lag| counts, and the message names the range.
    DatedSeries tenDays = field.driver(100, 109, 0);
    CorrelationInputException lags = assertThrows(CorrelationInputException.class, () -> CorrelationMap.compute(cache,
        cube, weights, 0, NT, TemporalStep.DAY, tenDays, CorrelationSettings.of(CorrelationMethod.PEARSON, -12, 2, 1,
            0.05), Optional.empty()));
    assertEquals(CorrelationInputException.Kind.LAG_RANGE_TOO_LONG, lags.kind());
    assertTrue(lags.getMessage().contains("lags -12 to 2 reach 12 days") && lags.getMessage().contains("below 10"),
        lags.getMessage());

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
   * The all-lags kernel alone against LagCorrelator on the same axis arrays, at every lag: cells
   * without gaps, with scattered, clustered and paired gaps, starting late or ending early, with a
   * few values only, constant; lags negative and positive, with steps, windows cut by the driver's
   * ends; both settings of the correction; vector, fused and plain multiply-adds. Every lag's row from the
   * kernel's sums must equal LagCorrelator's within the tolerance, and the r the kernel ranks lags
   * by must be that row's r.
   */
  /** The arithmetics this JVM runs, each tried by the kernel tests. */
  private static final List<MapLagKernel.Arithmetic> ARITHMETICS = Arrays.stream(MapLagKernel.Arithmetic.values())
      .filter(MapLagKernel.Arithmetic::available).toList();

  @Test
  void kernelEqualsLagCorrelatorAtEveryLag() {
    Random random = new Random(31);
    int n = 400;
    long[] secs = new long[n];
    for (int t = 0; t < n; t++) {
      secs[t] = START.plusDays(t).toEpochDay() * 86_400L;
    }
    MapPeriods periods = MapPeriods.of(secs, 0, n, TemporalStep.DAY);
    int[][] ranges = {{-5, 5, 1}, {0, 40, 3}, {-30, -20, 2}, {1, 1, 1}, {-60, 60, 7}, {250, 252, 1}, {-3, 33, 1}};
    int width = 12;
    int rows = 0, lagsChecked = 0, gappedRows = 0, refusedLanes = 0;
    for (int trial = 0; trial < 28; trial++) {
      int[] range = ranges[trial % ranges.length];
      boolean correct = trial % 5 != 0;
      CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, range[0], range[1], range[2],
          0.05, correct);
      // The driver covers days -20 .. 379, or in some trials days 40 .. 330 only.
      boolean shortDriver = trial % 3 == 2;
      int d0 = shortDriver ? 40 : -20, dn = shortDriver ? 291 : n;
      double[] d = new double[dn];
      LocalDate[] dDates = new LocalDate[dn];
      double phi = random.nextDouble() * 0.9;
      for (int i = 0; i < dn; i++) {
        dDates[i] = START.plusDays(d0 + i);
        d[i] = 5 + (i > 0 ? phi * (d[i - 1] - 5) : 0) + random.nextGaussian();
      }
      MapDriver driver;
      try {
        driver = MapDriver.prepare(periods, TemporalStep.DAY, new DatedSeries(TemporalStep.DAY, dDates, d), settings);
      } catch (CorrelationInputException e) {
        continue;
      }
      int start = driver.axisIndex(0);
      // Every arithmetic this JVM has: vector and fused as the map runs here, and plain.
      MapLagKernel.Arithmetic arithmetic = ARITHMETICS.get(trial % ARITHMETICS.size());
      MapLagKernel kernel = new MapLagKernel(driver, 16, n, start, arithmetic);
      kernel.begin(width); // fewer lanes than the kernel holds, as for the last band of a tile
      double[][] lanes = new double[width][n];
      for (int j = 0; j < width; j++) {
        for (int p = 0; p < n; p++) {
          int partner = p - d0 - (range[0] + range[1]) / 2; // the driver value near the middle lag earlier
          double signal = partner >= 0 && partner < dn ? d[partner] : 5;
          double v = 3 + 0.6 * signal + random.nextGaussian();
          lanes[j][p] = switch (j) {
            case 0, 8 -> v;
            case 1 -> random.nextDouble() < 0.05 ? Double.NaN : v;
            case 2 -> random.nextDouble() < 0.4 ? Double.NaN : v;
            case 3 -> p < 100 ? Double.NaN : v;
            case 4 -> p > 250 || p % 17 == 5 ? Double.NaN : v;
            // A few values only; with the short driver, values at both ends that no lag pairs.
            case 5 -> (shortDriver ? p <= 4 || p >= 395 : p == 10 || p == 11 || p == 300) ? v : Double.NaN;
            case 6 -> (p / 10) % 4 == 1 ? Double.NaN : v;
            case 7 -> 2.5;
            case 9 -> p % 9 == 4 || p % 9 == 5 ? Double.NaN : v;
            case 10 -> p % 60 == 7 ? v : Double.NaN;
            default -> p < 330 && p > 40 ? 1e6 + v : Double.NaN; // far from 0: centring matters
          };
          kernel.set(p, j, lanes[j][p]);
        }
      }
      kernel.scan(width);
      boolean[] fast = new boolean[16];
      int spanD = driver.last() - driver.first() + 1;
      for (int j = 0; j < width; j++) {
        // The map's rule: cells whose span the lags outreach go to the reference for its message.
        fast[j] = kernel.count(j) > 0 && settings.maxAbsLag() < Math.min(kernel.span(j), spanD);
      }
      kernel.prepare(fast);
      int lagCount = settings.lagCount();
      double[][] cross = new double[width][lagCount];
      double[][] rank = new double[width][lagCount];
      int[][] pairs = new int[width][lagCount];
      for (double[] c : cross) {
        Arrays.fill(c, Double.NaN);
      }
      kernel.correlate((j, l, r, np, c) -> {
        cross[j][l] = c;
        rank[j][l] = r;
        pairs[j][l] = np;
      });
      for (int j = 0; j < width; j++) {
        if (!fast[j]) {
          assertTrue(Double.isNaN(cross[j][0]), "trial " + trial + " lane " + j + " is not reported");
          continue;
        }
        double[] axis = driver.blankAxis();
        for (int p = 0; p < n; p++) {
          axis[start + p] = lanes[j][p];
        }
        CorrelationResult reference;
        try {
          reference = new LagCorrelator(settings).compute(axis, driver.raw());
        } catch (CorrelationInputException e) {
          // No pair at any lag: the kernel must see none either.
          assertEquals(CorrelationInputException.Kind.NO_OVERLAP, e.kind(), "trial " + trial + " lane " + j);
          assertEquals(0, Arrays.stream(pairs[j]).sum(), "trial " + trial + " lane " + j);
          refusedLanes++;
          continue;
        }
        for (int l = 0; l < lagCount; l++) {
          String where = "trial " + trial + " lane " + j + " lag " + settings.lags()[l];
          LagRow row = LagStatistics.row(settings.lags()[l], kernel.sums(j, l, cross[j][l]), settings);
          assertSameRow(reference.rows().get(l), row, where);
          assertEquals(row.n(), pairs[j][l], where + " pairs");
          assertEquals(row.r(), rank[j][l], 0.0, where + " ranking r"); // the same arithmetic on the same sums
          lagsChecked++;
          rows += row.valid() ? 1 : 0;
          gappedRows += row.valid() && kernel.count(j) < kernel.span(j) ? 1 : 0;
        }
      }
    }
    assertTrue(lagsChecked > 3000 && rows > 2000 && gappedRows > 1000 && refusedLanes > 0,
        "lags " + lagsChecked + ", valid " + rows + ", valid with gaps " + gappedRows + ", no overlap " + refusedLanes);
  }

  /**
   * The vector loops form each lane's sum as the fused scalar loop does (one fused multiply-add per
   * row, in row order), so their cross products must equal it bit for bit: bands of 16 lanes (8-lane
   * blocks) and 13 (a 4-lane tail and padding lanes), lag groups of 4, 3 and 1 lags (37 lags run as
   * 32 + 5), and a single lag. The build runs tests with {@code --add-modules=jdk.incubator.vector}
   * (parent pom), so VECTOR must be there; a JVM without it runs FUSED instead.
   */
  @Test
  void vectorCrossProductsEqualFusedBitForBit() {
    assertTrue(MapLagKernel.Arithmetic.VECTOR.available(),
        "tests run with --add-modules=jdk.incubator.vector on a processor with 256-bit vectors and FMA");
    Random random = new Random(7);
    int n = 700;
    long[] secs = new long[n];
    for (int t = 0; t < n; t++) {
      secs[t] = START.plusDays(t).toEpochDay() * 86_400L;
    }
    MapPeriods periods = MapPeriods.of(secs, 0, n, TemporalStep.DAY);
    LocalDate[] dDates = new LocalDate[n];
    double[] d = new double[n];
    for (int i = 0; i < n; i++) {
      dDates[i] = START.plusDays(i);
      d[i] = 2 + random.nextGaussian();
    }
    int compared = 0;
    for (int[] range : new int[][] {{-3, 33, 1}, {0, 60, 2}, {5, 5, 1}, {-10, -8, 1}}) {
      CorrelationSettings settings = new CorrelationSettings(CorrelationMethod.PEARSON, range[0], range[1], range[2],
          0.05, true);
      MapDriver driver = MapDriver.prepare(periods, TemporalStep.DAY, new DatedSeries(TemporalStep.DAY, dDates, d),
          settings);
      for (int lanes : new int[] {16, 13}) {
        double[][] values = new double[lanes][n];
        for (double[] lane : values) {
          for (int p = 0; p < n; p++) {
            lane[p] = random.nextDouble() < 0.1 ? Double.NaN : 1 + random.nextGaussian();
          }
        }
        double[][] fused = crossProducts(driver, settings, values, MapLagKernel.Arithmetic.FUSED);
        double[][] vector = crossProducts(driver, settings, values, MapLagKernel.Arithmetic.VECTOR);
        for (int j = 0; j < lanes; j++) {
          for (int l = 0; l < settings.lagCount(); l++) {
            String where = "lags " + Arrays.toString(range) + " lanes " + lanes + " lane " + j + " lag index " + l;
            assertFalse(Double.isNaN(fused[j][l]), where);
            assertEquals(Double.doubleToLongBits(fused[j][l]), Double.doubleToLongBits(vector[j][l]), where);
            compared++;
          }
        }
      }
    }
    assertEquals((16 + 13) * (37 + 31 + 1 + 3), compared, "cross products compared");
  }

  private static double[][] crossProducts(MapDriver driver, CorrelationSettings settings, double[][] values,
      MapLagKernel.Arithmetic arithmetic) {
    int lanes = values.length, n = values[0].length;
    MapLagKernel kernel = new MapLagKernel(driver, 16, n, driver.axisIndex(0), arithmetic);
    kernel.begin(lanes);
    for (int j = 0; j < lanes; j++) {
      for (int p = 0; p < n; p++) {
        kernel.set(p, j, values[j][p]);
      }
    }
    kernel.scan(lanes);
    boolean[] fast = new boolean[16];
    Arrays.fill(fast, 0, lanes, true);
    kernel.prepare(fast);
    double[][] cross = new double[lanes][settings.lagCount()];
    for (double[] c : cross) {
      Arrays.fill(c, Double.NaN);
    }
    kernel.correlate((j, l, r, pairs, c) -> cross[j][l] = c);
    return cross;
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

  /** The documented memory bound of a worker's kernel, for axes from a year to centuries of days. */
  @Test
  void aWorkersKernelStaysWithinItsBudget() {
    for (int rows : new int[] {365, 7305, 36_525, 200_000}) {
      for (int lags : new int[] {1, 31, 400}) {
        int width = CorrelationMap.width(rows, lags);
        String where = rows + " rows, " + lags + " lags: width " + width;
        assertTrue(width >= 4 && width <= CorrelationMap.MAX_WIDTH && width % 4 == 0, where);
        // Within BLOCK_VALUES, unless even 4 cells exceed it (then 4 cells, the documented fallback).
        assertTrue(MapLagKernel.footprint(width, rows, lags) <= CorrelationMap.BLOCK_VALUES || width == 4, where);
        if (width < CorrelationMap.MAX_WIDTH) {
          assertTrue(MapLagKernel.footprint(width + 4, rows, lags) > CorrelationMap.BLOCK_VALUES, where + " is the widest");
        }
      }
    }
    // 20 years of days and 31 lags, the benchmark's case: the widest band.
    assertEquals(CorrelationMap.MAX_WIDTH, CorrelationMap.width(7305, 31));
  }
}
