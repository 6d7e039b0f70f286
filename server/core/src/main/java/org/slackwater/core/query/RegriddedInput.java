package org.slackwater.core.query;

import java.io.IOException;
import java.util.Arrays;
import java.util.BitSet;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.ConservativeRegrid;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;

/**
 * One input of a derived variable that lives on another grid, time axis or chunking than the
 * derived variable (which takes those of the first variable of its expression). Values are
 * brought over chunk by chunk:
 *
 * <ul>
 *   <li>in space by first-order conservative regridding ({@link ConservativeRegrid}): a target
 *       cell gets the overlap-area weighted mean of the valid input cells it overlaps, and is
 *       missing where it overlaps none;
 *   <li>in time by date for daily cubes (products stamp their day at different hours) and by
 *       instant otherwise: a target step takes the input step of the same UTC day (or instant),
 *       CF times decoded to UTC so a noleap input simply has no 29 February, and is missing where
 *       the input has none.
 * </ul>
 *
 * A target chunk reads only the input chunks that overlap its rows, columns and steps. Failure:
 * an unreadable input chunk ({@link IOException}).
 */
final class RegriddedInput {
  private final CubeEntry input;
  private final LatLonGrid target;
  /** For each target step, the input step at the same instant, or -1. */
  private final int[] stepOf;

  private RegriddedInput(CubeEntry input, LatLonGrid target, int[] stepOf) {
    this.input = input;
    this.target = target;
    this.stepOf = stepOf;
  }

  /** Whether {@code input} can be used as it is in chunks of {@code first}. */
  static boolean aligned(CubeEntry first, CubeEntry input) {
    return first.descriptor().grid().equals(input.descriptor().grid()) && first.descriptor().time().equals(input.descriptor().time())
        && first.layout().equals(input.layout());
  }

  /**
   * The mapping of {@code input} onto {@code first}'s grid and steps.
   *
   * @throws IllegalArgumentException when the two share no step or no area (the message says which)
   */
  static RegriddedInput onto(CubeEntry first, CubeEntry input) {
    TimeAxis to = first.descriptor().time(), from = input.descriptor().time();
    boolean byDay = daily(to) && daily(from);
    int[] stepOf = new int[to.size()];
    int common = 0;
    for (int t = 0; t < to.size(); t++) {
      long want = to.epochSecond(t);
      if (byDay) {
        // Daily products stamp their day at different hours (00:00, 12:00): match the UTC date.
        long day = Math.floorDiv(want, 86_400L) * 86_400L;
        int s = from.firstAtOrAfter(day);
        stepOf[t] = s < from.size() && Math.floorDiv(from.epochSecond(s), 86_400L) == day / 86_400L ? s : -1;
      } else {
        int s = from.firstAtOrAfter(want);
        stepOf[t] = s < from.size() && from.epochSecond(s) == want ? s : -1;
      }
      common += stepOf[t] >= 0 ? 1 : 0;
    }
    if (common == 0) {
      throw new IllegalArgumentException("'" + input.name() + "' has no time step at the instants of '" + first.name() + "' ("
          + from.date(0) + " to " + from.date(from.size() - 1) + " against " + to.date(0) + " to " + to.date(to.size() - 1) + ")");
    }
    LatLonGrid tg = first.descriptor().grid(), sg = input.descriptor().grid();
    if (rows(sg, tg.latLower(0), tg.latUpper(tg.ny() - 1)) == null || columns(sg, tg.lonLower(0), tg.lonUpper(tg.nx() - 1)) == null) {
      throw new IllegalArgumentException("the grid of '" + input.name() + "' does not overlap the grid of '" + first.name() + "'");
    }
    return new RegriddedInput(input, tg, stepOf);
  }

  /** One step per day: every gap between steps is a whole number of days and most are one. */
  private static boolean daily(TimeAxis axis) {
    int ones = 0;
    for (int i = 1; i < axis.size(); i++) {
      long d = axis.epochSecond(i) - axis.epochSecond(i - 1);
      if (d % 86_400L != 0) {
        return false;
      }
      ones += d == 86_400L ? 1 : 0;
    }
    return axis.size() == 1 || ones * 2 >= axis.size() - 1;
  }

  /** Target cells that may get a value: those overlapping an input cell of the input's footprint. */
  BitSet footprint() {
    LatLonGrid sg = input.descriptor().grid();
    BitSet present = input.footprint().present();
    BitSet out = new BitSet(target.cells());
    for (int y = 0; y < target.ny(); y++) {
      int[] r = rows(sg, target.latLower(y), target.latUpper(y));
      for (int x = 0; r != null && x < target.nx(); x++) {
        int[] c = columns(sg, target.lonLower(x), target.lonUpper(x));
        if (c != null && anyPresent(present, sg.nx(), r, c)) {
          out.set(y * target.nx() + x);
        }
      }
    }
    return out;
  }

  /** The input's values on the target chunk {@code key}, in (time, row, column) order. */
  float[] values(ChunkKey key, ChunkSource source) throws IOException {
    float[] out = new float[key.values()];
    Arrays.fill(out, Float.NaN);
    LatLonGrid sg = input.descriptor().grid();
    int[] r = rows(sg, target.latLower(key.y0()), target.latUpper(key.y0() + key.ny() - 1));
    int[] c = columns(sg, target.lonLower(key.x0()), target.lonUpper(key.x0() + key.nx() - 1));
    if (r == null || c == null) {
      return out;
    }
    int sMin = Integer.MAX_VALUE, sMax = -1;
    for (int t = key.t0(); t < key.t0() + key.nt(); t++) {
      if (stepOf[t] >= 0) {
        sMin = Math.min(sMin, stepOf[t]);
        sMax = Math.max(sMax, stepOf[t]);
      }
    }
    if (sMax < 0) {
      return out;
    }
    int sny = r[1] - r[0], snx = c[1] - c[0], ns = sMax - sMin + 1;
    float[] block = gather(source, sMin, ns, r, c);
    ConservativeRegrid regrid = new ConservativeRegrid(sub(sg, r, c), sub(target, new int[] {key.y0(), key.y0() + key.ny()},
        new int[] {key.x0(), key.x0() + key.nx()}));
    double[] step = new double[sny * snx];
    int plane = key.ny() * key.nx();
    for (int t = key.t0(); t < key.t0() + key.nt(); t++) {
      if (stepOf[t] < 0) {
        continue;
      }
      int base = (stepOf[t] - sMin) * sny * snx;
      for (int i = 0; i < step.length; i++) {
        step[i] = block[base + i];
      }
      double[] regridded = regrid.apply(step);
      int o = (t - key.t0()) * plane;
      for (int i = 0; i < plane; i++) {
        out[o + i] = (float) regridded[i];
      }
    }
    return out;
  }

  /** Input values over steps [s0, s0 + ns) and the row/column ranges, NaN where no chunk holds them. */
  private float[] gather(ChunkSource source, int s0, int ns, int[] r, int[] c) throws IOException {
    int sny = r[1] - r[0], snx = c[1] - c[0];
    float[] block = new float[ns * sny * snx];
    Arrays.fill(block, Float.NaN);
    for (ChunkRecord rec : input.chunks()) {
      ChunkKey k = rec.key();
      int t0 = Math.max(k.t0(), s0), t1 = Math.min(k.t0() + k.nt(), s0 + ns);
      int y0 = Math.max(k.y0(), r[0]), y1 = Math.min(k.y0() + k.ny(), r[1]);
      int x0 = Math.max(k.x0(), c[0]), x1 = Math.min(k.x0() + k.nx(), c[1]);
      if (t0 >= t1 || y0 >= y1 || x0 >= x1 || rec.validCount() == 0) {
        continue;
      }
      float[] v = source.get(input, rec);
      for (int t = t0; t < t1; t++) {
        for (int y = y0; y < y1; y++) {
          int from = ((t - k.t0()) * k.ny() + (y - k.y0())) * k.nx() + (x0 - k.x0());
          int to = ((t - s0) * sny + (y - r[0])) * snx + (x0 - c[0]);
          System.arraycopy(v, from, block, to, x1 - x0);
        }
      }
    }
    return block;
  }

  private static boolean anyPresent(BitSet present, int nx, int[] r, int[] c) {
    for (int y = r[0]; y < r[1]; y++) {
      int i = present.nextSetBit(y * nx + c[0]);
      if (i >= 0 && i < y * nx + c[1]) {
        return true;
      }
    }
    return false;
  }

  /** The [first, end) rows of {@code g} overlapping latitudes (lo, hi) with positive length, or null. */
  private static int[] rows(LatLonGrid g, double lo, double hi) {
    return range(g.latLower(), g.latUpper(), lo, hi);
  }

  private static int[] columns(LatLonGrid g, double lo, double hi) {
    return range(g.lonLower(), g.lonUpper(), lo, hi);
  }

  private static int[] range(double[] lower, double[] upper, double lo, double hi) {
    int first = -1, end = -1;
    for (int i = 0; i < lower.length; i++) {
      if (Math.min(upper[i], hi) - Math.max(lower[i], lo) > 0) {
        if (first < 0) {
          first = i;
        }
        end = i + 1;
      }
    }
    return first < 0 ? null : new int[] {first, end};
  }

  private static LatLonGrid sub(LatLonGrid g, int[] r, int[] c) {
    return new LatLonGrid(Arrays.copyOfRange(g.latLower(), r[0], r[1]), Arrays.copyOfRange(g.latUpper(), r[0], r[1]),
        Arrays.copyOfRange(g.lonLower(), c[0], c[1]), Arrays.copyOfRange(g.lonUpper(), c[0], c[1]));
  }

  String name() {
    return input.name();
  }
}
