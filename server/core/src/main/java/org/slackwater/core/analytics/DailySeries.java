package org.slackwater.core.analytics;

/**
 * A statistic over a region at each native time step of a cube.
 *
 * @param epochSeconds the steps' instants (real UTC time line)
 * @param value the statistic; NaN where no cell was valid or coverage fell short
 * @param validFraction valid area / region area on the grid, per step (0..1)
 * @param validCells cells with a valid value and any area inside the region, per step
 */
public record DailySeries(long[] epochSeconds, double[] value, double[] validFraction, int[] validCells) {
  public DailySeries {
    int n = epochSeconds.length;
    if (value.length != n || validFraction.length != n || validCells.length != n) {
      throw new IllegalArgumentException("series arrays differ in length");
    }
  }

  public int size() {
    return epochSeconds.length;
  }
}
