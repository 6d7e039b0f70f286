package org.slackwater.render;

import java.awt.Paint;
import java.awt.TexturePaint;
import java.util.List;
import java.util.Locale;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.ui.Layer;
import org.jfree.data.category.DefaultCategoryDataset;
import org.slackwater.core.result.ResultTable;

/**
 * A driver ranking: one horizontal bar of r per driver at its best lag, in the server's rank
 * order (largest |r| first, at the top). Drivers whose best r is significant are filled, the
 * others hatched; a dagger marks those that stay significant after the Bonferroni correction
 * over the lags tried. The label of each bar gives the driver, its region, best lag, r and p. Drivers without a correlation (too few pairs) have no bar.
 */
final class RankingChart {
  private RankingChart() {}

  static Figure figure(ResultTable t) {
    return Figure.of(chart(t));
  }

  static JFreeChart chart(ResultTable t) {
    String[] driver = Tables.strings(t, "driver");
    String[] region = Tables.optionalStrings(t, "region").orElse(new String[driver.length]);
    double[] lag = Tables.numbers(t, "best_lag"), r = Tables.numbers(t, "r");
    double[] p = Tables.optionalNumbers(t, "p_value").orElse(null);
    String[] sig = Tables.strings(t, "significant");
    String[] bonf = Tables.optionalStrings(t, "significant_after_bonferroni").orElse(new String[driver.length]);
    String lagUnit = Tables.unit(t, "best_lag");

    DefaultCategoryDataset data = new DefaultCategoryDataset();
    String[] keys = new String[driver.length];
    double lim = 0.05;
    for (int i = 0; i < driver.length; i++) {
      keys[i] = (i + 1) + ". " + driver[i] + (region[i] == null ? "" : " over " + region[i]) + ", lag " + Titles.count((long) lag[i], lagUnit)
          + (Double.isNaN(r[i]) ? ": no correlation (too few pairs)" : ": r = " + String.format(Locale.ROOT, "%+.3f", r[i])
              + (p == null || Double.isNaN(p[i]) ? "" : ", " + formatP(p[i])))
          + ("yes".equals(bonf[i]) ? " †" : "");
      data.addValue(Double.isNaN(r[i]) ? null : r[i], "r", keys[i]);
      if (!Double.isNaN(r[i])) {
        lim = Math.max(lim, Math.abs(r[i]));
      }
    }
    lim = Math.min(1, lim * 1.2);
    boolean[] filled = new boolean[driver.length];
    for (int i = 0; i < filled.length; i++) {
      filled[i] = "yes".equals(sig[i]);
    }

    TexturePaint hatch = Style.hatch(Style.PRIMARY);
    BarRenderer renderer = new BarRenderer() {
      private static final long serialVersionUID = 1L;

      @Override
      public Paint getItemPaint(int row, int column) {
        return filled[column] ? Style.PRIMARY : hatch;
      }
    };
    renderer.setBarPainter(new StandardBarPainter());
    renderer.setShadowVisible(false);
    renderer.setDrawBarOutline(true);
    renderer.setDefaultOutlinePaint(Style.PRIMARY);
    renderer.setDefaultOutlineStroke(Style.THIN);
    renderer.setMaximumBarWidth(0.12);
    renderer.setItemMargin(0);
    CategoryAxis cats = Charts.style(new CategoryAxis(null));
    cats.setMaximumCategoryLabelWidthRatio(0.42f);
    cats.setMaximumCategoryLabelLines(3);
    cats.setCategoryMargin(0.25);
    NumberAxis values = Charts.numberAxis("correlation r at the best lag");
    values.setRange(-lim, lim);
    CategoryPlot plot = new CategoryPlot(data, cats, values, renderer);
    Charts.style(plot);
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    plot.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
    plot.addRangeMarker(new ValueMarker(0, Style.ZERO_LINE, Style.THIN), Layer.BACKGROUND);

    return Charts.chart(plot, t.title(), List.of(Titles.ranking(t)), Charts.notes(List.of(t)), Charts.legend(List.of(
        Charts.box("significant at the best lag", Style.PRIMARY, Style.PRIMARY),
        Charts.box("not significant", hatch, Style.PRIMARY),
        Charts.line("† significant after Bonferroni over the lags tried", Style.BACKGROUND, Style.THIN))));
  }

  private static String formatP(double v) {
    return Titles.pValue(v);
  }
}
