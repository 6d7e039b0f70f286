package org.slackwater.render;

import java.awt.BasicStroke;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.Polygon;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.ResultTable;

/**
 * A map or correlation map drawn cell by cell with Java2D: each cell a rectangle of its grid
 * step in the colour of its value ({@link ColourScale}), cells without a value in a neutral grey
 * with a diagonal hatch that no colour map contains (the hatch leaves each cell's centre plain),
 * the region outline over the cells, degree ticks (N/S, E/W) on the frame, a colour bar with the
 * value's name and unit, and a legend row naming the missing cells, the outline and the colour map.
 */
final class CellMap implements Figure {
  /** Distance between hatch lines of a missing cell, layout pixels. */
  static final double HATCH = 6;

  private final ResultKind kind;
  private final MapData data;
  private final ColourScale scale;
  private final String title, subtitle;
  private final List<String> notes;

  CellMap(ResultTable t, ResultKind kind) {
    this.kind = kind;
    this.data = MapData.of(t, kind);
    this.scale = ColourScale.of(data.value(), data.diverging());
    this.title = t.title();
    this.subtitle = Titles.map(t, valueLabel(), data.value().length, data.missing());
    this.notes = Charts.notes(List.of(t));
  }

  MapData data() {
    return data;
  }

  ColourScale scale() {
    return scale;
  }

  MapLayout layout(int w, int h) {
    return MapLayout.of(data, title, subtitle, notes, w, h);
  }

  @Override
  public void draw(Graphics2D g, int w, int h) {
    MapLayout l = layout(w, h);
    header(g, l);
    cells(g, l);
    outline(g, l);
    frame(g, l);
    colourBar(g, l);
    legend(g, l, w);
    footer(g, l, h);
  }

  private String valueLabel() {
    if (kind == ResultKind.CORRELATION_MAP) {
      return "correlation r (" + Tables.meta(data.table(), "method", "pearson") + ")";
    }
    return Tables.label(data.valueColumn().name(), data.valueColumn().unit());
  }

  private void header(Graphics2D g, MapLayout l) {
    double y = 10;
    g.setColor(Style.TEXT);
    g.setFont(Style.TITLE);
    for (String s : l.title()) {
      g.drawString(s, (float) MapLayout.PAD, (float) (y + Text.ascent(Style.TITLE)));
      y += Text.height(Style.TITLE);
    }
    g.setColor(Style.MUTED_TEXT);
    g.setFont(Style.SUBTITLE);
    for (String s : l.subtitle()) {
      g.drawString(s, (float) MapLayout.PAD, (float) (y + Text.ascent(Style.SUBTITLE)));
      y += Text.height(Style.SUBTITLE);
    }
  }

  private void cells(Graphics2D g, MapLayout l) {
    Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
    // Cells edge to edge without antialiasing: each pixel belongs to one cell and keeps its exact colour.
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    List<Rectangle2D> missing = new ArrayList<>();
    for (int i = 0; i < data.value().length; i++) {
      Rectangle2D r = l.cell(data.lat()[i], data.lon()[i], data.cellLat(), data.cellLon());
      double v = data.value()[i];
      if (Double.isNaN(v)) {
        missing.add(r);
        g.setColor(Style.MISSING);
      } else {
        g.setColor(scale.colour(v));
      }
      g.fill(r);
    }
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
    for (Rectangle2D r : missing) {
      hatch(g, r);
    }
  }

  /** Diagonal lines at ±(j + ½) spacings from the cell's centre, so the centre itself stays plain grey. */
  static void hatch(Graphics2D g, Rectangle2D r) {
    Shape clip = g.getClip();
    g.clip(r);
    g.setColor(Style.MISSING_HATCH);
    g.setStroke(new BasicStroke(1f));
    double cx = r.getCenterX(), cy = r.getCenterY(), reach = r.getWidth() + r.getHeight();
    for (double off = HATCH / 2; off <= reach; off += HATCH) {
      for (double s : new double[] {off, -off}) {
        // the line x + y = cx + cy + s, drawn across the whole cell
        g.draw(new Line2D.Double(cx + s - reach, cy + reach, cx + s + reach, cy - reach));
      }
    }
    g.setClip(clip);
  }

  private void outline(Graphics2D g, MapLayout l) {
    if (data.region().isEmpty()) {
      return;
    }
    Path2D path = new Path2D.Double();
    Geometry geom = data.region().get();
    for (int i = 0; i < geom.getNumGeometries(); i++) {
      Geometry part = geom.getGeometryN(i);
      if (part instanceof Polygon p) {
        ring(path, p.getExteriorRing(), l);
        for (int k = 0; k < p.getNumInteriorRing(); k++) {
          ring(path, p.getInteriorRingN(k), l);
        }
      } else if (part instanceof LineString s) {
        ring(path, s, l);
      }
    }
    g.setColor(Style.OUTLINE_HALO);
    g.setStroke(new BasicStroke(3.4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
    g.draw(path);
    g.setColor(Style.OUTLINE);
    g.setStroke(new BasicStroke(1.5f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
    g.draw(path);
  }

  private static void ring(Path2D path, LineString ring, MapLayout l) {
    Coordinate[] c = ring.getCoordinates();
    for (int i = 0; i < c.length; i++) {
      double x = l.x(c[i].x), y = l.y(c[i].y);
      if (i == 0) {
        path.moveTo(x, y);
      } else {
        path.lineTo(x, y);
      }
    }
  }

  private void frame(Graphics2D g, MapLayout l) {
    Rectangle2D f = l.frame();
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    g.draw(f);
    g.setFont(Style.TICK);
    double asc = Text.ascent(Style.TICK);
    List<BigDecimal> lons = Ticks.between(l.lonWest(), l.lonEast(), (int) Math.max(2, f.getWidth() / 110));
    for (BigDecimal v : lons) {
      double x = l.x(v.doubleValue());
      g.setColor(Style.AXIS);
      g.draw(new Line2D.Double(x, f.getMaxY(), x, f.getMaxY() + 4));
      String s = Ticks.longitude(v);
      g.setColor(Style.MUTED_TEXT);
      g.drawString(s, (float) (x - Text.width(s, Style.TICK) / 2), (float) (f.getMaxY() + 6 + asc));
    }
    List<BigDecimal> lats = Ticks.between(l.latSouth(), l.latNorth(), (int) Math.max(2, f.getHeight() / 70));
    for (BigDecimal v : lats) {
      double y = l.y(v.doubleValue());
      g.setColor(Style.AXIS);
      g.draw(new Line2D.Double(f.getX() - 4, y, f.getX(), y));
      String s = Ticks.latitude(v);
      g.setColor(Style.MUTED_TEXT);
      g.drawString(s, (float) (f.getX() - 6 - Text.width(s, Style.TICK)), (float) (y + asc / 2 - 1));
    }
  }

  private void colourBar(Graphics2D g, MapLayout l) {
    Rectangle2D b = l.bar();
    // One image row per device pixel row, so each row has exactly one colour map entry.
    double device = Math.abs(g.getTransform().getScaleY());
    int rows = Math.max(2, (int) Math.round(b.getHeight() * device));
    BufferedImage strip = new BufferedImage(1, rows, BufferedImage.TYPE_INT_RGB);
    for (int r = 0; r < rows; r++) {
      strip.setRGB(0, r, scale.map().at(1 - (double) r / (rows - 1)).getRGB());
    }
    Object interp = g.getRenderingHint(RenderingHints.KEY_INTERPOLATION);
    g.setRenderingHint(RenderingHints.KEY_INTERPOLATION, RenderingHints.VALUE_INTERPOLATION_NEAREST_NEIGHBOR);
    g.drawImage(strip, new AffineTransform(b.getWidth(), 0, 0, b.getHeight() / rows, b.getX(), b.getY()), null);
    if (interp != null) {
      g.setRenderingHint(RenderingHints.KEY_INTERPOLATION, interp);
    }
    g.setColor(Style.AXIS);
    g.setStroke(Style.THIN);
    // The frame lies just outside the strip, so both end colours stay visible.
    g.draw(new Rectangle2D.Double(b.getX() - 0.5, b.getY() - 0.5, b.getWidth() + 1, b.getHeight() + 1));

    g.setFont(Style.TICK);
    double asc = Text.ascent(Style.TICK), widest = 0;
    for (BigDecimal v : Ticks.between(scale.low(), scale.high(), (int) Math.max(2, b.getHeight() / 60))) {
      double y = b.getMaxY() - scale.fraction(v.doubleValue()) * b.getHeight();
      g.setColor(Style.AXIS);
      g.draw(new Line2D.Double(b.getMaxX(), y, b.getMaxX() + 4, y));
      String s = Ticks.label(v);
      g.setColor(Style.MUTED_TEXT);
      g.drawString(s, (float) (b.getMaxX() + 6), (float) (y + asc / 2 - 1));
      widest = Math.max(widest, Text.width(s, Style.TICK));
    }
    String label = Text.shorten(valueLabel(), Style.TICK, b.getHeight());
    AffineTransform saved = g.getTransform();
    g.translate(b.getMaxX() + 6 + widest + 8 + asc, b.getCenterY() + Text.width(label, Style.TICK) / 2);
    g.rotate(-Math.PI / 2);
    g.setColor(Style.TEXT);
    g.drawString(label, 0f, 0f);
    g.setTransform(saved);
  }

  private void legend(Graphics2D g, MapLayout l, int w) {
    double x = l.frame().getX(), y = l.legendTop(), asc = Text.ascent(Style.LEGEND);
    g.setFont(Style.LEGEND);
    int missing = data.missing();
    if (missing > 0) {
      Rectangle2D sw = new Rectangle2D.Double(x, y, 18, 12);
      g.setColor(Style.MISSING);
      g.fill(sw);
      hatch(g, sw);
      g.setColor(Style.AXIS);
      g.setStroke(Style.THIN);
      g.draw(sw);
      x = text(g, "no data (" + missing + (missing == 1 ? " cell)" : " cells)"), x + 24, y + 6 + asc / 2 - 1) + 18;
    }
    if (data.region().isPresent()) {
      g.setColor(Style.OUTLINE_HALO);
      g.setStroke(new BasicStroke(3.4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
      g.draw(new Line2D.Double(x, y + 6, x + 18, y + 6));
      g.setColor(Style.OUTLINE);
      g.setStroke(new BasicStroke(1.5f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
      g.draw(new Line2D.Double(x, y + 6, x + 18, y + 6));
      x = text(g, "region outline" + Tables.meta(data.table(), "region", "").transform(r -> r.isEmpty() ? "" : " (" + r + ")"),
          x + 24, y + 6 + asc / 2 - 1) + 18;
    }
    String colours = scale.map().isDiverging()
        ? "colours: " + scale.map().name() + ", centred at 0"
        : "colours: " + scale.map().name();
    g.setColor(Style.MUTED_TEXT);
    g.drawString(Text.shorten(colours, Style.LEGEND, Math.max(20, w - MapLayout.PAD - x)), (float) x, (float) (y + 6 + asc / 2 - 1));
  }

  private static double text(Graphics2D g, String s, double x, double baseline) {
    g.setColor(Style.TEXT);
    g.drawString(s, (float) x, (float) baseline);
    return x + Text.width(s, g.getFont());
  }

  private void footer(Graphics2D g, MapLayout l, int h) {
    g.setFont(Style.NOTE);
    g.setColor(Style.MUTED_TEXT);
    double lh = Text.height(Style.NOTE), y = h - 8 - l.notes().size() * lh;
    for (String n : l.notes()) {
      g.drawString(n, (float) MapLayout.PAD, (float) (y + Text.ascent(Style.NOTE)));
      y += lh;
    }
  }
}
