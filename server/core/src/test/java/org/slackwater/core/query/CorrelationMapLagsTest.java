package org.slackwater.core.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.hipparchus.distribution.continuous.TDistribution;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.hipparchus.stat.correlation.SpearmansCorrelation;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.ingest.Ingestor;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.query.QueryException;

/**
 * {@code map correlation ... lags a to b} from query text to table on a field with planted lags:
 * the invented Wrenmouth estuary's chlorophyll on a 6 x 6 grid over the "Outer Bay", 546 days from
 * 2014-01-01, against the Harle River discharge over the "Harle Watershed" (one AR(1) series, the
 * same in every cell of its own grid, so that its area mean is that series). Cells follow the
 * discharge 2, 5 or 9 days later or lead it by 4 days (plus noise; even rows lose about a tenth of
 * their days), are unrelated, or are land. Each cell's best lag must be the planted one and equal
 * the largest |r| of Hipparchus over the cell's shifted pairs, built here from the values this
 * source delivered; and the errors of the lag clause carry its line and column.
 */
class CorrelationMapLagsTest {
  private static final ChunkLayout LAYOUT = new ChunkLayout(40, 4, 4);
  private static final LocalDate START = LocalDate.of(2014, 1, 1);
  private static final int DAYS = 546; // 2014-01-01 to 2015-06-30
  private static final int N = 6;
  /** The discharge starts and ends this many days beyond the cube, so every planted shift has a value. */
  private static final int LEAD = 20;
  private static final String HEAD = "map correlation of chl over \"Outer Bay\" with flow over \"Harle Watershed\""
      + " from 2014-01-01 to 2015-06-30 by day";

  enum Kind { LAG2, LAG5, LAG9, LEADS4, UNRELATED, LAND }

  static Kind kind(int y, int x) {
    return Kind.values()[(y * N + x + y) % Kind.values().length];
  }

  /** The planted lag (positive: the discharge leads), or null. */
  static Integer planted(Kind kind) {
    return switch (kind) {
      case LAG2 -> 2;
      case LAG5 -> 5;
      case LAG9 -> 9;
      case LEADS4 -> -4;
      default -> null;
    };
  }

  @TempDir Path dir;
  private Workspace ws;
  private float[] flow; // by day
  private float[] chl; // (t, y, x)

  @BeforeEach
  void setUp() throws Exception {
    Random random = new Random(20150630L);
    double[] q = new double[LEAD + DAYS + LEAD];
    for (int i = 1; i < q.length; i++) {
      q[i] = 0.3 * q[i - 1] + random.nextGaussian(); // AR(1), phi = 0.3: r falls to 0.3 of its peak one day off
    }
    flow = new float[DAYS];
    for (int t = 0; t < DAYS; t++) {
      flow[t] = (float) (50 + 10 * q[LEAD + t]);
    }
    chl = new float[DAYS * N * N];
    double[] unrelated = new double[N * N];
    for (int t = 0; t < DAYS; t++) {
      for (int y = 0; y < N; y++) {
        for (int x = 0; x < N; x++) {
          int c = y * N + x;
          unrelated[c] = 0.5 * unrelated[c] + random.nextGaussian();
          boolean gap = y % 2 == 0 && random.nextDouble() < 0.1;
          Integer lag = planted(kind(y, x));
          double v = kind(y, x) == Kind.LAND || gap ? Double.NaN
              : kind(y, x) == Kind.UNRELATED ? 8 + unrelated[c]
              : 8 + 2 * q[LEAD + t - lag] + random.nextGaussian();
          chl[t * N * N + c] = (float) v;
        }
      }
    }
    ws = Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, LAYOUT);
    Ingestor ingestor = new Ingestor(List.of(new Synthetic()), ws.catalog(), ws.store(), LAYOUT);
    ingestor.ingest(Files.writeString(dir.resolve("chl.synthetic"), "chl\n"), Optional.empty());
    ingestor.ingest(Files.writeString(dir.resolve("flow.synthetic"), "flow\n"), Optional.empty());
    ws.catalog().putRegion(GeoJsonRegions.parseNamed("Outer Bay", """
        {"type":"Polygon","coordinates":[[[-31.2,43.9],[-30.9,43.9],[-30.9,44.2],[-31.2,44.2],[-31.2,43.9]]]}"""));
    ws.catalog().putRegion(GeoJsonRegions.parseNamed("Harle Watershed", """
        {"type":"Polygon","coordinates":[[[-31.8,44.4],[-31.4,44.4],[-31.4,44.8],[-31.8,44.8],[-31.8,44.4]]]}"""));
  }

  @AfterEach
  void tearDown() {
    ws.close(); // closes the allocator last: a leaked Arrow buffer fails the test
  }

  /** The cell's values at t paired with the discharge at t - lag, both as stored (float), pairs with a value only. */
  private double[][] pairs(int y, int x, int lag) {
    List<double[]> p = new ArrayList<>();
    for (int t = Math.max(0, lag); t < Math.min(DAYS, DAYS + lag); t++) {
      float v = chl[t * N * N + y * N + x];
      if (!Float.isNaN(v)) {
        p.add(new double[] {v, flow[t - lag]});
      }
    }
    return new double[][] {p.stream().mapToDouble(a -> a[0]).toArray(), p.stream().mapToDouble(a -> a[1]).toArray()};
  }

  private double pearson(int y, int x, int lag) {
    double[][] p = pairs(y, x, lag);
    return new PearsonsCorrelation().correlation(p[0], p[1]);
  }

  /** The lag of the largest Hipparchus |r| among {@code lags} (all distinct |r| on this noisy field). */
  private int argmax(int y, int x, int[] lags) {
    int best = lags[0];
    for (int lag : lags) {
      if (Math.abs(pearson(y, x, lag)) > Math.abs(pearson(y, x, best))) {
        best = lag;
      }
    }
    return best;
  }

  private static int[] range(int first, int last, int step) {
    return java.util.stream.IntStream.iterate(first, l -> l <= last, l -> l + step).toArray();
  }

  @Test
  void eachCellsBestLagIsThePlantedOneAndHipparchusLargestR() {
    ResultTable t = ws.engine().run(HEAD + " lags -6 to 12 days").get(0);
    assertEquals(List.of("row", "column", "lat", "lon", "fraction_inside", "best_lag", "r", "n", "n_effective", "p_value",
        "significant", "significant_after_bonferroni", "valid_lags"), t.columns().stream().map(Column::name).toList());
    assertEquals("-6 to 12 day step 1, 19 lags (positive: the driver leads)", t.metadata().get("lags"));
    assertEquals(N * N, t.rowCount());
    int[] lags = range(-6, 12, 1);
    Column.Longs rows = (Column.Longs) t.column("row"), cols = (Column.Longs) t.column("column");
    Column.Longs best = (Column.Longs) t.column("best_lag"), n = (Column.Longs) t.column("n");
    Column.Longs valid = (Column.Longs) t.column("valid_lags");
    Column.Doubles r = (Column.Doubles) t.column("r"), p = (Column.Doubles) t.column("p_value");
    Column.Doubles neff = (Column.Doubles) t.column("n_effective");
    Column.Strings significant = (Column.Strings) t.column("significant");
    Column.Strings bonferroni = (Column.Strings) t.column("significant_after_bonferroni");
    int planted = 0;
    for (int i = 0; i < t.rowCount(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      String where = "cell (" + y + ", " + x + ") " + kind(y, x);
      if (kind(y, x) == Kind.LAND) {
        assertTrue(Double.isNaN(r.get(i)), where);
        assertNull(significant.get(i), where);
        assertEquals(0, valid.get(i), where);
        continue;
      }
      Integer lag = planted(kind(y, x));
      if (lag != null) {
        assertEquals(lag, (int) best.get(i), where + " planted lag");
        planted++;
      }
      assertEquals(argmax(y, x, lags), best.get(i), where + " largest |r| of Hipparchus");
      // Hipparchus on the shifted pairs; the map sums in another order, so to rounding.
      assertEquals(pearson(y, x, (int) best.get(i)), r.get(i), 1e-9, where);
      assertEquals(pairs(y, x, (int) best.get(i))[0].length, n.get(i), where + " pairs");
      assertEquals(lags.length, valid.get(i), where);
      // Student's t with N_eff - 2 degrees of freedom (Hipparchus' TDistribution), as correlate computes it.
      double tStat = r.get(i) * Math.sqrt((neff.get(i) - 2) / (1 - r.get(i) * r.get(i)));
      assertEquals(2 * new TDistribution(neff.get(i) - 2).cumulativeProbability(-Math.abs(tStat)), p.get(i),
          1e-12 + 1e-9 * p.get(i), where);
      assertEquals(p.get(i) <= 0.05 ? "yes" : "no", significant.get(i), where);
      // Bonferroni over the valid lags: alpha / 19.
      assertEquals(p.get(i) <= 0.05 / lags.length ? "yes" : "no", bonferroni.get(i), where);
    }
    assertEquals(24, planted, "planted cells checked");
  }

  @Test
  void spearmanFindsThePlantedLagsWithHipparchusRankCorrelation() {
    ResultTable t = ws.engine().run(HEAD + " lags -6 to 12 days using spearman").get(0);
    assertEquals("spearman", t.metadata().get("method"));
    Column.Longs rows = (Column.Longs) t.column("row"), cols = (Column.Longs) t.column("column");
    Column.Longs best = (Column.Longs) t.column("best_lag");
    Column.Doubles r = (Column.Doubles) t.column("r");
    for (int i = 0; i < t.rowCount(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      Integer lag = planted(kind(y, x));
      if (lag == null) {
        continue;
      }
      assertEquals(lag, (int) best.get(i), "cell (" + y + ", " + x + ")");
      double[][] pr = pairs(y, x, lag);
      assertEquals(new SpearmansCorrelation().correlation(pr[0], pr[1]), r.get(i), 1e-9, "cell (" + y + ", " + x + ")");
    }
  }

  @Test
  void aStepThatDoesNotDivideTheRangeStopsShortAsInCorrelate() {
    // -6, -2, 2, 6, 10: 'up to at most 12', as correlate reads the same clause.
    ResultTable t = ws.engine().run(HEAD + " lags -6 to 12 days step 4 days").get(0);
    assertEquals("-6 to 10 day step 4, 5 lags (positive: the driver leads)", t.metadata().get("lags"));
    int[] lags = range(-6, 12, 4);
    Column.Longs rows = (Column.Longs) t.column("row"), cols = (Column.Longs) t.column("column");
    Column.Longs best = (Column.Longs) t.column("best_lag"), valid = (Column.Longs) t.column("valid_lags");
    Column.Doubles r = (Column.Doubles) t.column("r");
    for (int i = 0; i < t.rowCount(); i++) {
      int y = (int) rows.get(i), x = (int) cols.get(i);
      if (kind(y, x) == Kind.LAND) {
        continue;
      }
      String where = "cell (" + y + ", " + x + ")";
      assertEquals(argmax(y, x, lags), best.get(i), where);
      assertEquals(pearson(y, x, (int) best.get(i)), r.get(i), 1e-9, where);
      assertEquals(lags.length, valid.get(i), where);
    }
    // The planted lag 2 is one of them: found exactly.
    for (int i = 0; i < t.rowCount(); i++) {
      if (kind((int) rows.get(i), (int) cols.get(i)) == Kind.LAG2) {
        assertEquals(2, best.get(i));
      }
    }
  }

  // ---- errors of the lag clause, with its line and column ------------------------------------

  private QueryException refused(String text) {
    return assertThrows(QueryException.class, () -> ws.engine().run(text));
  }

  @Test
  void moreLagsThanTheLimitAreRefusedAtTheClause() {
    String text = HEAD + "\n    lags -100000 to 100000 days";
    QueryException e = refused(text);
    assertEquals("lags -100000 to 100000 by 1 make more than " + CorrelationSettings.MAX_LAGS
        + " lags; use a larger lag step or a shorter range", e.detail());
    assertEquals("map fewer lags, e.g. with a larger lag step", e.hint());
    assertEquals(2, e.line());
    assertEquals(5, e.column());
  }

  @Test
  void lagsReachingThePeriodsEndAreRefusedWithTheDriversSpan() {
    String text = HEAD + " lags 0 to " + DAYS + " days";
    QueryException e = refused(text);
    assertEquals("lag range too long for the driver: lags 0 to " + DAYS + " reach " + DAYS + " days, but the driver"
        + " has values over only " + DAYS + " days (2014-01-01 to 2015-06-30); keep every |lag| below " + DAYS, e.detail());
    assertEquals("use smaller lags or a longer period", e.hint());
    assertEquals(1, e.line());
    assertEquals(text.indexOf("lags") + 1, e.column());
  }

  @Test
  void lagsMustBeWholeStepsOfTheSeries() {
    String weekly = HEAD.replace("by day", "by week");
    String days = weekly + " lags 0 to 10 days";
    QueryException e = refused(days);
    assertEquals("lags must be whole weeks of the series", e.detail());
    assertEquals("on a weekly series give lags in weeks", e.hint());
    assertEquals(days.indexOf("lags") + 1, e.column());
    // The step counts too: 14 days are two weeks, a step of 3 days is not whole.
    String step = weekly + " lags 0 to 14 days step 3 days";
    e = refused(step);
    assertEquals("lags must be whole weeks of the series", e.detail());
    assertEquals(step.indexOf("lags") + 1, e.column());
    String months = HEAD + " lags 0 to 2 months";
    e = refused(months);
    assertEquals("lags in months do not fit a series by day", e.detail());
    assertEquals("lags must be whole steps of the series", e.hint());
    assertEquals(months.indexOf("lags") + 1, e.column());
  }

  /** Serves {@code chl} (the 6 x 6 bay grid) or {@code flow} (a 4 x 4 watershed grid) for files ending in {@code .synthetic}. */
  private final class Synthetic implements CubeSource {
    @Override
    public String name() {
      return "synthetic";
    }

    @Override
    public boolean accepts(Path file) {
      return file.getFileName().toString().endsWith(".synthetic");
    }

    @Override
    public List<String> variables(Path file) {
      return List.of(file.getFileName().toString().replace(".synthetic", ""));
    }

    @Override
    public SourceCube open(Path file, String variable) {
      long[] secs = new long[DAYS];
      for (int t = 0; t < DAYS; t++) {
        secs[t] = START.plusDays(t).toEpochDay() * 86_400L;
      }
      boolean isChl = variable.equals("chl");
      CubeDescriptor d = isChl
          ? new CubeDescriptor("chl", "mass_concentration_of_chlorophyll_in_sea_water", "chlorophyll", "mg m-3",
              "mg m-3", LatLonGrid.regular(43.9, -31.2, 0.05, 0.05, N, N),
              new TimeAxis("standard", "days since 2014-01-01", TimeAxis.Alignment.EXACT, secs), Map.of())
          : new CubeDescriptor("flow", "water_volume_transport_in_river_channel", "discharge", "m3 s-1", "m3 s-1",
              LatLonGrid.regular(44.4, -31.8, 0.1, 0.1, 4, 4),
              new TimeAxis("standard", "days since 2014-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
      int nx = isChl ? N : 4;
      return new SourceCube() {
        @Override
        public CubeDescriptor descriptor() {
          return d;
        }

        @Override
        public void read(int t0, int nt, int y0, int ny, int x0, int nxr, float[] dest) {
          int i = 0;
          for (int t = t0; t < t0 + nt; t++) {
            for (int y = y0; y < y0 + ny; y++) {
              for (int x = x0; x < x0 + nxr; x++) {
                dest[i++] = isChl ? chl[t * N * N + y * nx + x] : flow[t];
              }
            }
          }
        }

        @Override
        public void close() {}
      };
    }
  }
}
