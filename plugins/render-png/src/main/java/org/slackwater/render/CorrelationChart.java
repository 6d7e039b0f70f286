package org.slackwater.render;

import java.awt.Font;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.slackwater.core.result.ResultTable;

/**
 * A lagged correlation: r per lag as bars (filled dark where significant), at each lag a short
 * line at ± the |r| that lag needs for significance ({@link Significance#criticalR} from that
 * lag's effective sample size and the result's alpha), and the best lag labelled with its r, p and
 * whether it survives the Bonferroni correction over the lags tried. Lags without a correlation
 * (too few pairs) have no bar.
 */
final class CorrelationChart {
  private CorrelationChart() {}

  /** Half the width of a bar and of a threshold line, in lags. */
  private static final double HALF_BAR = 0.32, HALF_LINE = 0.44;

  static Figure figure(ResultTable t) {
    return Figure.of(chart(t));
  }

  static JFreeChart chart(ResultTable t) {
    double[] lag = Tables.numbers(t, "lag"), r = Tables.numbers(t, "r"), nEff = Tables.numbers(t, "n_effective");
    String[] sig = Tables.optionalStrings(t, "significant").orElse(null);
    double alpha = Significance.alpha(t.title(), t.metadata().get("alpha"));
    double[] crit = thresholds(nEff, alpha);

    XYIntervalSeries yes = new XYIntervalSeries("significant", false, true), no = new XYIntervalSeries("not significant", false, true);
    XYSeries upper = new XYSeries("+r crit", false, true), lower = new XYSeries("-r crit", false, true);
    double lim = 0.05;
    for (int i = 0; i < lag.length; i++) {
      if (!Double.isNaN(r[i])) {
        boolean significant = sig != null ? "yes".equals(sig[i]) : !Double.isNaN(crit[i]) && Math.abs(r[i]) >= crit[i];
        (significant ? yes : no).add(lag[i], lag[i] - HALF_BAR, lag[i] + HALF_BAR, r[i], Math.min(0, r[i]), Math.max(0, r[i]));
        lim = Math.max(lim, Math.abs(r[i]));
      }
      if (!Double.isNaN(crit[i])) {
        upper.add(lag[i] - HALF_LINE, crit[i]);
        upper.add(lag[i] + HALF_LINE, crit[i]);
        upper.add(lag[i] + HALF_LINE, null); // one short line per lag
        lower.add(lag[i] - HALF_LINE, -crit[i]);
        lower.add(lag[i] + HALF_LINE, -crit[i]);
        lower.add(lag[i] + HALF_LINE, null);
        lim = Math.max(lim, crit[i]);
      }
    }
    lim = Math.min(1, lim * 1.3);

    XYPlot plot = new XYPlot();
    Charts.style(plot);
    plot.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
    String lagUnit = Tables.unit(t, "lag");
    NumberAxis x = Charts.numberAxis(Tables.label("lag", lagUnit) + " (positive: the driver leads)");
    x.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
    x.setRange(min(lag) - 0.7, max(lag) + 0.7);
    plot.setDomainAxis(x);
    NumberAxis y = Charts.numberAxis("correlation r");
    y.setRange(-lim, lim);
    plot.setRangeAxis(y);
    plot.setDomainGridlinesVisible(false);

    XYIntervalSeriesCollection bars = new XYIntervalSeriesCollection();
    bars.addSeries(yes);
    bars.addSeries(no);
    XYBarRenderer br = new XYBarRenderer();
    br.setUseYInterval(true);
    br.setBarPainter(new StandardXYBarPainter());
    br.setShadowVisible(false);
    br.setSeriesPaint(0, Style.PRIMARY);
    br.setSeriesPaint(1, Style.SECONDARY);
    plot.setDataset(0, bars);
    plot.setRenderer(0, br);

    XYLineAndShapeRenderer lr = new XYLineAndShapeRenderer(true, false);
    for (int k = 0; k < 2; k++) {
      lr.setSeriesPaint(k, Style.THRESHOLD);
      lr.setSeriesStroke(k, Style.LINE);
    }
    lr.setDrawSeriesLineAsPath(false);
    XYSeriesCollection lines = new XYSeriesCollection();
    lines.addSeries(upper);
    lines.addSeries(lower);
    plot.setDataset(1, lines);
    plot.setRenderer(1, lr);
    plot.addRangeMarker(new ValueMarker(0, Style.ZERO_LINE, Style.THIN), Layer.BACKGROUND);

    labelBest(t, plot, lag, r, lim, lagUnit);

    List<String> sub = new ArrayList<>(List.of(Titles.correlation(t), Titles.significance(t, alpha)));
    return Charts.chart(plot, t.title(), sub, Charts.notes(List.of(t)), Charts.legend(List.of(
        Charts.box("significant", Style.PRIMARY, null),
        Charts.box("not significant", Style.SECONDARY, null),
        Charts.line("± |r| needed for significance at each lag", Style.THRESHOLD, Style.LINE))));
  }

  /** ± r_crit per row. */
  static double[] thresholds(double[] nEffective, double alpha) {
    double[] out = new double[nEffective.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = Double.isNaN(nEffective[i]) ? Double.NaN : Significance.criticalR(nEffective[i], alpha);
    }
    return out;
  }

  private static void labelBest(ResultTable t, XYPlot plot, double[] lag, double[] r, double lim, String lagUnit) {
    String best = t.metadata().get("best_lag");
    if (best == null) {
      return;
    }
    for (int i = 0; i < lag.length; i++) {
      if (Long.toString((long) lag[i]).equals(best.trim()) && !Double.isNaN(r[i])) {
        String p = t.metadata().get("best_p");
        String bonf = t.metadata().get("best_significant_after_bonferroni");
        String text = "best lag " + Titles.count((long) lag[i], lagUnit) + ": r = " + String.format(Locale.ROOT, "%.3f", r[i])
            + (p == null ? "" : ", " + formatP(p))
            + (bonf == null ? "" : "yes".equals(bonf) ? " (significant after Bonferroni)" : " (not significant after Bonferroni)");
        double yPos = r[i] + Math.signum(r[i] == 0 ? 1 : r[i]) * lim * 0.04;
        XYTextAnnotation a = new XYTextAnnotation(text, lag[i], yPos);
        a.setFont(Style.LEGEND.deriveFont(Font.BOLD));
        a.setPaint(Style.EVENT);
        a.setTextAnchor(r[i] >= 0 ? TextAnchor.BOTTOM_CENTER : TextAnchor.TOP_CENTER);
        plot.addAnnotation(a);
        return;
      }
    }
  }

  private static String formatP(String p) {
    try {
      return Titles.pValue(Double.parseDouble(p));
    } catch (NumberFormatException e) {
      return "p = " + p;
    }
  }

  private static double min(double[] v) {
    double m = Double.POSITIVE_INFINITY;
    for (double x : v) {
      m = Math.min(m, x);
    }
    return m;
  }

  private static double max(double[] v) {
    double m = Double.NEGATIVE_INFINITY;
    for (double x : v) {
      m = Math.max(m, x);
    }
    return m;
  }
}
