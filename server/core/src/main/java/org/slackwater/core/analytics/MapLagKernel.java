package org.slackwater.core.analytics;

import java.util.Arrays;
import org.slackwater.core.analytics.correlation.CentredPrefix;
import org.slackwater.core.analytics.correlation.CorrelationSettings;
import org.slackwater.core.analytics.correlation.LagStatistics;
import org.slackwater.core.analytics.correlation.PairSums;

/**
 * Pearson sums of a band of cells at every lag in one pass over the band, for a {@link MapDriver}
 * without gaps between its first and last value. The band holds up to {@code width} cells (lanes)
 * time-major on the map's step axis, {@code values()[row * stride() + lane]}, as {@link TileBand}
 * gathers them. Per lag the {@link PairSums} are those {@link
 * org.slackwater.core.analytics.correlation.LagCorrelator} forms over the complete pairs, so
 * {@link LagStatistics} turns them into the same row; they are formed differently, so results
 * agree to rounding (about 1e-15 relative), not to the bit.
 *
 * <p><b>How.</b> Each cell is centred on the mean of its values (as LagCorrelator centres it) and
 * its missing values set to 0. Then:
 * <ul>
 *   <li>the cross products Σ x(t) d(t - L) for all lags at once: for a segment of rows that stays
 *       in the L2 cache, 4 cells x 4 lags accumulate in 16 registers (each row loads 4 values and
 *       4 driver values for 16 multiply-adds, fused where the processor has them); zeros make
 *       every sum run over exactly the complete pairs, so gaps cost nothing here;
 *   <li>the target's sums over each lag's window from prefix sums of x, x² and x(t) x(t + 1),
 *       formed in the same pass as the centring and in CentredPrefix's order, kept only at the few
 *       positions the lags need (each lag's window starts and ends where the driver's values,
 *       shifted by the lag, do; before a cell's first value and after its last every term is 0);
 *   <li>the driver's sums from its {@link CentredPrefix}; for a cell with gaps minus the driver
 *       values paired with the cell's missing steps (and those steps' neighbours for the lag-1
 *       sums), O(gaps) per lag.
 * </ul>
 * Cost per band: O(rows x lanes x lags) multiply-adds, plus O(rows x lanes) for the prefix pass
 * and O(lags x gaps) per cell with gaps. Memory ({@link #footprint}): the values (rows x width
 * doubles), the prefix snapshots (3 x positions x width, at most 3 positions per lag), the cross
 * products of {@value #LAG_GROUP} lags at a time, and the gap lists (at most rows x width ints,
 * grown on demand); allocated once per worker.
 *
 * <p>Mutable and not thread-safe: one per worker.
 */
final class MapLagKernel {
  /** Lags whose cross products are accumulated together; 4 x 4 blocks of lanes by lags. */
  static final int LAG_GROUP = 32;
  /** Values of one time segment (rows x lanes): 256 KB of doubles, inside a core's L2 cache. */
  private static final int SEGMENT_VALUES = 1 << 15;
  /** Whether {@link Math#fma} is the processor's instruction ({@link FusedMultiplyAdd}). */
  static final boolean FUSED = FusedMultiplyAdd.AVAILABLE;

  /** How the cross products are formed; every choice gives the same sums up to rounding. */
  enum Arithmetic {
    /** Multiply, then add: two roundings per step. */
    PLAIN,
    /** {@link Math#fma}: one rounding per step. */
    FUSED,
    /** {@link VectorCross}: FUSED's sums bit for bit, four lanes per instruction. */
    VECTOR;

    /**
     * The fastest this JVM runs: VECTOR when started with {@code --add-modules
     * jdk.incubator.vector} on a processor with 256-bit vectors and fused multiply-adds, else
     * FUSED where the processor fuses, else PLAIN.
     */
    static final Arithmetic BEST = vectorUsable() ? VECTOR : MapLagKernel.FUSED ? FUSED : PLAIN;

    /** The module first: without it, merely loading {@link VectorCross} fails. */
    private static boolean vectorUsable() {
      if (ModuleLayer.boot().findModule("jdk.incubator.vector").isEmpty()) {
        return false;
      }
      try {
        return VectorCross.hardware();
      } catch (LinkageError e) {
        return false; // present but not readable from here
      }
    }

    /** Whether this JVM can run it (VECTOR needs the module, FUSED the instruction). */
    boolean available() {
      return switch (this) {
        case PLAIN -> true;
        case FUSED -> MapLagKernel.FUSED;
        case VECTOR -> BEST == VECTOR;
      };
    }
  }

  private final Arithmetic arithmetic;
  private final MapDriver driver;
  private final CorrelationSettings settings;
  private final int[] lags;
  private final int width;
  /** Lanes of the current band rounded up to 4: the row length of {@link #x}. */
  private int stride;
  private final int rows;
  /** Axis position of row 0. */
  private final int start;
  private final double[] x;
  // Per lane, in rows: the first and last valid row, valid count, mean, gaps listed from gapAt.
  private final int[] first;
  private final int[] last;
  private final int[] count;
  private final double[] mean;
  private final boolean[] fast;
  private final int[] gapAt;
  private final int[] gapCount;
  private int[] gaps = new int[0];
  // Prefix snapshots at the sorted positions; per lag the slots of its window's ends.
  private final int[] positions;
  private final int[] slotLo;
  private final int[] slotHi;
  private final int[] slotHi1;
  private final double[] snapSum;
  private final double[] snapSquares;
  private final double[] snapLagged;
  private final double[] cross;
  private final double[] runSum;
  private final double[] runSquares;
  private final double[] runLagged;
  /** Per lane for the centring: the mean and 1 for a lane correlated here, 0 and 0 for another. */
  private final double[] shift;
  private final double[] keep;
  /** Complete pairs of the last {@link #r} call. */
  private int lastPairs;
  /** The first snapshot position not yet taken while centring. */
  private int nextPosition;

  /**
   * @param width lanes per block, a positive multiple of 4
   * @param rows axis rows from the first period to the last
   * @param start axis position of the first period
   */
  MapLagKernel(MapDriver driver, int width, int rows, int start) {
    this(driver, width, rows, start, Arithmetic.BEST);
  }

  /** With the arithmetic chosen, for testing each; it must be {@link Arithmetic#available}. */
  MapLagKernel(MapDriver driver, int width, int rows, int start, Arithmetic arithmetic) {
    if (!arithmetic.available()) {
      throw new IllegalArgumentException(arithmetic + " arithmetic is not available in this JVM");
    }
    this.arithmetic = arithmetic;
    if (width <= 0 || width % 4 != 0) {
      throw new IllegalArgumentException("width must be a positive multiple of 4: " + width);
    }
    this.driver = driver;
    this.settings = driver.settings();
    this.lags = settings.lags();
    this.width = width;
    this.rows = rows;
    this.start = start;
    x = new double[rows * width];
    first = new int[width];
    last = new int[width];
    count = new int[width];
    mean = new double[width];
    fast = new boolean[width];
    gapAt = new int[width];
    gapCount = new int[width];
    int n = lags.length;
    slotLo = new int[n];
    slotHi = new int[n];
    slotHi1 = new int[n];
    positions = positions(n);
    snapSum = new double[positions.length * width];
    snapSquares = new double[positions.length * width];
    snapLagged = new double[positions.length * width];
    cross = new double[width * LAG_GROUP];
    runSum = new double[width];
    runSquares = new double[width];
    runLagged = new double[width];
    shift = new double[width];
    keep = new double[width];
  }

  /**
   * Rows where prefix sums are read: lag L's window of pairs lies within rows [P1, P2) with P1 =
   * driver first + L - start and P2 = driver last + L + 1 - start (lag-1 sums up to P2 - 1),
   * clipped to [0, rows]. Before a cell's first value and after its last every term is 0, so these
   * positions serve every cell whatever its own first and last value.
   */
  private int[] positions(int n) {
    int[] all = new int[3 * n];
    for (int l = 0; l < n; l++) {
      all[3 * l] = clip(driver.first() + lags[l] - start);
      all[3 * l + 1] = clip(driver.last() + lags[l] + 1 - start);
      all[3 * l + 2] = clip(driver.last() + lags[l] - start);
    }
    int[] sorted = Arrays.stream(all).sorted().distinct().toArray();
    for (int l = 0; l < n; l++) {
      slotLo[l] = Arrays.binarySearch(sorted, all[3 * l]);
      slotHi[l] = Arrays.binarySearch(sorted, all[3 * l + 1]);
      slotHi1[l] = Arrays.binarySearch(sorted, all[3 * l + 2]);
    }
    return sorted;
  }

  private int clip(long row) {
    return (int) Math.max(0, Math.min(rows, row));
  }

  /** Doubles a kernel holds for this width, rows and number of lags (the worker's memory bound). */
  static long footprint(int width, int rows, int lagCount) {
    return (long) width * (rows + 3L * Math.min(3L * lagCount, rows + 1L) + LAG_GROUP);
  }

  int width() {
    return width;
  }

  /**
   * Starts a band of {@code lanes} cells (at most the width): from now on {@link #values()} holds
   * its values as {@code [row * stride() + lane]}.
   */
  void begin(int lanes) {
    if (lanes < 1 || lanes > width) {
      throw new IllegalArgumentException("a band holds 1 to " + width + " cells, not " + lanes);
    }
    stride = (lanes + 3) & ~3;
  }

  /** Row length of {@link #values()} for the current band: its lanes rounded up to 4. */
  int stride() {
    return stride;
  }

  /** The band's values, {@code [row * stride() + lane]}: gathered into, then centred in place. */
  double[] values() {
    return x;
  }

  /** Lane {@code j}'s value at {@code row}, as gathered (before {@link #prepare}). */
  double value(int row, int j) {
    return x[row * stride + j];
  }

  void set(int row, int j, double v) {
    x[row * stride + j] = v;
  }

  /**
   * Count, first and last valid row and mean of lanes [0, lanes), the mean summed in row order as
   * LagCorrelator sums it; lanes from {@code lanes} to the stride are cleared.
   */
  void scan(int lanes) {
    Arrays.fill(count, 0);
    Arrays.fill(runSum, 0);
    for (int r = 0; r < rows; r++) {
      int b = r * stride;
      for (int j = 0; j < lanes; j++) {
        double v = x[b + j];
        if (v == v) {
          runSum[j] += v;
          count[j]++;
        }
      }
    }
    found(lanes, runSum);
  }

  /**
   * What {@link #scan} finds, given instead as {@link TileBand#gather} gathers it on the way: per
   * lane the sum of its values in row order and the number of its {@code periods} without one.
   */
  void scanned(int lanes, int periods, double[] sums, int[] missing) {
    for (int j = 0; j < lanes; j++) {
      count[j] = periods - missing[j];
    }
    found(lanes, sums);
  }

  /** First and last valid rows and means from the counts and sums; clears the lanes past {@code lanes}. */
  private void found(int lanes, double[] sums) {
    for (int j = lanes; j < width; j++) {
      count[j] = 0;
    }
    for (int r = 0; r < rows; r++) {
      Arrays.fill(x, r * stride + lanes, (r + 1) * stride, 0.0);
    }
    for (int j = 0; j < width; j++) {
      first[j] = -1;
      last[j] = -1;
      mean[j] = Double.NaN;
      if (j < lanes && count[j] > 0) {
        int r = 0;
        while (x[r * stride + j] != x[r * stride + j]) {
          r++;
        }
        first[j] = r;
        r = rows - 1;
        while (x[r * stride + j] != x[r * stride + j]) {
          r--;
        }
        last[j] = r;
        mean[j] = sums[j] / count[j];
      }
    }
  }

  int count(int j) {
    return count[j];
  }

  /** Steps from the lane's first value to its last (0 without values). */
  int span(int j) {
    return count[j] == 0 ? 0 : last[j] - first[j] + 1;
  }

  /**
   * Marks the lanes to correlate here ({@code fast}); the others are set to 0 as the values are
   * centred. Centring, gap lists and prefix snapshots are made segment by segment in {@link
   * #correlate}, while each segment is in the cache for the cross products anyway.
   */
  void prepare(boolean[] fastLanes) {
    System.arraycopy(fastLanes, 0, fast, 0, width);
    int total = 0;
    for (int j = 0; j < width; j++) {
      gapAt[j] = total;
      gapCount[j] = 0;
      if (fast[j]) {
        total += span(j) - count[j];
        shift[j] = mean[j];
        keep[j] = 1;
      } else {
        shift[j] = 0;
        keep[j] = 0;
      }
    }
    if (gaps.length < total) {
      gaps = new int[total];
    }
    Arrays.fill(runSum, 0);
    Arrays.fill(runSquares, 0);
    Arrays.fill(runLagged, 0);
    nextPosition = 0;
  }

  /**
   * Centres rows [a0, a1) in place (rows before a0 done), lists their gaps and carries the prefix
   * sums over them, taking the snapshots of the positions in [a0, a1]. Row by row, the running
   * sums of all lanes side by side (they stay in the L1 cache); per lane the sums run in row order
   * and CentredPrefix's order of operations.
   */
  private void centre(int a0, int a1) {
    int w = stride;
    for (int r = a0; r < a1; r++) {
      int b = r * w;
      if (r > 0 && (nextPosition == positions.length || positions[nextPosition] != r)) {
        // The common row: centre, then the lag-1 term of rows r - 1 and r and the sums, in one loop.
        for (int j = 0, p = b - w; j < w; j++) {
          double v = x[b + j];
          double c = v == v ? (v - shift[j]) * keep[j] : gap(r, j);
          x[b + j] = c;
          runLagged[j] = runLagged[j] + x[p + j] * c;
          runSum[j] = runSum[j] + c;
          runSquares[j] = runSquares[j] + c * c;
        }
        continue;
      }
      for (int j = 0; j < w; j++) {
        double v = x[b + j];
        x[b + j] = v == v ? (v - shift[j]) * keep[j] : gap(r, j);
      }
      if (r > 0) {
        // The lag-1 term of rows r - 1 and r completes the prefix at r, as CentredPrefix adds it.
        for (int j = 0, p = b - w; j < w; j++) {
          runLagged[j] = runLagged[j] + x[p + j] * x[b + j];
        }
      }
      snapshots(r);
      for (int j = 0; j < w; j++) {
        double c = x[b + j];
        runSum[j] = runSum[j] + c;
        runSquares[j] = runSquares[j] + c * c;
      }
    }
    if (a1 == rows) {
      snapshots(rows); // every sum complete (the lag-1 term past the last row is 0)
    }
  }

  /** The running sums as the snapshots of the positions equal to {@code r}. */
  private void snapshots(int r) {
    int w = stride;
    while (nextPosition < positions.length && positions[nextPosition] == r) {
      System.arraycopy(runSum, 0, snapSum, nextPosition * w, w);
      System.arraycopy(runSquares, 0, snapSquares, nextPosition * w, w);
      System.arraycopy(runLagged, 0, snapLagged, nextPosition * w, w);
      nextPosition++;
    }
  }

  /** A missing value of lane j at row r: listed if it lies between the lane's first and last value; 0. */
  private double gap(int r, int j) {
    if (fast[j] && r > first[j] && r < last[j]) {
      gaps[gapAt[j] + gapCount[j]++] = r;
    }
    return 0;
  }

  /** Receives each lag's r, pairs and cross product of each lane, lag by lag. */
  @FunctionalInterface
  interface Sink {
    /**
     * @param lane the lane
     * @param lag the lag's index among the settings' lags
     * @param r its r from the sums alone, NaN where the row would be invalid
     * @param pairs its complete pairs
     * @param cross its cross product, for {@link #sums}
     */
    void accept(int lane, int lag, double r, int pairs, double cross);
  }

  /**
   * For every lag and every lane marked fast in {@link #prepare}: r from the counts and sums alone,
   * to {@code sink} with the lag's pairs and cross product (which {@link #sums} needs). Lags come
   * in increasing order for each lane. Centres the band on the way (once per {@link #prepare}).
   */
  void correlate(Sink sink) {
    double[] d = driver.padded();
    int pad = driver.padding();
    int step = settings.lagStep();
    int w = stride;
    int segment = Math.max(16, SEGMENT_VALUES / w);
    for (int g0 = 0; g0 < lags.length; g0 += LAG_GROUP) {
      int inGroup = Math.min(LAG_GROUP, lags.length - g0);
      Arrays.fill(cross, 0);
      for (int a0 = 0; a0 < rows; a0 += segment) {
        int a1 = Math.min(rows, a0 + segment);
        if (g0 == 0) {
          centre(a0, a1);
        }
        for (int j = 0; j < w; ) {
          boolean here = fast[j] || fast[j + 1] || fast[j + 2] || fast[j + 3];
          boolean next = j + 8 <= w && (fast[j + 4] || fast[j + 5] || fast[j + 6] || fast[j + 7]);
          if (here && next && arithmetic == Arithmetic.VECTOR) {
            groupCross(j, 8, inGroup, g0, step, a0, a1, d, pad);
            j += 8;
          } else {
            if (here) {
              groupCross(j, 4, inGroup, g0, step, a0, a1, d, pad);
            }
            j += 4;
          }
        }
      }
      for (int j = 0; j < w; j++) {
        if (!fast[j]) {
          continue;
        }
        for (int q = 0; q < inGroup; q++) {
          int l = g0 + q;
          double c = cross[j * LAG_GROUP + q];
          double r = r(j, l, c);
          sink.accept(j, l, r, lastPairs, c);
        }
      }
    }
  }

  /** The cross products of lanes [j, j + lanes) (4, or 8 with VECTOR) for the group's lags over rows [a0, a1). */
  private void groupCross(int j, int lanes, int inGroup, int g0, int step, int a0, int a1, double[] d, int pad) {
    int w = stride;
    for (int q = 0; q < inGroup; ) {
      int lag = settings.minLag() + (g0 + q) * step;
      int off = j * LAG_GROUP + q;
      int j0 = start - lag + pad;
      if (inGroup - q >= 3) {
        // Four lags; where only three remain the fourth reads the driver's padding, unused.
        switch (arithmetic) {
          case VECTOR -> {
            if (lanes == 8) {
              VectorCross.cross8x4(x, w, j, a0, a1, d, j0, step, cross, off);
            } else {
              VectorCross.cross4x4(x, w, j, a0, a1, d, j0, step, cross, off);
            }
          }
          case FUSED -> fused4x4(x, w, j, a0, a1, d, j0, step, cross, off);
          case PLAIN -> cross4x4(x, w, j, a0, a1, d, j0, step, cross, off);
        }
        q += 4;
      } else {
        // One or two lags left (a single-lag map): one at a time rather than four.
        for (int h = 0; h < lanes; h += 4) {
          int o = off + h * LAG_GROUP;
          switch (arithmetic) {
            case VECTOR -> VectorCross.cross4x1(x, w, j + h, a0, a1, d, j0, cross, o);
            case FUSED -> fused4x1(x, w, j + h, a0, a1, d, j0, cross, o);
            case PLAIN -> cross4x1(x, w, j + h, a0, a1, d, j0, cross, o);
          }
        }
        q++;
      }
    }
  }

  /**
   * Σ x[a * width + lane + i] d[j0 + a - k s] over rows [a0, a1) for lanes i and lags k in 0..3, added
   * to {@code c[off + i * LAG_GROUP + k]}.
   */
  private static void cross4x4(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, int s,
      double[] c, int off) {
    double c00 = 0, c01 = 0, c02 = 0, c03 = 0, c10 = 0, c11 = 0, c12 = 0, c13 = 0;
    double c20 = 0, c21 = 0, c22 = 0, c23 = 0, c30 = 0, c31 = 0, c32 = 0, c33 = 0;
    int s2 = 2 * s, s3 = 3 * s;
    for (int a = a0; a < a1; a++) {
      int i = a * width + lane;
      double u0 = x[i], u1 = x[i + 1], u2 = x[i + 2], u3 = x[i + 3];
      int k = j0 + a;
      double d0 = d[k], d1 = d[k - s], d2 = d[k - s2], d3 = d[k - s3];
      c00 += u0 * d0;
      c01 += u0 * d1;
      c02 += u0 * d2;
      c03 += u0 * d3;
      c10 += u1 * d0;
      c11 += u1 * d1;
      c12 += u1 * d2;
      c13 += u1 * d3;
      c20 += u2 * d0;
      c21 += u2 * d1;
      c22 += u2 * d2;
      c23 += u2 * d3;
      c30 += u3 * d0;
      c31 += u3 * d1;
      c32 += u3 * d2;
      c33 += u3 * d3;
    }
    c[off] += c00;
    c[off + 1] += c01;
    c[off + 2] += c02;
    c[off + 3] += c03;
    off += LAG_GROUP;
    c[off] += c10;
    c[off + 1] += c11;
    c[off + 2] += c12;
    c[off + 3] += c13;
    off += LAG_GROUP;
    c[off] += c20;
    c[off + 1] += c21;
    c[off + 2] += c22;
    c[off + 3] += c23;
    off += LAG_GROUP;
    c[off] += c30;
    c[off + 1] += c31;
    c[off + 2] += c32;
    c[off + 3] += c33;
  }

  /** {@link #cross4x4} with fused multiply-adds: the same sums, each step rounded once. */
  private static void fused4x4(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, int s,
      double[] c, int off) {
    double c00 = 0, c01 = 0, c02 = 0, c03 = 0, c10 = 0, c11 = 0, c12 = 0, c13 = 0;
    double c20 = 0, c21 = 0, c22 = 0, c23 = 0, c30 = 0, c31 = 0, c32 = 0, c33 = 0;
    int s2 = 2 * s, s3 = 3 * s;
    for (int a = a0; a < a1; a++) {
      int i = a * width + lane;
      double u0 = x[i], u1 = x[i + 1], u2 = x[i + 2], u3 = x[i + 3];
      int k = j0 + a;
      double d0 = d[k], d1 = d[k - s], d2 = d[k - s2], d3 = d[k - s3];
      c00 = Math.fma(u0, d0, c00);
      c01 = Math.fma(u0, d1, c01);
      c02 = Math.fma(u0, d2, c02);
      c03 = Math.fma(u0, d3, c03);
      c10 = Math.fma(u1, d0, c10);
      c11 = Math.fma(u1, d1, c11);
      c12 = Math.fma(u1, d2, c12);
      c13 = Math.fma(u1, d3, c13);
      c20 = Math.fma(u2, d0, c20);
      c21 = Math.fma(u2, d1, c21);
      c22 = Math.fma(u2, d2, c22);
      c23 = Math.fma(u2, d3, c23);
      c30 = Math.fma(u3, d0, c30);
      c31 = Math.fma(u3, d1, c31);
      c32 = Math.fma(u3, d2, c32);
      c33 = Math.fma(u3, d3, c33);
    }
    c[off] += c00;
    c[off + 1] += c01;
    c[off + 2] += c02;
    c[off + 3] += c03;
    off += LAG_GROUP;
    c[off] += c10;
    c[off + 1] += c11;
    c[off + 2] += c12;
    c[off + 3] += c13;
    off += LAG_GROUP;
    c[off] += c20;
    c[off + 1] += c21;
    c[off + 2] += c22;
    c[off + 3] += c23;
    off += LAG_GROUP;
    c[off] += c30;
    c[off + 1] += c31;
    c[off + 2] += c32;
    c[off + 3] += c33;
  }

  /**
   * Σ x[a * width + lane + i] d[j0 + a] over rows [a0, a1) for lanes i in 0..3 (one lag), added to
   * {@code c[off + i * LAG_GROUP]}.
   */
  private static void cross4x1(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, double[] c,
      int off) {
    double c0 = 0, c1 = 0, c2 = 0, c3 = 0;
    for (int a = a0; a < a1; a++) {
      int i = a * width + lane;
      double v = d[j0 + a];
      c0 += x[i] * v;
      c1 += x[i + 1] * v;
      c2 += x[i + 2] * v;
      c3 += x[i + 3] * v;
    }
    c[off] += c0;
    c[off + LAG_GROUP] += c1;
    c[off + 2 * LAG_GROUP] += c2;
    c[off + 3 * LAG_GROUP] += c3;
  }

  /** {@link #cross4x1} with fused multiply-adds. */
  private static void fused4x1(double[] x, int width, int lane, int a0, int a1, double[] d, int j0, double[] c,
      int off) {
    double c0 = 0, c1 = 0, c2 = 0, c3 = 0;
    for (int a = a0; a < a1; a++) {
      int i = a * width + lane;
      double v = d[j0 + a];
      c0 = Math.fma(x[i], v, c0);
      c1 = Math.fma(x[i + 1], v, c1);
      c2 = Math.fma(x[i + 2], v, c2);
      c3 = Math.fma(x[i + 3], v, c3);
    }
    c[off] += c0;
    c[off + LAG_GROUP] += c1;
    c[off + 2 * LAG_GROUP] += c2;
    c[off + 3 * LAG_GROUP] += c3;
  }

  // Lane j's window at lag index l, in rows: [lo, hi), clipped to the lane's values.
  private int lo(int j, int l) {
    return (int) Math.max(first[j], (long) driver.first() + lags[l] - start);
  }

  private int hi(int j, int l) {
    return (int) Math.min(last[j] + 1L, (long) driver.last() + lags[l] + 1 - start);
  }

  /**
   * r of lane j at lag index l (NaN where the row would be invalid), from the sums alone; sets
   * {@link #lastPairs}.
   */
  private double r(int j, int l, double crossProduct) {
    int lo = lo(j, l), hi = hi(j, l);
    if (hi <= lo) {
      lastPairs = 0;
      return Double.NaN;
    }
    int lag = lags[l];
    int n = hi - lo;
    double sb = 0, sbb = 0;
    for (int q = gapAt[j], end = q + gapCount[j]; q < end; q++) {
      int g = gaps[q];
      if (g >= lo && g < hi) {
        double v = driver.centredOrZero(start + g - lag);
        n--;
        sb += v;
        sbb += v * v;
      }
    }
    CentredPrefix dp = driver.prefix();
    int dlo = lo + start - lag, dhi = hi + start - lag;
    double sa = snapSum[slotHi[l] * stride + j] - snapSum[slotLo[l] * stride + j];
    double saa = snapSquares[slotHi[l] * stride + j] - snapSquares[slotLo[l] * stride + j];
    lastPairs = n;
    return LagStatistics.r(n, sa, dp.sum(dlo, dhi) - sb, saa, dp.squares(dlo, dhi) - sbb, crossProduct);
  }

  /** All the sums of lane j at lag index l, the cross product given. */
  PairSums sums(int j, int l, double crossProduct) {
    int lo = lo(j, l), hi = hi(j, l);
    if (hi <= lo) {
      return PairSums.NONE;
    }
    int lag = lags[l];
    int n = hi - lo, m = n - 1;
    double sb = 0, sbb = 0, t0 = 0, t1 = 0, b0 = 0, b1 = 0, bb = 0;
    int added = Integer.MIN_VALUE;
    for (int q = gapAt[j], end = q + gapCount[j]; q < end; q++) {
      int g = gaps[q];
      if (g >= lo && g < hi) {
        double v = driver.centredOrZero(start + g - lag);
        n--;
        sb += v;
        sbb += v * v;
      }
      // A lag-1 pair starts at z when z and z + 1 are both values: not at a gap nor just before.
      for (int z = Math.max(g - 1, added + 1); z <= g; z++) {
        added = z;
        if (z >= lo && z < hi - 1) {
          double v = driver.centredOrZero(start + z - lag), w = driver.centredOrZero(start + z + 1 - lag);
          m--;
          t0 += x[z * stride + j];
          t1 += x[(z + 1) * stride + j];
          b0 += v;
          b1 += w;
          bb += v * w;
        }
      }
    }
    CentredPrefix dp = driver.prefix();
    int dlo = lo + start - lag, dhi = hi + start - lag;
    int sLo = slotLo[l] * stride + j, sHi = slotHi[l] * stride + j, sHi1 = slotHi1[l] * stride + j;
    double sa = snapSum[sHi] - snapSum[sLo];
    return new PairSums(n, m, sa, dp.sum(dlo, dhi) - sb, snapSquares[sHi] - snapSquares[sLo],
        dp.squares(dlo, dhi) - sbb, crossProduct,
        sa - x[(hi - 1) * stride + j] - t0, sa - x[lo * stride + j] - t1, snapLagged[sHi1] - snapLagged[sLo],
        dp.sum(dlo, dhi - 1) - b0, dp.sum(dlo + 1, dhi) - b1, dp.lagged(dlo, dhi) - bb);
  }
}
