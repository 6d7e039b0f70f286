package org.slackwater.core.analytics.correlation;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One {@link LagRow} per requested lag, in increasing lag order, and the best lag.
 *
 * <p>The best lag is the valid row with the largest |r|; equal |r| goes to the smaller |lag|, and
 * between -k and +k to +k (driver leading). Picking the best of many lags inflates the chance of a
 * spurious hit; {@link #bestSignificantAfterBonferroni()} divides alpha by the number of valid
 * lags for a conservative answer.
 *
 * @param settings what was computed
 * @param rows one row per lag
 */
public record CorrelationResult(CorrelationSettings settings, List<LagRow> rows) {
  public CorrelationResult {
    Objects.requireNonNull(settings, "settings");
    rows = List.copyOf(rows);
  }

  public Optional<LagRow> best() {
    LagRow best = null;
    for (LagRow row : rows) {
      if (row.valid() && (best == null || better(row, best))) {
        best = row;
      }
    }
    return Optional.ofNullable(best);
  }

  /** Whether the best lag's p-value is at most alpha; false when no lag is valid. */
  public boolean bestSignificant() {
    return best().map(LagRow::significant).orElse(false);
  }

  /** Whether the best lag's p-value is at most alpha / (number of valid lags). */
  public boolean bestSignificantAfterBonferroni() {
    long valid = validLagCount();
    return best().map(b -> b.pValue() <= settings.alpha() / valid).orElse(false);
  }

  public int validLagCount() {
    return (int) rows.stream().filter(LagRow::valid).count();
  }

  /** The row of a lag, if it was requested. */
  public Optional<LagRow> row(int lag) {
    return rows.stream().filter(r -> r.lag() == lag).findFirst();
  }

  private static boolean better(LagRow a, LagRow b) {
    return better(a.r(), a.lag(), b.r(), b.lag());
  }

  /**
   * The best-lag order of the class comment for two valid correlations: whether r {@code ra} at
   * lag {@code la} beats r {@code rb} at lag {@code lb}. Public so that callers ranking lags from
   * sums (the correlation map) pick the same lag without building rows.
   */
  public static boolean better(double ra, int la, double rb, int lb) {
    double absA = Math.abs(ra);
    double absB = Math.abs(rb);
    if (absA != absB) {
      return absA > absB;
    }
    int ka = Math.abs(la);
    int kb = Math.abs(lb);
    return ka != kb ? ka < kb : la > lb;
  }
}
