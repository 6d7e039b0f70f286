package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.ResultTable;

/** Maps rendered to PNG, decoded with ImageIO, checked pixel by pixel against the published colour maps. */
class MapRenderingTest {
  private static final double NAN = Double.NaN;

  /** Sequential values 10..20 with one cell without data (row 1, column 2); 15 sits exactly mid-scale. */
  private static final double[][] TEMPERATURE = {
      {10, 11, 12, 13, 14},
      {15, 16, NAN, 17, 18},
      {19, 19.5, 15, 12.5, 20},
      {11.5, 13.5, 16.5, 18.5, 17.5}};

  private static final PlotOptions PRINT = new PlotOptions(900, 600, 2);

  private static ResultTable temperatureMap() {
    return Fixtures.map("map", "mean_water_temperature", "degC", TEMPERATURE, Map.of());
  }

  private static double[] centre(MapLayout l, int row, int col, double scale) {
    double lat = Fixtures.LAT0 + Fixtures.STEP * row, lon = Fixtures.LON0 + Fixtures.STEP * col;
    return new double[] {l.x(lon) * scale, l.y(lat) * scale};
  }

  private static Color cellPixel(BufferedImage img, MapLayout l, int row, int col, double scale) {
    double[] c = centre(l, row, col, scale);
    return Pixels.at(img, c[0], c[1]);
  }

  @Test
  void sizeIsWidthTimesScaleByHeightTimesScale() {
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(temperatureMap()), PRINT), "map-print");
    Pixels.assertSize(img, 1800, 1200);
  }

  @Test
  void missingCellCentreHasTheMissingColourAndTheLegendListsIt() {
    ResultTable t = temperatureMap();
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-missing");
    MapLayout l = new CellMap(t, ResultKind.MAP).layout(PRINT.width(), PRINT.height());
    Pixels.assertColour(Style.MISSING, cellPixel(img, l, 1, 2, 2), 1, "centre of the cell without data");
    // The hatch is there too: the missing cell holds hatch-coloured pixels.
    Rectangle2D cell = l.cell(Fixtures.LAT0 + Fixtures.STEP, Fixtures.LON0 + 2 * Fixtures.STEP, Fixtures.STEP, Fixtures.STEP);
    BufferedImage inside = img.getSubimage((int) (cell.getX() * 2) + 2, (int) (cell.getY() * 2) + 2,
        (int) (cell.getWidth() * 2) - 4, (int) (cell.getHeight() * 2) - 4);
    assertTrue(Pixels.count(inside, Style.MISSING_HATCH, 12) > 20, "hatch lines in the missing cell");
    // No other cell centre is grey.
    for (int r = 0; r < 4; r++) {
      for (int c = 0; c < 5; c++) {
        if (r != 1 || c != 2) {
          assertTrue(!Pixels.close(Style.MISSING, cellPixel(img, l, r, c, 2), 20), "cell " + r + "," + c + " is not drawn as missing");
        }
      }
    }
    // The legend below the map shows the missing-cell swatch.
    int below = (int) Math.ceil(l.frame().getMaxY() * 2) + 4;
    assertTrue(Pixels.count(img, Style.MISSING, 1, below, img.getHeight()) > 50, "missing swatch in the legend");
  }

  /**
   * Values map onto the 256 published viridis entries (matplotlib _cm_listed.py, _viridis_data;
   * van der Walt and Smith 2015, CC0) over [min, max] = [10, 20]: 10 is entry 0 (#440154),
   * 20 entry 255 (#fde725), 15 at fraction 0.5 entry 128 (#21918c), 12.5 at 0.25 entry 64.
   */
  @Test
  void cellColoursAreTheViridisEntriesOfTheirValues() {
    ResultTable t = temperatureMap();
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-viridis");
    MapLayout l = new CellMap(t, ResultKind.MAP).layout(PRINT.width(), PRINT.height());
    Pixels.assertColour(Pixels.hex("#440154"), cellPixel(img, l, 0, 0, 2), 1, "value 10 (minimum)");
    Pixels.assertColour(Pixels.hex("#fde725"), cellPixel(img, l, 2, 4, 2), 1, "value 20 (maximum)");
    Pixels.assertColour(Pixels.hex("#21918c"), cellPixel(img, l, 1, 0, 2), 1, "value 15");
    Pixels.assertColour(Pixels.hex("#21918c"), cellPixel(img, l, 2, 2, 2), 1, "value 15, second cell");
    // Entry 64 of the published table: (0.229739, 0.322361, 0.545706) = #3b528b.
    Pixels.assertColour(Pixels.hex("#3b528b"), cellPixel(img, l, 2, 3, 2), 1, "value 12.5");
  }

  @Test
  void colourBarEndsAreThePublishedViridisEnds() {
    ResultTable t = temperatureMap();
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-bar");
    Rectangle2D bar = new CellMap(t, ResultKind.MAP).layout(PRINT.width(), PRINT.height()).bar();
    double x = bar.getCenterX() * 2;
    Pixels.assertColour(Pixels.hex("#440154"), Pixels.at(img, x, bar.getMaxY() * 2 - 1), 1, "low end of the colour bar");
    Pixels.assertColour(Pixels.hex("#fde725"), Pixels.at(img, x, bar.getY() * 2 + 1), 1, "high end of the colour bar");
  }

  @Test
  void regionOutlineIsDrawnOnTheCellEdges() {
    ResultTable t = temperatureMap();
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-outline");
    MapLayout l = new CellMap(t, ResultKind.MAP).layout(PRINT.width(), PRINT.height());
    double west = Fixtures.LON0 - Fixtures.STEP / 2, midLat = Fixtures.LAT0 + Fixtures.STEP * 1.5;
    Color darkest = darkestNear(img, l.x(west) * 2, l.y(midLat) * 2, 2);
    Pixels.assertColour(Style.OUTLINE, darkest, 12, "outline on the western edge");
  }

  /**
   * Standardized anomalies are diverging: limits ± the largest magnitude (2.5), zero at the
   * centre class of ColorBrewer RdBu (#f7f7f7), -2.5 at its blue end (#053061), +2.5 at its red
   * end (#67001f) (colorbrewer2.org, 11 classes).
   */
  @Test
  void anomalyMapIsDivergingAndCentredAtZero() {
    double[][] z = {
        {-2.5, -1, 0, 1, 2},
        {-0.5, NAN, 0.5, 1.5, 2.5},
        {-2, -1.5, 0.25, 0.75, 1.25}};
    ResultTable t = Fixtures.map("map", "standardized_anomaly_mean_water_temperature", "1", z,
        Map.of("baseline_windows", "15 years, the period's calendar window in each"));
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-anomaly");
    CellMap m = new CellMap(t, ResultKind.MAP);
    assertTrue(m.scale().map().isDiverging());
    assertEquals(-2.5, m.scale().low());
    assertEquals(2.5, m.scale().high());
    MapLayout l = m.layout(PRINT.width(), PRINT.height());
    Pixels.assertColour(Pixels.hex("#f7f7f7"), cellPixel(img, l, 0, 2, 2), 1, "value 0");
    Pixels.assertColour(Pixels.hex("#053061"), cellPixel(img, l, 0, 0, 2), 1, "value -2.5");
    Pixels.assertColour(Pixels.hex("#67001f"), cellPixel(img, l, 1, 4, 2), 1, "value +2.5");
    Pixels.assertColour(Style.MISSING, cellPixel(img, l, 1, 1, 2), 1, "cell without data");
    Rectangle2D bar = l.bar();
    Pixels.assertColour(Pixels.hex("#f7f7f7"), Pixels.at(img, bar.getCenterX() * 2, bar.getCenterY() * 2), 2, "middle of the colour bar");
  }

  @Test
  void differenceMapIsDivergingEvenWithOnlyPositiveValues() {
    double[][] d = {{0.5, 1, 2}, {0, 0.25, 1.5}};
    ResultTable t = Fixtures.map("map", "difference_mean_water_temperature", "degC", d,
        Map.of("difference", "period minus reference, cell by cell"));
    CellMap m = new CellMap(t, ResultKind.MAP);
    assertEquals(-2, m.scale().low());
    assertEquals(2, m.scale().high());
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PlotOptions.defaults()), "map-difference");
    Pixels.assertColour(Pixels.hex("#f7f7f7"), cellPixel(img, m.layout(1000, 600), 1, 0, 1), 1, "difference 0");
  }

  @Test
  void correlationMapColoursRAroundZero() {
    double[][] r = {{-0.6, -0.3, 0}, {0.3, 0.6, NAN}};
    ResultTable base = Fixtures.correlationMap(r);
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(base), PRINT), "map-correlation");
    CellMap m = new CellMap(base, ResultKind.CORRELATION_MAP);
    MapLayout l = m.layout(PRINT.width(), PRINT.height());
    Pixels.assertColour(Pixels.hex("#f7f7f7"), cellPixel(img, l, 0, 2, 2), 1, "r = 0");
    Pixels.assertColour(Pixels.hex("#053061"), cellPixel(img, l, 0, 0, 2), 1, "r = -0.6 (the low limit)");
    Pixels.assertColour(Style.MISSING, cellPixel(img, l, 1, 2, 2), 1, "cell without r");
  }

  @Test
  void mapWithoutAnyValueDrawsEveryCellAsMissing() {
    double[][] none = {{NAN, NAN}, {NAN, NAN}};
    ResultTable t = Fixtures.map("map", "mean_water_temperature", "degC", none, Map.of());
    BufferedImage img = Pixels.decode(PngRenderer.render(List.of(t), PRINT), "map-empty");
    MapLayout l = new CellMap(t, ResultKind.MAP).layout(PRINT.width(), PRINT.height());
    for (int r = 0; r < 2; r++) {
      for (int c = 0; c < 2; c++) {
        Pixels.assertColour(Style.MISSING, cellPixel(img, l, r, c, 2), 1, "cell " + r + "," + c);
      }
    }
  }

  @Test
  void cellSizeComesFromTheGridSpacing() {
    MapData d = MapData.of(temperatureMap(), ResultKind.MAP);
    assertEquals(0.05, d.cellLat(), 1e-12);
    assertEquals(0.05, d.cellLon(), 1e-12);
    assertEquals(1, d.missing());
  }

  @Test
  void badOutlineIsAPlotException() {
    ResultTable t = temperatureMap().with("region_wkt", "POLYGON ((1 2, 3");
    PlotException e = org.junit.jupiter.api.Assertions.assertThrows(PlotException.class, () -> PngRenderer.render(List.of(t), PRINT));
    assertTrue(e.getMessage().contains("(metadata region_wkt) is not valid WKT"), e.getMessage());
  }

  private static Color darkestNear(BufferedImage img, double x, double y, int radius) {
    Color best = Color.WHITE;
    for (int dy = -radius; dy <= radius; dy++) {
      for (int dx = -radius; dx <= radius; dx++) {
        Color c = Pixels.at(img, x + dx, y + dy);
        if (c.getRed() + c.getGreen() + c.getBlue() < best.getRed() + best.getGreen() + best.getBlue()) {
          best = c;
        }
      }
    }
    return best;
  }
}
