package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code map <statistic> <variable> over <region> <period> [in <unit>] as <comparison>}: in each
 * cell, the statistic over the period compared with that cell's baseline climatology for the
 * same time of year (anomaly, standardized anomaly or percentile rank).
 *
 * @throws IllegalArgumentException if the series has a region of its own: a map's is {@code region}
 */
public record ComparisonMap(SeriesTerm values, RegionRef region, Period period, Optional<UnitRef> unit,
        Comparison comparison, Position position) implements MapStatement {

    public ComparisonMap {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(comparison, "comparison");
        Objects.requireNonNull(position, "position");
        SeriesTerms.requireNoRegion(values, "series");
    }
}
