package org.slackwater.render;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;
import org.slackwater.core.result.ResultTable;
import org.slackwater.render.BacktestData.Firing;
import org.slackwater.render.BacktestData.Outcome;
import org.slackwater.render.BacktestLayout.EventMark;

/**
 * A watch backtest as a timeline over the evaluated days: each firing a bar from its first to its
 * last day in the lane of its outcome (lead, during event, false alarm; lanes labelled with their
 * counts), coloured by outcome and patterned (solid, stripes, cross-hatch) so that colour-blind
 * readers and grey print can tell them apart; a firing still on at the end runs to the axis end
 * and ends in an arrow. Each event is a vertical marker in {@link Style#EVENT} labelled "caught
 * (lead N d)" or "missed": solid with a filled triangle when caught, dashed with a hollow one when
 * missed. The summary ("3 of 4 events caught, ...") is the first subtitle; the caution is printed
 * in a box across the bottom.
 *
 * <p>Bars and marker lines are drawn without antialiasing, so that their pixels keep exactly the
 * colours the legend shows. Failure modes: see {@link BacktestData}.
 */
final class BacktestChart implements Figure {
  /** Pattern lines only where they can be seen. */
  static final double MIN_PATTERN_WIDTH = 10;
  private static final double PATTERN_SPACING = 7;
  private static final Stroke EVENT_SOLID = new BasicStroke(2f);
  private static final Stroke EVENT_DASHED = new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {5f, 4f}, 0f);

  private final BacktestData data;

  BacktestChart(ResultTable t) {
    this.data = BacktestData.of(t);
  }

  BacktestData data() {
    return data;
  }

  BacktestLayout layout(int w, int h) {
    return BacktestLayout.of(data, legend(), w, h);
  }

  @Override
  public void draw(Graphics2D g, int w, int h) {
    BacktestLayout l = layout(w, h);
    l.heading().draw(g);
    lanes(g, l);
    // Event lines behind the bars, so that a firing spanning its event stays whole.
    events(g, l);
    firings(g, l);
    for (BacktestCloseup c : l.closeups()) {
      closeup(g, l, c);
    }
    FlowLegend.draw(g, l.legend(), BacktestLayout.PAD, l.legendTop(), w - 2 * BacktestLayout.PAD);
    Heading.notes(g, l.notes(), w, l.caution().box().getY() - 6);
    l.caution().draw(g);
  }

  private void lanes(Graphics2D g, BacktestLayout l) {
    Rectangle2D p = l.plot();
    List<DayAxis.Tick> ticks = l.axis().ticks(Style.TICK, 14);
    g.setStroke(Style.GRID_STROKE);
    g.setColor(Style.GRID);
    for (DayAxis.Tick t : ticks) {
      g.draw(new Line2D.Double(t.x(), p.getY(), t.x(), p.getMaxY()));
    }
    double asc = Text.ascent(Style.LEGEND);
    for (Outcome o : Outcome.values()) {
      Rectangle2D lane = l.lane(o);
      if (o.ordinal() > 0) {
        g.setColor(Style.GRID);
        g.draw(new Line2D.Double(lane.getX(), lane.getY(), lane.getMaxX(), lane.getY()));
      }
      String label = BacktestLayout.laneLabel(data, o);
      g.setFont(Style.LEGEND);
      g.setColor(Style.TEXT);
      g.drawString(label, (float) (p.getX() - 8 - Text.width(label, Style.LEGEND)), (float) (lane.getCenterY() + asc / 2 - 1));
    }
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    g.draw(p);
    g.setFont(Style.TICK);
    double tickAsc = Text.ascent(Style.TICK);
    for (DayAxis.Tick t : ticks) {
      g.setColor(Style.AXIS);
      g.draw(new Line2D.Double(t.x(), p.getMaxY(), t.x(), p.getMaxY() + 4));
      double tw = Text.width(t.label(), Style.TICK);
      double x = Math.max(2, Math.min(t.x() - tw / 2, l.plot().getMaxX() + BacktestLayout.RIGHT_ROOM - tw));
      g.setColor(Style.MUTED_TEXT);
      g.drawString(t.label(), (float) x, (float) (p.getMaxY() + 6 + tickAsc));
    }
  }

  private void firings(Graphics2D g, BacktestLayout l) {
    for (Firing f : data.firings()) {
      Rectangle2D r = l.bar(f);
      fill(g, r, f.outcome());
      if (f.end().isEmpty()) {
        stillOn(g, r, colour(f.outcome()));
      }
    }
  }

  private void closeup(Graphics2D g, BacktestLayout l, BacktestCloseup c) {
    if (c == l.closeups().get(0)) {
      g.setFont(Style.NOTE);
      g.setColor(Style.MUTED_TEXT);
      int before = data.leadWindow().orElse(60) + BacktestCloseup.MARGIN_DAYS;
      g.drawString("around each event, day by day (" + before + " days before to " + BacktestCloseup.AFTER_DAYS + " after; lanes as above):",
          (float) BacktestLayout.PAD, (float) l.closeupCaption());
    }
    g.setFont(Style.NOTE);
    g.setColor(Style.EVENT);
    g.drawString(c.header(), (float) c.box().getX(), (float) c.headerBaseline());
    Rectangle2D b = c.box();
    List<DayAxis.Tick> ticks = c.ticks();
    g.setStroke(Style.GRID_STROKE);
    g.setColor(Style.GRID);
    for (DayAxis.Tick t : ticks) {
      g.draw(new Line2D.Double(t.x(), b.getY(), t.x(), b.getMaxY()));
    }
    for (Outcome o : Outcome.values()) {
      if (o.ordinal() > 0) {
        Rectangle2D lane = BacktestLayout.lane(b, o);
        g.draw(new Line2D.Double(lane.getX(), lane.getY(), lane.getMaxX(), lane.getY()));
      }
    }
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    g.setColor(Style.EVENT);
    g.setStroke(c.event().caught() ? EVENT_SOLID : EVENT_DASHED);
    double ex = c.axis().mid(c.event().day());
    g.draw(new Line2D.Double(ex, b.getY(), ex, b.getMaxY()));
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
    Shape clip = g.getClip();
    g.clip(new Rectangle2D.Double(b.getX(), b.getY(), b.getWidth() + 1, b.getHeight()));
    for (Firing f : data.firings()) {
      Rectangle2D r = BacktestLayout.bar(b, c.axis(), f);
      if (r.getWidth() > 0) {
        fill(g, r, f.outcome());
      }
    }
    g.setClip(clip);
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    g.draw(b);
    g.setFont(Style.TICK);
    double asc = Text.ascent(Style.TICK);
    for (DayAxis.Tick t : ticks) {
      g.setColor(Style.AXIS);
      g.draw(new Line2D.Double(t.x(), b.getMaxY(), t.x(), b.getMaxY() + 4));
      double tw = Text.width(t.label(), Style.TICK);
      g.setColor(Style.MUTED_TEXT);
      g.drawString(t.label(), (float) Math.max(b.getX() - 4, Math.min(t.x() - tw / 2, b.getMaxX() + 4 - tw)), (float) (b.getMaxY() + 6 + asc));
    }
  }

  /** A bar in its outcome's colour and pattern; the pattern only where the bar is wide enough to show it. */
  static void fill(Graphics2D g, Rectangle2D r, Outcome o) {
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    g.setColor(colour(o));
    g.fill(r);
    if (o != Outcome.LEAD && r.getWidth() >= MIN_PATTERN_WIDTH) {
      pattern(g, r, o == Outcome.FALSE_ALARM);
    }
    if (o == Outcome.DURING_EVENT) {
      g.setColor(Style.DURING_EVENT_EDGE);
      g.setStroke(Style.THIN);
      g.draw(new Rectangle2D.Double(r.getX(), r.getY(), r.getWidth() - 1, r.getHeight() - 1));
    }
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
  }

  /** White diagonal lines ("/"), and the other diagonal too for a cross-hatch. */
  private static void pattern(Graphics2D g, Rectangle2D r, boolean cross) {
    Shape clip = g.getClip();
    g.clip(r);
    g.setColor(Style.BACKGROUND);
    g.setStroke(new BasicStroke(1f));
    double h = r.getHeight();
    // Lines start every PATTERN_SPACING along the bottom edge, from one bar height left of the bar to its right end.
    for (double off = PATTERN_SPACING / 2 - h - (h % PATTERN_SPACING); off <= r.getWidth(); off += PATTERN_SPACING) {
      g.draw(new Line2D.Double(r.getX() + off, r.getMaxY(), r.getX() + off + h, r.getY()));
      if (cross) {
        g.draw(new Line2D.Double(r.getX() + off, r.getY(), r.getX() + off + h, r.getMaxY()));
      }
    }
    g.setClip(clip);
  }

  private static void stillOn(Graphics2D g, Rectangle2D r, Color c) {
    double x = r.getMaxX() + 1, y = r.getCenterY(), s = Math.min(7, r.getHeight() / 2 + 2);
    Path2D arrow = new Path2D.Double();
    arrow.moveTo(x, y - s);
    arrow.lineTo(x + s * 1.2, y);
    arrow.lineTo(x, y + s);
    arrow.closePath();
    g.setColor(c);
    g.fill(arrow);
  }

  static Color colour(Outcome o) {
    return switch (o) {
      case LEAD -> Style.LEAD;
      case DURING_EVENT -> Style.DURING_EVENT;
      case FALSE_ALARM -> Style.FALSE_ALARM;
    };
  }

  private void events(Graphics2D g, BacktestLayout l) {
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    for (EventMark m : l.marks()) {
      // The line in exact colour (no antialiasing), 2 px wide about the middle of the event's day.
      g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
      g.setColor(Style.EVENT);
      g.setStroke(m.event().caught() ? EVENT_SOLID : EVENT_DASHED);
      g.draw(new Line2D.Double(m.x(), l.markTop(m), m.x(), l.plot().getMaxY()));
      g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
      triangle(g, m.x(), l.plot().getY() - 1, m.event().caught());
      if (!m.label().isEmpty()) {
        g.setFont(Style.NOTE);
        g.setColor(Style.EVENT);
        g.drawString(m.label(), (float) m.labelX(), (float) l.labelBaseline(m));
      }
    }
  }

  /** A downward triangle whose tip is at (x, tipY): filled when the event was caught, hollow when missed. */
  private static void triangle(Graphics2D g, double x, double tipY, boolean filled) {
    double s = BacktestLayout.TRIANGLE;
    Path2D t = new Path2D.Double();
    t.moveTo(x - s * 0.6, tipY - s);
    t.lineTo(x + s * 0.6, tipY - s);
    t.lineTo(x, tipY);
    t.closePath();
    g.setColor(filled ? Style.EVENT : Style.BACKGROUND);
    g.fill(t);
    g.setColor(Style.EVENT);
    g.setStroke(new BasicStroke(1.3f));
    g.draw(t);
  }

  private List<FlowLegend.Item> legend() {
    List<FlowLegend.Item> items = new ArrayList<>();
    // The server's rules (WatchBacktest): the window in days before and after an event.
    String before = data.leadWindow().stream().mapToObj(n -> "0 to " + n + " days ").findFirst().orElse("");
    String after = data.leadWindow().stream().mapToObj(n -> "1 to " + n + " days ").findFirst().orElse("");
    items.add(new FlowLegend.Item((g, b) -> fill(g, b, Outcome.LEAD), "lead: began " + before + "before an event"));
    items.add(new FlowLegend.Item((g, b) -> fill(g, b, Outcome.DURING_EVENT), "during event: began " + after + "after one"));
    items.add(new FlowLegend.Item((g, b) -> fill(g, b, Outcome.FALSE_ALARM), "false alarm: neither"));
    items.add(new FlowLegend.Item((g, b) -> eventSwatch(g, b, true), "event caught"));
    items.add(new FlowLegend.Item((g, b) -> eventSwatch(g, b, false), "event missed"));
    if (data.firings().stream().anyMatch(f -> f.end().isEmpty())) {
      items.add(new FlowLegend.Item((g, b) -> stillOn(g, new Rectangle2D.Double(b.getX(), b.getY(), 4, b.getHeight()), Style.TEXT),
          "still on at the end"));
    }
    return items;
  }

  private static void eventSwatch(Graphics2D g, Rectangle2D b, boolean caught) {
    double x = b.getCenterX();
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    g.setColor(Style.EVENT);
    g.setStroke(caught ? EVENT_SOLID : EVENT_DASHED);
    g.draw(new Line2D.Double(x, b.getY() + 4, x, b.getMaxY() + 3));
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
    double s = BacktestLayout.TRIANGLE * 0.7;
    Path2D t = new Path2D.Double();
    t.moveTo(x - s * 0.6, b.getY() - 1);
    t.lineTo(x + s * 0.6, b.getY() - 1);
    t.lineTo(x, b.getY() - 1 + s);
    t.closePath();
    g.setColor(caught ? Style.EVENT : Style.BACKGROUND);
    g.fill(t);
    g.setColor(Style.EVENT);
    g.setStroke(new BasicStroke(1.2f));
    g.draw(t);
  }
}
