package org.slackwater.render;

import java.awt.geom.Rectangle2D;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slackwater.render.BacktestData.Event;

/**
 * A close-up of the days around one event, so that a lead of a few days stays readable when the
 * whole backtest spans decades: from the lead window (plus {@link #MARGIN_DAYS}) before the event to
 * {@link #AFTER_DAYS} after it, clipped to the evaluated days, with the same three lanes as the
 * timeline and ticks in days from the event ("-60 d", "0", "+30 d").
 */
record BacktestCloseup(Event event, DayAxis axis, Rectangle2D box, double headerBaseline, String header) {
  static final int AFTER_DAYS = 30, MARGIN_DAYS = 5;
  static final int[] TICK_STEPS = {7, 14, 30, 60, 90, 180};

  static BacktestCloseup of(Event e, BacktestData d, Rectangle2D box, double headerBaseline) {
    int before = d.leadWindow().orElse(60) + MARGIN_DAYS;
    LocalDate a = e.day().minusDays(before), b = e.day().plusDays(AFTER_DAYS);
    a = a.isBefore(d.from()) ? d.from() : a;
    b = b.isAfter(d.to()) ? d.to() : b;
    String header = Text.shorten(WatchTitles.eventLabel(e, true), Style.NOTE, box.getWidth());
    return new BacktestCloseup(e, new DayAxis(a, b, box.getX(), box.getMaxX()), box, headerBaseline, header);
  }

  /** Ticks at whole multiples of a step of days from the event, the finest step whose labels keep apart. */
  List<DayAxis.Tick> ticks() {
    double widest = Text.width("-000 d", Style.TICK) + 10;
    int step = TICK_STEPS[TICK_STEPS.length - 1];
    for (int s : TICK_STEPS) {
      if (s * axis.pixelsPerDay() >= widest) {
        step = s;
        break;
      }
    }
    List<DayAxis.Tick> out = new ArrayList<>();
    long e = event.day().toEpochDay();
    for (long k = Math.floorDiv(axis.from().toEpochDay() - e, step); e + k * step <= axis.to().toEpochDay(); k++) {
      long day = e + k * step;
      if (day >= axis.from().toEpochDay()) {
        long rel = k * step;
        out.add(new DayAxis.Tick(axis.mid(LocalDate.ofEpochDay(day)), rel == 0 ? "0" : (rel > 0 ? "+" : "") + rel + " d"));
      }
    }
    return out;
  }
}
