package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code map <statistic> <variable> over <region> <period> [in <unit>]}: in each cell, the
 * statistic of the variable's values over the period.
 *
 * @throws IllegalArgumentException if the series has a region of its own: a map's is {@code region}
 */
public record StatisticMap(SeriesTerm values, RegionRef region, Period period, Optional<UnitRef> unit,
        Position position) implements MapStatement {

    public StatisticMap {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        SeriesTerms.requireNoRegion(values, "series");
    }
}
