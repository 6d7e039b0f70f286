package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slackwater.core.result.ResultTable;

/** Results that are not plots, and results a plot cannot be made of: each a PlotException that says what to do. */
class PngRendererErrorsTest {

  private static PlotException refused(List<ResultTable> results) {
    return assertThrows(PlotException.class, () -> PngRenderer.render(results, PlotOptions.defaults()));
  }

  @Test
  void catalogHasNoPlot() {
    PlotException e = refused(List.of(Fixtures.catalog()));
    assertEquals("a catalog listing has no plot (result 'variables'); ask for format=csv or json", e.getMessage());
  }

  @Test
  void watchIsARuleNotAPlot() {
    PlotException e = refused(List.of(Fixtures.watch()));
    assertTrue(e.getMessage().startsWith("a watch is a rule, not a plot (result 'watch \"North Intake bloom\" (checked, not stored)')"),
        e.getMessage());
    assertTrue(e.getMessage().contains("ask for format=json or csv"), e.getMessage());
  }

  @Test
  void definitionAloneHasNoPlotButIsSkippedBeforeAPlot() {
    PlotException e = refused(List.of(Fixtures.definition()));
    assertTrue(e.getMessage().startsWith("a definition ('let') has no plot"), e.getMessage());
    byte[] png = PngRenderer.render(List.of(Fixtures.definition(), Fixtures.chlorophyllSeries()), PlotOptions.defaults());
    Pixels.assertSize(Pixels.decode(png, "let-then-series"), 1000, 600);
  }

  @Test
  void onlyDefinitionsHaveNothingToPlot() {
    PlotException e = refused(List.of(Fixtures.definition(), Fixtures.definition()));
    assertEquals("the query defines variables but asks for nothing to plot; add a statement that uses them", e.getMessage());
  }

  @Test
  void aWatchAmongSeriesIsStillRefused() {
    PlotException e = refused(List.of(Fixtures.chlorophyllSeries(), Fixtures.watch()));
    assertTrue(e.getMessage().startsWith("a watch is a rule, not a plot"), e.getMessage());
  }

  @Test
  void differentKindsDoNotShareOnePicture() {
    PlotException e = refused(List.of(Fixtures.correlation(), Fixtures.eventWindows()));
    assertEquals("the query gives 2 results (correlation, event window) and one PNG holds one plot (only series stack into panels);"
        + " send each statement as its own query, or ask for format=json", e.getMessage());
  }

  @Test
  void noResults() {
    assertEquals("the query gave no results, so there is nothing to plot", refused(List.of()).getMessage());
  }

  @Test
  void resultWithoutKind() {
    ResultTable t = new ResultTable("mystery", Fixtures.chlorophyllSeries().columns(), Map.of(), List.of());
    assertTrue(refused(List.of(t)).getMessage().startsWith("the result 'mystery' does not say what kind of result it is (metadata result_kind is missing)"));
    ResultTable u = t.with("result_kind", "histogram");
    assertTrue(refused(List.of(u)).getMessage().startsWith("the result 'mystery' is of an unknown kind 'histogram'"));
  }

  @Test
  void emptyResult() {
    ResultTable t = Fixtures.monthlySeries("chlorophyll", "mg m-3", new double[0], Map.of());
    assertTrue(refused(List.of(t)).getMessage().contains("has no rows, so there is nothing to plot; check the region and the period"));
  }

  @Test
  void missingColumnIsNamed() {
    ResultTable c = Fixtures.correlation();
    ResultTable broken = new ResultTable(c.title(), c.columns().stream().filter(col -> !col.name().equals("n_effective")).toList(),
        c.metadata(), List.of());
    assertTrue(refused(List.of(broken)).getMessage().contains("has no column 'n_effective', which its plot needs"));
  }

  @Test
  void badEventDateIsNamed() {
    ResultTable t = Fixtures.monthlySeries("chlorophyll", "mg m-3", Fixtures.CHLOROPHYLL_2014, Map.of("events", "2014-06-20, 20 June"));
    assertTrue(refused(List.of(t)).getMessage().contains("holds '20 June', which is not an ISO 8601 date (yyyy-mm-dd)"));
  }
}
