package org.slackwater.core.analytics;

/**
 * A statistic over the valid cells of a region at one time step.
 *
 * <ul>
 *   <li>{@code MEAN}: Σ aᵢvᵢ / Σ aᵢ, aᵢ the area of cell i inside the region (CF conventions 7.2/7.3);
 *   <li>{@code SUM}: the area integral Σ aᵢvᵢ (unit × m²);
 *   <li>{@code MIN}, {@code MAX}: over cells with any area inside;
 *   <li>{@code PERCENTILE}: the area-weighted percentile: the smallest value v such that cells with
 *       values ≤ v cover at least p % of the valid area (the inverse of the area-weighted empirical
 *       distribution function; no interpolation). The median is p = 50.
 * </ul>
 */
public record SpatialStatistic(Kind kind, double percentile) {
  public enum Kind { MEAN, SUM, MIN, MAX, PERCENTILE }

  public SpatialStatistic {
    if (kind == Kind.PERCENTILE && !(percentile > 0 && percentile < 100)) {
      throw new IllegalArgumentException("a percentile must be between 0 and 100 (exclusive), was " + percentile);
    }
  }

  public static SpatialStatistic of(Kind kind) {
    return new SpatialStatistic(kind, Double.NaN);
  }

  public static SpatialStatistic percentile(double p) {
    return new SpatialStatistic(Kind.PERCENTILE, p);
  }
}
