package org.slackwater.render;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;

/**
 * A legend of hand-drawn figures: swatch and label pairs laid left to right, wrapping onto a new
 * row when the next pair would pass the right edge.
 */
final class FlowLegend {
  private FlowLegend() {}

  /** Paints a swatch into its box. */
  interface Swatch {
    void draw(Graphics2D g, Rectangle2D box);
  }

  record Item(Swatch swatch, String label) {}

  static final double SWATCH_W = 18, SWATCH_H = 11, LABEL_GAP = 5, ITEM_GAP = 16, ROW = 17;

  /** Items in rows; a label too long for a row of its own is shortened with an ellipsis. */
  static List<List<Item>> rows(List<Item> items, double width) {
    List<List<Item>> rows = new ArrayList<>();
    List<Item> row = new ArrayList<>();
    double x = 0;
    for (Item item : items) {
      double room = width - SWATCH_W - LABEL_GAP;
      Item it = Text.width(item.label(), Style.LEGEND) <= room ? item : new Item(item.swatch(), Text.shorten(item.label(), Style.LEGEND, room));
      double w = width(it);
      if (!row.isEmpty() && x + w > width) {
        rows.add(row);
        row = new ArrayList<>();
        x = 0;
      }
      row.add(it);
      x += w + ITEM_GAP;
    }
    if (!row.isEmpty()) {
      rows.add(row);
    }
    return rows;
  }

  static double height(List<Item> items, double width) {
    return rows(items, width).size() * ROW;
  }

  static void draw(Graphics2D g, List<Item> items, double left, double top, double width) {
    double y = top, asc = Text.ascent(Style.LEGEND);
    for (List<Item> row : rows(items, width)) {
      double x = left;
      for (Item it : row) {
        Rectangle2D box = new Rectangle2D.Double(x, y + (ROW - SWATCH_H) / 2, SWATCH_W, SWATCH_H);
        it.swatch().draw(g, box);
        g.setFont(Style.LEGEND);
        g.setColor(Style.TEXT);
        g.drawString(it.label(), (float) (x + SWATCH_W + LABEL_GAP), (float) (y + ROW / 2 + asc / 2 - 1));
        x += width(it) + ITEM_GAP;
      }
      y += ROW;
    }
  }

  private static double width(Item it) {
    return SWATCH_W + LABEL_GAP + Text.width(it.label(), Style.LEGEND);
  }
}
