package org.slackwater.core.analytics;

/**
 * Cuts ascending cell offsets into runs of consecutive offsets, so that per-step loops read each
 * run contiguously. Shared by {@link AreaStatistics} and the correlation-map tile copy.
 */
final class OffsetRuns {
  private OffsetRuns() {}

  /**
   * Fills {@code runStart} (first offset), {@code runFirst} (index of its first member) and
   * {@code runLen} for {@code offset[0, count)}; each array needs room for {@code count} runs.
   *
   * @return the number of runs
   */
  static int cut(int[] offset, int count, int[] runStart, int[] runFirst, int[] runLen) {
    int runs = 0;
    for (int j = 0; j < count; j++) {
      if (runs > 0 && offset[j] == runStart[runs - 1] + runLen[runs - 1]) {
        runLen[runs - 1]++;
      } else {
        runStart[runs] = offset[j];
        runFirst[runs] = j;
        runLen[runs] = 1;
        runs++;
      }
    }
    return runs;
  }
}
