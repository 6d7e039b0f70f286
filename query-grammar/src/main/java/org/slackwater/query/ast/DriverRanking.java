package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * {@code rank drivers of <series> among <driver>, ... over <region> <period> by <step> [lags ...]
 * [using <method>] [against <baseline>] [with coverage ...]}: the candidate drivers ordered by
 * the strength of their lagged correlation with {@code series}. All series are anomalies from
 * the baseline climatology (the statement's period when no baseline is given). Each series is
 * taken over its own region ({@code within}) or else over {@code region}.
 *
 * @throws IllegalArgumentException if there is no driver, a driver is listed twice (the same
 *     statistic, variable and region once placed in {@code region}), or the series being
 *     explained is among the drivers
 */
public record DriverRanking(
        SeriesTerm series,
        List<SeriesTerm> drivers,
        RegionRef region,
        Period period,
        Step step,
        Optional<LagRange> lags,
        CorrelationMethod method,
        Optional<Period> baseline,
        Optional<GapAllowance> gaps,
        Optional<Coverage> coverage,
        Position position)
        implements Statement {

    public DriverRanking {
        Objects.requireNonNull(series, "series");
        drivers = List.copyOf(drivers);
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(step, "step");
        Objects.requireNonNull(lags, "lags");
        Objects.requireNonNull(method, "method");
        Objects.requireNonNull(baseline, "baseline");
        Objects.requireNonNull(gaps, "gaps");
        Objects.requireNonNull(coverage, "coverage");
        Objects.requireNonNull(position, "position");
        if (drivers.isEmpty()) {
            throw new IllegalArgumentException("a driver ranking needs at least one driver");
        }
        SeriesTerms.requireDistinct(drivers, region, "driver");
        for (SeriesTerm driver : drivers) {
            if (driver.sameSeries(series, region)) {
                throw new IllegalArgumentException("the series being explained is among its drivers: "
                        + series.variable().name());
            }
        }
    }

    /** Without a missing-days allowance (the defaults of the statistic apply). */
    public DriverRanking(SeriesTerm series, List<SeriesTerm> drivers, RegionRef region, Period period, Step step, Optional<LagRange> lags, CorrelationMethod method, Optional<Period> baseline, Optional<Coverage> coverage, Position position) {
        this(series, drivers, region, period, step, lags, method, baseline, Optional.empty(), coverage, position);
    }
}
