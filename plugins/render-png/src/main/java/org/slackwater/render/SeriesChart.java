package org.slackwater.render;

import java.awt.Color;
import java.awt.geom.Ellipse2D;
import java.text.DateFormat;
import java.text.SimpleDateFormat;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.annotations.XYTitleAnnotation;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.DateTickUnit;
import org.jfree.chart.axis.DateTickUnitType;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.TickUnits;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.slackwater.core.result.ResultTable;
import org.slackwater.render.SeriesData.Comparison;

/**
 * Series results over time, one or more panels stacked on a shared date axis (one query with
 * several series statements gives several panels).
 *
 * <ul>
 *   <li>A plain series: its values as a line; steps without a value leave a gap.</li>
 *   <li>A comparison with a baseline (anomaly, standardized anomaly): a panel in the data's unit
 *       with the baseline climatology as a band (mean ± 1 sd) and its mean dashed, the period's
 *       own values (undone from the comparison) as a line, and the departure from the baseline
 *       mean shaded per step, warm above and cool below; then a panel of the value asked for
 *       (anomaly or standardized anomaly) as bars from 0 in the same two colours.</li>
 *   <li>A percentile rank: bars from 50 (the baseline median), above and below coloured apart; a
 *       rank cannot be turned back into data, so there is no climatology panel.</li>
 * </ul>
 *
 * Event dates in the metadata key {@code events} are drawn as vertical markers on every panel.
 */
final class SeriesChart {
  private SeriesChart() {}

  /** Draw point markers only when the points are few enough to tell apart. */
  private static final int MAX_POINTS_WITH_MARKERS = 120;
  /** Above this many points the line is drawn thin. */
  private static final int MAX_POINTS_FULL_LINE = 400;

  static Figure figure(List<ResultTable> tables) {
    List<SeriesData> all = tables.stream().map(SeriesData::of).toList();
    DateAxis time = dateAxis();
    CombinedDomainXYPlot plot = new CombinedDomainXYPlot(time);
    plot.setGap(12);
    Map<String, LegendItem> legend = new LinkedHashMap<>();
    List<XYPlot> panels = new ArrayList<>();
    for (SeriesData s : all) {
      if (s.comparison() == Comparison.NONE) {
        panels.add(add(plot, valuesPanel(s), 3));
      } else {
        if (s.observed().isPresent()) {
          panels.add(add(plot, climatologyPanel(s, legend), 3));
        }
        panels.add(add(plot, departurePanel(s, legend), 2));
      }
    }
    // The axis spans whole steps: from the first step's start to the day after the last step's end.
    time.setRange(all.stream().mapToDouble(s -> s.xLow()[0]).min().orElseThrow(),
        all.stream().mapToDouble(s -> s.xHigh()[s.size() - 1]).max().orElseThrow());
    boolean stacked = panels.size() > 1;
    int p = 0;
    for (SeriesData s : all) {
      int count = s.comparison() != Comparison.NONE && s.observed().isPresent() ? 2 : 1;
      for (int k = 0; k < count; k++, p++) {
        XYPlot panel = panels.get(p);
        if (stacked) {
          panel.addAnnotation(caption(k == 0 ? captionOf(s) : departureCaption(s)));
        } else {
          panel.getRangeAxis().setLabel(Tables.label(s.valueColumn()));
        }
        markEvents(panel, s.events(), p == 0, legend);
      }
    }
    String title = all.size() == 1 ? all.get(0).table().title()
        : String.join("; ", all.stream().map(s -> s.table().title()).toList());
    List<String> sub = new ArrayList<>();
    for (int i = 0; i < Math.min(3, all.size()); i++) {
      sub.add(Titles.series(all.get(i)));
    }
    if (all.size() > 3) {
      sub.add("and " + (all.size() - 3) + " more series");
    }
    JFreeChart chart = Charts.chart(plot, title, sub, Charts.notes(tables), Charts.legend(new ArrayList<>(legend.values())));
    return Figure.of(chart);
  }

  private static XYPlot add(CombinedDomainXYPlot plot, XYPlot panel, int weight) {
    plot.add(panel, weight);
    return panel;
  }

  private static XYPlot valuesPanel(SeriesData s) {
    XYPlot p = panel(Tables.label("", s.valueColumn().unit()).trim());
    p.setDataset(0, line("values", s.xMid(), s.value()));
    p.setRenderer(0, lineRenderer(s.size()));
    return p;
  }

  private static XYPlot climatologyPanel(SeriesData s, Map<String, LegendItem> legend) {
    double[] mean = s.baselineMean().orElseThrow(), sd = s.baselineSd().orElseThrow(), obs = s.observed().orElseThrow();
    XYPlot p = panel(s.baselineUnit().isEmpty() || s.baselineUnit().equals("1") ? "" : s.baselineUnit());
    p.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);

    // The band is one series per run of steps with a baseline, so a gap stays a gap.
    YIntervalSeriesCollection band = new YIntervalSeriesCollection();
    YIntervalSeries run = null;
    for (int i = 0; i < s.size(); i++) {
      if (Double.isNaN(mean[i]) || Double.isNaN(sd[i])) {
        run = null;
        continue;
      }
      if (run == null) {
        run = new YIntervalSeries("baseline " + band.getSeriesCount(), false, true);
        band.addSeries(run);
      }
      run.add(s.xMid()[i], mean[i], mean[i] - sd[i], mean[i] + sd[i]);
    }
    DeviationRenderer br = new DeviationRenderer(true, false);
    br.setAlpha(1f);
    for (int k = 0; k < band.getSeriesCount(); k++) {
      br.setSeriesPaint(k, Style.BASELINE);
      br.setSeriesStroke(k, Style.DASHED);
      br.setSeriesFillPaint(k, Style.BAND);
    }
    p.setDataset(0, band);
    p.setRenderer(0, br);

    XYSeriesCollection pair = line("this period", s.xMid(), obs);
    pair.addSeries(line("baseline mean", s.xMid(), mean).getSeries(0));
    p.setDataset(1, pair);
    p.setRenderer(1, new DepartureFill());

    p.setDataset(2, line("this period", s.xMid(), obs));
    p.setRenderer(2, lineRenderer(s.size()));

    legend.put("line", Charts.line("this period", Style.PRIMARY, Style.LINE));
    legend.put("band", Charts.box("baseline mean ± 1 sd" + baselineRange(s), Style.BAND, null));
    legend.put("mean", Charts.line("baseline mean", Style.BASELINE, Style.DASHED));
    legend.put("above", Charts.box("above the baseline", Style.ABOVE, null));
    legend.put("below", Charts.box("below the baseline", Style.BELOW, null));
    return p;
  }

  private static XYPlot departurePanel(SeriesData s, Map<String, LegendItem> legend) {
    double ref = s.comparison().reference;
    XYPlot p = panel(departureAxis(s));
    XYIntervalSeries above = new XYIntervalSeries("above", false, true), below = new XYIntervalSeries("below", false, true);
    for (int i = 0; i < s.size(); i++) {
      double v = s.value()[i];
      if (Double.isNaN(v)) {
        continue;
      }
      (v >= ref ? above : below).add(s.xMid()[i], s.xLow()[i], s.xHigh()[i], v, Math.min(v, ref), Math.max(v, ref));
    }
    p.setDataset(0, intervals(above, below));
    p.setRenderer(0, departureBars());
    p.addRangeMarker(new ValueMarker(ref, Style.ZERO_LINE, Style.THIN), Layer.BACKGROUND);
    NumberAxis axis = (NumberAxis) p.getRangeAxis();
    axis.setAutoRangeIncludesZero(ref == 0);
    if (s.comparison() == Comparison.PERCENTILE_RANK) {
      axis.setRange(0, 100);
    }
    legend.put("above", Charts.box("above the baseline", Style.ABOVE, null));
    legend.put("below", Charts.box("below the baseline", Style.BELOW, null));
    return p;
  }

  private static XYPlot panel(String rangeLabel) {
    XYPlot p = new XYPlot();
    Charts.style(p);
    p.setRangeAxis(Charts.numberAxis(rangeLabel));
    return p;
  }

  private static XYSeriesCollection line(String key, double[] x, double[] y) {
    XYSeries series = new XYSeries(key, false, true);
    for (int i = 0; i < x.length; i++) {
      series.add(x[i], Double.isNaN(y[i]) ? null : y[i]);
    }
    return new XYSeriesCollection(series);
  }

  private static XYLineAndShapeRenderer lineRenderer(int points) {
    XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, points <= MAX_POINTS_WITH_MARKERS);
    r.setSeriesPaint(0, Style.PRIMARY);
    // Thousands of daily values would merge into a band at full width.
    r.setSeriesStroke(0, points <= MAX_POINTS_FULL_LINE ? Style.LINE : Style.THIN_LINE);
    r.setSeriesShape(0, new Ellipse2D.Double(-3, -3, 6, 6));
    // One path per series (a missing value starts a new piece): faster than segments and joins cleanly.
    r.setDrawSeriesLineAsPath(true);
    return r;
  }

  private static XYIntervalSeriesCollection intervals(XYIntervalSeries above, XYIntervalSeries below) {
    XYIntervalSeriesCollection c = new XYIntervalSeriesCollection();
    c.addSeries(above);
    c.addSeries(below);
    return c;
  }

  private static XYBarRenderer departureBars() {
    XYBarRenderer r = new XYBarRenderer(0.15);
    r.setUseYInterval(true);
    r.setBarPainter(new StandardXYBarPainter());
    r.setShadowVisible(false);
    r.setDrawBarOutline(false);
    r.setSeriesPaint(0, Style.ABOVE);
    r.setSeriesPaint(1, Style.BELOW);
    return r;
  }

  private static String departureAxis(SeriesData s) {
    return switch (s.comparison()) {
      case ANOMALY -> Tables.label("anomaly", s.valueColumn().unit());
      case STANDARDIZED_ANOMALY -> "standardized anomaly (sd)";
      case PERCENTILE_RANK -> "percentile rank [%]";
      case NONE -> Tables.label(s.valueColumn());
    };
  }

  private static String captionOf(SeriesData s) {
    String region = Tables.meta(s.table(), "region", "");
    String where = region.isEmpty() ? "" : " over " + region;
    if (s.comparison() == Comparison.NONE) {
      return Tables.label(s.valueColumn().name() + where, s.valueColumn().unit());
    }
    return Tables.label(s.baseName() + where, s.baselineUnit()) + " against its baseline";
  }

  private static String departureCaption(SeriesData s) {
    String region = Tables.meta(s.table(), "region", "");
    return s.valueColumn().name().replace('_', ' ') + (region.isEmpty() ? "" : " over " + region);
  }

  private static XYTitleAnnotation caption(String text) {
    TextTitle t = new TextTitle(text, Style.LEGEND);
    t.setPaint(Style.TEXT);
    t.setBackgroundPaint(new Color(255, 255, 255, 215));
    t.setPadding(new RectangleInsets(1, 3, 1, 3));
    return new XYTitleAnnotation(0.005, 0.995, t, RectangleAnchor.TOP_LEFT);
  }

  private static String baselineRange(SeriesData s) {
    String b = s.table().metadata().get("baseline");
    return b == null ? "" : ", " + b;
  }

  private static void markEvents(XYPlot panel, List<LocalDate> events, boolean labelled, Map<String, LegendItem> legend) {
    for (LocalDate e : events) {
      ValueMarker m = new ValueMarker((e.toEpochDay() + 0.5) * 86_400_000d, Style.EVENT, Style.DASHED);
      if (labelled) {
        m.setLabel(e.toString());
        m.setLabelFont(Style.NOTE);
        m.setLabelPaint(Style.EVENT);
        m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
        m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
      }
      panel.addDomainMarker(m, Layer.FOREGROUND);
      legend.put("event", Charts.line("event", Style.EVENT, Style.DASHED));
    }
  }

  /** A UTC date axis with ISO 8601 labels: yyyy, yyyy-MM or yyyy-MM-dd, whichever the tick spacing needs. */
  private static DateAxis dateAxis() {
    TimeZone utc = TimeZone.getTimeZone("UTC");
    DateAxis a = Charts.style(new DateAxis(null, utc, Locale.ROOT));
    TickUnits units = new TickUnits();
    DateFormat day = iso("yyyy-MM-dd", utc), month = iso("yyyy-MM", utc), year = iso("yyyy", utc);
    for (int d : new int[] {1, 2, 7, 14}) {
      units.add(new DateTickUnit(DateTickUnitType.DAY, d, day));
    }
    for (int m : new int[] {1, 2, 3, 6}) {
      units.add(new DateTickUnit(DateTickUnitType.MONTH, m, month));
    }
    for (int y : new int[] {1, 2, 5, 10, 20, 50}) {
      units.add(new DateTickUnit(DateTickUnitType.YEAR, y, year));
    }
    a.setStandardTickUnits(units);
    a.setLowerMargin(0.01);
    a.setUpperMargin(0.01);
    return a;
  }

  private static DateFormat iso(String pattern, TimeZone zone) {
    SimpleDateFormat f = new SimpleDateFormat(pattern, Locale.ROOT);
    f.setTimeZone(zone);
    return f;
  }
}
