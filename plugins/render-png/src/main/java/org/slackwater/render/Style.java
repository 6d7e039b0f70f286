package org.slackwater.render;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.Rectangle;
import java.awt.RenderingHints;
import java.awt.Stroke;
import java.awt.TexturePaint;
import java.awt.image.BufferedImage;

/**
 * The look shared by every plot: a calm slate-and-teal scheme on white, SansSerif type, light
 * grid. Sizes are layout pixels; {@link PlotOptions#scale()} enlarges everything together.
 * Paints that carry meaning (missing data, threshold, positive/negative anomaly) are chosen so that
 * none of them occurs in the colour maps or in another role.
 */
final class Style {
  private Style() {}

  static final Color BACKGROUND = Color.WHITE;
  static final Color TEXT = new Color(0x24, 0x32, 0x3d);
  static final Color MUTED_TEXT = new Color(0x5e, 0x6b, 0x75);
  static final Color AXIS = new Color(0x6b, 0x77, 0x80);
  static final Color GRID = new Color(0xe2, 0xe6, 0xe9);
  static final Color ZERO_LINE = new Color(0x9a, 0xa5, 0xad);

  /** Lines of plain series, filled bars of significant correlations. */
  static final Color PRIMARY = new Color(0x1f, 0x5c, 0x73);
  /** Bars of correlations that are not significant. */
  static final Color SECONDARY = new Color(0xa9, 0xc4, 0xd0);
  /** The baseline climatology: band and mean line. */
  static final Color BAND = new Color(0xdc, 0xe5, 0xe3);
  static final Color BASELINE = new Color(0x6f, 0x8a, 0x84);
  /** Anomalies above and below the baseline. */
  static final Color ABOVE = new Color(0xc4, 0x6a, 0x3e);
  static final Color BELOW = new Color(0x4a, 0x86, 0xa8);
  /** Significance thresholds. */
  static final Color THRESHOLD = new Color(0xb3, 0x3c, 0x5a);
  /** Event markers and the best-lag label. */
  static final Color EVENT = new Color(0x8a, 0x6d, 0x1f);

  /**
   * Backtest firings by outcome: Okabe and Ito's colour-universal-design palette (Okabe and Ito
   * 2008, "Color Universal Design", from memory): blue, sky blue and vermillion stay apart under
   * protanopia, deuteranopia and tritanopia (checked in the tests). Lead and false alarm are close
   * in grey, so outcomes also differ by lane and by pattern (solid, stripes, cross-hatch).
   */
  static final Color LEAD = new Color(0x00, 0x72, 0xb2);
  static final Color DURING_EVENT = new Color(0x56, 0xb4, 0xe9);
  static final Color FALSE_ALARM = new Color(0xd5, 0x5e, 0x00);
  /** Edge of the light during-event bars, so they keep 3:1 against white (WCAG 2.1, 1.4.11) where the fill alone has 2.3:1. */
  static final Color DURING_EVENT_EDGE = new Color(0x3d, 0x8f, 0xc4);

  /**
   * Watch levels: no rule holds (a pale grey), then notice, warning and alert from ColorBrewer's
   * sequential YlOrBr (7 classes: #fec44f, #ec7014, #8c2d04; C. A. Brewer, colorbrewer2.org),
   * one hue getting darker, so the order survives colour-blindness and grey print.
   */
  static final Color LEVEL_NONE = new Color(0xec, 0xef, 0xf1);
  static final Color NOTICE = new Color(0xfe, 0xc4, 0x4f);
  static final Color WARNING = new Color(0xec, 0x70, 0x14);
  static final Color ALERT = new Color(0x8c, 0x2d, 0x04);

  /** The caution box: dark text on a pale warm ground, framed, so it reads as part of the result. */
  static final Color CAUTION_BACKGROUND = new Color(0xfb, 0xf5, 0xe6);
  static final Color CAUTION_FRAME = new Color(0x8c, 0x7a, 0x4e);

  /**
   * Map cells without a value: a neutral grey that no colour map contains, hatched. Mid grey is
   * the neutral farthest from both maps: every viridis entry and every RdBu colour differs from it
   * by more than 40 in some channel (checked in the tests).
   */
  static final Color MISSING = new Color(0xa0, 0xa0, 0xa0);
  static final Color MISSING_HATCH = new Color(0x70, 0x70, 0x70);
  static final Color OUTLINE = new Color(0x1b, 0x22, 0x28);
  static final Color OUTLINE_HALO = Color.WHITE;

  static final String FAMILY = Font.SANS_SERIF;
  static final Font TITLE = new Font(FAMILY, Font.BOLD, 15);
  static final Font SUBTITLE = new Font(FAMILY, Font.PLAIN, 12);
  static final Font AXIS_LABEL = new Font(FAMILY, Font.PLAIN, 12);
  static final Font TICK = new Font(FAMILY, Font.PLAIN, 11);
  static final Font NOTE = new Font(FAMILY, Font.PLAIN, 10);
  static final Font LEGEND = new Font(FAMILY, Font.PLAIN, 11);
  /** The caution of watch outputs: as large as the subtitle, its first words bold. */
  static final Font CAUTION = new Font(FAMILY, Font.PLAIN, 12);
  static final Font CAUTION_LEAD = new Font(FAMILY, Font.BOLD, 12);

  static final Stroke LINE = new BasicStroke(2.0f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
  static final Stroke THIN = new BasicStroke(1.0f);
  static final Stroke THIN_LINE = new BasicStroke(1.0f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
  static final Stroke DASHED = new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {6f, 4f}, 0f);
  static final Stroke GRID_STROKE = new BasicStroke(0.8f);

  /** Diagonal hatch for hollow bars: thin lines of {@code line} on white. */
  static TexturePaint hatch(Color line) {
    BufferedImage tile = new BufferedImage(8, 8, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = tile.createGraphics();
    g.setColor(BACKGROUND);
    g.fillRect(0, 0, 8, 8);
    g.setColor(line);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_OFF);
    for (int i = 0; i < 8; i++) {
      g.fillRect(i, 7 - i, 1, 1);
    }
    g.dispose();
    return new TexturePaint(tile, new Rectangle(0, 0, 8, 8));
  }

  static void quality(Graphics2D g) {
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
    g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
    g.setRenderingHint(RenderingHints.KEY_FRACTIONALMETRICS, RenderingHints.VALUE_FRACTIONALMETRICS_ON);
    g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
    g.setRenderingHint(RenderingHints.KEY_RENDERING, RenderingHints.VALUE_RENDER_QUALITY);
  }
}
