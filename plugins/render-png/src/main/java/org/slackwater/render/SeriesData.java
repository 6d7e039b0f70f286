package org.slackwater.render;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * One series result read for plotting. Times are UTC epoch milliseconds: each value covers the
 * step from {@code xLow} (its start date) to {@code xHigh} (the day after its end date; a daily
 * series has no end column and covers one day) and is drawn at the middle. The value column is
 * the first real-valued column that is not coverage bookkeeping (valid_fraction, cells) or the
 * baseline; its name says whether it is a comparison with a baseline (anomaly_, standardized_anomaly_,
 * percentile_rank_). Missing values are NaN.
 */
record SeriesData(ResultTable table, Column.Doubles valueColumn, Comparison comparison, LocalDate[] start, LocalDate[] end,
    double[] xLow, double[] xHigh, double[] xMid, double[] value, Optional<double[]> baselineMean, Optional<double[]> baselineSd,
    String baselineUnit, List<LocalDate> events) {

  /** What the value column holds. */
  enum Comparison {
    NONE("", 0), ANOMALY("anomaly_", 0), STANDARDIZED_ANOMALY("standardized_anomaly_", 0), PERCENTILE_RANK("percentile_rank_", 50);

    final String prefix;
    /** The value meaning "as usual": departures are drawn from it. */
    final double reference;

    Comparison(String prefix, double reference) {
      this.prefix = prefix;
      this.reference = reference;
    }

    static Comparison of(String name) {
      for (Comparison c : List.of(STANDARDIZED_ANOMALY, ANOMALY, PERCENTILE_RANK)) {
        if (name.startsWith(c.prefix)) {
          return c;
        }
      }
      return NONE;
    }
  }

  private static final Set<String> BOOKKEEPING = Set.of("valid_fraction", "cells");
  private static final long DAY_MS = 86_400_000L;

  static SeriesData of(ResultTable t) {
    LocalDate[] start = Tables.dates(t, "time");
    LocalDate[] end = Tables.find(t, "end").isPresent() ? Tables.dates(t, "end") : start.clone();
    Column.Doubles v = t.columns().stream()
        .filter(c -> c instanceof Column.Doubles && !BOOKKEEPING.contains(c.name()) && !c.name().startsWith("baseline_"))
        .map(c -> (Column.Doubles) c).findFirst()
        .orElseThrow(() -> new PlotException("the series '" + t.title() + "' has no value column; ask for format=json or csv"));
    int n = start.length;
    double[] lo = new double[n], hi = new double[n], mid = new double[n];
    for (int i = 0; i < n; i++) {
      if (start[i] == null) {
        throw new PlotException("row " + (i + 1) + " of the series '" + t.title() + "' has no date; ask for format=json or csv");
      }
      LocalDate e = end[i] == null ? start[i] : end[i];
      lo[i] = start[i].toEpochDay() * (double) DAY_MS;
      hi[i] = (e.toEpochDay() + 1) * (double) DAY_MS;
      mid[i] = (lo[i] + hi[i]) / 2;
    }
    Optional<double[]> mean = Tables.optionalNumbers(t, "baseline_mean");
    Optional<double[]> sd = Tables.optionalNumbers(t, "baseline_sd");
    if (mean.isEmpty() || sd.isEmpty()) {
      mean = Optional.empty();
      sd = Optional.empty();
    }
    return new SeriesData(t, v, Comparison.of(v.name()), start, end, lo, hi, mid, v.values().clone(), mean, sd,
        Tables.unit(t, "baseline_mean"), events(t));
  }

  /** Metadata {@code events}: comma-separated ISO 8601 dates to mark; none if absent. */
  static List<LocalDate> events(ResultTable t) {
    String s = t.metadata().get("events");
    List<LocalDate> out = new ArrayList<>();
    if (s == null || s.isBlank()) {
      return out;
    }
    for (String part : s.split(",")) {
      String d = part.trim();
      if (d.isEmpty()) {
        continue;
      }
      try {
        out.add(LocalDate.parse(d));
      } catch (DateTimeParseException e) {
        throw new PlotException("the metadata 'events' of the series '" + t.title() + "' holds '" + d
            + "', which is not an ISO 8601 date (yyyy-mm-dd); give the event dates as yyyy-mm-dd, separated by commas");
      }
    }
    return out;
  }

  /** The quantity compared with the baseline, e.g. "mean_chlorophyll" for "standardized_anomaly_mean_chlorophyll". */
  String baseName() {
    return valueColumn.name().substring(comparison.prefix.length());
  }

  /**
   * The period's own values in the baseline's unit, when the comparison can be undone:
   * baseline mean + anomaly, or baseline mean + standardized anomaly x baseline sd.
   */
  Optional<double[]> observed() {
    if (baselineMean.isEmpty() || (comparison != Comparison.ANOMALY && comparison != Comparison.STANDARDIZED_ANOMALY)) {
      return Optional.empty();
    }
    double[] m = baselineMean.get(), s = baselineSd.get(), out = new double[value.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = comparison == Comparison.ANOMALY ? m[i] + value[i] : m[i] + value[i] * s[i];
    }
    return Optional.of(out);
  }

  int size() {
    return value.length;
  }

  int missing() {
    int k = 0;
    for (double x : value) {
      k += Double.isNaN(x) ? 1 : 0;
    }
    return k;
  }

  LocalDate first() {
    return start[0];
  }

  LocalDate last() {
    int i = end.length - 1;
    return end[i] == null ? start[i] : end[i];
  }
}
