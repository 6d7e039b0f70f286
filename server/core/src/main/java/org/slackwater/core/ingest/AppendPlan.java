package org.slackwater.core.ingest;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.slackwater.core.catalog.StepRange;
import org.slackwater.core.catalog.StepText;
import org.slackwater.core.cube.TimeAxis;

/**
 * How a file's time steps combine with a cube's: which of the file's steps the cube already holds
 * (overlap), which are new, and where each step of the combined axis comes from.
 *
 * <p>The rule: every cube step inside the file's time span [first, last step of the file] must
 * also be a step of the file. So the file may add steps after the cube's end (the daily case),
 * before its start, or inside a gap, and may re-deliver steps the cube holds (the same values, or
 * new values if it is a reprocessed version); but a file whose steps interleave with the cube's
 * (it spans cube steps it does not hold) is refused. With that rule the file's steps are one
 * consecutive block {@code [lo, lo + m)} of the combined axis, replacing the cube's steps {@code
 * [lo, hi)}: combined step k comes from the cube's step k before the block, from file step
 * {@code k - lo} inside it, and from the cube's step {@code k - shift} after it, where {@code
 * shift = m - (hi - lo)} is the number of steps added. Steps match by exact instant.
 */
final class AppendPlan {

  private final int lo;
  private final int hi;
  private final int m;
  private final boolean reprocessed;
  private final long[] combined;
  /** Combined indices of the steps the file adds. */
  private final int[] added;
  /** File indices of the steps the cube already holds, and the cube indices they match. */
  private final int[] overlapFile;
  private final int[] overlapCube;

  private AppendPlan(int lo, int hi, int m, boolean reprocessed, long[] combined, int[] added, int[] overlapFile, int[] overlapCube) {
    this.lo = lo;
    this.hi = hi;
    this.m = m;
    this.reprocessed = reprocessed;
    this.combined = combined;
    this.added = added;
    this.overlapFile = overlapFile;
    this.overlapCube = overlapCube;
  }

  /**
   * Plans adding {@code file}'s steps to {@code cube}'s.
   *
   * @param where {@code file X, variable V}, for messages
   * @throws IngestException if the file's steps interleave with the cube's
   */
  static AppendPlan of(TimeAxis cube, TimeAxis file, boolean reprocessed, String cubeName, String where) throws IngestException {
    long[] c = cube.epochSeconds();
    long[] f = file.epochSeconds();
    int n = c.length;
    int m = f.length;
    int lo = cube.firstAtOrAfter(f[0]);
    int hi = cube.firstAtOrAfter(f[m - 1] + 1);
    List<Integer> fileSide = new ArrayList<>();
    List<Integer> cubeSide = new ArrayList<>();
    for (int j = 0; j < m; j++) {
      int i = Arrays.binarySearch(c, lo, hi, f[j]);
      if (i >= 0) {
        fileSide.add(j);
        cubeSide.add(i);
      }
    }
    if (cubeSide.size() != hi - lo) {
      List<String> lacking = new ArrayList<>();
      for (int i = lo; i < hi && lacking.size() < 5; i++) {
        if (Arrays.binarySearch(f, c[i]) < 0) {
          lacking.add(StepText.of(c[i]));
        }
      }
      int count = hi - lo - cubeSide.size();
      throw new IngestException(where + ": its time steps interleave with those of cube '" + cubeName + "': the cube has "
          + count + " step(s) (" + String.join(", ", lacking) + (count > lacking.size() ? ", ..." : "")
          + ") between the file's first step " + StepText.of(f[0]) + " and its last " + StepText.of(f[m - 1])
          + " that the file does not hold. Nothing was changed. A file may add steps before, after or between the cube's"
          + " steps and re-deliver steps the cube holds, but must hold every cube step within its own time span:"
          + " split the file at those steps or include them");
    }
    int shift = m - (hi - lo);
    long[] combined = new long[n + shift];
    System.arraycopy(c, 0, combined, 0, lo);
    System.arraycopy(f, 0, combined, lo, m);
    System.arraycopy(c, hi, combined, lo + m, n - hi);
    int[] addedIdx = new int[shift];
    for (int j = 0, a = 0, o = 0; j < m; j++) {
      if (o < fileSide.size() && fileSide.get(o) == j) {
        o++;
      } else {
        addedIdx[a++] = lo + j;
      }
    }
    return new AppendPlan(lo, hi, m, reprocessed, combined,
        addedIdx, fileSide.stream().mapToInt(Integer::intValue).toArray(), cubeSide.stream().mapToInt(Integer::intValue).toArray());
  }

  int combinedSize() {
    return combined.length;
  }

  long[] combinedAxis() {
    return combined.clone();
  }

  boolean addsSteps() {
    return added.length > 0;
  }

  boolean overlaps() {
    return overlapFile.length > 0;
  }

  boolean reprocessed() {
    return reprocessed;
  }

  /** True if nothing would change: no new step, and overlapping steps are not to be replaced. */
  boolean changesNothing() {
    return !addsSteps() && !(reprocessed && overlaps());
  }

  /** File indices of the steps the cube holds already. */
  int[] overlapFileSteps() {
    return overlapFile.clone();
  }

  /** The cube's indices of those steps. */
  int[] overlapCubeSteps() {
    return overlapCube.clone();
  }

  boolean fromFile(int k) {
    return k >= lo && k < lo + m;
  }

  int fileStep(int k) {
    return k - lo;
  }

  /** The cube's step that combined step {@code k} (not from the file) comes from. */
  int cubeStep(int k) {
    return k < lo ? k : k - (m - (hi - lo));
  }

  /** Steps added before the cube's step {@code k}: 0 unless k is after the file's block. */
  int shift() {
    return m - (hi - lo);
  }

  /** The first combined step whose values may differ from the cube's step of the same index; -1 if none. */
  int firstChanged() {
    if (reprocessed && overlaps()) {
      return lo;
    }
    return addsSteps() ? added[0] : -1;
  }

  /** The last combined step whose values or position may differ (after it, cube steps only move by {@link #shift}). */
  int lastChanged() {
    if (reprocessed && overlaps()) {
      return lo + m - 1;
    }
    return addsSteps() ? added[added.length - 1] : -1;
  }

  Optional<StepRange> appended() {
    if (!addsSteps()) {
      return Optional.empty();
    }
    int a = added[0];
    int b = added[added.length - 1];
    return Optional.of(new StepRange(a, b, added.length, instant(a), instant(b)));
  }

  /** The cube steps a reprocessed file replaces (in combined indices); empty unless reprocessed. */
  Optional<StepRange> replaced() {
    if (!reprocessed || !overlaps()) {
      return Optional.empty();
    }
    int a = lo + overlapFile[0];
    int b = lo + overlapFile[overlapFile.length - 1];
    return Optional.of(new StepRange(a, b, overlapFile.length, instant(a), instant(b)));
  }

  List<StepGap> gaps(TimeAxis.Alignment alignment) {
    boolean[] isNew = new boolean[combined.length];
    for (int k : added) {
      isNew[k] = true;
    }
    return StepGaps.around(combined, isNew, alignment);
  }

  private java.time.Instant instant(int k) {
    return java.time.Instant.ofEpochSecond(combined[k]);
  }
}
