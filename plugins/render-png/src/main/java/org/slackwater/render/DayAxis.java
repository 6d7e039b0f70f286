package org.slackwater.render;

import java.awt.Font;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

/**
 * A horizontal axis of whole days for hand-drawn figures: the days {@code from..to} (both
 * included) laid edge to edge from {@code left} to {@code right} layout pixels, so day d covers
 * [x(d), x(d + 1)). Ticks fall on the first day of a period (day of month, month, year) and are
 * labelled in ISO 8601 (yyyy-mm-dd, yyyy-mm or yyyy), spaced so that labels do not touch.
 *
 * <p>Failure modes: an empty range ({@code to} before {@code from}) or a non-positive width is an
 * {@link IllegalArgumentException}; callers check their data first.
 */
record DayAxis(LocalDate from, LocalDate to, double left, double right) {
  /** A tick: its x and its label. */
  record Tick(double x, String label) {}

  /** Tick spacings to try, finest first. */
  private enum Unit { DAY, MONTH, YEAR }

  private record Spacing(Unit unit, int step, double nominalDays) {}

  private static final List<Spacing> SPACINGS = List.of(
      new Spacing(Unit.DAY, 1, 1), new Spacing(Unit.DAY, 2, 2), new Spacing(Unit.DAY, 7, 7), new Spacing(Unit.DAY, 14, 14),
      new Spacing(Unit.MONTH, 1, 30.44), new Spacing(Unit.MONTH, 2, 60.9), new Spacing(Unit.MONTH, 3, 91.3),
      new Spacing(Unit.MONTH, 6, 182.6), new Spacing(Unit.YEAR, 1, 365.25), new Spacing(Unit.YEAR, 2, 730.5),
      new Spacing(Unit.YEAR, 5, 1826), new Spacing(Unit.YEAR, 10, 3652), new Spacing(Unit.YEAR, 20, 7305),
      new Spacing(Unit.YEAR, 50, 18262), new Spacing(Unit.YEAR, 100, 36525));

  DayAxis {
    if (to.isBefore(from)) {
      throw new IllegalArgumentException("a day axis needs from <= to, got " + from + " to " + to);
    }
    if (!(right > left)) {
      throw new IllegalArgumentException("a day axis needs a positive width, got " + left + " to " + right);
    }
  }

  /** Number of days on the axis. */
  long days() {
    return to.toEpochDay() - from.toEpochDay() + 1;
  }

  double pixelsPerDay() {
    return (right - left) / days();
  }

  /** The left edge of a day (its 00:00). */
  double x(LocalDate day) {
    return x((double) day.toEpochDay());
  }

  /** x of a fractional epoch day (0 = 1970-01-01 00:00). */
  double x(double epochDay) {
    return left + (epochDay - from.toEpochDay()) * pixelsPerDay();
  }

  /** The middle of a day. */
  double mid(LocalDate day) {
    return x(day.toEpochDay() + 0.5);
  }

  /**
   * The left and right x of the days {@code first..last} (both included), widened about their
   * middle to at least {@code minWidth} and kept inside the axis where it can be, so that a one-day
   * firing over twenty years still shows.
   */
  double[] span(LocalDate first, LocalDate last, double minWidth) {
    double x0 = x(first), x1 = x(last.toEpochDay() + 1.0);
    if (x1 - x0 >= minWidth) {
      return new double[] {x0, x1};
    }
    double m = (x0 + x1) / 2, a = m - minWidth / 2, b = m + minWidth / 2;
    if (a < left) {
      b += left - a;
      a = left;
    } else if (b > right) {
      a -= b - right;
      b = right;
    }
    return new double[] {a, b};
  }

  /** Ticks whose labels in {@code font} keep at least {@code gap} pixels between them. */
  List<Tick> ticks(Font font, double gap) {
    Spacing chosen = SPACINGS.get(SPACINGS.size() - 1);
    for (Spacing s : SPACINGS) {
      double labelWidth = Text.width(sample(s.unit()), font);
      if (s.nominalDays() * pixelsPerDay() >= labelWidth + gap) {
        chosen = s;
        break;
      }
    }
    List<Tick> out = new ArrayList<>();
    // Up to the last day's start: a tick at the axis end would name the day after the range.
    for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
      if (isTick(d, chosen)) {
        out.add(new Tick(x(d), label(d, chosen.unit())));
        d = skipAhead(d, chosen);
      }
    }
    return out;
  }

  private static String sample(Unit u) {
    return switch (u) {
      case DAY -> "0000-00-00";
      case MONTH -> "0000-00";
      case YEAR -> "0000";
    };
  }

  /** Ticks on days 1, 3, 5 ... (step 2), 1, 8, 15, 22 (step 7), 1 and 15 (step 14); months from January; years divisible by the step. */
  private static boolean isTick(LocalDate d, Spacing s) {
    return switch (s.unit()) {
      case DAY -> s.step() == 1 || (s.step() == 2 && d.getDayOfMonth() % 2 == 1 && d.getDayOfMonth() < 31)
          || (s.step() == 7 && (d.getDayOfMonth() - 1) % 7 == 0 && d.getDayOfMonth() < 29)
          || (s.step() == 14 && (d.getDayOfMonth() == 1 || d.getDayOfMonth() == 15));
      case MONTH -> d.getDayOfMonth() == 1 && (d.getMonthValue() - 1) % s.step() == 0;
      case YEAR -> d.getDayOfYear() == 1 && Math.floorMod(d.getYear(), s.step()) == 0;
    };
  }

  /** After a tick, the day before the earliest possible next one (walking decades day by day would be slow). */
  private static LocalDate skipAhead(LocalDate d, Spacing s) {
    return switch (s.unit()) {
      case DAY -> d;
      case MONTH -> d.plusMonths(1).minusDays(1);
      case YEAR -> d.plusYears(1).minusDays(1);
    };
  }

  private static String label(LocalDate d, Unit u) {
    String iso = d.toString();
    return switch (u) {
      case DAY -> iso;
      case MONTH -> iso.substring(0, iso.length() - 3);
      case YEAR -> iso.substring(0, iso.length() - 6);
    };
  }
}
