package org.slackwater.core.analytics;

import org.slackwater.core.analytics.correlation.CorrelationResult;

/**
 * Picks a cell's reported lag among the lags tried, from each lag's r and number of pairs alone,
 * so that only the chosen lag needs a full row (autocorrelations, N_eff, t, p):
 *
 * <ul>
 *   <li>the best valid lag, by {@link CorrelationResult#better} (largest |r|; equal |r| to the
 *       smaller |lag|, then to the positive lag), as {@code correlate} and {@code rank drivers}
 *       choose it;
 *   <li>without a valid lag, the lag with the most pairs (same tie rule on |lag|), so that its
 *       row's note says why even the best-supplied lag gives no correlation.
 * </ul>
 *
 * It also counts the valid lags (the Bonferroni divisor) and all pairs (none at all means the
 * series never meet). Mutable scratch, one per lane of a worker, {@link #reset} per cell.
 */
final class BestLag {
  private int best;
  private int bestLag;
  private double bestR;
  private double bestCross;
  private int fallback;
  private int fallbackLag;
  private int fallbackN;
  private double fallbackCross;
  private int valid;
  private long pairs;

  BestLag() {
    reset();
  }

  void reset() {
    best = -1;
    fallback = -1;
    valid = 0;
    pairs = 0;
  }

  /**
   * @param index the lag's position among the lags tried
   * @param r the lag's r, NaN where its row is invalid
   * @param n its pairs
   * @param cross a value kept with the lag for the caller (the map keeps its cross product)
   */
  void offer(int index, int lag, double r, int n, double cross) {
    pairs += n;
    if (r == r) {
      valid++;
      if (best < 0 || CorrelationResult.better(r, lag, bestR, bestLag)) {
        best = index;
        bestLag = lag;
        bestR = r;
        bestCross = cross;
      }
    } else if (fallback < 0 || n > fallbackN || (n == fallbackN && closer(lag, fallbackLag))) {
      fallback = index;
      fallbackLag = lag;
      fallbackN = n;
      fallbackCross = cross;
    }
  }

  private static boolean closer(int a, int b) {
    return Math.abs(a) != Math.abs(b) ? Math.abs(a) < Math.abs(b) : a > b;
  }

  /** The index of the reported lag (best valid, else fallback); -1 if nothing was offered. */
  int chosen() {
    return best >= 0 ? best : fallback;
  }

  /** The value kept with the reported lag. */
  double chosenCross() {
    return best >= 0 ? bestCross : fallbackCross;
  }

  int validLags() {
    return valid;
  }

  long pairs() {
    return pairs;
  }
}
