package org.slackwater.render;

import java.awt.Color;
import java.awt.Paint;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.axis.Axis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.HorizontalAlignment;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.slackwater.core.result.ResultTable;

/**
 * Building and styling charts in the shared look ({@link Style}): title, subtitle lines,
 * a footer with the query and the result's warnings, a legend of fixed items, plots with a light grid.
 */
final class Charts {
  private Charts() {}

  /** At most this many warnings in the footer; the rest are counted. */
  private static final int MAX_WARNINGS = 3;

  static JFreeChart chart(Plot plot, String title, List<String> subtitles, List<String> notes, LegendItemCollection legend) {
    JFreeChart chart = new JFreeChart(null, Style.TITLE, plot, false);
    chart.setBackgroundPaint(Style.BACKGROUND);
    chart.setPadding(new RectangleInsets(10, 12, 8, 16));
    chart.setAntiAlias(true);
    chart.setTextAntiAlias(true);
    TextTitle head = new TextTitle(title, Style.TITLE, Style.TEXT, RectangleEdge.TOP, HorizontalAlignment.LEFT,
        org.jfree.chart.ui.VerticalAlignment.CENTER, new RectangleInsets(0, 0, 2, 0));
    head.setMaximumLinesToDisplay(2);
    chart.addSubtitle(head);
    for (String s : subtitles) {
      TextTitle sub = new TextTitle(s, Style.SUBTITLE, Style.MUTED_TEXT, RectangleEdge.TOP, HorizontalAlignment.LEFT,
          org.jfree.chart.ui.VerticalAlignment.CENTER, new RectangleInsets(1, 0, 1, 0));
      sub.setMaximumLinesToDisplay(2);
      chart.addSubtitle(sub);
    }
    // Bottom titles stack upwards in the order added: notes at the very bottom, the legend above them.
    for (int i = notes.size() - 1; i >= 0; i--) {
      TextTitle foot = new TextTitle(notes.get(i), Style.NOTE, Style.MUTED_TEXT, RectangleEdge.BOTTOM, HorizontalAlignment.LEFT,
          org.jfree.chart.ui.VerticalAlignment.CENTER, new RectangleInsets(1, 0, 0, 0));
      foot.setMaximumLinesToDisplay(2);
      chart.addSubtitle(foot);
    }
    if (legend != null && legend.getItemCount() > 0) {
      LegendTitle lt = new LegendTitle(() -> legend);
      lt.setItemFont(Style.LEGEND);
      lt.setItemPaint(Style.TEXT);
      lt.setFrame(BlockBorder.NONE);
      lt.setBackgroundPaint(Style.BACKGROUND);
      lt.setPosition(RectangleEdge.BOTTOM);
      lt.setHorizontalAlignment(HorizontalAlignment.LEFT);
      lt.setMargin(new RectangleInsets(4, 0, 4, 0));
      chart.addSubtitle(lt);
    }
    return chart;
  }

  /** The query text and the warnings of the results, for the footer. */
  static List<String> notes(List<ResultTable> tables) {
    List<String> out = new ArrayList<>();
    List<String> warnings = new ArrayList<>();
    for (ResultTable t : tables) {
      String q = t.metadata().get("query");
      if (q != null && !q.isBlank() && !out.contains("query: " + q)) {
        out.add("query: " + q);
      }
      for (String w : t.warnings()) {
        if (!warnings.contains(w)) {
          warnings.add(w);
        }
      }
    }
    for (int i = 0; i < Math.min(MAX_WARNINGS, warnings.size()); i++) {
      out.add("note: " + warnings.get(i));
    }
    if (warnings.size() > MAX_WARNINGS) {
      out.add("and " + (warnings.size() - MAX_WARNINGS) + " more notes (format=json lists them all)");
    }
    return out;
  }

  static void style(XYPlot p) {
    p.setBackgroundPaint(Style.BACKGROUND);
    p.setOutlinePaint(Style.GRID);
    p.setDomainGridlinePaint(Style.GRID);
    p.setRangeGridlinePaint(Style.GRID);
    p.setDomainGridlineStroke(Style.GRID_STROKE);
    p.setRangeGridlineStroke(Style.GRID_STROKE);
    p.setAxisOffset(RectangleInsets.ZERO_INSETS);
    p.setInsets(new RectangleInsets(6, 4, 4, 8));
  }

  static void style(CategoryPlot p) {
    p.setBackgroundPaint(Style.BACKGROUND);
    p.setOutlinePaint(Style.GRID);
    p.setDomainGridlinesVisible(false);
    p.setRangeGridlinePaint(Style.GRID);
    p.setRangeGridlineStroke(Style.GRID_STROKE);
    p.setAxisOffset(RectangleInsets.ZERO_INSETS);
    p.setInsets(new RectangleInsets(6, 4, 4, 8));
  }

  static <A extends Axis> A style(A axis) {
    axis.setLabelFont(Style.AXIS_LABEL);
    axis.setLabelPaint(Style.TEXT);
    axis.setTickLabelFont(Style.TICK);
    axis.setTickLabelPaint(Style.MUTED_TEXT);
    axis.setAxisLinePaint(Style.AXIS);
    axis.setTickMarkPaint(Style.AXIS);
    return axis;
  }

  static NumberAxis numberAxis(String label) {
    NumberAxis a = style(new NumberAxis(label));
    a.setAutoRangeIncludesZero(false);
    // Wider label insets make the axis choose fewer, calmer ticks.
    a.setTickLabelInsets(new RectangleInsets(7, 4, 7, 4));
    return a;
  }

  static LegendItem box(String label, Paint fill, Paint outline) {
    Rectangle2D shape = new Rectangle2D.Double(-6, -5, 12, 10);
    return new LegendItem(label, null, null, null, true, shape, true, fill, outline != null, outline == null ? Color.WHITE : outline,
        Style.THIN, false, new Line2D.Double(), Style.THIN, Color.WHITE);
  }

  static LegendItem line(String label, Paint paint, Stroke stroke) {
    return new LegendItem(label, null, null, null, false, new Rectangle2D.Double(), false, paint, false, paint, Style.THIN, true,
        new Line2D.Double(-10, 0, 10, 0), stroke, paint);
  }

  static LegendItemCollection legend(List<LegendItem> items) {
    LegendItemCollection c = new LegendItemCollection();
    for (LegendItem i : items) {
      c.add(i);
    }
    return c;
  }
}
