package org.slackwater.render;

import java.util.ArrayList;
import java.util.List;
import org.slackwater.core.result.ResultTable;

/**
 * Subtitle lines: what a plot shows (variable and unit), where (region), when (period) and
 * against what (baseline), from the result's metadata and data. The main title is the result's
 * own title, which the server already writes as "statistic variable over region, period".
 */
final class Titles {
  private Titles() {}

  static final String SEP = "  ·  ";

  static String series(SeriesData s) {
    ResultTable t = s.table();
    List<String> parts = new ArrayList<>();
    parts.add(Tables.label(s.valueColumn()) + unitNote(s.valueColumn().unit()));
    parts.add(Tables.meta(t, "region", "region not named"));
    String step = Tables.meta(t, "step", "step");
    int missing = s.missing();
    parts.add(s.first() + " to " + s.last() + ", " + s.size() + " " + plural(step, s.size())
        + (missing > 0 ? " (" + missing + " without a value)" : ""));
    String baseline = t.metadata().get("baseline");
    if (baseline != null) {
      parts.add("baseline " + baseline + Tables.meta(t, "climatology", "").transform(c -> c.isEmpty() ? "" : ", climatology " + c));
    }
    return String.join(SEP, parts);
  }

  static String correlation(ResultTable t) {
    List<String> parts = new ArrayList<>();
    parts.add("target " + Tables.meta(t, "target", "?"));
    parts.add("driver " + Tables.meta(t, "driver", "?"));
    parts.add(Tables.meta(t, "method", "pearson") + " r" + (Tables.meta(t, "deseasonalized", "no").startsWith("yes") ? " of deseasonalized anomalies" : ""));
    return String.join(SEP, parts);
  }

  static String significance(ResultTable t, double alpha) {
    return "significance: two-sided test of r = 0 at alpha " + alpha + ", effective sample size "
        + Tables.meta(t, "effective_sample_size", "as reported");
  }

  static String ranking(ResultTable t) {
    List<String> parts = new ArrayList<>();
    parts.add("target " + Tables.meta(t, "target", "?") + " over " + Tables.meta(t, "region", "?"));
    parts.add("lags " + Tables.meta(t, "lags", "?") + " " + Tables.meta(t, "lag_unit", ""));
    parts.add(Tables.meta(t, "method", "pearson") + " r, " + Tables.meta(t, "ranked_by", "ranked by |r|"));
    return String.join(SEP, parts);
  }

  static String window(ResultTable t) {
    return "window " + Tables.meta(t, "window", "?") + SEP + "baseline years " + Tables.meta(t, "baseline_years", "?");
  }

  static String map(ResultTable t, String valueLabel, int cells, int missing) {
    List<String> parts = new ArrayList<>();
    parts.add(valueLabel);
    if (t.metadata().containsKey("values")) {
      parts.add(Tables.meta(t, "values", "") + " vs " + Tables.meta(t, "driver", "?") + ", lag " + Tables.meta(t, "lag", "0"));
    } else {
      parts.add(Tables.meta(t, "region", "region not named"));
      parts.add(Tables.meta(t, "period", "period not given"));
    }
    String extra = t.metadata().containsKey("baseline_windows") ? "baseline " + t.metadata().get("baseline_windows")
        : t.metadata().containsKey("difference") ? t.metadata().get("difference") : "";
    if (!extra.isEmpty()) {
      parts.add(extra);
    }
    parts.add(cells + " cells" + (missing > 0 ? ", " + missing + " without a value" : ""));
    return String.join(SEP, parts);
  }

  private static String unitNote(String unit) {
    return unit.equals("1") ? " (dimensionless)" : "";
  }

  /** "p = 0.045", or "p < 0.001" below that (the usual reporting convention, common practice). */
  static String pValue(double p) {
    return p < 0.001 ? "p < 0.001" : String.format(java.util.Locale.ROOT, "p = %.3f", p);
  }

  /** "3 weeks", "1 week", "0 days"; the bare number when there is no unit. */
  static String count(long n, String unit) {
    return unit.isEmpty() ? Long.toString(n) : n + " " + plural(unit, n == 1 ? 1 : 2);
  }

  private static String plural(String step, int n) {
    return n == 1 ? step : step.endsWith("y") && !step.endsWith("ay") ? step.substring(0, step.length() - 1) + "ies" : step + "s";
  }
}
