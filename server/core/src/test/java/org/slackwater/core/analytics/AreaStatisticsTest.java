package org.slackwater.core.analytics;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Map.Entry;
import java.util.SplittableRandom;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.io.WKTReader;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.Provenance;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionWeights;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;

/**
 * {@link AreaStatistics} against a plain reference: for every step, every cell of the region in
 * the footprint, in row-major order, Σ aᵢvᵢ / Σ aᵢ over the valid values (CF conventions 7.2/7.3
 * area weighting), the extremes, and the area-weighted percentile as {@link SpatialStatistic}
 * defines it. The cube is cut into small chunks so that the region spans partial edge tiles and
 * the chunks' step counts are not multiples of four. Steps mix few missing values, most missing
 * (the valid area is then summed directly) and all missing.
 *
 * <p>Tolerance: the reference adds the same products in another order, so values agree to 1e-12
 * relative and valid fractions to 1e-12 absolute (the rounding of a few hundred additions is about
 * 1e-14); counts, missing steps and the extremes are exact.
 */
class AreaStatisticsTest {
  private static final double TOLERANCE = 1e-12;
  private static final int STEPS = 100, NY = 45, NX = 50;
  private static final LatLonGrid GRID = LatLonGrid.regular(43.5, -32, 0.05, 0.05, NY, NX);
  private static final ChunkLayout LAYOUT = new ChunkLayout(37, 16, 16);

  private final float[][][] values = new float[STEPS][NY][NX];
  private final Map<String, float[]> chunkValues = new HashMap<>();
  private final CubeEntry cube;
  private final CellWeights weights;

  AreaStatisticsTest() throws Exception {
    SplittableRandom rnd = new SplittableRandom(31);
    BitSet present = new BitSet(NY * NX);
    for (int t = 0; t < STEPS; t++) {
      double missing = switch (t % 10) {
        case 3 -> 1.0; // a day with no valid value
        case 7 -> 0.97; // mostly cloud
        default -> 0.03;
      };
      for (int y = 0; y < NY; y++) {
        for (int x = 0; x < NX; x++) {
          boolean land = x + y < 12; // never a value: outside the footprint
          float v = (float) (12 + 5 * Math.sin(0.1 * t + 0.2 * x) + 0.05 * y + rnd.nextDouble());
          values[t][y][x] = land || rnd.nextDouble() < missing ? Float.NaN : v;
          if (!Float.isNaN(values[t][y][x])) {
            present.set(y * NX + x);
          }
        }
      }
    }
    List<ChunkRecord> chunks = new ArrayList<>();
    for (int t0 = 0; t0 < STEPS; t0 += LAYOUT.steps()) {
      for (int y0 = 0; y0 < NY; y0 += LAYOUT.rows()) {
        for (int x0 = 0; x0 < NX; x0 += LAYOUT.columns()) {
          ChunkKey k = new ChunkKey(t0, y0, x0, Math.min(LAYOUT.steps(), STEPS - t0), Math.min(LAYOUT.rows(), NY - y0),
              Math.min(LAYOUT.columns(), NX - x0));
          float[] v = new float[k.values()];
          int i = 0;
          for (int t = k.t0(); t < k.t0() + k.nt(); t++) {
            for (int y = k.y0(); y < k.y0() + k.ny(); y++) {
              for (int x = k.x0(); x < k.x0() + k.nx(); x++) {
                v[i++] = values[t][y][x];
              }
            }
          }
          chunkValues.put(k.fileName(), v);
          chunks.add(new ChunkRecord(k, k.fileName(), "0".repeat(64), v.length * 4L, 0));
        }
      }
    }
    long[] secs = new long[STEPS];
    for (int t = 0; t < STEPS; t++) {
      secs[t] = 1_136_073_600L + 86_400L * t; // 2006-01-01 onwards, daily
    }
    CubeDescriptor d = new CubeDescriptor("chl", "", "test field", "1", "1", GRID,
        new TimeAxis("standard", "days since 2006-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
    cube = new CubeEntry("chl", 1, d, LAYOUT, chunks, new Footprint(NY * NX, present),
        new Provenance("test.nc", "0".repeat(64), "chl", "test", Instant.EPOCH));
    // Crosses tile borders in both directions and reaches into the partial last row of tiles.
    Geometry region = new WKTReader().read(
        "POLYGON((-31.93 43.56, -30.12 43.71, -29.58 44.9, -30.6 45.68, -31.85 45.2, -31.93 43.56))");
    weights = RegionWeights.compute(GRID, region);
  }

  private ChunkSource source() {
    return (c, chunk) -> chunkValues.get(chunk.file());
  }

  @Test
  void meanSumAndCoverageMatchAPlainLoopOverEveryCell() throws IOException {
    for (SpatialStatistic.Kind kind : new SpatialStatistic.Kind[] {SpatialStatistic.Kind.MEAN, SpatialStatistic.Kind.SUM}) {
      for (double coverage : new double[] {0.5, 0.0}) {
        assertMatchesReference(SpatialStatistic.of(kind), 0, STEPS, coverage);
        assertMatchesReference(SpatialStatistic.of(kind), 5, 93, coverage);
      }
    }
  }

  @Test
  void extremesAndPercentilesMatchAPlainLoopOverEveryCell() throws IOException {
    assertMatchesReference(SpatialStatistic.of(SpatialStatistic.Kind.MIN), 0, STEPS, 0.0);
    assertMatchesReference(SpatialStatistic.of(SpatialStatistic.Kind.MAX), 2, 77, 0.5);
    assertMatchesReference(SpatialStatistic.percentile(50), 0, STEPS, 0.5);
    assertMatchesReference(SpatialStatistic.percentile(90), 38, 99, 0.0);
  }

  @Test
  void parallelRunsGiveTheSameBits() throws IOException {
    SpatialStatistic mean = SpatialStatistic.of(SpatialStatistic.Kind.MEAN);
    DailySeries a = AreaStatistics.compute(source(), cube, weights, mean, 0, STEPS, 0.5);
    DailySeries b = AreaStatistics.compute(source(), cube, weights, mean, 0, STEPS, 0.5);
    assertArrayEquals(a.value(), b.value());
    assertArrayEquals(a.validFraction(), b.validFraction());
  }

  @Test
  void aChunkThatCannotBeReadFailsTheStatisticWithItsMessage() {
    ChunkSource broken = (c, chunk) -> {
      if (chunk.key().t0() == 37) {
        throw new IOException("chunk " + chunk.file() + " of cube chl: checksum mismatch; re-ingest the source file");
      }
      return chunkValues.get(chunk.file());
    };
    IOException e = assertThrows(IOException.class, () -> AreaStatistics.compute(broken, cube, weights,
        SpatialStatistic.of(SpatialStatistic.Kind.MEAN), 0, STEPS, 0.5));
    assertTrue(e.getMessage().contains("checksum mismatch; re-ingest"), e.getMessage());
  }

  private void assertMatchesReference(SpatialStatistic stat, int from, int to, double minCoverage) throws IOException {
    DailySeries got = AreaStatistics.compute(source(), cube, weights, stat, from, to, minCoverage);
    assertEquals(to - from, got.size());
    double regionArea = 0;
    for (int i = 0; i < weights.size(); i++) {
      if (cube.footprint().contains(weights.index(i))) {
        regionArea += weights.area(i);
      }
    }
    int nanSteps = 0;
    for (int s = 0; s < to - from; s++) {
      int t = from + s;
      double w = 0, wv = 0, lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
      int count = 0;
      TreeMap<Float, Double> areaByValue = new TreeMap<>();
      for (int i = 0; i < weights.size(); i++) {
        if (!cube.footprint().contains(weights.index(i))) {
          continue;
        }
        float f = values[t][weights.row(i)][weights.column(i)];
        if (Float.isNaN(f)) {
          continue;
        }
        w += weights.area(i);
        wv += weights.area(i) * f;
        count++;
        lo = Math.min(lo, f);
        hi = Math.max(hi, f);
        areaByValue.merge(f, weights.area(i), Double::sum);
      }
      String where = stat + " step " + t;
      double frac = w / regionArea;
      assertEquals(count, got.validCells()[s], where);
      assertEquals(frac, got.validFraction()[s], TOLERANCE, where);
      assertEquals(t * 86_400L + 1_136_073_600L, got.epochSeconds()[s], where);
      if (count == 0 || frac + 1e-12 < minCoverage) {
        assertTrue(Double.isNaN(got.value()[s]), where + " is missing");
        nanSteps++;
        continue;
      }
      double expected = switch (stat.kind()) {
        case MEAN -> wv / w;
        case SUM -> wv;
        case MIN -> lo;
        case MAX -> hi;
        case PERCENTILE -> {
          double cum = 0, target = stat.percentile() / 100 * w;
          double v = Double.NaN;
          for (Entry<Float, Double> e : areaByValue.entrySet()) {
            cum += e.getValue();
            if (cum >= target * (1 - 1e-12)) {
              v = e.getKey();
              break;
            }
          }
          yield v;
        }
      };
      assertEquals(expected, got.value()[s], TOLERANCE * Math.abs(expected), where);
    }
    assertTrue(nanSteps > 0 && nanSteps < to - from, "the steps mix missing and valid results");
    assertTrue(Arrays.stream(got.validFraction()).anyMatch(f -> f == 0), "a step with no valid value has fraction 0");
  }
}
