package org.slackwater.render;

import java.awt.geom.Rectangle2D;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.slackwater.core.result.Column;

/**
 * Where the parts of a watch run go, top to bottom: heading, the row of raise and clear markers,
 * the level strip, one panel per condition value (equal heights, each under its caption row, a
 * shared day axis, the axis labels under the last), tick labels, legend, notes and the caution box at the very bottom.
 * Each panel's value range is its finite values' range padded by {@link #RANGE_PAD} each side
 * (a constant series gets ±1, or ±10 % of its value); a panel without any value has no range.
 */
record WatchRunLayout(Heading heading, DayAxis axis, Rectangle2D strip, List<Panel> panels, double legendTop, List<FlowLegend.Item> legend,
    List<String> notes, CautionBox caution) {

  /** One value panel: its column, values, box, value range and ticks (none when it has no values). */
  record Panel(Column column, double[] values, Rectangle2D box, double lo, double hi, List<BigDecimal> ticks) {
    boolean hasValues() {
      return hi > lo;
    }

    double y(double v) {
      return box.getMaxY() - (v - lo) / (hi - lo) * box.getHeight();
    }
  }

  static final double PAD = Heading.PAD;
  static final double MARKER_ROW = 11, STRIP = 22, STRIP_GAP = 6, PANEL_GAP = 6, RANGE_PAD = 0.08;
  static final String STRIP_LABEL = "level";
  /** The least height of a value panel's plotting area. */
  static final double MIN_PANEL = 24;

  WatchRunLayout {
    panels = List.copyOf(panels);
    legend = List.copyOf(legend);
    notes = List.copyOf(notes);
  }

  /**
   * The layout, leaving out the footer notes when the panels would otherwise get less than
   * {@link #MIN_PANEL} pixels each; a {@link PlotException} naming the height needed when even
   * that is not enough (the caution is never shortened to make room).
   */
  static WatchRunLayout of(WatchRunData d, List<FlowLegend.Item> legend, int w, int h) {
    WatchRunLayout l = build(d, legend, d.output().notes(), w, h);
    double need = MIN_PANEL * d.values().size();
    if (l.room() < need && !l.notes().isEmpty()) {
      l = build(d, legend, List.of(), w, h);
    }
    if (l.room() < need) {
      throw BacktestLayout.tooSmall("a watch run", w, h, h + (int) Math.ceil(need - l.room()));
    }
    return l;
  }

  /** Height left for the panels' plotting areas (the strip, captions and gaps taken out). */
  double room() {
    int n = panels.size();
    double caption = Text.height(Style.LEGEND) + 3;
    return legendTop - 6 - (Text.height(Style.TICK) + 8) - (strip.getMaxY() + STRIP_GAP) - n * caption - Math.max(0, n - 1) * PANEL_GAP;
  }

  private static WatchRunLayout build(WatchRunData d, List<FlowLegend.Item> legend, List<String> notes, int w, int h) {
    String definition = Tables.meta(d.table(), "definition", "");
    List<String> subtitles = new ArrayList<>(List.of(WatchTitles.runSummary(d)));
    if (!definition.isEmpty()) {
      subtitles.add(definition);
    }
    Heading heading = Heading.of(WatchTitles.runTitle(d), subtitles, w);
    double stripTop = heading.bottom() + 8 + MARKER_ROW;
    CautionBox caution = CautionBox.of(d.output().caution(), PAD, w - 2 * PAD, h - 8);
    double notesTop = caution.box().getY() - 6 - notes.size() * Text.height(Style.NOTE);
    double legendTop = notesTop - 4 - FlowLegend.height(legend, w - 2 * PAD);
    double bottom = Math.max(stripTop + STRIP + 20, legendTop - 6 - (Text.height(Style.TICK) + 8));

    int n = d.values().size();
    double panelsTop = stripTop + STRIP + STRIP_GAP;
    // Each panel's caption sits in a row above it, so that it hides no value.
    double caption = Text.height(Style.LEGEND) + 3;
    double ph = n == 0 ? 0 : Math.max(12, (bottom - panelsTop - (n - 1) * PANEL_GAP - n * caption) / n);
    List<double[]> ranges = new ArrayList<>();
    List<List<BigDecimal>> ticks = new ArrayList<>();
    double labels = Text.width(STRIP_LABEL, Style.LEGEND);
    for (Column c : d.values()) {
      double[] r = range(d.values(c));
      ranges.add(r);
      List<BigDecimal> t = r[1] > r[0] ? Ticks.between(r[0], r[1], (int) Math.max(2, Math.min(6, ph / 28))) : List.of();
      ticks.add(t);
      for (BigDecimal v : t) {
        labels = Math.max(labels, Text.width(Ticks.label(v), Style.TICK));
      }
    }
    double left = PAD + labels + 10, right = Math.max(left + 40, w - PAD - 4);
    DayAxis axis = new DayAxis(d.from(), d.to(), left, right);
    Rectangle2D strip = new Rectangle2D.Double(left, stripTop, right - left, STRIP);
    List<Panel> panels = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      Column c = d.values().get(i);
      Rectangle2D box = new Rectangle2D.Double(left, panelsTop + caption + i * (ph + PANEL_GAP + caption), right - left, ph);
      panels.add(new Panel(c, d.values(c), box, ranges.get(i)[0], ranges.get(i)[1], ticks.get(i)));
    }
    return new WatchRunLayout(heading, axis, strip, panels, legendTop, legend, notes, caution);
  }

  /** The bottom of the lowest part that carries the day axis (the last panel, or the strip). */
  double axisY() {
    return panels.isEmpty() ? strip.getMaxY() : panels.get(panels.size() - 1).box().getMaxY();
  }

  /** The finite values' range, padded; {lo, hi} with hi = lo when there is no finite value. */
  static double[] range(double[] v) {
    double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
    for (double x : v) {
      if (Double.isFinite(x)) {
        lo = Math.min(lo, x);
        hi = Math.max(hi, x);
      }
    }
    if (lo > hi) {
      return new double[] {0, 0};
    }
    if (hi == lo) {
      double half = lo == 0 ? 1 : Math.abs(lo) * 0.1;
      return new double[] {lo - half, hi + half};
    }
    double pad = (hi - lo) * RANGE_PAD;
    return new double[] {lo - pad, hi + pad};
  }
}
