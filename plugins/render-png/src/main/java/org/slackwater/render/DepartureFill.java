package org.slackwater.render;

import java.awt.AlphaComposite;
import java.awt.Composite;
import java.awt.Graphics2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CrosshairState;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.AbstractXYItemRenderer;
import org.jfree.chart.renderer.xy.XYItemRendererState;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.XYDataset;

/**
 * Shades the area between series 0 (the period's values) and series 1 (the baseline mean) of its
 * dataset: {@link Style#ABOVE} where the values lie above the mean, {@link Style#BELOW} where below,
 * split exactly where the two lines cross, translucent so that the baseline band stays visible.
 * A step where either value is missing interrupts the shading, like the lines. Draws no legend
 * items of its own (the chart's legend names the colours).
 */
final class DepartureFill extends AbstractXYItemRenderer {
  private static final long serialVersionUID = 1L;
  static final float ALPHA = 0.5f;

  @Override
  public void drawItem(Graphics2D g2, XYItemRendererState state, Rectangle2D dataArea, PlotRenderingInfo info, XYPlot plot,
      ValueAxis domainAxis, ValueAxis rangeAxis, XYDataset dataset, int series, int item, CrosshairState crosshairState, int pass) {
    if (series != 0 || item != 0) {
      return; // the whole shading is drawn once, from the first item
    }
    RectangleEdge xe = plot.getDomainAxisEdge(), ye = plot.getRangeAxisEdge();
    Path2D above = new Path2D.Double(Path2D.WIND_NON_ZERO), below = new Path2D.Double(Path2D.WIND_NON_ZERO);
    int n = Math.min(dataset.getItemCount(0), dataset.getItemCount(1));
    for (int i = 0; i + 1 < n; i++) {
      double x0 = dataset.getXValue(0, i), x1 = dataset.getXValue(0, i + 1);
      double v0 = dataset.getYValue(0, i), v1 = dataset.getYValue(0, i + 1), m0 = dataset.getYValue(1, i), m1 = dataset.getYValue(1, i + 1);
      if (Double.isNaN(v0) || Double.isNaN(v1) || Double.isNaN(m0) || Double.isNaN(m1)) {
        continue;
      }
      double d0 = v0 - m0, d1 = v1 - m1;
      if (d0 * d1 >= 0) {
        quad(d0 + d1 >= 0 ? above : below, x0, x1, v0, v1, m0, m1, dataArea, domainAxis, rangeAxis, xe, ye);
      } else {
        double t = d0 / (d0 - d1), xc = x0 + t * (x1 - x0), yc = m0 + t * (m1 - m0);
        quad(d0 > 0 ? above : below, x0, xc, v0, yc, m0, yc, dataArea, domainAxis, rangeAxis, xe, ye);
        quad(d1 > 0 ? above : below, xc, x1, yc, v1, yc, m1, dataArea, domainAxis, rangeAxis, xe, ye);
      }
    }
    Composite saved = g2.getComposite();
    g2.setComposite(AlphaComposite.getInstance(AlphaComposite.SRC_OVER, ALPHA));
    g2.setPaint(Style.ABOVE);
    g2.fill(above);
    g2.setPaint(Style.BELOW);
    g2.fill(below);
    g2.setComposite(saved);
  }

  private static void quad(Path2D p, double x0, double x1, double v0, double v1, double m0, double m1, Rectangle2D area,
      ValueAxis xa, ValueAxis ya, RectangleEdge xe, RectangleEdge ye) {
    double px0 = xa.valueToJava2D(x0, area, xe), px1 = xa.valueToJava2D(x1, area, xe);
    p.moveTo(px0, ya.valueToJava2D(v0, area, ye));
    p.lineTo(px1, ya.valueToJava2D(v1, area, ye));
    p.lineTo(px1, ya.valueToJava2D(m1, area, ye));
    p.lineTo(px0, ya.valueToJava2D(m0, area, ye));
    p.closePath();
  }

  @Override
  public org.jfree.chart.LegendItem getLegendItem(int datasetIndex, int series) {
    return null;
  }
}
