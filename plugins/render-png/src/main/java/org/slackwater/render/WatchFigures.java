package org.slackwater.render;

import java.util.Optional;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.ResultTable;

/**
 * The plots of watch outputs, chosen by their {@code result_kind} label: {@code backtest}
 * ({@link BacktestChart}) and {@code watch_run} ({@link WatchRunChart}). Labels, not
 * {@link ResultKind} constants, because these results are made by the watch endpoints rather than
 * by a query statement; a label the enum also gets later keeps working. Every figure made here
 * prints the caution.
 */
final class WatchFigures {
  private WatchFigures() {}

  static final String BACKTEST = "backtest";
  static final String WATCH_RUN = "watch_run";

  /** The label of a watch output, or empty for every other result. */
  static Optional<String> label(ResultTable t) {
    String label = t.metadata().get(ResultKind.KEY);
    return BACKTEST.equals(label) || WATCH_RUN.equals(label) ? Optional.of(label) : Optional.empty();
  }

  static Figure figure(ResultTable t, String label) {
    return BACKTEST.equals(label) ? new BacktestChart(t) : new WatchRunChart(t);
  }

  /** A backtest with no events and no firings is still a result worth showing: the watch never fired. */
  static boolean plotsWithoutRows(String label) {
    return BACKTEST.equals(label);
  }
}
