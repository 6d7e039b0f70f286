package org.slackwater.core.analytics.correlation;

/**
 * The raw sums over the complete pairs of one lag from which {@link LagStatistics} derives r, the
 * lag-1 autocorrelations, N_eff, t and p. Values are those of the two series each centred on the
 * mean of all its values (not on the pairs' means), which keeps the one-pass formulas well
 * conditioned; any such shift cancels in the results.
 *
 * <p>"Adjacent" pairs are two complete pairs one calendar step apart, the lag-1 pairs of the
 * paired sample: {@code adjacent} of them, with the sums of the earlier value ({@code adjT0},
 * {@code adjD0}), of the later value ({@code adjT1}, {@code adjD1}) and of their products
 * ({@code adjTT}, {@code adjDD}), for the target (T) and the driver (D).
 *
 * @param n complete pairs
 * @param adjacent lag-1 pairs among them
 * @param sumT sum of the target values
 * @param sumD sum of the driver values
 * @param sumTT sum of the squared target values
 * @param sumDD sum of the squared driver values
 * @param sumTD sum of the products target x driver
 * @param adjT0 sum of the earlier target value of each lag-1 pair
 * @param adjT1 sum of the later target value of each lag-1 pair
 * @param adjTT sum of the products of the two target values of each lag-1 pair
 * @param adjD0 sum of the earlier driver value of each lag-1 pair
 * @param adjD1 sum of the later driver value of each lag-1 pair
 * @param adjDD sum of the products of the two driver values of each lag-1 pair
 */
public record PairSums(int n, int adjacent, double sumT, double sumD, double sumTT, double sumDD, double sumTD,
    double adjT0, double adjT1, double adjTT, double adjD0, double adjD1, double adjDD) {
  /** No pair at all. */
  public static final PairSums NONE = new PairSums(0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0);

  public PairSums {
    if (n < 0 || adjacent < 0 || (n > 0 && adjacent >= n) || (n == 0 && adjacent != 0)) {
      throw new IllegalArgumentException("pair counts must satisfy 0 <= adjacent < n (got n = " + n
          + ", adjacent = " + adjacent + ")");
    }
  }
}
