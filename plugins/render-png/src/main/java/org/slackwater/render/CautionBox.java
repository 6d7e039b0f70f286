package org.slackwater.render;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.util.List;

/**
 * The caution of an early-warning plot, printed across the bottom of the picture in a framed
 * box: "Caution:" in bold, then the caution word-wrapped to the box, at subtitle size (12 px, no
 * smaller than the axis labels), dark text on a pale ground. It is part of the figure, not a
 * footnote, so that a copied or printed plot keeps it.
 *
 * <p>The caution is never cut: it takes as many lines as it needs up to {@link #MAX_LINES} (the
 * server's caution takes two lines at 1000 px width, three at 600 px and seven at the smallest
 * plot, 200 px), and the plot above gets what is left. Only a caution longer than that is
 * shortened, with an ellipsis.
 */
record CautionBox(List<String> lines, Rectangle2D box) {
  static final String LEAD = "Caution:";
  static final int MAX_LINES = 12;
  static final double PAD_X = 8, PAD_Y = 5;

  CautionBox {
    lines = List.copyOf(lines);
  }

  /** The box for {@code caution} across {@code width} from {@code x}, its bottom edge at {@code bottom}. */
  static CautionBox of(String caution, double x, double width, double bottom) {
    double inner = width - 2 * PAD_X;
    List<String> lines = Text.wrap(caution, Style.CAUTION, inner - leadWidth(), inner, MAX_LINES);
    double h = lines.size() * Text.height(Style.CAUTION) + 2 * PAD_Y;
    return new CautionBox(lines, new Rectangle2D.Double(x, bottom - h, width, h));
  }

  /** Height the box takes for this caution and width, before it is placed. */
  static double height(String caution, double width) {
    return of(caution, 0, width, 0).box().getHeight();
  }

  private static double leadWidth() {
    return Text.width(LEAD + " ", Style.CAUTION_LEAD);
  }

  void draw(Graphics2D g) {
    g.setColor(Style.CAUTION_BACKGROUND);
    g.fill(box);
    g.setColor(Style.CAUTION_FRAME);
    g.setStroke(Style.THIN);
    g.draw(box);
    double lh = Text.height(Style.CAUTION), x = box.getX() + PAD_X, y = box.getY() + PAD_Y + Text.ascent(Style.CAUTION);
    g.setColor(Style.TEXT);
    g.setFont(Style.CAUTION_LEAD);
    g.drawString(LEAD, (float) x, (float) y);
    g.setFont(Style.CAUTION);
    for (int i = 0; i < lines.size(); i++) {
      g.drawString(lines.get(i), (float) (i == 0 ? x + leadWidth() : x), (float) (y + i * lh));
    }
  }
}
