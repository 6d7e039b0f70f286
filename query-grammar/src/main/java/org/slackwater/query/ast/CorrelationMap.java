package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code map correlation of <values> over <region> with <driver> over <driverRegion> <period>
 * by <step> [lags ... | at lag ...] [using <method>] [deseasonalized]}: in each cell of
 * {@code region}, the correlation of that cell's series with the one area series of the driver
 * over {@code driverRegion}, at every lag of {@code lags}. The lags are those of
 * {@link Correlation}: a positive lag means the driver leads; no lag clause means lag 0 only.
 *
 * @throws IllegalArgumentException if either series has a region of its own: the map's regions
 *     are {@code region} and {@code driverRegion}
 */
public record CorrelationMap(
        SeriesTerm values,
        RegionRef region,
        SeriesTerm driver,
        RegionRef driverRegion,
        Period period,
        Step step,
        Optional<LagRange> lags,
        CorrelationMethod method,
        Optional<Deseasonalized> deseasonalized,
        Position position)
        implements MapStatement {

    public CorrelationMap {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(driver, "driver");
        Objects.requireNonNull(driverRegion, "driverRegion");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(step, "step");
        Objects.requireNonNull(lags, "lags");
        Objects.requireNonNull(method, "method");
        Objects.requireNonNull(deseasonalized, "deseasonalized");
        Objects.requireNonNull(position, "position");
        SeriesTerms.requireNoRegion(values, "series");
        SeriesTerms.requireNoRegion(driver, "driver");
    }
}
