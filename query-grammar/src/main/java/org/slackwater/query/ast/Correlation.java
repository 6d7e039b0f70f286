package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code correlate <series> with <driver> over <region> <period> by <step> [lags ...]
 * [using <method>] [deseasonalized] [with coverage ...]}: the correlation of two area series at
 * each lag. A positive lag means the driver leads {@code series} (see {@link LagRange}); no
 * lag clause means lag 0 only. Each series is taken over its own region ({@code within}) or
 * else over {@code region}.
 */
public record Correlation(
        SeriesTerm series,
        SeriesTerm driver,
        RegionRef region,
        Period period,
        Step step,
        Optional<LagRange> lags,
        CorrelationMethod method,
        Optional<Deseasonalized> deseasonalized,
        Optional<GapAllowance> gaps,
        Optional<Coverage> coverage,
        Position position)
        implements Statement {

    public Correlation {
        Objects.requireNonNull(series, "series");
        Objects.requireNonNull(driver, "driver");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(step, "step");
        Objects.requireNonNull(lags, "lags");
        Objects.requireNonNull(method, "method");
        Objects.requireNonNull(deseasonalized, "deseasonalized");
        Objects.requireNonNull(gaps, "gaps");
        Objects.requireNonNull(coverage, "coverage");
        Objects.requireNonNull(position, "position");
    }

    /** Without a missing-days allowance (the defaults of the statistic apply). */
    public Correlation(SeriesTerm series, SeriesTerm driver, RegionRef region, Period period, Step step, Optional<LagRange> lags, CorrelationMethod method, Optional<Deseasonalized> deseasonalized, Optional<Coverage> coverage, Position position) {
        this(series, driver, region, period, step, lags, method, deseasonalized, Optional.empty(), coverage, position);
    }
}
