package org.slackwater.render;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * Result tables in the layouts the server writes (column names, units, metadata keys of the
 * demo server's sample outputs for each result kind), with numbers taken from those samples
 * where a test does not need values of its own. The scenario is the invented Wrenmouth estuary.
 */
final class Fixtures {
  private Fixtures() {}

  static final String REGION = "Outer Bay";

  /** Monthly mean chlorophyll over Outer Bay in 2014 (the demo sample). */
  static final double[] CHLOROPHYLL_2014 = {0.8287450557431717, 0.7862393251189422, 1.312698150726754, 2.4938523022420034,
      2.201804357079044, 5.7850393679793894, 3.998807496829031, 0.9913265276988247, 0.8587019069144514, 0.8347710159333925,
      0.7995596697902803, 0.7984760467713723};

  static ResultTable monthlySeries(String variable, String unit, double[] values, Map<String, String> extraMeta) {
    int n = values.length;
    LocalDate[] start = new LocalDate[n], end = new LocalDate[n];
    String[] period = new String[n];
    double[] valid = new double[n], cells = new double[n];
    long[] steps = new long[n], expected = new long[n];
    for (int i = 0; i < n; i++) {
      start[i] = LocalDate.of(2014, 1, 1).plusMonths(i);
      end[i] = start[i].plusMonths(1).minusDays(1);
      period[i] = start[i].toString().substring(0, 7);
      valid[i] = Double.isNaN(values[i]) ? 0.1 : 0.7;
      cells[i] = 120;
      steps[i] = Double.isNaN(values[i]) ? 0 : 20;
      expected[i] = start[i].lengthOfMonth();
    }
    Map<String, String> meta = seriesMeta(variable, unit);
    meta.putAll(extraMeta);
    return new ResultTable("mean " + variable + " over " + REGION + ", by month, 2014-01-01 to 2014-12-31", List.of(
        new Column.Dates("time", start), new Column.Dates("end", end), new Column.Strings("period", period),
        new Column.Doubles("mean_" + variable, unit, values), new Column.Doubles("valid_fraction", "1", valid),
        new Column.Doubles("cells", "", cells), new Column.Longs("steps", "", steps), new Column.Longs("steps_expected", "", expected)),
        meta, List.of());
  }

  static ResultTable chlorophyllSeries() {
    return monthlySeries("chlorophyll", "mg m-3", CHLOROPHYLL_2014, Map.of());
  }

  /** The demo's standardized anomaly of monthly chlorophyll in 2014 against 2006 to 2020. */
  static ResultTable standardizedAnomalySeries() {
    double[] z = {-0.43988849857049966, -1.1845766298629645, 1.6829318345625484, 0.9392510555059026, 1.5894151357160888,
        3.4718728359615967, 0.7340575058303258, 0.014395700152608933, -0.5603778577606137, -0.9554908307136086,
        -1.4214866338333147, -2.231548739851258};
    double[] mean = {0.8463019650958583, 0.8638615309227732, 1.167249885277003, 2.348279734332304, 1.837679742268626,
        1.6681509787870261, 2.196963898622829, 0.989577255640778, 0.8925931098139287, 0.9212553932913627, 0.9159207692847227,
        0.893220283100695};
    double[] sd = {0.039912180949811346, 0.06552738239721184, 0.08642552387605056, 0.1549879204887244, 0.2290934612538259,
        1.185783173435878, 2.454635480047377, 0.12151351024976902, 0.06047919708125803, 0.09051303746513122, 0.08185873628698997,
        0.04245671834872754};
    ResultTable plain = chlorophyllSeries();
    List<Column> cols = new ArrayList<>();
    cols.add(plain.column("time"));
    cols.add(plain.column("end"));
    cols.add(plain.column("period"));
    cols.add(new Column.Doubles("standardized_anomaly_mean_chlorophyll", "1", z));
    cols.add(new Column.Doubles("baseline_mean", "mg m-3", mean));
    cols.add(new Column.Doubles("baseline_sd", "mg m-3", sd));
    cols.add(new Column.Longs("baseline_n", "", new long[] {15, 15, 15, 15, 15, 15, 15, 15, 15, 15, 15, 15}));
    cols.add(plain.column("valid_fraction"));
    cols.add(plain.column("cells"));
    Map<String, String> meta = seriesMeta("chlorophyll", "1");
    meta.put("baseline", "2006-01-01 to 2020-12-31");
    meta.put("climatology", "by calendar month");
    return new ResultTable("standardized anomaly of mean chlorophyll over Outer Bay, by month, 2014-01-01 to 2014-12-31", cols, meta, List.of());
  }

  private static Map<String, String> seriesMeta(String variable, String unit) {
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "mean " + variable + " over \"Outer Bay\" during 2014 by month");
    meta.put("statistic", "mean");
    meta.put("variable", variable);
    meta.put("units", unit);
    meta.put("region", REGION);
    meta.put("step", "month");
    meta.put("result_kind", "series");
    return meta;
  }

  /** The demo's lagged correlation of weekly chlorophyll with water temperature, lags 0 to 6 weeks. */
  static ResultTable correlation() {
    long[] lag = {0, 1, 2, 3, 4, 5, 6};
    double[] r = {-0.0016461701116322542, 0.07391683797755386, 0.13896413477198077, 0.17120084189221568, 0.15169323006039112,
        0.07419814467391786, 0.007347386646473833};
    double[] neff = {371.64819211803064, 373.5175021933458, 372.6239730352034, 368.4733023447735, 362.4066405149512,
        357.8556654651555, 361.6808233168553};
    double[] p = {0.9747684902708474, 0.15394800908697404, 0.0072199730929888555, 9.684352221405434E-4, 0.0037967399712200743,
        0.16132405790321425, 0.8892525142525455};
    String[] sig = {"no", "no", "yes", "yes", "yes", "no", "no"};
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "correlate chlorophyll with water_temperature over \"Outer Bay\" during 2006 to 2025 by week lags 0 to 6 weeks deseasonalized");
    meta.put("target", "mean chlorophyll [mg m-3] over Outer Bay");
    meta.put("driver", "mean water_temperature [degC] over Outer Bay");
    meta.put("deseasonalized", "yes (anomalies from a climatology by period of year)");
    meta.put("lag_unit", "week (positive: the driver leads)");
    meta.put("method", "pearson");
    meta.put("alpha", "0.05");
    meta.put("effective_sample_size", "Bretherton et al. (1999): N (1 - r1 r2) / (1 + r1 r2)");
    meta.put("best_lag", "3");
    meta.put("best_r", "0.17120084189221568");
    meta.put("best_p", "9.684352221405434E-4");
    meta.put("best_significant", "yes");
    meta.put("best_significant_after_bonferroni", "yes");
    meta.put("result_kind", "correlation");
    return new ResultTable("correlation of mean chlorophyll over Outer Bay with mean water_temperature over Outer Bay, by week", List.of(
        new Column.Longs("lag", "week", lag), new Column.Longs("n", "", new long[] {982, 981, 980, 979, 978, 977, 976}),
        new Column.Doubles("r", "1", r), new Column.Doubles("n_effective", "", neff), new Column.Doubles("p_value", "1", p),
        new Column.Strings("significant", sig), new Column.Strings("note", new String[7])), meta, List.of());
  }

  /** A driver ranking in the demo's layout with the given r and significance per driver. */
  static ResultTable ranking(double[] r, String[] significant) {
    int n = r.length;
    String[] drivers = {"water_temperature", "cloud_fraction", "turbidity", "rainfall", "runoff"};
    String[] name = new String[n], region = new String[n], stat = new String[n], dir = new String[n], bonf = new String[n];
    long[] rank = new long[n], lag = new long[n], count = new long[n];
    double[] neff = new double[n], p = new double[n];
    for (int i = 0; i < n; i++) {
      rank[i] = i + 1;
      name[i] = drivers[i];
      region[i] = REGION;
      stat[i] = "mean";
      lag[i] = 3;
      dir[i] = r[i] > 0 ? "higher with higher target" : "lower with higher target";
      count[i] = 979;
      neff[i] = 700;
      p[i] = "yes".equals(significant[i]) ? 0.001 : 0.4;
      bonf[i] = significant[i];
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "rank drivers of chlorophyll among water_temperature, cloud_fraction, turbidity over \"Outer Bay\" during 2006 to 2025 by week lags 0 to 8 weeks");
    meta.put("target", "mean chlorophyll");
    meta.put("region", REGION);
    meta.put("lags", "0 to 8 step 1");
    meta.put("method", "pearson");
    meta.put("lag_unit", "week (positive: the driver leads)");
    meta.put("ranked_by", "largest |r| at the best lag, on deseasonalized anomalies");
    meta.put("result_kind", "ranking");
    return new ResultTable("drivers of mean chlorophyll over Outer Bay, by week", List.of(
        new Column.Longs("rank", "", rank), new Column.Strings("driver", name), new Column.Strings("region", region),
        new Column.Strings("statistic", stat), new Column.Longs("best_lag", "week", lag), new Column.Doubles("r", "1", r),
        new Column.Strings("direction", dir), new Column.Longs("n", "", count), new Column.Doubles("n_effective", "", neff),
        new Column.Doubles("p_value", "1", p), new Column.Strings("significant", significant),
        new Column.Strings("significant_after_bonferroni", bonf)), meta, List.of());
  }

  /** The demo's windows of 25 days before two bloom events, for three drivers. */
  static ResultTable eventWindows() {
    LocalDate a = LocalDate.of(2014, 6, 20), b = LocalDate.of(2009, 7, 4);
    LocalDate[] event = {a, b, a, b, a, b};
    String[] driver = {"water_temperature", "water_temperature", "cloud_fraction", "cloud_fraction", "turbidity", "turbidity"};
    String[] units = {"degC", "degC", "1", "1", "FNU", "FNU"};
    double[] value = {20.872917084793, 21.12525142821609, 0.01813566859469571, 0.14783215953020074, 2.4664566147416074, 2.3567755392935177};
    double[] mean = {19.04510687964522, 20.432661763111724, 0.4100927941468287, 0.3745460358230029, 2.8430248289409885, 2.7504791840829608};
    double[] sd = {0.7476730849147828, 0.7086797551198553, 0.11248281024545312, 0.14195935079327143, 0.16716694558835282, 0.22472326275044185};
    double[] anomaly = new double[6], z = new double[6];
    for (int i = 0; i < 6; i++) {
      anomaly[i] = value[i] - mean[i];
      z[i] = anomaly[i] / sd[i];
    }
    double[] pct = {100, 84.21052631578948, 0, 10.526315789473685, 0, 5.2631578947368425};
    LocalDate[] start = new LocalDate[6], end = new LocalDate[6];
    String[] region = new String[6], stat = new String[6];
    for (int i = 0; i < 6; i++) {
      start[i] = event[i].minusDays(25);
      end[i] = event[i].minusDays(1);
      region[i] = REGION;
      stat[i] = "mean (window mean)";
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "window 25 days before 2014-06-20, 2009-07-04 of water_temperature, cloud_fraction, turbidity over \"Outer Bay\"");
    meta.put("window", "25 days before each event date (the event day itself excluded)");
    meta.put("baseline_years", "2006 to 2025, each event's own year left out");
    meta.put("result_kind", "event_window");
    return new ResultTable("windows of 25 days before 2 event(s)", List.of(
        new Column.Dates("event", event), new Column.Strings("driver", driver), new Column.Strings("region", region),
        new Column.Strings("statistic", stat), new Column.Strings("units", units), new Column.Dates("window_start", start),
        new Column.Dates("window_end", end), new Column.Doubles("value", "", value), new Column.Doubles("baseline_mean", "", mean),
        new Column.Doubles("baseline_sd", "", sd), new Column.Doubles("anomaly", "", anomaly),
        new Column.Doubles("standardized_anomaly", "1", z), new Column.Doubles("percentile_rank", "%", pct),
        new Column.Longs("baseline_years", "", new long[] {19, 19, 19, 19, 19, 19})), meta, List.of());
  }

  /** Grid of the demo's water cube near the estuary mouth: 0.05 degree cells, centres at 43.825 + 0.05 i N, -30.975 + 0.05 j E. */
  static final double LAT0 = 43.825, LON0 = -30.975, STEP = 0.05;

  /**
   * A map in the server's layout over {@code rows} x {@code cols} cells, value column
   * {@code valueName [unit]}, values[row][col] (NaN = no data), the region outline through the
   * grid's outer cell edges.
   */
  static ResultTable map(String kind, String valueName, String unit, double[][] values, Map<String, String> extraMeta) {
    int rows = values.length, cols = values[0].length, m = rows * cols;
    long[] row = new long[m], col = new long[m], validSteps = new long[m];
    double[] lat = new double[m], lon = new double[m], frac = new double[m], v = new double[m];
    int k = 0;
    for (int i = 0; i < rows; i++) {
      for (int j = 0; j < cols; j++, k++) {
        row[k] = i + 1;
        col[k] = j + 11;
        lat[k] = LAT0 + STEP * i;
        lon[k] = LON0 + STEP * j;
        frac[k] = 1;
        v[k] = values[i][j];
        validSteps[k] = Double.isNaN(values[i][j]) ? 0 : 30;
      }
    }
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "map mean water_temperature over \"Outer Bay\" during 2014-06");
    meta.put("variable", "water_temperature");
    meta.put("statistic", "mean over time, per cell");
    meta.put("units", unit);
    meta.put("region", REGION);
    meta.put("period", "2014-06-01 to 2014-06-30");
    meta.put("grid", rows + " x " + cols + " cells");
    meta.put("region_wkt", outline(rows, cols));
    meta.putAll(extraMeta);
    meta.put("result_kind", kind);
    List<Column> columns = new ArrayList<>(List.of(new Column.Longs("row", "", row), new Column.Longs("column", "", col),
        new Column.Doubles("lat", "degrees_north", lat), new Column.Doubles("lon", "degrees_east", lon),
        new Column.Doubles("fraction_inside", "1", frac), new Column.Doubles(valueName, unit, v)));
    columns.add(new Column.Longs("valid_steps", "", validSteps));
    return new ResultTable("map of " + valueName.replace('_', ' ') + " over Outer Bay, 2014-06-01 to 2014-06-30", columns, meta, List.of());
  }

  /** The rectangle through the outer cell edges, as WKT (lon lat). */
  static String outline(int rows, int cols) {
    double w = LON0 - STEP / 2, e = LON0 + STEP * (cols - 0.5), s = LAT0 - STEP / 2, n = LAT0 + STEP * (rows - 0.5);
    return "POLYGON ((" + w + " " + s + ", " + e + " " + s + ", " + e + " " + n + ", " + w + " " + n + ", " + w + " " + s + "))";
  }

  /** A correlation map in the server's layout (title, metadata keys), r per cell; NaN = too few pairs. */
  static ResultTable correlationMap(double[][] r) {
    ResultTable m = map("correlation_map", "r", "1", r, Map.of());
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", "map correlation of chlorophyll over \"Outer Bay\" with mean water_temperature during 2006 to 2025 by week at lag 3 weeks");
    meta.put("values", "chlorophyll per cell over Outer Bay");
    meta.put("driver", "mean water_temperature over Outer Bay");
    meta.put("lag", "3 week (positive: the driver leads)");
    meta.put("method", "pearson");
    meta.put("deseasonalized", "no");
    meta.put("region_wkt", m.metadata().get("region_wkt"));
    meta.put("result_kind", "correlation_map");
    return new ResultTable("map of the correlation of chlorophyll with water_temperature", m.columns(), meta, List.of());
  }

  static ResultTable catalog() {
    return new ResultTable("variables", List.of(new Column.Strings("variable", new String[] {"chlorophyll", "rainfall"}),
        new Column.Strings("units", new String[] {"mg m-3", "mm/day"})), Map.of("result_kind", "catalog"), List.of());
  }

  static ResultTable watch() {
    String caution = "Screening aid only: built from remote-sensing and model data, which can be wrong. Confirm with water sampling,"
        + " and follow local drinking-water regulations and licensed operators before acting.";
    return new ResultTable("watch \"North Intake bloom\" (checked, not stored)", List.of(
        new Column.Strings("rule", new String[] {"1"}), new Column.Strings("severity", new String[] {"warning"}),
        new Column.Strings("condition", new String[] {"when mean chlorophyll above 10 mg/m3 for 3 days"}),
        new Column.Strings("caution", new String[] {caution})),
        Map.of("result_kind", "watch", "watch", "North Intake bloom", "caution", caution), List.of(caution));
  }

  static ResultTable definition() {
    return new ResultTable("defined chlorophyll_load", List.of(new Column.Strings("variable", new String[] {"chlorophyll_load"})),
        Map.of("result_kind", "definition"), List.of());
  }
}
