package org.slackwater.core.analytics;

import java.util.List;
import java.util.Objects;
import org.slackwater.core.analytics.correlation.CorrelationResult;
import org.slackwater.core.analytics.correlation.LagRow;

/**
 * One cell of a correlation map: the row of the lag reported for it and how many lags were tried
 * and valid.
 *
 * <p>With one lag the row is that lag's row, valid or not, exactly as {@code correlate} gives it.
 * With several, it is the row of the best valid lag (largest |r|; equal |r| to the smaller |lag|,
 * then the positive one: {@link CorrelationResult#best()}); without a valid lag, the invalid row
 * of the lag with the most pairs, whose note says why. A cell whose series cannot be correlated
 * at all gets an invalid row with n = 0 at the first lag and the refusal as its note.
 *
 * <p>{@code row.significant()} is p &lt;= alpha for that lag alone. Choosing the best of many
 * lags inflates the chance of a spurious hit, so {@code significantAfterBonferroni} is p &lt;=
 * alpha / validLags, as {@link CorrelationResult#bestSignificantAfterBonferroni()} (the same
 * test as {@code rank drivers}); with one lag both agree.
 *
 * @param row the reported lag's row
 * @param lagsTested lags in the request
 * @param validLags lags with a valid r for this cell
 * @param significantAfterBonferroni the row is valid and p &lt;= alpha / validLags
 */
public record CellCorrelation(LagRow row, int lagsTested, int validLags, boolean significantAfterBonferroni) {
  public CellCorrelation {
    Objects.requireNonNull(row, "row");
    if (lagsTested < 1 || validLags < 0 || validLags > lagsTested) {
      throw new IllegalArgumentException("need 0 <= validLags <= lagsTested, lagsTested >= 1 (got " + validLags
          + " of " + lagsTested + ")");
    }
    if (row.valid() == (validLags == 0)) {
      throw new IllegalArgumentException("a valid row needs a valid lag and an invalid row none (row "
          + (row.valid() ? "valid" : "invalid") + ", " + validLags + " valid lags)");
    }
  }

  /** The cell's row chosen among the lags tried; Bonferroni over the valid ones at {@code alpha}. */
  static CellCorrelation of(LagRow row, int lagsTested, int validLags, double alpha) {
    return new CellCorrelation(row, lagsTested, validLags, row.valid() && row.pValue() <= alpha / validLags);
  }

  /** A cell that could not be correlated at all. */
  static CellCorrelation refused(LagRow row, int lagsTested) {
    return new CellCorrelation(row, lagsTested, 0, false);
  }

  /** The cell's entry from a whole result (every lag's row), by the rules above. */
  static CellCorrelation of(CorrelationResult result) {
    List<LagRow> rows = result.rows();
    BestLag pick = new BestLag();
    for (int i = 0; i < rows.size(); i++) {
      LagRow r = rows.get(i);
      pick.offer(i, r.lag(), r.r(), r.n(), 0);
    }
    return of(rows.get(pick.chosen()), rows.size(), pick.validLags(), result.settings().alpha());
  }
}
