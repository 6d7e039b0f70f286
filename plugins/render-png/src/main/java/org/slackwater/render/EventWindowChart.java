package org.slackwater.render;

import java.awt.BasicStroke;
import java.awt.Paint;
import java.awt.Shape;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.labels.ItemLabelAnchor;
import org.jfree.chart.labels.ItemLabelPosition;
import org.jfree.chart.labels.StandardCategoryItemLabelGenerator;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.CombinedDomainCategoryPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.LineAndShapeRenderer;
import org.jfree.chart.renderer.category.StatisticalLineAndShapeRenderer;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.CategoryDataset;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.statistics.DefaultStatisticalCategoryDataset;
import org.slackwater.core.result.ResultTable;

/**
 * Windows before events: one panel per driver (its own unit, side by side), one row per event. In each,
 * the spread of the same calendar window in the other baseline years (mean as a dash, ± 1 sd as
 * an error bar) and this event's window value as a diamond, warm when above the baseline mean
 * and cool below, labelled with its standardized anomaly z and percentile rank. A window without
 * a value (too many missing days) has no diamond and says so.
 */
final class EventWindowChart {
  private EventWindowChart() {}

  /** The rows of one driver: its label and the row numbers. */
  private record Driver(String label, List<Integer> rows) {}

  static Figure figure(ResultTable t) {
    return Figure.of(chart(t));
  }

  static JFreeChart chart(ResultTable t) {
    String[] event = Tables.strings(t, "event"), driver = Tables.strings(t, "driver");
    String[] region = Tables.optionalStrings(t, "region").orElse(new String[event.length]);
    String[] units = Tables.optionalStrings(t, "units").orElse(new String[event.length]);
    double[] value = Tables.numbers(t, "value"), mean = Tables.numbers(t, "baseline_mean"), sd = Tables.numbers(t, "baseline_sd");
    double[] z = Tables.numbers(t, "standardized_anomaly");
    double[] pct = Tables.optionalNumbers(t, "percentile_rank").orElse(null);

    Map<String, Driver> drivers = new LinkedHashMap<>();
    for (int i = 0; i < event.length; i++) {
      String unit = units[i] == null ? "" : units[i];
      String label = Tables.label(driver[i] + (region[i] == null ? "" : " over " + region[i]), unit);
      drivers.computeIfAbsent(label, k -> new Driver(k, new ArrayList<>())).rows().add(i);
    }

    CategoryAxis events = Charts.style(new CategoryAxis("event date (the window ends the day before)"));
    events.setCategoryMargin(0.4);
    CombinedDomainCategoryPlot plot = new CombinedDomainCategoryPlot(events);
    plot.setGap(18);
    // Events down the side, one column per driver: each driver's unit label then reads across.
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    for (Driver d : drivers.values()) {
      plot.add(panel(d, event, value, mean, sd, z, pct), 1);
    }

    Shape diamond = diamond(6);
    List<LegendItem> legend = List.of(
        new LegendItem("same window in the other years: mean ± 1 sd", null, null, null, baselineDash(), Style.BASELINE,
            new BasicStroke(1.5f), Style.BASELINE),
        new LegendItem("this event's window, above the baseline mean", null, null, null, diamond, Style.ABOVE),
        new LegendItem("below the baseline mean", null, null, null, diamond, Style.BELOW));
    return Charts.chart(plot, t.title(), List.of(Titles.window(t)), Charts.notes(List.of(t)), Charts.legend(legend));
  }

  private static CategoryPlot panel(Driver d, String[] event, double[] value, double[] mean, double[] sd, double[] z, double[] pct) {
    DefaultStatisticalCategoryDataset baseline = new DefaultStatisticalCategoryDataset();
    DefaultCategoryDataset values = new DefaultCategoryDataset();
    Map<String, String> labels = new LinkedHashMap<>();
    Map<String, Boolean> above = new LinkedHashMap<>();
    for (int i : d.rows()) {
      String e = event[i] == null ? "event " + (i + 1) : event[i];
      baseline.add(Double.isNaN(mean[i]) ? null : (Number) mean[i], Double.isNaN(sd[i]) ? null : (Number) sd[i], "baseline", e);
      values.addValue(Double.isNaN(value[i]) ? null : (Number) value[i], "value", e);
      labels.put(e, Double.isNaN(value[i]) ? "no value (too many days missing)"
          : Double.isNaN(z[i]) ? "z not defined"
          : String.format(Locale.ROOT, "z = %+.2f", z[i]) + (pct == null || Double.isNaN(pct[i]) ? "" : String.format(Locale.ROOT, ", percentile %.0f", pct[i])));
      above.put(e, !Double.isNaN(value[i]) && !Double.isNaN(mean[i]) && value[i] >= mean[i]);
    }

    StatisticalLineAndShapeRenderer br = new StatisticalLineAndShapeRenderer(false, true);
    br.setSeriesPaint(0, Style.BASELINE);
    br.setSeriesShape(0, baselineDash());
    br.setErrorIndicatorPaint(Style.BASELINE);
    br.setErrorIndicatorStroke(new BasicStroke(1.5f));

    double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
    for (int i : d.rows()) {
      for (double v : new double[] {value[i], mean[i] - sd[i], mean[i] + sd[i]}) {
        if (Double.isFinite(v)) {
          lo = Math.min(lo, v);
          hi = Math.max(hi, v);
        }
      }
    }
    double middle = (lo + hi) / 2;
    // Labels sit above their marker and run towards the middle of the panel, so none is cut at an edge.
    ItemLabelPosition towardsLeft = new ItemLabelPosition(ItemLabelAnchor.OUTSIDE12, TextAnchor.BOTTOM_RIGHT);
    ItemLabelPosition towardsRight = new ItemLabelPosition(ItemLabelAnchor.OUTSIDE12, TextAnchor.BOTTOM_LEFT);
    LineAndShapeRenderer vr = new LineAndShapeRenderer(false, true) {
      private static final long serialVersionUID = 1L;

      @Override
      public Paint getItemPaint(int row, int column) {
        return above.getOrDefault((String) values.getColumnKey(column), true) ? Style.ABOVE : Style.BELOW;
      }

      @Override
      public ItemLabelPosition getPositiveItemLabelPosition(int row, int column) {
        Number v = values.getValue(row, column);
        return v != null && v.doubleValue() > middle ? towardsLeft : towardsRight;
      }

      @Override
      public ItemLabelPosition getNegativeItemLabelPosition(int row, int column) {
        return getPositiveItemLabelPosition(row, column);
      }
    };
    vr.setSeriesShape(0, diamond(6));
    vr.setDefaultItemLabelGenerator(new StandardCategoryItemLabelGenerator() {
      private static final long serialVersionUID = 1L;

      @Override
      public String generateLabel(CategoryDataset dataset, int row, int column) {
        return labels.get((String) dataset.getColumnKey(column));
      }
    });
    vr.setDefaultItemLabelsVisible(true);
    vr.setDefaultItemLabelFont(Style.LEGEND);
    vr.setDefaultItemLabelPaint(Style.TEXT);
    vr.setItemLabelInsets(new RectangleInsets(6, 6, 6, 6));

    NumberAxis axis = Charts.numberAxis(d.label());
    axis.setAutoRangeIncludesZero(false);
    axis.setUpperMargin(0.15);
    axis.setLowerMargin(0.15);
    CategoryPlot p = new CategoryPlot(baseline, null, axis, br);
    Charts.style(p);
    p.setDataset(1, values);
    p.setRenderer(1, vr);
    p.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
    p.setOrientation(PlotOrientation.HORIZONTAL);
    p.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
    return p;
  }

  private static Shape baselineDash() {
    return new Rectangle2D.Double(-9, -1.5, 18, 3);
  }

  private static Shape diamond(double r) {
    Path2D.Double s = new Path2D.Double();
    s.moveTo(0, -r);
    s.lineTo(r, 0);
    s.lineTo(0, r);
    s.lineTo(-r, 0);
    s.closePath();
    return s;
  }
}
