package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code map <statistic> <variable> over <region> <period> minus <reference> [in <unit>]}: in
 * each cell, the statistic over the period minus the same statistic over the reference period.
 *
 * @throws IllegalArgumentException if the series has a region of its own: a map's is {@code region}
 */
public record DifferenceMap(SeriesTerm values, RegionRef region, Period period, Period reference,
        Optional<UnitRef> unit, Position position) implements MapStatement {

    public DifferenceMap {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(reference, "reference");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        SeriesTerms.requireNoRegion(values, "series");
    }
}
