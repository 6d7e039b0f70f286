package org.slackwater.render;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import org.jfree.chart.JFreeChart;

/** Something that draws itself into a canvas of layout pixels (the graphics is already scaled). */
interface Figure {
  void draw(Graphics2D g, int width, int height);

  static Figure of(JFreeChart chart) {
    return (g, w, h) -> chart.draw(g, new Rectangle2D.Double(0, 0, w, h));
  }
}
