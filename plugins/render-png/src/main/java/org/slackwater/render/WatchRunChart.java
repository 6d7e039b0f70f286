package org.slackwater.render;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.watch.WatchState;
import org.slackwater.render.WatchRunLayout.Panel;

/**
 * A watch run day by day: at the top a strip coloured by each day's level (none, notice, warning,
 * alert: {@link Style#LEVEL_NONE} to {@link Style#ALERT}, darker with severity) with a filled
 * triangle over each day the watch was raised and a hollow one over each day it cleared; below
 * it one panel per condition value on the same day axis, its values as a line (gaps where a day
 * has none) over a pale shading of the days at a level, so that the values can be read against
 * the level they gave. The caution is printed in a box across the bottom.
 *
 * <p>Level cells are drawn without antialiasing, each at least {@link #MIN_RUN_WIDTH} pixels
 * wide, so that a one-day raise in a long run still shows. Failure modes: see {@link WatchRunData}.
 */
final class WatchRunChart implements Figure {
  static final double MIN_RUN_WIDTH = 3;
  /** Above this many days the line is drawn thin. */
  private static final int MAX_DAYS_FULL_LINE = 400;
  /** How much of the level colour the panel shading keeps (the rest white). */
  static final double SHADE = 0.22;

  private final WatchRunData data;

  WatchRunChart(ResultTable t) {
    this.data = WatchRunData.of(t);
  }

  WatchRunData data() {
    return data;
  }

  WatchRunLayout layout(int w, int h) {
    return WatchRunLayout.of(data, legend(), w, h);
  }

  static Color levelColour(int level) {
    return switch (level) {
      case 0 -> Style.LEVEL_NONE;
      case 1 -> Style.NOTICE;
      case 2 -> Style.WARNING;
      default -> Style.ALERT;
    };
  }

  /** The level colour mixed with white, for the shading behind the values. */
  static Color shade(int level) {
    Color c = levelColour(level);
    return new Color(mix(c.getRed()), mix(c.getGreen()), mix(c.getBlue()));
  }

  private static int mix(int channel) {
    return (int) Math.round(255 - (255 - channel) * SHADE);
  }

  @Override
  public void draw(Graphics2D g, int w, int h) {
    WatchRunLayout l = layout(w, h);
    l.heading().draw(g);
    List<DayAxis.Tick> ticks = l.axis().ticks(Style.TICK, 14);
    strip(g, l);
    for (Panel p : l.panels()) {
      panel(g, l, p, ticks);
    }
    axis(g, l, ticks);
    FlowLegend.draw(g, l.legend(), WatchRunLayout.PAD, l.legendTop(), w - 2 * WatchRunLayout.PAD);
    Heading.notes(g, l.notes(), w, l.caution().box().getY() - 6);
    l.caution().draw(g);
  }

  /** Runs of days in a row at one level: {first index, last index}. */
  private List<int[]> runs() {
    List<int[]> out = new ArrayList<>();
    List<LocalDate> days = data.days();
    int start = 0;
    for (int i = 1; i <= days.size(); i++) {
      boolean breaks = i == days.size() || !data.levels().get(i).equals(data.levels().get(start))
          || days.get(i).toEpochDay() - days.get(i - 1).toEpochDay() > 1;
      if (breaks) {
        out.add(new int[] {start, i - 1});
        start = i;
      }
    }
    return out;
  }

  private void strip(Graphics2D g, WatchRunLayout l) {
    Rectangle2D s = l.strip();
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    List<int[]> runs = runs();
    // Quiet runs first, so that a short raised run widened to the minimum stays on top.
    for (boolean raised : new boolean[] {false, true}) {
      for (int[] r : runs) {
        int level = data.levels().get(r[0]);
        if ((level > 0) != raised) {
          continue;
        }
        double[] x = l.axis().span(data.days().get(r[0]), data.days().get(r[1]), level > 0 ? MIN_RUN_WIDTH : 0);
        g.setColor(levelColour(level));
        g.fill(new Rectangle2D.Double(x[0], s.getY(), x[1] - x[0], s.getHeight()));
      }
    }
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    g.draw(s);
    g.setFont(Style.LEGEND);
    g.setColor(Style.TEXT);
    double asc = Text.ascent(Style.LEGEND);
    g.drawString(WatchRunLayout.STRIP_LABEL, (float) (s.getX() - 8 - Text.width(WatchRunLayout.STRIP_LABEL, Style.LEGEND)),
        (float) (s.getCenterY() + asc / 2 - 1));
    // Clears first, so that where markers crowd together (years of days) the raises stay on top.
    for (WatchState kind : new WatchState[] {WatchState.CLEARED, WatchState.RAISED}) {
      for (int i = 0; i < data.days().size(); i++) {
        if (data.states().get(i) == kind) {
          triangle(g, l.axis().mid(data.days().get(i)), s.getY() - 1, kind == WatchState.RAISED);
        }
      }
    }
  }

  /** A downward triangle, tip at (x, tipY): filled for a raise, hollow for a clear. */
  static void triangle(Graphics2D g, double x, double tipY, boolean filled) {
    double size = WatchRunLayout.MARKER_ROW - 2;
    Path2D t = new Path2D.Double();
    t.moveTo(x - size * 0.55, tipY - size);
    t.lineTo(x + size * 0.55, tipY - size);
    t.lineTo(x, tipY);
    t.closePath();
    g.setColor(filled ? Style.TEXT : Style.BACKGROUND);
    g.fill(t);
    g.setColor(Style.TEXT);
    g.setStroke(new BasicStroke(1.2f));
    g.draw(t);
  }

  private void panel(Graphics2D g, WatchRunLayout l, Panel p, List<DayAxis.Tick> ticks) {
    Rectangle2D b = p.box();
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    for (int[] r : runs()) {
      int level = data.levels().get(r[0]);
      if (level > 0) {
        double[] x = l.axis().span(data.days().get(r[0]), data.days().get(r[1]), MIN_RUN_WIDTH);
        g.setColor(shade(level));
        g.fill(new Rectangle2D.Double(x[0], b.getY(), x[1] - x[0], b.getHeight()));
      }
    }
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
    g.setStroke(Style.GRID_STROKE);
    g.setColor(Style.GRID);
    for (DayAxis.Tick t : ticks) {
      g.draw(new Line2D.Double(t.x(), b.getY(), t.x(), b.getMaxY()));
    }
    double asc = Text.ascent(Style.TICK);
    for (BigDecimal v : p.ticks()) {
      double y = p.y(v.doubleValue());
      g.setColor(Style.GRID);
      g.setStroke(Style.GRID_STROKE);
      g.draw(new Line2D.Double(b.getX(), y, b.getMaxX(), y));
      String s = Ticks.label(v);
      g.setColor(Style.MUTED_TEXT);
      g.setFont(Style.TICK);
      g.drawString(s, (float) (b.getX() - 6 - Text.width(s, Style.TICK)), (float) (y + asc / 2 - 1));
    }
    if (p.hasValues()) {
      line(g, l, p);
    }
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    g.draw(b);
    caption(g, p);
  }

  private void line(Graphics2D g, WatchRunLayout l, Panel p) {
    Path2D path = new Path2D.Double();
    List<Shape> dots = new ArrayList<>();
    List<LocalDate> days = data.days();
    boolean open = false;
    for (int i = 0; i < days.size(); i++) {
      double v = p.values()[i];
      boolean joined = open && days.get(i).toEpochDay() - days.get(i - 1).toEpochDay() == 1;
      if (!Double.isFinite(v)) {
        open = false;
        continue;
      }
      double x = l.axis().mid(days.get(i)), y = p.y(v);
      if (joined) {
        path.lineTo(x, y);
      } else {
        path.moveTo(x, y);
        boolean alone = (i + 1 >= days.size() || !Double.isFinite(p.values()[i + 1])
            || days.get(i + 1).toEpochDay() - days.get(i).toEpochDay() > 1);
        if (alone) {
          dots.add(new Ellipse2D.Double(x - 1.5, y - 1.5, 3, 3));
        }
      }
      open = true;
    }
    Shape clip = g.getClip();
    g.clip(p.box());
    g.setColor(Style.PRIMARY);
    g.setStroke(days.size() <= MAX_DAYS_FULL_LINE ? Style.LINE : Style.THIN_LINE);
    g.draw(path);
    for (Shape d : dots) {
      g.fill(d);
    }
    g.setClip(clip);
  }

  /** The panel's name and unit in the row above it, left-aligned with the panel. */
  private static void caption(Graphics2D g, Panel p) {
    String text = Tables.label(p.column()) + (p.hasValues() ? "" : " (no values in these days)");
    g.setColor(Style.TEXT);
    g.setFont(Style.LEGEND);
    g.drawString(Text.shorten(text, Style.LEGEND, p.box().getWidth()), (float) p.box().getX(),
        (float) (p.box().getY() - 3 - Text.descent(Style.LEGEND)));
  }

  private void axis(Graphics2D g, WatchRunLayout l, List<DayAxis.Tick> ticks) {
    double y = l.axisY(), asc = Text.ascent(Style.TICK);
    Rectangle2D s = l.strip();
    g.setFont(Style.TICK);
    for (DayAxis.Tick t : ticks) {
      g.setColor(Style.AXIS);
      g.setStroke(Style.THIN);
      g.draw(new Line2D.Double(t.x(), y, t.x(), y + 4));
      double tw = Text.width(t.label(), Style.TICK);
      double x = Math.max(2, Math.min(t.x() - tw / 2, s.getMaxX() + WatchRunLayout.PAD - 2 - tw));
      g.setColor(Style.MUTED_TEXT);
      g.drawString(t.label(), (float) x, (float) (y + 6 + asc));
    }
  }

  private List<FlowLegend.Item> legend() {
    List<FlowLegend.Item> items = new ArrayList<>();
    for (int level = 0; level < WatchRunData.LEVELS.size(); level++) {
      Color c = levelColour(level);
      items.add(new FlowLegend.Item((g, b) -> {
        g.setColor(c);
        g.fill(b);
        g.setColor(Style.AXIS);
        g.setStroke(Style.THIN);
        g.draw(b);
      }, level == 0 ? "no rule holds" : WatchRunData.LEVELS.get(level)));
    }
    items.add(new FlowLegend.Item((g, b) -> triangle(g, b.getCenterX(), b.getMaxY(), true), "raised"));
    items.add(new FlowLegend.Item((g, b) -> triangle(g, b.getCenterX(), b.getMaxY(), false), "cleared"));
    if (!data.values().isEmpty()) {
      items.add(new FlowLegend.Item((g, b) -> {
        g.setColor(shade(2));
        g.fill(b);
        g.setColor(Style.PRIMARY);
        g.setStroke(Style.LINE);
        g.draw(new Line2D.Double(b.getX() + 1, b.getCenterY(), b.getMaxX() - 1, b.getCenterY()));
      }, "condition value; shaded: days at a level"));
    }
    return items;
  }
}
