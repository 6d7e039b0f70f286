package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slackwater.core.result.ResultTable;

/**
 * Series, correlation, ranking and event-window plots: rendered, decoded, and checked for the
 * marks each must carry (their colours are the ones {@link Style} reserves for that meaning).
 */
class ChartContentTest {
  private static final PlotOptions SCREEN = PlotOptions.defaults();
  private static final PlotOptions PRINT = new PlotOptions(1000, 600, 2);

  private static BufferedImage render(List<ResultTable> t, PlotOptions o, String name) {
    BufferedImage img = Pixels.decode(PngRenderer.render(t, o), name);
    Pixels.assertSize(img, o.pixelWidth(), o.pixelHeight());
    return img;
  }

  @Test
  void seriesDrawsItsLine() {
    BufferedImage img = render(List.of(Fixtures.chlorophyllSeries()), SCREEN, "series");
    assertTrue(Pixels.count(img, Style.PRIMARY, 2) > 300, "series line pixels");
    assertEquals(0, Pixels.count(img, Style.EVENT, 2), "no event markers without events");
  }

  /**
   * At scale 2 everything is twice as large, so the line covers about 4 times the pixels (more,
   * since a wider line has relatively fewer blended edge pixels); unscaled drawing would give about 2.
   */
  @Test
  void printScaleDrawsTheSamePlotLarger() {
    int screen = Pixels.count(render(List.of(Fixtures.chlorophyllSeries()), SCREEN, "series-screen"), Style.PRIMARY, 2);
    int print = Pixels.count(render(List.of(Fixtures.chlorophyllSeries()), PRINT, "series-print"), Style.PRIMARY, 2);
    double ratio = (double) print / screen;
    assertTrue(ratio > 3 && ratio < 8, "line pixels at scale 2 / scale 1 = " + ratio);
  }

  @Test
  void eventsAreMarked() {
    ResultTable t = Fixtures.monthlySeries("chlorophyll", "mg m-3", Fixtures.CHLOROPHYLL_2014, Map.of("events", "2014-06-20,2014-09-02"));
    BufferedImage img = render(List.of(t), PRINT, "series-events");
    assertTrue(Pixels.count(img, Style.EVENT, 2) > 1000, "two dashed event markers");
  }

  @Test
  void severalSeriesStackIntoPanels() {
    double[] temperature = {12.1, 12.4, 13.0, 14.2, 16.0, 18.5, 20.9, 21.3, 19.8, 17.1, 14.9, 13.0};
    ResultTable chl = Fixtures.chlorophyllSeries();
    ResultTable wt = Fixtures.monthlySeries("water_temperature", "degC", temperature, Map.of());
    BufferedImage img = render(List.of(chl, wt), SCREEN, "series-stacked");
    int h = img.getHeight();
    assertTrue(Pixels.count(img, Style.PRIMARY, 2, 0, h / 2) > 150, "line in the upper panel");
    assertTrue(Pixels.count(img, Style.PRIMARY, 2, h / 2, h) > 150, "line in the lower panel");
  }

  @Test
  void missingValuesLeaveGapsNotErrors() {
    double[] v = Fixtures.CHLOROPHYLL_2014.clone();
    v[4] = Double.NaN;
    v[5] = Double.NaN;
    int gap = Pixels.count(render(List.of(Fixtures.monthlySeries("chlorophyll", "mg m-3", v, Map.of())), SCREEN, "series-gap"), Style.PRIMARY, 2);
    int full = Pixels.count(render(List.of(Fixtures.chlorophyllSeries()), SCREEN, "series-full"), Style.PRIMARY, 2);
    assertTrue(gap < full * 0.8, "the peak months are not drawn: " + gap + " vs " + full);
  }

  @Test
  void seriesWithoutAnyValueStillRenders() {
    double[] none = new double[12];
    java.util.Arrays.fill(none, Double.NaN);
    BufferedImage img = render(List.of(Fixtures.monthlySeries("chlorophyll", "mg m-3", none, Map.of())), SCREEN, "series-empty");
    assertEquals(0, Pixels.count(img, Style.PRIMARY, 2), "no line");
  }

  @Test
  void anomalyShowsBaselineBandAndBothSigns() {
    BufferedImage img = render(List.of(Fixtures.standardizedAnomalySeries()), PRINT, "series-anomaly");
    assertTrue(Pixels.count(img, Style.BAND, 1) > 2000, "baseline band");
    assertTrue(Pixels.count(img, Style.ABOVE, 1) > 2000, "bars above the baseline");
    assertTrue(Pixels.count(img, Style.BELOW, 1) > 2000, "bars below the baseline");
    assertTrue(Pixels.count(img, Style.PRIMARY, 2) > 500, "the period's own values");
  }

  @Test
  void percentileRankHasBarsAroundFifty() {
    ResultTable z = Fixtures.standardizedAnomalySeries();
    double[] pct = {40, 10, 95, 80, 90, 100, 70, 52, 30, 20, 5, 0};
    List<org.slackwater.core.result.Column> cols = new java.util.ArrayList<>(z.columns());
    cols.set(3, new org.slackwater.core.result.Column.Doubles("percentile_rank_mean_chlorophyll", "%", pct));
    ResultTable t = new ResultTable("percentile rank of mean chlorophyll over Outer Bay", cols, z.metadata(), List.of());
    BufferedImage img = render(List.of(t), SCREEN, "series-percentile");
    assertTrue(Pixels.count(img, Style.ABOVE, 1) > 500 && Pixels.count(img, Style.BELOW, 1) > 500, "both signs around 50");
    assertEquals(0, Pixels.count(img, Style.BAND, 1), "no climatology band: a rank cannot be turned back into data");
  }

  @Test
  void correlationShowsBarsThresholdAndBothSignificanceClasses() {
    BufferedImage img = render(List.of(Fixtures.correlation()), SCREEN, "correlation");
    assertTrue(Pixels.count(img, Style.THRESHOLD, 2) > 300, "threshold lines");
    assertTrue(Pixels.count(img, Style.PRIMARY, 1) > 2000, "significant bars (lags 2 to 4)");
    assertTrue(Pixels.count(img, Style.SECONDARY, 1) > 1000, "bars that are not significant (lags 1, 5)");
    assertTrue(Pixels.count(img, Style.EVENT, 40) > 50, "best-lag label");
  }

  @Test
  void rankingFillsSignificantDriversAndHatchesTheOthers() {
    double[] r = {0.17, -0.157, -0.075};
    int filled = Pixels.count(render(List.of(Fixtures.ranking(r, new String[] {"yes", "yes", "yes"})), SCREEN, "ranking-filled"), Style.PRIMARY, 1);
    int hatched = Pixels.count(render(List.of(Fixtures.ranking(r, new String[] {"no", "no", "no"})), SCREEN, "ranking-hatched"), Style.PRIMARY, 1);
    int mixed = Pixels.count(render(List.of(Fixtures.ranking(r, new String[] {"yes", "no", "no"})), SCREEN, "ranking"), Style.PRIMARY, 1);
    // A hatch tile of 8 x 8 has one diagonal of 8 pixels: an eighth of a filled bar, plus the outline.
    assertTrue(hatched < filled / 3, "hatched " + hatched + " vs filled " + filled);
    assertTrue(mixed > hatched && mixed < filled, "one filled bar among hatched ones: " + mixed);
  }

  @Test
  void eventWindowShowsBaselineSpreadAndTheEventValue() {
    BufferedImage img = render(List.of(Fixtures.eventWindows()), SCREEN, "event-window");
    assertTrue(Pixels.count(img, Style.BASELINE, 1) > 200, "baseline mean and ±1 sd bars");
    assertTrue(Pixels.count(img, Style.ABOVE, 1) > 40, "water temperature above its baseline in both events");
    assertTrue(Pixels.count(img, Style.BELOW, 1) > 80, "cloud and turbidity below theirs");
  }
}
