package org.slackwater.core.query;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.ingest.Ingestor;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.store.ChunkLayout;

/**
 * The euphotic depth as a {@code let} on a diffuse attenuation coefficient cube, with no
 * function of its own: {@code let zeu = 4.605 / kd}. Beer-Lambert (handbook): the downwelling
 * light at depth z is E(z) = E(0) exp(-Kd z), so 1 % of the surface light is left at
 * z = ln(100) / Kd, and ln(100) = 4.60517 (4.605 rounded). The unit algebra must turn a number over
 * {@code m-1} (or {@code 1/m}) into metres, and Kd times that depth into a plain number.
 *
 * <p>ucar.units 4.5.5 calls reciprocal units (m and m-1) compatible and converts between them by
 * identity; Slackwater compares derived units instead ({@code UnitConversion.sameQuantity}), so
 * {@code 4.605 / kd} is labelled m and {@code kd + 1 m} is refused (both tested here).
 *
 * <p>The Kd cube is served from memory on a 2 x 2 grid of the invented Wrenmouth estuary, three
 * days of July 2014, one value per cell for all days: 0.1 m-1 (clear water: 46 m, common practice
 * says light reaches 30 to 50 m in very clear water), 4.605 m-1 (turbid water: 1 m, common
 * practice about 1 m in very turbid water), 0.2 and 1.0 m-1.
 */
class EuphoticDepthTest {
  private static final ChunkLayout LAYOUT = new ChunkLayout(40, 4, 4);
  private static final float[] KD = {0.1f, 4.605f, 0.2f, 1.0f}; // (row, column) = (0,0), (0,1), (1,0), (1,1)
  private static final String BOX = "box(44.0 N, 31.2 W, 44.2 N, 31.0 W)";
  /** ln(100): the optical depth at which 1 % of the surface light is left (Beer-Lambert). */
  private static final double LN_100 = Math.log(100);

  @TempDir Path dir;
  private Workspace ws;

  @BeforeEach
  void setUp() throws Exception {
    ws = Workspace.open(dir.resolve("store"), 64L << 20, 16L << 20, LAYOUT);
    Ingestor ingestor = new Ingestor(List.of(new KdSource()), ws.catalog(), ws.store(), LAYOUT);
    ingestor.ingest(Files.writeString(dir.resolve("kd.kd"), "m-1\n"), Optional.empty());
    ingestor.ingest(Files.writeString(dir.resolve("kd_slash.kd"), "1/m\n"), Optional.empty());
  }

  @AfterEach
  void tearDown() {
    ws.close(); // closes the allocator last: a leaked Arrow buffer fails the test
  }

  /** A map's {@code column} per cell, indexed row * 2 + column. */
  private static double[] perCell(ResultTable map, String column) {
    Column.Longs rows = (Column.Longs) map.column("row"), cols = (Column.Longs) map.column("column");
    Column.Doubles v = (Column.Doubles) map.column(column);
    double[] out = new double[4];
    for (int i = 0; i < map.rowCount(); i++) {
      out[(int) (rows.get(i) * 2 + cols.get(i))] = v.get(i);
    }
    return out;
  }

  @Test
  void euphoticDepthIsInMetresAndLeavesOnePercentOfTheLight() {
    for (String kd : List.of("kd", "kd_slash")) {
      List<ResultTable> r = ws.engine().run("let zeu = 4.605 / " + kd + " in m; let tau = " + kd + " * zeu;"
          + " map mean zeu over " + BOX + " during 2014-07-01 to 2014-07-03;"
          + " map mean tau over " + BOX + " during 2014-07-01 to 2014-07-03");
      assertEquals("m", ((Column.Strings) r.get(0).column("units")).get(0), kd + ": 1 / m-1 in m");
      assertEquals("1", ((Column.Strings) r.get(1).column("units")).get(0), kd + ": m-1 x m is a plain number");
      ResultTable depth = r.get(2);
      assertEquals(4, depth.rowCount());
      assertEquals("m", depth.column("mean_zeu").unit(), kd);
      double[] zeu = perCell(depth, "mean_zeu");
      double[] tau = perCell(r.get(3), "mean_tau");
      // Kd stored as float; the depth from that float, to float rounding of the stored result.
      for (int c = 0; c < 4; c++) {
        assertEquals(4.605 / KD[c], zeu[c], 1e-6 * zeu[c], kd + " cell " + c);
        // Beer-Lambert: exp(-Kd zeu) = exp(-4.605) = 1 % of the surface light, to the rounding of ln(100).
        assertEquals(0.01, Math.exp(-KD[c] * zeu[c]), 0.01 * Math.abs(4.605 - LN_100) * 1.01, kd + " cell " + c);
        assertEquals(4.605, tau[c], 1e-5, kd + " cell " + c + ": the optical depth of the euphotic zone");
      }
      // Clear water (Kd = 0.1 m-1): 46.05 m, within the 30 to 50 m of common practice; turbid (4.605 m-1): 1 m.
      assertEquals(46.05, zeu[0], 1e-4);
      assertEquals(1.0, zeu[1], 1e-6);
      assertEquals(23.025, zeu[2], 1e-4);
      assertEquals(4.605, zeu[3], 1e-5);
    }
  }

  @Test
  void withoutAUnitTheDepthIsLabelledMetres() {
    // 1 / m-1 = m: the label follows the unit algebra, not kd's own unit.
    List<ResultTable> r = ws.engine().run("let zeu = 4.605 / kd; map mean zeu over " + BOX + " during 2014-07-02");
    assertEquals("m", ((Column.Strings) r.get(0).column("units")).get(0));
    assertEquals("m", r.get(1).column("mean_zeu").unit());
    assertEquals(46.05, perCell(r.get(1), "mean_zeu")[0], 1e-4);
  }

  @Test
  void anAttenuationAndALengthDoNotAdd() {
    // m-1 and m are reciprocal, not the same quantity: no sum, no conversion.
    org.slackwater.query.QueryException sum = org.junit.jupiter.api.Assertions.assertThrows(
        org.slackwater.query.QueryException.class, () -> ws.engine().run("let bad = kd + 1 m"));
    org.junit.jupiter.api.Assertions.assertTrue(sum.getMessage().contains("m"), sum.getMessage());
    org.slackwater.query.QueryException map = org.junit.jupiter.api.Assertions.assertThrows(
        org.slackwater.query.QueryException.class, () -> ws.engine().run("map mean kd over " + BOX + " during 2014-07-02 in m"));
    org.junit.jupiter.api.Assertions.assertTrue(map.getMessage().contains("cannot be converted"), map.getMessage());
  }

  @Test
  void theDepthConvertsToOtherLengths() {
    List<ResultTable> r = ws.engine().run("let zeu = 4.605 / kd in cm; map mean zeu over " + BOX + " during 2014-07-02");
    assertEquals("cm", ((Column.Strings) r.get(0).column("units")).get(0));
    double[] zeu = perCell(r.get(1), "mean_zeu");
    // 1 m = 100 cm (SI).
    assertEquals(4605, zeu[0], 4605 * 1e-6);
    assertEquals(100, zeu[1], 1e-4);
  }

  /** Kd on a 2 x 2 grid for any file ending in {@code .kd}; the file holds the unit, its name the variable. */
  private static final class KdSource implements CubeSource {
    @Override
    public String name() {
      return "kd";
    }

    @Override
    public boolean accepts(Path file) {
      return file.getFileName().toString().endsWith(".kd");
    }

    @Override
    public List<String> variables(Path file) {
      return List.of(file.getFileName().toString().replace(".kd", ""));
    }

    @Override
    public SourceCube open(Path file, String variable) throws org.slackwater.core.spi.SourceException {
      String units;
      try {
        units = Files.readString(file).trim();
      } catch (java.io.IOException e) {
        throw new org.slackwater.core.spi.SourceException("cannot read " + file.getFileName());
      }
      long[] secs = new long[3];
      for (int t = 0; t < 3; t++) {
        secs[t] = LocalDate.of(2014, 7, 1 + t).toEpochDay() * 86_400L;
      }
      CubeDescriptor d = new CubeDescriptor(variable, "", "diffuse attenuation coefficient of downwelling light", units, units,
          LatLonGrid.regular(44.0, -31.2, 0.1, 0.1, 2, 2),
          new TimeAxis("standard", "days since 2014-07-01", TimeAxis.Alignment.EXACT, secs), Map.of());
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
                dest[i++] = KD[y * 2 + x];
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
