package org.slackwater.demo;

/**
 * What to generate: the span of whole calendar years, how much coarser than nominal the grids are,
 * and the seed of every random stream.
 *
 * <p>Semantics: years run from 1 January {@code firstYear} to 31 December {@code lastYear} inclusive.
 * {@code resolutionDivisor} divides the nominal number of cells per direction of every grid (integer
 * division, never fewer than 3 cells per direction). The same options always produce byte-identical
 * files.
 *
 * <p>Failure modes: the compact constructor throws {@link IllegalArgumentException} with a message
 * naming the offending value and the accepted range.
 */
public record DemoOptions(int firstYear, int lastYear, int resolutionDivisor, long seed) {

  /** Seed of the published demo scenario; the bloom and storm details below are drawn from it. */
  public static final long DEFAULT_SEED = 20060101L;

  /** Earliest year accepted: the time axes are counted from 2006, and earlier years add nothing. */
  public static final int MIN_YEAR = 1950;

  /** Latest year accepted; beyond it the scenario stops being a plausible demo. */
  public static final int MAX_YEAR = 2100;

  /** Largest divisor accepted; coarser grids would lose the estuary entirely. */
  public static final int MAX_DIVISOR = 16;

  public DemoOptions {
    if (firstYear < MIN_YEAR || firstYear > MAX_YEAR) {
      throw new IllegalArgumentException("firstYear " + firstYear + " is outside " + MIN_YEAR + ".." + MAX_YEAR
          + "; choose a year in that range");
    }
    if (lastYear < firstYear || lastYear > MAX_YEAR) {
      throw new IllegalArgumentException("lastYear " + lastYear + " must be between firstYear " + firstYear
          + " and " + MAX_YEAR);
    }
    if (resolutionDivisor < 1 || resolutionDivisor > MAX_DIVISOR) {
      throw new IllegalArgumentException("resolutionDivisor " + resolutionDivisor + " is outside 1.." + MAX_DIVISOR
          + "; 1 gives the nominal grids, 4 the small test grids");
    }
  }

  /** The full demo: 2006..2025 at nominal resolution. */
  public static DemoOptions full() {
    return new DemoOptions(2006, 2025, 1, DEFAULT_SEED);
  }

  /** The quick test scenario: 2013 (no bloom) and 2014 (bloom), grids 4x coarser per direction. */
  public static DemoOptions small() {
    return new DemoOptions(2013, 2014, 4, DEFAULT_SEED);
  }

  /** Number of calendar years covered. */
  public int years() {
    return lastYear - firstYear + 1;
  }
}
