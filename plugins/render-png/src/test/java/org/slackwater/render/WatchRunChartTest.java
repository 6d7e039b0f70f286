package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.core.watch.WatchTables;

/**
 * Watch runs rendered to PNG and decoded with ImageIO: the level strip's colours on the days of
 * each level, the raise and clear markers, the value lines where the panel's axis puts them, gaps
 * on days without values, and the caution. Positions are computed here from the axis (day d
 * starts at left + (d - from) / days x width; a value v sits at bottom - (v - lo) / (hi - lo) x height).
 */
class WatchRunChartTest {
  private static final PlotOptions PRINT = new PlotOptions(1000, 600, 2);
  private static final double S = PRINT.scale();
  private static final LocalDate FROM = LocalDate.parse("2014-05-01"), TO = LocalDate.parse("2014-07-31");
  /** The demo run, its layout and its rendering, made once: most checks look at the same picture. */
  private static final ResultTable DEMO = WatchFixtures.demoRun();
  private static final WatchRunLayout DEMO_LAYOUT = new WatchRunChart(DEMO).layout(PRINT.width(), PRINT.height());
  private static final BufferedImage DEMO_IMG = render(DEMO, "watch-run");

  private static BufferedImage render(ResultTable t, String name) {
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), name);
    Pixels.assertSize(img, PRINT.pixelWidth(), PRINT.pixelHeight());
    return img;
  }

  /** The middle of a day on a box spanning FROM..TO. */
  private static double mid(Rectangle2D box, LocalDate from, LocalDate to, LocalDate d) {
    return box.getX() + (d.toEpochDay() - from.toEpochDay() + 0.5) * box.getWidth() / (to.toEpochDay() - from.toEpochDay() + 1);
  }

  private static double mid(Rectangle2D box, String day) {
    return mid(box, FROM, TO, LocalDate.parse(day));
  }

  private static Color at(BufferedImage img, double x, double y) {
    return Pixels.at(img, x * S, y * S);
  }

  private static int column(BufferedImage img, Color c, int tolerance, double x, double y0, double y1) {
    int n = 0;
    for (int py = (int) Math.ceil(y0 * S); py < (int) (y1 * S); py++) {
      for (int px = (int) Math.floor((x - 0.5) * S); px <= (int) Math.ceil((x + 0.5) * S); px++) {
        n += Pixels.close(new Color(img.getRGB(px, py)), c, tolerance) ? 1 : 0;
      }
    }
    return n;
  }

  @Test
  void levelStripShowsEachDaysLevel() {
    ResultTable t = DEMO;
    WatchRunLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    Rectangle2D s = l.strip();
    double y = s.getCenterY();
    // The fixture: warning 05-30 to 06-24, alert 06-14 to 06-16 inside it, notice 07-20 and 07-21, none otherwise.
    Pixels.assertColour(Style.LEVEL_NONE, at(img, mid(s, "2014-05-10"), y), 1, "05-10, no rule holds");
    Pixels.assertColour(Style.WARNING, at(img, mid(s, "2014-06-01"), y), 1, "06-01, warning");
    Pixels.assertColour(Style.ALERT, at(img, mid(s, "2014-06-15"), y), 1, "06-15, alert");
    Pixels.assertColour(Style.WARNING, at(img, mid(s, "2014-06-24"), y), 1, "06-24, warning, the last day before it clears");
    Pixels.assertColour(Style.LEVEL_NONE, at(img, mid(s, "2014-06-25"), y), 1, "06-25, cleared");
    Pixels.assertColour(Style.NOTICE, at(img, mid(s, "2014-07-20"), y), 1, "07-20, notice");
  }

  /** Raised: 05-30 (quiet to warning), 06-14 (warning to alert), 07-20; cleared: 06-25, 07-22 (WatchState's rules). */
  @Test
  void raiseAndClearDaysAreMarkedAboveTheStrip() {
    ResultTable t = DEMO;
    WatchRunLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    Rectangle2D s = l.strip();
    double top = s.getY() - WatchRunLayout.MARKER_ROW, bottom = s.getY() - 1;
    for (String day : List.of("2014-05-30", "2014-06-14", "2014-07-20", "2014-06-25", "2014-07-22")) {
      assertTrue(column(img, Style.TEXT, 30, mid(s, day), top, bottom) > 4, "marker over " + day);
    }
    for (String day : List.of("2014-05-10", "2014-06-05", "2014-07-10")) {
      assertEquals(0, column(img, Style.TEXT, 30, mid(s, day), top, bottom), "no marker over " + day);
    }
    // A raise is filled, a clear hollow: the middle of the triangle is dark for 05-30 and white for 06-25.
    double y = s.getY() - 1 - (WatchRunLayout.MARKER_ROW - 2) * 0.6;
    assertTrue(ColourScience.luminance(at(img, mid(s, "2014-05-30"), y)) < 0.1, "filled raise marker");
    assertTrue(ColourScience.luminance(at(img, mid(s, "2014-06-25"), y)) > 0.8, "hollow clear marker");
  }

  @Test
  void eachValueIsDrawnWhereItsPanelAxisPutsIt() {
    ResultTable t = DEMO;
    WatchRunLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    assertEquals(3, l.panels().size(), "one panel per condition value");
    LocalDate[] days = ((Column.Dates) t.column("day")).values();
    for (int p = 0; p < 3; p++) {
      WatchRunLayout.Panel panel = l.panels().get(p);
      double[] v = ((Column.Doubles) t.columns().get(4 + p)).values();
      double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
      for (double x : v) {
        if (!Double.isNaN(x)) {
          lo = Math.min(lo, x);
          hi = Math.max(hi, x);
        }
      }
      // The axis: the values' range with 8 % of it added each side.
      double pad = (hi - lo) * 0.08;
      lo -= pad;
      hi += pad;
      for (int i : new int[] {5, 40, 70, 88}) {
        double x = mid(panel.box(), FROM, TO, days[i]);
        double y = panel.box().getMaxY() - (v[i] - lo) / (hi - lo) * panel.box().getHeight();
        int found = 0;
        for (double dy = -2; dy <= 2; dy += 0.5) {
          found += Pixels.close(at(img, x, y + dy), Style.PRIMARY, 40) ? 1 : 0;
        }
        assertTrue(found > 0, t.columns().get(4 + p).name() + " on " + days[i] + " at y " + y);
      }
      // 07-05 and 07-06 have no values: no line there.
      for (String gap : List.of("2014-07-05", "2014-07-06")) {
        assertEquals(0, column(img, Style.PRIMARY, 40, mid(panel.box(), gap), panel.box().getY() + 1, panel.box().getMaxY() - 1),
            "gap on " + gap + " in panel " + p);
      }
    }
  }

  @Test
  void panelsShadeTheDaysAtALevel() {
    ResultTable t = DEMO;
    WatchRunLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    Rectangle2D b = l.panels().get(2).box();
    assertTrue(column(img, WatchRunChart.shade(2), 1, mid(b, "2014-06-05"), b.getY() + 1, b.getMaxY() - 1) > 50, "warning days shaded");
    assertEquals(0, column(img, WatchRunChart.shade(2), 1, mid(b, "2014-05-10"), b.getY() + 1, b.getMaxY() - 1), "quiet days plain");
  }

  @Test
  void cautionIsPrintedInTheBottomBand() {
    ResultTable t = DEMO;
    WatchRunLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    assertTrue(l.caution().box().getMaxY() > PRINT.height() - 12, "at the bottom");
    assertTrue(BacktestChartTest.darkPixels(img, l.caution().box()) > 2000, "caution text pixels");
  }

  @Test
  void summaryCountsTheRun() {
    WatchRunData d = new WatchRunChart(WatchFixtures.demoRun()).data();
    // 92 days from 05-01 to 07-31; raised 05-30, 06-14, 07-20; cleared 06-25, 07-22; warning 05-30..06-13 and 06-17..06-24
    // (15 + 8 = 23 days), alert 06-14..06-16 (3), notice 07-20..07-21 (2).
    assertEquals("92 days  ·  raised on 3 days, cleared on 2 days  ·  at a level on 28 days (notice 2, warning 23, alert 3)",
        WatchTitles.runSummary(d));
    assertEquals("watch \"North Intake bloom risk\", 2014-05-01 to 2014-07-31", WatchTitles.runTitle(d));
  }

  /** Twenty years of days: a one-day notice keeps a few pixels in the strip (a day is 0.13 px there). */
  @Test
  void aOneDayRaiseStaysVisibleOverTwentyYears() {
    WatchRun run = WatchFixtures.run(LocalDate.parse("2006-01-01"), LocalDate.parse("2025-12-31"),
        List.of(WatchFixtures.episode("2016-03-03", "2016-03-03", 1)), List.of());
    ResultTable t = WatchTables.of(run, false);
    WatchRunLayout l = new WatchRunChart(t).layout(PRINT.width(), PRINT.height());
    BufferedImage img = render(t, "watch-run-20-years");
    int y = (int) (l.strip().getCenterY() * S), n = 0;
    for (int px = 0; px < img.getWidth(); px++) {
      n += Pixels.close(new Color(img.getRGB(px, y)), Style.NOTICE, 1) ? 1 : 0;
    }
    assertTrue(n >= WatchRunChart.MIN_RUN_WIDTH * S - 1, "notice pixels " + n);
  }

  // --- errors ---

  private static String refused(ResultTable t) {
    return assertThrows(PlotException.class, () -> PngRenderer.render(List.of(t), PlotOptions.defaults())).getMessage();
  }

  private static ResultTable replace(ResultTable t, Column c) {
    List<Column> cols = new ArrayList<>();
    for (Column x : t.columns()) {
      cols.add(x.name().equals(c.name()) ? c : x);
    }
    return new ResultTable("run", cols, t.metadata(), t.warnings());
  }

  private static String[] strings(ResultTable t, String name) {
    Column.Strings s = (Column.Strings) t.column(name);
    String[] out = new String[s.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = s.get(i);
    }
    return out;
  }

  @Test
  void malformedRunsAreNamed() {
    ResultTable t = WatchFixtures.demoRun();
    String[] level = strings(t, "level");
    level[3] = "severe";
    assertEquals("row 4 of the watch run 'run' has level 'severe' (column level); a level is one of none, notice, warning, alert",
        refused(replace(t, new Column.Strings("level", level))));
    String[] state = strings(t, "state");
    state[3] = "pending";
    assertEquals("row 4 of the watch run 'run' has state 'pending' (column state); a state is one of quiet, raised, ongoing, cleared",
        refused(replace(t, new Column.Strings("state", state))));
    LocalDate[] day = ((Column.Dates) t.column("day")).values().clone();
    day[10] = day[9];
    assertEquals("row 11 of the watch run 'run' is dated 2014-05-10, not after the row before (2014-05-10); a watch run has one row per day"
        + " in order", refused(replace(t, new Column.Dates("day", day))));
    day = ((Column.Dates) t.column("day")).values().clone();
    day[0] = LocalDate.parse("2014-04-30");
    assertEquals("the watch run 'run' has a row dated 2014-04-30, outside the evaluated days 2014-05-01 to 2014-07-31 (metadata evaluated);"
        + " the table does not fit together, evaluate the watch again", refused(replace(t, new Column.Dates("day", day))));
    ResultTable noDay = new ResultTable("run", t.columns().stream().filter(c -> !c.name().equals("day")).toList(), t.metadata(), List.of());
    assertEquals("the result 'run' has no column 'day', which its plot needs; ask for format=json or csv", refused(noDay));
  }

  @Test
  void aTransitionsListingIsNotARun() {
    WatchRun run = WatchFixtures.run(FROM, TO, List.of(WatchFixtures.episode("2014-05-30", "2014-06-24", 2)), List.of());
    ResultTable t = WatchTables.of(run, true);
    assertEquals("the watch run '" + t.title() + "' holds only the days the watch was raised or cleared, not every day, so the days between"
        + " cannot be drawn; ask for every day of the run (the evaluate endpoint gives them)", refused(t));
  }

  @Test
  void aRunWithoutDaysHasNothingToPlot() {
    WatchRun run = WatchFixtures.run(FROM, TO, List.of(), List.of());
    ResultTable t = WatchTables.of(run, true);
    assertEquals(0, t.rowCount(), "a quiet run has no transitions");
    assertTrue(refused(t).contains("has no rows, so there is nothing to plot"));
  }

  /** The level colours darken with severity, so grey print keeps the order: CIE L* apart by 10 or more (our margin), and ΔE*ab 15 apart with each dichromacy. */
  @Test
  void levelColoursKeepTheirOrderInGreyAndForColourBlindReaders() {
    Color[] c = {Style.LEVEL_NONE, Style.NOTICE, Style.WARNING, Style.ALERT};
    for (int i = 1; i < c.length; i++) {
      assertTrue(ColourScience.lightness(c[i - 1]) - ColourScience.lightness(c[i]) >= 10, "L* step " + i);
      for (ColourScience.Vision v : ColourScience.Vision.values()) {
        assertTrue(ColourScience.deltaE(c[i - 1], c[i], v) >= 15, v + " level " + (i - 1) + " vs " + i);
      }
    }
  }
}
