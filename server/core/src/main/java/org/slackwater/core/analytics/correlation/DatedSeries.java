package org.slackwater.core.analytics.correlation;

import java.time.LocalDate;
import java.util.Objects;
import org.slackwater.core.analytics.StepSeries;
import org.slackwater.core.analytics.TemporalStep;

/**
 * Values at a {@link TemporalStep}, each dated by the first day of its period; NaN = missing.
 *
 * <p>The step is part of the series because it is the unit of a lag: lag k pairs a target
 * period with the driver period k steps earlier on the calendar (k days, weeks, months, seasons
 * or years). Dates need not be contiguous; a period that is absent counts like a NaN.
 *
 * <p>Fails with a {@link CorrelationInputException} ({@code BAD_DATES}) if the dates are not
 * strictly increasing or a date is not the first day of its period (a monthly series must be
 * dated 2014-07-01, not 2014-07-15; a weekly one on Mondays). Arrays are copied in and out.
 *
 * @param step the period length of the series
 * @param dates first day of each period, strictly increasing
 * @param values the value of each period; NaN where missing
 */
public record DatedSeries(TemporalStep step, LocalDate[] dates, double[] values) {
  public DatedSeries {
    Objects.requireNonNull(step, "step");
    Objects.requireNonNull(dates, "dates");
    Objects.requireNonNull(values, "values");
    if (dates.length != values.length) {
      throw new CorrelationInputException(CorrelationInputException.Kind.BAD_DATES,
          "a series has " + dates.length + " dates but " + values.length + " values; give one value per date");
    }
    dates = dates.clone();
    values = values.clone();
    for (int i = 0; i < dates.length; i++) {
      LocalDate d = Objects.requireNonNull(dates[i], "date");
      if (!step.start(d).equals(d)) {
        throw new CorrelationInputException(CorrelationInputException.Kind.BAD_DATES,
            "date " + d + " at position " + (i + 1) + " is not the first day of its " + StepOrdinal.noun(step)
                + "; a " + StepOrdinal.adjective(step) + " series is dated by the first day of each period ("
                + step.start(d) + ")");
      }
      if (i > 0 && !d.isAfter(dates[i - 1])) {
        throw new CorrelationInputException(CorrelationInputException.Kind.BAD_DATES,
            "dates are not strictly increasing: " + dates[i - 1] + " is followed by " + d + " at position "
                + (i + 1) + "; sort the series and merge duplicate dates");
      }
    }
  }

  /** The dates and values of a temporal aggregation, at its step. */
  public static DatedSeries of(StepSeries series) {
    return new DatedSeries(series.step(), series.start(), series.value());
  }

  @Override
  public LocalDate[] dates() {
    return dates.clone();
  }

  @Override
  public double[] values() {
    return values.clone();
  }

  public int size() {
    return dates.length;
  }

  public LocalDate date(int i) {
    return dates[i];
  }

  public double value(int i) {
    return values[i];
  }

  /** Same step and dates, new values. */
  DatedSeries withValues(double[] newValues) {
    return new DatedSeries(step, dates, newValues);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof DatedSeries s && s.step == step && java.util.Arrays.equals(s.dates, dates)
        && java.util.Arrays.equals(s.values, values);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * step.hashCode() + java.util.Arrays.hashCode(dates)) + java.util.Arrays.hashCode(values);
  }

  @Override
  public String toString() {
    return StepOrdinal.adjective(step) + " series of " + dates.length + " values"
        + (dates.length > 0 ? " from " + dates[0] + " to " + dates[dates.length - 1] : "");
  }
}
