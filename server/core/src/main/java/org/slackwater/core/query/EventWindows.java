package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.analytics.BaselineStats;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * Windows before events: for each event date E and each driver, the driver's daily values over
 * the {@code days} days before E (E − days to E − 1) are reduced to one number (the mean, or the
 * total for a sum statistic), and compared with the same calendar window in every baseline year
 * other than the event's own: anomaly, standardized anomaly (sample standard deviation) and
 * mid-rank percentile, 100 (below + ½ equal) / n. A window with any day missing is left empty
 * for a total; a mean needs half of its days. A total over a window that includes a day the cube
 * does not have (29 February on a noleap calendar) is scaled by days / steps present.
 */
final class EventWindows {
  private EventWindows() {}

  /** A driver's daily series over the baseline years and the event windows; {@code total} sums instead of averaging. */
  record Driver(String name, String region, String statistic, String unit, SeriesPlan daily, boolean total) {}

  static ResultTable compute(List<LocalDate> events, int days, List<Driver> drivers, int baselineFirstYear, int baselineLastYear,
      ChunkSource cache, Map<String, String> meta, List<String> warnings) throws IOException {
    List<LocalDate> eventCol = new ArrayList<>(), startCol = new ArrayList<>(), endCol = new ArrayList<>();
    List<String> driverCol = new ArrayList<>(), regionCol = new ArrayList<>(), statCol = new ArrayList<>(), unitCol = new ArrayList<>();
    List<double[]> numbers = new ArrayList<>();
    List<Long> yearsCol = new ArrayList<>();
    for (Driver d : drivers) {
      StepSeries s = d.daily().compute(cache);
      Map<LocalDate, Double> byDate = new LinkedHashMap<>();
      for (int i = 0; i < s.size(); i++) {
        byDate.put(s.start()[i], s.value()[i]);
      }
      for (LocalDate e : events) {
        double value = window(byDate, e, days, d.total());
        List<Double> base = new ArrayList<>();
        for (int y = baselineFirstYear; y <= baselineLastYear; y++) {
          if (y == e.getYear()) {
            continue;
          }
          double v = window(byDate, e.withYear(y), days, d.total());
          if (!Double.isNaN(v)) {
            base.add(v);
          }
        }
        BaselineStats b = BaselineStats.of(base.stream().mapToDouble(Double::doubleValue).toArray());
        eventCol.add(e);
        startCol.add(e.minusDays(days));
        endCol.add(e.minusDays(1));
        driverCol.add(d.name());
        regionCol.add(d.region());
        unitCol.add(d.unit());
        statCol.add(d.statistic() + (d.total() ? " (window total)" : " (window mean)"));
        numbers.add(new double[] {value, b.mean(), b.sd(), b.anomaly(value), b.standardizedAnomaly(value), b.percentileRank(value)});
        yearsCol.add((long) b.n());
      }
    }
    int n = eventCol.size();
    double[][] cols = new double[6][n];
    for (int i = 0; i < n; i++) {
      for (int c = 0; c < 6; c++) {
        cols[c][i] = numbers.get(i)[c];
      }
    }
    Map<String, String> m = new LinkedHashMap<>(meta);
    m.put("window", days + " days before each event date (the event day itself excluded)");
    m.put("baseline_years", baselineFirstYear + " to " + baselineLastYear + ", each event's own year left out");
    return new ResultTable("windows of " + days + " days before " + events.size() + " event(s)", List.of(
        new Column.Dates("event", eventCol.toArray(LocalDate[]::new)), new Column.Strings("driver", driverCol.toArray(String[]::new)),
        new Column.Strings("region", regionCol.toArray(String[]::new)),
        new Column.Strings("statistic", statCol.toArray(String[]::new)), new Column.Strings("units", unitCol.toArray(String[]::new)),
        new Column.Dates("window_start", startCol.toArray(LocalDate[]::new)), new Column.Dates("window_end", endCol.toArray(LocalDate[]::new)),
        new Column.Doubles("value", "", cols[0]), new Column.Doubles("baseline_mean", "", cols[1]),
        new Column.Doubles("baseline_sd", "", cols[2]), new Column.Doubles("anomaly", "", cols[3]),
        new Column.Doubles("standardized_anomaly", "1", cols[4]), new Column.Doubles("percentile_rank", "%", cols[5]),
        new Column.Longs("baseline_years", "", yearsCol.stream().mapToLong(Long::longValue).toArray())), m, warnings);
  }

  /** Mean (at least half the days present) or total (every day present) of the days before {@code end}. */
  static double window(Map<LocalDate, Double> byDate, LocalDate end, int days, boolean total) {
    double sum = 0;
    int have = 0, expected = 0;
    for (LocalDate d = end.minusDays(days); d.isBefore(end); d = d.plusDays(1)) {
      Double v = byDate.get(d);
      if (v == null) {
        continue; // not a step of this cube (e.g. 29 February on a noleap calendar)
      }
      expected++;
      if (!Double.isNaN(v)) {
        sum += v;
        have++;
      }
    }
    if (expected == 0 || (total ? have < expected : have * 2 < expected)) {
      return Double.NaN;
    }
    return total ? sum * days / expected : sum / have;
  }
}
