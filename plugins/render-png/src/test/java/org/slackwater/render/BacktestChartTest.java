package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.watch.WatchBacktest;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.render.BacktestData.Outcome;

/**
 * Backtest timelines rendered to PNG and decoded with ImageIO. Positions are computed here from
 * the axis (the plot box and the evaluated days: day d starts at left + (d - from) / days x width),
 * not taken from the drawing code, and the pixels found there must have the colour the legend
 * gives that mark.
 */
class BacktestChartTest {
  private static final PlotOptions PRINT = new PlotOptions(1000, 600, 2);
  private static final double S = PRINT.scale();
  /** The demo backtest, its layout and its rendering, made once: most checks look at the same picture. */
  private static final ResultTable DEMO = WatchFixtures.demoBacktest();
  private static final BacktestLayout DEMO_LAYOUT = new BacktestChart(DEMO).layout(PRINT.width(), PRINT.height());
  private static final BufferedImage DEMO_IMG = render(DEMO, PRINT, "backtest-demo");

  private static BufferedImage render(ResultTable t, PlotOptions o, String name) {
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), o), name);
    Pixels.assertSize(img, o.pixelWidth(), o.pixelHeight());
    return img;
  }

  /** x of the start of a day on a box spanning the evaluated days of the result. */
  private static double x(Rectangle2D box, ResultTable t, LocalDate d) {
    String[] range = t.metadata().get("evaluated").split(" to ");
    long from = LocalDate.parse(range[0]).toEpochDay(), to = LocalDate.parse(range[1]).toEpochDay();
    return box.getX() + (d.toEpochDay() - from) * box.getWidth() / (to - from + 1);
  }

  /** Pixels of colour {@code c} in the device-pixel rectangle around layout point (x, y), ± dx and ± dy layout pixels. */
  private static int around(BufferedImage img, Color c, int tolerance, double x, double y, double dx, double dy) {
    int n = 0;
    for (int py = (int) Math.floor((y - dy) * S); py <= (int) Math.ceil((y + dy) * S); py++) {
      for (int px = (int) Math.floor((x - dx) * S); px <= (int) Math.ceil((x + dx) * S); px++) {
        if (px >= 0 && py >= 0 && px < img.getWidth() && py < img.getHeight() && Pixels.close(new Color(img.getRGB(px, py)), c, tolerance)) {
          n++;
        }
      }
    }
    return n;
  }

  private static double laneY(Rectangle2D plot, Outcome o) {
    return plot.getY() + (o.ordinal() + 0.5) * plot.getHeight() / 3;
  }

  @Test
  void summaryLineCountsTheDemoBacktest() {
    ResultTable t = WatchFixtures.demoBacktest();
    BacktestData d = new BacktestChart(t).data();
    // Leads by hand: 2009-07-04 - 2009-06-22 = 12 days, 2014-06-20 - 2014-05-30 = 21, 2018-06-28 - 2018-06-09 = 19;
    // 2023-06-19 has no firing in the 60 days before it; 2006-10-07 has no event within 60 days after it.
    assertEquals("3 of 4 events caught, leads 12/21/19 days, 1 false alarm in 2006-2025", WatchTitles.backtestSummary(d));
    assertEquals("12 21 19", t.metadata().get("lead_days"), "the server's own summary agrees");
    // Hit rate 3/4; false alarm ratio 1 / (4 lead firings + 1 false alarm), the usual verification measures.
    assertTrue(WatchTitles.backtestMeasures(d).startsWith("hit rate 75 % (3 of 4)  ·  false alarm ratio 20 % (1 of 5 warnings)  ·  6 firings"),
        WatchTitles.backtestMeasures(d));
    assertEquals("backtest of watch \"North Intake bloom risk\", 2006-01-01 to 2025-12-31", WatchTitles.backtestTitle(d));
  }

  @Test
  void eachFiringLiesInItsOutcomeLaneInItsColourAtItsDays() {
    ResultTable t = DEMO;
    BacktestLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    List<BacktestData.Firing> firings = new BacktestChart(t).data().firings();
    assertEquals(6, firings.size());
    for (BacktestData.Firing f : firings) {
      double mid = (x(l.plot(), t, f.start()) + x(l.plot(), t, f.end().orElseThrow().plusDays(1))) / 2;
      Color c = BacktestChart.colour(f.outcome());
      assertTrue(around(img, c, 2, mid, laneY(l.plot(), f.outcome()), 1, 2) > 0, f + ": its colour at its days in its lane");
      for (Outcome other : Outcome.values()) {
        if (other != f.outcome()) {
          assertEquals(0, around(img, c, 2, mid, laneY(l.plot(), other), 1, 2), f + ": not in the " + other.label + " lane");
        }
      }
    }
  }

  /** 20 years on 1000 px make a day 0.13 px: a 2-day false alarm must still be at least 4 layout px (8 device px) wide. */
  @Test
  void shortFiringsKeepAMinimumWidth() {
    ResultTable t = DEMO;
    BacktestLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    int y = (int) (laneY(l.plot(), Outcome.FALSE_ALARM) * S);
    int run = 0;
    for (int px = 0; px < img.getWidth(); px++) {
      run += Pixels.close(new Color(img.getRGB(px, y)), Style.FALSE_ALARM, 2) ? 1 : 0;
    }
    double days = x(l.plot(), t, LocalDate.parse("2006-10-09")) - x(l.plot(), t, LocalDate.parse("2006-10-07"));
    assertTrue(days < 0.5, "two days are under half a pixel here: " + days);
    assertTrue(run >= BacktestLayout.MIN_BAR_WIDTH * S - 1 && run <= BacktestLayout.MIN_BAR_WIDTH * S + 1, "false alarm bar width " + run + " px");
  }

  /** Caught events: a solid line; the missed one dashed (5 on, 4 off): checked down the false-alarm lane, where no bar lies near them. */
  @Test
  void eventsAreMarkedSolidWhenCaughtAndDashedWhenMissed() {
    ResultTable t = DEMO;
    BacktestLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    Rectangle2D lane = BacktestLayout.lane(l.plot(), Outcome.FALSE_ALARM);
    for (LocalDate e : WatchFixtures.DEMO_EVENTS) {
      double mid = (x(l.plot(), t, e) + x(l.plot(), t, e.plusDays(1))) / 2;
      int rows = 0, hit = 0;
      for (int py = (int) (lane.getY() * S) + 2; py < (int) (lane.getMaxY() * S) - 2; py++, rows++) {
        boolean found = false;
        for (int px = (int) Math.floor((mid - 1.5) * S); px <= (int) Math.ceil((mid + 1.5) * S); px++) {
          found |= Pixels.close(new Color(img.getRGB(px, py)), Style.EVENT, 2);
        }
        hit += found ? 1 : 0;
      }
      double share = (double) hit / rows;
      if (e.equals(LocalDate.parse("2023-06-19"))) {
        assertTrue(share > 0.35 && share < 0.8, "missed event " + e + " dashed: " + share);
      } else {
        assertTrue(share > 0.97, "caught event " + e + " solid: " + share);
      }
    }
  }

  @Test
  void eventLabelsSayCaughtWithTheLeadOrMissed() {
    BacktestLayout l = new BacktestChart(WatchFixtures.demoBacktest()).layout(PRINT.width(), PRINT.height());
    List<String> labels = l.marks().stream().map(BacktestLayout.EventMark::label).toList();
    assertEquals(List.of("2009-07-04 caught (lead 12 d)", "2014-06-20 caught (lead 21 d)", "2018-06-28 caught (lead 19 d)", "2023-06-19 missed"),
        labels);
    // At 600 px the labels no longer fit in one row, but each still has one.
    BacktestLayout small = new BacktestChart(WatchFixtures.demoBacktest()).layout(600, 400);
    assertTrue(small.marks().stream().noneMatch(m -> m.label().isEmpty()), "every event labelled at 600 px");
    assertTrue(small.labelRows() > 1, "labels stacked in rows");
  }

  /** In the close-up of 2009-07-04 the lead firing (06-22 to 06-29) shows day by day: present on its days, absent between it and the event. */
  @Test
  void closeUpsShowTheLeadDayByDay() {
    ResultTable t = DEMO;
    BacktestLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    assertEquals(4, l.closeups().size());
    BacktestCloseup c = l.closeups().get(0);
    Rectangle2D box = c.box();
    // The close-up spans the 60-day lead window + 5 days before the event and 30 after: 96 days.
    LocalDate from = LocalDate.parse("2009-07-04").minusDays(65), to = LocalDate.parse("2009-07-04").plusDays(30);
    double perDay = box.getWidth() / (to.toEpochDay() - from.toEpochDay() + 1);
    double y = box.getY() + box.getHeight() / 6;
    for (String day : List.of("2009-06-22", "2009-06-25", "2009-06-29")) {
      double x = box.getX() + (LocalDate.parse(day).toEpochDay() - from.toEpochDay() + 0.5) * perDay;
      assertTrue(around(img, Style.LEAD, 2, x, y, 0.5, 1) > 0, "lead bar on " + day);
    }
    for (String day : List.of("2009-06-18", "2009-07-02")) {
      double x = box.getX() + (LocalDate.parse(day).toEpochDay() - from.toEpochDay() + 0.5) * perDay;
      assertEquals(0, around(img, Style.LEAD, 2, x, y, 0.3, 1), "no bar on " + day);
    }
    double event = box.getX() + (LocalDate.parse("2009-07-04").toEpochDay() - from.toEpochDay() + 0.5) * perDay;
    assertTrue(around(img, Style.EVENT, 2, event, box.getCenterY(), 1, 1) > 0, "event line in the close-up");
  }

  @Test
  void cautionIsPrintedInTheBottomBand() {
    ResultTable t = DEMO;
    BacktestLayout l = DEMO_LAYOUT;
    BufferedImage img = DEMO_IMG;
    Rectangle2D box = l.caution().box();
    assertTrue(box.getMaxY() <= PRINT.height() && box.getMaxY() > PRINT.height() - 12, "the caution box is at the bottom: " + box);
    assertTrue(box.getY() > l.legendTop(), "below the legend");
    int dark = darkPixels(img, box);
    // Two lines of 12 px text at scale 2: thousands of glyph pixels (a blank box has none).
    assertTrue(dark > 2000, "caution text pixels: " + dark);
    assertEquals(WatchStatements.CAUTION, String.join(" ", l.caution().lines()), "the whole caution, nothing cut");
  }

  static int darkPixels(BufferedImage img, Rectangle2D layoutBox) {
    int n = 0;
    for (int py = (int) (layoutBox.getY() * 2) + 2; py < (int) (layoutBox.getMaxY() * 2) - 2; py++) {
      for (int px = (int) (layoutBox.getX() * 2) + 2; px < (int) (layoutBox.getMaxX() * 2) - 2; px++) {
        n += ColourScience.luminance(new Color(img.getRGB(px, py))) < 0.2 ? 1 : 0;
      }
    }
    return n;
  }

  @Test
  void aResultWithoutItsCautionStillPrintsTheStandardOne() {
    ResultTable t = WatchFixtures.demoBacktest();
    Map<String, String> meta = new LinkedHashMap<>(t.metadata());
    meta.remove("caution");
    ResultTable bare = new ResultTable(t.title(), t.columns().stream().filter(c -> !c.name().equals("caution")).toList(), meta, List.of());
    BacktestLayout l = new BacktestChart(bare).layout(PRINT.width(), PRINT.height());
    assertEquals(WatchStatements.CAUTION, String.join(" ", l.caution().lines()));
    assertTrue(darkPixels(render(bare, PRINT, "backtest-no-caution"), l.caution().box()) > 2000);
  }

  /** Over one year the bars are wide: the false alarm is cross-hatched, the during-event bar striped, the lead solid, a firing still on ends in an arrow. */
  @Test
  void wideBarsCarryTheirPatternAndAFiringStillOnRunsToTheEnd() {
    WatchRun run = WatchFixtures.run(LocalDate.parse("2014-01-01"), LocalDate.parse("2014-12-31"), List.of(
        WatchFixtures.episode("2014-02-01", "2014-03-15", 2), WatchFixtures.episode("2014-05-20", "2014-06-25", 2),
        WatchFixtures.episode("2014-07-10", "2014-08-20", 1), WatchFixtures.episode("2014-12-01", "2014-12-31", 3)), List.of());
    ResultTable t = WatchBacktest.table(WatchBacktest.of(run, List.of(LocalDate.parse("2014-06-20")), 30));
    BacktestChart chart = new BacktestChart(t);
    List<Outcome> outcomes = chart.data().firings().stream().map(BacktestData.Firing::outcome).toList();
    // Against 2014-06-20 with a 30-day window: 02-01 starts 139 days before (false alarm), 05-20 31 days before (false
    // alarm, just outside), 07-10 20 days after (during event), 12-01 164 days after (false alarm).
    assertEquals(List.of(Outcome.FALSE_ALARM, Outcome.FALSE_ALARM, Outcome.DURING_EVENT, Outcome.FALSE_ALARM), outcomes);
    ResultTable lead = WatchBacktest.table(WatchBacktest.of(run, List.of(LocalDate.parse("2014-06-20")), 60));
    assertEquals(Outcome.LEAD, new BacktestChart(lead).data().firings().get(1).outcome(), "with 60 days, 05-20 (31 days before) is a lead");

    BacktestLayout l = chart.layout(PRINT.width(), PRINT.height());
    BufferedImage img = render(t, PRINT, "backtest-patterns");
    Rectangle2D falseAlarm = l.bar(chart.data().firings().get(0)), during = l.bar(chart.data().firings().get(2));
    assertTrue(inside(img, falseAlarm, Style.FALSE_ALARM) > 0.5 && inside(img, falseAlarm, Color.WHITE) > 0.1, "cross-hatched false alarm");
    assertTrue(inside(img, during, Style.DURING_EVENT) > 0.4 && inside(img, during, Color.WHITE) > 0.05, "striped during-event bar");
    BufferedImage leadImg = render(lead, PRINT, "backtest-patterns-lead");
    BacktestChart leadChart = new BacktestChart(lead);
    Rectangle2D leadBar = leadChart.layout(PRINT.width(), PRINT.height()).bar(leadChart.data().firings().get(1));
    assertTrue(inside(leadImg, leadBar, Style.LEAD) > 0.95, "solid lead bar");

    BacktestData.Firing last = chart.data().firings().get(3);
    assertTrue(last.end().isEmpty(), "the December firing is still on at the end");
    Rectangle2D bar = l.bar(last);
    assertEquals(l.plot().getMaxX(), bar.getMaxX(), 1e-9, "runs to the end of the axis");
    assertTrue(around(img, Style.FALSE_ALARM, 2, l.plot().getMaxX() + 4, bar.getCenterY(), 2, 2) > 4, "arrow beyond the axis end");
    assertTrue(l.closeups().isEmpty(), "one year needs no close-ups");
  }

  private static double inside(BufferedImage img, Rectangle2D r, Color c) {
    int n = 0, all = 0;
    for (int py = (int) Math.ceil(r.getY() * S) + 2; py < (int) (r.getMaxY() * S) - 2; py++) {
      for (int px = (int) Math.ceil(r.getX() * S) + 2; px < (int) (r.getMaxX() * S) - 2; px++) {
        all++;
        n += Pixels.close(new Color(img.getRGB(px, py)), c, 2) ? 1 : 0;
      }
    }
    return (double) n / all;
  }

  @Test
  void aBacktestWithNoEventsAndNoFiringsStillPlots() {
    WatchRun quiet = WatchFixtures.run(LocalDate.parse("2014-01-01"), LocalDate.parse("2014-12-31"), List.of(), List.of());
    ResultTable t = WatchBacktest.table(WatchBacktest.of(quiet, List.of(), 60));
    assertEquals(0, t.rowCount());
    BacktestChart chart = new BacktestChart(t);
    assertEquals("no events in the evaluated days, no false alarms in 2014", WatchTitles.backtestSummary(chart.data()));
    BufferedImage img = render(t, PRINT, "backtest-empty");
    assertTrue(darkPixels(img, chart.layout(PRINT.width(), PRINT.height()).caution().box()) > 2000, "caution printed");
  }

  /**
   * The smallest plot (200 x 200) cannot hold a timeline under the whole caution: refused with the
   * height that would do, and that height works, with the caution whole and every line inside the box.
   */
  @Test
  void aPlotTooSmallForTheCautionSaysWhatHeightWouldDo() {
    for (ResultTable t : List.of(DEMO, WatchFixtures.demoRun())) {
      String kind = t.metadata().get("result_kind");
      PlotException e = org.junit.jupiter.api.Assertions.assertThrows(PlotException.class,
          () -> PngRenderer.render(List.of(t), new PlotOptions(200, 200, 1)));
      java.util.regex.Matcher m = java.util.regex.Pattern.compile("ask for height=(\\d+) or more at width=200, or a wider plot$").matcher(e.getMessage());
      assertTrue(m.find(), e.getMessage());
      assertTrue(e.getMessage().startsWith((kind.equals("backtest") ? "a backtest" : "a watch run") + " plot of 200 x 200 px has no room left"),
          e.getMessage());
      int needed = Integer.parseInt(m.group(1));
      PlotOptions enough = new PlotOptions(200, needed, 2);
      Pixels.assertSize(Pixels.decode(PngRenderer.render(List.of(t), enough), "watch-narrow-" + kind), 400, needed * 2);
      CautionBox c = kind.equals("backtest") ? new BacktestChart(t).layout(200, needed).caution() : new WatchRunChart(t).layout(200, needed).caution();
      assertEquals(WatchStatements.CAUTION, String.join(" ", c.lines()));
      for (String line : c.lines()) {
        assertTrue(Text.width(line, Style.CAUTION) <= 200 - 2 * Heading.PAD - 2 * CautionBox.PAD_X, "line fits: " + line);
      }
      org.junit.jupiter.api.Assertions.assertThrows(PlotException.class, () -> PngRenderer.render(List.of(t), new PlotOptions(200, needed - 2, 1)),
          "two pixels less is too little");
    }
  }

  // --- colours ---

  /**
   * The three outcome colours stay apart for normal vision and simulated protanopia, deuteranopia
   * and tritanopia (Machado et al. 2009): ΔE*ab of at least 20 (about 9 times the just noticeable
   * difference of 2.3, Sharma 2003, from memory; our margin for thin bars).
   */
  @Test
  void outcomeColoursAreTellableApartWithColourBlindness() {
    Color[] c = {Style.LEAD, Style.DURING_EVENT, Style.FALSE_ALARM};
    for (ColourScience.Vision v : ColourScience.Vision.values()) {
      for (int i = 0; i < c.length; i++) {
        for (int j = i + 1; j < c.length; j++) {
          double d = ColourScience.deltaE(c[i], c[j], v);
          assertTrue(d >= 20, v + ": " + Pixels.hex(c[i]) + " vs " + Pixels.hex(c[j]) + " ΔE " + d);
        }
      }
    }
    // WCAG 2.1 SC 1.4.11: graphics 3:1 against the background. Lead and false alarm reach it; the light
    // during-event fill does not, so its bars get an edge that does.
    assertTrue(ColourScience.contrast(Style.LEAD, Color.WHITE) >= 3);
    assertTrue(ColourScience.contrast(Style.FALSE_ALARM, Color.WHITE) >= 3);
    assertTrue(ColourScience.contrast(Style.DURING_EVENT, Color.WHITE) < 3);
    assertTrue(ColourScience.contrast(Style.DURING_EVENT_EDGE, Color.WHITE) >= 3);
  }

  /** WCAG 2.1 SC 1.4.3: text 4.5:1 against its background; the caution text on its box and the event labels on white. */
  @Test
  void cautionAndLabelsAreReadable() {
    assertTrue(ColourScience.contrast(Style.TEXT, Style.CAUTION_BACKGROUND) >= 4.5);
    assertTrue(ColourScience.contrast(Style.EVENT, Color.WHITE) >= 4.5);
    assertTrue(Style.CAUTION.getSize() >= Style.SUBTITLE.getSize(), "caution no smaller than the subtitle");
  }

  // --- errors ---

  private static ResultTable withColumn(ResultTable t, String name, Column replacement) {
    List<Column> cols = new ArrayList<>();
    for (Column c : t.columns()) {
      cols.add(c.name().equals(name) ? replacement : c);
    }
    return new ResultTable(t.title(), cols, t.metadata(), t.warnings());
  }

  private static String[] strings(ResultTable t, String name) {
    Column.Strings s = (Column.Strings) t.column(name);
    String[] out = new String[s.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = s.get(i);
    }
    return out;
  }

  private static String refused(ResultTable t) {
    return org.junit.jupiter.api.Assertions.assertThrows(PlotException.class, () -> PngRenderer.render(List.of(t), PlotOptions.defaults()))
        .getMessage();
  }

  @Test
  void evaluatedDaysAreRequiredAndChecked() {
    ResultTable t = WatchFixtures.demoBacktest();
    Map<String, String> meta = new LinkedHashMap<>(t.metadata());
    meta.remove("evaluated");
    ResultTable none = new ResultTable("bt", t.columns(), meta, List.of());
    assertEquals("the backtest 'bt' does not give the days it evaluated (metadata evaluated, 'yyyy-mm-dd to yyyy-mm-dd'), which its time axis"
        + " needs; ask the server for the backtest again, or for format=json", refused(none));
    assertEquals("the result 'bt' gives the evaluated days as '2006 to 2025' (metadata evaluated); a watch plot needs 'yyyy-mm-dd to yyyy-mm-dd',"
        + " as the server writes it", refused(none.with("evaluated", "2006 to 2025")));
    assertEquals("the result 'bt' gives the evaluated days as '2025-12-31 to 2006-01-01' (metadata evaluated), which end before they start;"
        + " the first date must not be after the second", refused(none.with("evaluated", "2025-12-31 to 2006-01-01")));
  }

  @Test
  void rowsThatDoNotFitABacktestAreNamed() {
    ResultTable t = WatchFixtures.demoBacktest();
    String title = t.title();
    String[] kind = strings(t, "kind");
    kind[5] = "alarm";
    assertEquals("row 6 of the backtest '" + title + "' is of kind 'alarm' (column kind); a backtest row is an 'event' or a 'firing'",
        refused(withColumn(t, "kind", new Column.Strings("kind", kind))));

    String[] outcome = strings(t, "outcome");
    outcome[4] = "hit";
    assertEquals("row 5 of the backtest '" + title + "' is a firing with outcome 'hit' (column outcome); a firing is a 'lead', 'during event'"
        + " or 'false alarm'", refused(withColumn(t, "outcome", new Column.Strings("outcome", outcome))));
    outcome = strings(t, "outcome");
    outcome[0] = "lead";
    assertEquals("row 1 of the backtest '" + title + "' is an event with outcome 'lead' (column outcome); an event is 'caught' or 'missed'",
        refused(withColumn(t, "outcome", new Column.Strings("outcome", outcome))));

    Column.Dates ends = (Column.Dates) t.column("end");
    LocalDate[] end = ends.values().clone();
    end[4] = LocalDate.parse("2006-10-01");
    assertEquals("row 5 of the backtest '" + title + "' is a firing that ends (2006-10-01, column end) before it starts (2006-10-07, column day);"
        + " the end is the firing's last day", refused(withColumn(t, "end", new Column.Dates("end", end))));

    LocalDate[] day = ((Column.Dates) t.column("day")).values().clone();
    day[0] = LocalDate.parse("2030-07-04");
    assertEquals("row 1 of the backtest '" + title + "' is dated 2030-07-04, outside the evaluated days 2006-01-01 to 2025-12-31 (metadata"
        + " evaluated); the table does not fit together, ask the server for the backtest again",
        refused(withColumn(t, "day", new Column.Dates("day", day))));
    day[0] = null;
    assertEquals("row 1 of the backtest '" + title + "' has no day (column day); every event and firing needs its date",
        refused(withColumn(t, "day", new Column.Dates("day", day))));

    ResultTable noOutcome = new ResultTable(title, t.columns().stream().filter(c -> !c.name().equals("outcome")).toList(), t.metadata(), List.of());
    assertEquals("the result '" + title + "' has no column 'outcome', which its plot needs; ask for format=json or csv", refused(noOutcome));
  }

  @Test
  void aBacktestDoesNotShareAPictureWithOtherResults() {
    PlotException e = org.junit.jupiter.api.Assertions.assertThrows(PlotException.class,
        () -> PngRenderer.render(List.of(WatchFixtures.demoBacktest(), Fixtures.chlorophyllSeries()), PlotOptions.defaults()));
    assertEquals("the query gives 2 results (backtest, series) and one PNG holds one plot (only series stack into panels); send each statement"
        + " as its own query, or ask for format=json", e.getMessage());
  }
}
