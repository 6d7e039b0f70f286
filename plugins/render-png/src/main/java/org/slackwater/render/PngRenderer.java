package org.slackwater.render;

import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.ResultTable;

/**
 * One PNG for one query's results. The plot is chosen from each result's {@code result_kind}:
 *
 * <ul>
 *   <li>series: a line over time; an anomaly result (with baseline_mean and baseline_sd) adds
 *       the baseline climatology band and shades departures above and below it. Several series
 *       in one query become panels stacked on one time axis.</li>
 *   <li>correlation: r per lag as bars, the |r| needed for significance at each lag, the best lag.</li>
 *   <li>ranking: r per driver at its best lag, significant drivers filled, others hatched.</li>
 *   <li>event_window: per driver, each event window's value against the same window in the other
 *       years (baseline mean ± 1 sd), labelled with the standardized anomaly.</li>
 *   <li>map, correlation_map: the cells in a colour map (viridis; a diverging map centred at 0 for
 *       differences, anomalies and correlations), the region outline, a colour bar, missing cells
 *       hatched grey.</li>
 *   <li>backtest (a watch tried on history): a timeline of the watch's firings in lanes by
 *       outcome and the events as markers, caught or missed, with the summary and the caution.</li>
 *   <li>watch_run (a watch evaluated day by day): a level strip with the raise and clear days,
 *       a panel per condition value below it, and the caution.</li>
 * </ul>
 *
 * Definitions ({@code let}) are skipped when the query also has something to plot. Failure modes:
 * {@link PlotException} for results that are tables rather than plots (watch, definition,
 * catalog), for several results that do not fit one picture, for empty results (except a
 * backtest: one without events or firings still plots, the watch never fired) and for results
 * without the columns their kind needs; the message says what to ask for instead. Thread-safe:
 * every call builds its own chart.
 */
public final class PngRenderer {
  static {
    // Rendering needs no display; a server without one must not try to open it.
    if (System.getProperty("java.awt.headless") == null) {
      System.setProperty("java.awt.headless", "true");
    }
  }

  private PngRenderer() {}

  public static byte[] render(List<ResultTable> results, PlotOptions options) {
    Objects.requireNonNull(results, "results");
    Objects.requireNonNull(options, "options");
    Figure figure = figure(results);
    BufferedImage image = new BufferedImage(options.pixelWidth(), options.pixelHeight(), BufferedImage.TYPE_INT_RGB);
    Graphics2D g = image.createGraphics();
    try {
      g.setColor(Style.BACKGROUND);
      g.fillRect(0, 0, image.getWidth(), image.getHeight());
      g.scale((double) image.getWidth() / options.width(), (double) image.getHeight() / options.height());
      Style.quality(g);
      figure.draw(g, options.width(), options.height());
    } finally {
      g.dispose();
    }
    return PngEncoder.encode(image, 96 * options.scale());
  }

  /** The figure for a query's results, or why there is none. */
  static Figure figure(List<ResultTable> results) {
    if (results.isEmpty()) {
      throw new PlotException("the query gave no results, so there is nothing to plot");
    }
    List<ResultTable> plotted = new ArrayList<>();
    // Per plotted result: its ResultKind, or null for a watch output (backtest, watch run), named in 'names'.
    List<ResultKind> kinds = new ArrayList<>();
    List<String> names = new ArrayList<>();
    for (ResultTable t : results) {
      Optional<String> watch = WatchFigures.label(t);
      if (watch.isPresent()) {
        plotted.add(t);
        kinds.add(null);
        names.add(watch.get().replace('_', ' '));
        continue;
      }
      ResultKind k = Tables.kind(t);
      if (k == ResultKind.DEFINITION && results.size() > 1) {
        continue; // a 'let' that prepares the statement after it
      }
      refuseTables(t, k);
      plotted.add(t);
      kinds.add(k);
      names.add(Tables.kindName(k));
    }
    if (plotted.isEmpty()) {
      throw new PlotException("the query defines variables but asks for nothing to plot; add a statement that uses them");
    }
    for (int i = 0; i < plotted.size(); i++) {
      ResultTable t = plotted.get(i);
      boolean emptyIsFine = kinds.get(i) == null && WatchFigures.plotsWithoutRows(WatchFigures.label(t).orElseThrow());
      if (t.rowCount() == 0 && !emptyIsFine) {
        throw new PlotException("the result '" + t.title() + "' has no rows, so there is nothing to plot; check the region and the period"
            + " (format=json shows the warnings)");
      }
    }
    if (kinds.stream().allMatch(k -> k == ResultKind.SERIES)) {
      return SeriesChart.figure(plotted);
    }
    if (plotted.size() > 1) {
      throw new PlotException("the query gives " + plotted.size() + " results (" + String.join(", ", names)
          + ") and one PNG holds one plot (only series stack into panels); send each statement as its own query, or ask for format=json");
    }
    ResultTable t = plotted.get(0);
    if (kinds.get(0) == null) {
      return WatchFigures.figure(t, WatchFigures.label(t).orElseThrow());
    }
    return switch (kinds.get(0)) {
      case CORRELATION -> CorrelationChart.figure(t);
      case RANKING -> RankingChart.figure(t);
      case EVENT_WINDOW -> EventWindowChart.figure(t);
      case MAP, CORRELATION_MAP -> new CellMap(t, kinds.get(0));
      default -> throw new IllegalStateException("unreachable: " + kinds.get(0));
    };
  }

  private static void refuseTables(ResultTable t, ResultKind k) {
    switch (k) {
      case WATCH -> throw new PlotException("a watch is a rule, not a plot (result '" + t.title() + "'); ask for format=json or csv,"
          + " or plot the watched series with a 'mean ... over ... during ...' query");
      case DEFINITION -> throw new PlotException("a definition ('let') has no plot (result '" + t.title() + "'); ask for format=json or csv,"
          + " or add a statement that uses the new variable");
      case CATALOG -> throw new PlotException("a catalog listing has no plot (result '" + t.title() + "'); ask for format=csv or json");
      default -> { }
    }
  }
}
