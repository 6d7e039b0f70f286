package org.slackwater.render;

import java.awt.geom.Rectangle2D;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slackwater.render.BacktestData.Event;
import org.slackwater.render.BacktestData.Firing;
import org.slackwater.render.BacktestData.Outcome;

/**
 * Where the parts of a backtest timeline go on a canvas of layout pixels, top to bottom: heading,
 * event labels (up to {@link #LABEL_ROWS} rows, a label moving down a row when it would touch the
 * one before), the event triangles, three lanes (lead, during event, false alarm) over the day
 * axis, tick labels, legend, notes and the caution box at the very bottom.
 *
 * <p>Firing bars are {@link #MIN_BAR_WIDTH} pixels wide at least, so that a one-day firing in a
 * twenty-year backtest stays visible. An event label that fits no row is shortened to its outcome,
 * then left out (its marker stays, filled when caught and hollow when missed).
 */
record BacktestLayout(Heading heading, DayAxis axis, Rectangle2D plot, List<EventMark> marks, int labelRows, List<BacktestCloseup> closeups,
    double closeupCaption, double legendTop, List<FlowLegend.Item> legend, List<String> notes, CautionBox caution) {

  /** One event marker: its x (the middle of the event's day), its label (empty when left out) and where the label goes. */
  record EventMark(Event event, double x, String label, int row, double labelX) {}

  static final double PAD = Heading.PAD;
  static final double MIN_BAR_WIDTH = 4;
  /** The least height of the three lanes. */
  static final double MIN_PLOT = 3 * 14;
  static final int LABEL_ROWS = 3;
  static final double LABEL_ROW = 14, TRIANGLE = 9, LABEL_GAP = 8;
  /** Room right of the axis for the arrow of a firing still on at the end. */
  static final double RIGHT_ROOM = 12;

  /** Close-ups are drawn for at most this many events, when the whole span is longer than this many days. */
  static final int MAX_CLOSEUPS = 6, CLOSEUP_MIN_SPAN_DAYS = 400;
  static final double CLOSEUP_MIN_WIDTH = 110, CLOSEUP_GAP = 14, MAIN_LANE_MAX = 50;

  BacktestLayout {
    marks = List.copyOf(marks);
    closeups = List.copyOf(closeups);
    legend = List.copyOf(legend);
    notes = List.copyOf(notes);
  }

  /**
   * The layout, leaving out the footer notes when the timeline would otherwise get less than
   * {@link #MIN_PLOT} pixels; a {@link PlotException} naming the height needed when even that is
   * not enough (the caution is never shortened to make room).
   */
  static BacktestLayout of(BacktestData d, List<FlowLegend.Item> legend, int w, int h) {
    BacktestLayout l = build(d, legend, d.output().notes(), w, h);
    if (l.room() < MIN_PLOT && !l.notes().isEmpty()) {
      l = build(d, legend, List.of(), w, h);
    }
    if (l.room() < MIN_PLOT) {
      throw tooSmall("a backtest", w, h, h + (int) Math.ceil(MIN_PLOT - l.room()));
    }
    return l;
  }

  static PlotException tooSmall(String what, int w, int h, int needed) {
    return new PlotException(what + " plot of " + w + " x " + h + " px has no room left for its data once the title, legend and"
        + " caution are in (the caution is printed whole); ask for height=" + needed + " or more at width=" + w + ", or a wider plot");
  }

  /** Height left for the timeline and its close-ups. */
  double room() {
    return legendTop - 6 - (Text.height(Style.TICK) + 8) - plot.getY();
  }

  private static BacktestLayout build(BacktestData d, List<FlowLegend.Item> legend, List<String> notes, int w, int h) {
    Heading heading = Heading.of(WatchTitles.backtestTitle(d), List.of(WatchTitles.backtestSummary(d), WatchTitles.backtestMeasures(d)), w);
    double laneLabels = 0;
    for (Outcome o : Outcome.values()) {
      laneLabels = Math.max(laneLabels, Text.width(laneLabel(d, o), Style.LEGEND));
    }
    double left = PAD + laneLabels + 10, right = Math.max(left + 40, w - PAD - RIGHT_ROOM);
    DayAxis axis = new DayAxis(d.from(), d.to(), left, right);
    List<EventMark> marks = place(d.events(), axis, w);
    int rows = marks.stream().filter(m -> !m.label().isEmpty()).mapToInt(m -> m.row() + 1).max().orElse(0);

    double plotTop = heading.bottom() + 10 + rows * LABEL_ROW + TRIANGLE + 2;
    CautionBox caution = CautionBox.of(d.output().caution(), PAD, w - 2 * PAD, h - 8);
    double notesTop = caution.box().getY() - 6 - notes.size() * Text.height(Style.NOTE);
    double legendHeight = FlowLegend.height(legend, w - 2 * PAD);
    double legendTop = notesTop - 4 - legendHeight;
    double tickRow = Text.height(Style.TICK) + 8;
    double available = legendTop - 6 - tickRow - plotTop;

    // Close-ups below the timeline when the events are few, the span long and the space there.
    int n = d.events().size();
    double closeupWidth = n == 0 ? 0 : (w - 2 * PAD - (n - 1) * CLOSEUP_GAP) / n;
    // Fixed parts of the close-up block: gap, caption, header, and its tick labels; its lanes take 16 to 34 px each.
    double closeupFixed = 10 + Text.height(Style.NOTE) + 4 + Text.height(Style.NOTE) + 3 + tickRow;
    boolean closeups = n > 0 && n <= MAX_CLOSEUPS && axis.days() > CLOSEUP_MIN_SPAN_DAYS && closeupWidth >= CLOSEUP_MIN_WIDTH
        && available - tickRow - closeupFixed - 3 * 16 >= 3 * 22;
    double plotHeight = available;
    if (closeups) {
      double shared = available - tickRow - closeupFixed;
      plotHeight = Math.min(3 * MAIN_LANE_MAX, shared - 3 * 16);
      plotHeight = Math.max(plotHeight, shared - 3 * 34);
    }
    Rectangle2D plot = new Rectangle2D.Double(left, plotTop, right - left, plotHeight);
    List<BacktestCloseup> list = new ArrayList<>();
    double caption = 0;
    if (closeups) {
      double top = plot.getMaxY() + tickRow + 10;
      caption = top + Text.ascent(Style.NOTE);
      double headerBaseline = top + Text.height(Style.NOTE) + 4 + Text.ascent(Style.NOTE);
      double boxTop = top + 2 * Text.height(Style.NOTE) + 7;
      double boxHeight = legendTop - 6 - tickRow - boxTop;
      for (int i = 0; i < n; i++) {
        Rectangle2D box = new Rectangle2D.Double(PAD + i * (closeupWidth + CLOSEUP_GAP), boxTop, closeupWidth, boxHeight);
        list.add(BacktestCloseup.of(d.events().get(i), d, box, headerBaseline));
      }
    }
    return new BacktestLayout(heading, axis, plot, marks, rows, list, caption, legendTop, legend, notes, caution);
  }

  static String laneLabel(BacktestData d, Outcome o) {
    return o.label + " (" + d.count(o) + ")";
  }

  /** The lane of an outcome in the timeline: a third of the plot, lead at the top. */
  Rectangle2D lane(Outcome o) {
    return lane(plot, o);
  }

  /** The bar of a firing in the timeline: its days on the axis (at least {@link #MIN_BAR_WIDTH} wide), centred in its lane. */
  Rectangle2D bar(Firing f) {
    return bar(plot, axis, f);
  }

  /** The lane of an outcome in a box of three lanes. */
  static Rectangle2D lane(Rectangle2D box, Outcome o) {
    double lh = box.getHeight() / Outcome.values().length;
    return new Rectangle2D.Double(box.getX(), box.getY() + o.ordinal() * lh, box.getWidth(), lh);
  }

  /** The bar of a firing in a box of three lanes on {@code axis}; a firing outside the axis gets an empty bar. */
  static Rectangle2D bar(Rectangle2D box, DayAxis axis, Firing f) {
    Rectangle2D lane = lane(box, f.outcome());
    double bh = Math.max(4, Math.min(lane.getHeight() * 0.6, 24));
    LocalDate first = f.start().isBefore(axis.from()) ? axis.from() : f.start();
    LocalDate last = f.lastDay(axis.to()).isAfter(axis.to()) ? axis.to() : f.lastDay(axis.to());
    if (last.isBefore(first)) {
      return new Rectangle2D.Double(lane.getX(), lane.getCenterY(), 0, 0);
    }
    double[] x = axis.span(first, last, MIN_BAR_WIDTH);
    return new Rectangle2D.Double(x[0], lane.getCenterY() - bh / 2, x[1] - x[0], bh);
  }

  /** The y where an event's marker line starts: the top of its label row, or its triangle when it has no label. */
  double markTop(EventMark m) {
    return m.label().isEmpty() ? plot.getY() - TRIANGLE - 2 : heading.bottom() + 10 + m.row() * LABEL_ROW;
  }

  /** Label baselines sit in rows above the triangles. */
  double labelBaseline(EventMark m) {
    return heading.bottom() + 10 + m.row() * LABEL_ROW + Text.ascent(Style.NOTE) + 1;
  }

  /**
   * Labels beside their marker (right, else left), each in the first row where it keeps
   * {@link #LABEL_GAP} from what is already there and where its marker line, which runs down
   * through the rows below, crosses no label; the date-less short form when the full one fits
   * nowhere. Placed in date order and in reverse, and the order that labels more events in full wins.
   */
  private static List<EventMark> place(List<Event> events, DayAxis axis, int w) {
    List<EventMark> forward = place(events, axis, w, false), backward = place(events, axis, w, true);
    return score(backward) > score(forward) ? backward : forward;
  }

  /** Full labels count most, short ones next. */
  private static int score(List<EventMark> marks) {
    int s = 0;
    for (EventMark m : marks) {
      s += m.label().isEmpty() ? 0 : m.label().startsWith(m.event().day().toString()) ? 1000 : 1;
    }
    return s;
  }

  private static List<EventMark> place(List<Event> events, DayAxis axis, int w, boolean reverse) {
    List<List<double[]>> taken = new ArrayList<>();
    for (int r = 0; r < LABEL_ROWS; r++) {
      taken.add(new ArrayList<>());
    }
    EventMark[] out = new EventMark[events.size()];
    for (int k = 0; k < events.size(); k++) {
      int i = reverse ? events.size() - 1 - k : k;
      Event e = events.get(i);
      double x = axis.mid(e.day());
      out[i] = new EventMark(e, x, "", LABEL_ROWS, x);
      outer:
      for (String label : List.of(WatchTitles.eventLabel(e, true), WatchTitles.eventLabel(e, false))) {
        double lw = Text.width(label, Style.NOTE);
        for (int r = 0; r < LABEL_ROWS; r++) {
          for (double lx : new double[] {x + 4, x - 4 - lw}) {
            if (lx < PAD || lx + lw > w - PAD || !free(taken.get(r), lx - LABEL_GAP, lx + lw + LABEL_GAP)) {
              continue;
            }
            boolean clear = true;
            for (int below = r + 1; below < LABEL_ROWS && clear; below++) {
              clear = free(taken.get(below), x - 2, x + 2);
            }
            if (clear) {
              taken.get(r).add(new double[] {lx, lx + lw});
              for (int below = r + 1; below < LABEL_ROWS; below++) {
                taken.get(below).add(new double[] {x - 2, x + 2});
              }
              out[i] = new EventMark(e, x, label, r, lx);
              break outer;
            }
          }
        }
      }
    }
    return List.of(out);
  }

  private static boolean free(List<double[]> boxes, double a, double b) {
    for (double[] box : boxes) {
      if (a < box[1] && b > box[0]) {
        return false;
      }
    }
    return true;
  }
}
