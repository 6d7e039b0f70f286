package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * A time series of one statistic of a variable over a region: for each step of the period,
 * the statistic of the area-weighted values in the region, optionally converted to a unit,
 * compared with a baseline, and kept only where enough of the region had data.
 */
public record AreaSeries(
        Statistic statistic,
        Identifier variable,
        RegionRef region,
        Period period,
        Step step,
        Optional<UnitRef> unit,
        Optional<Comparison> comparison,
        Optional<GapAllowance> gaps,
        Optional<Coverage> coverage,
        Position position)
        implements Statement {

    public AreaSeries {
        Objects.requireNonNull(statistic, "statistic");
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(step, "step");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(comparison, "comparison");
        Objects.requireNonNull(gaps, "gaps");
        Objects.requireNonNull(coverage, "coverage");
        Objects.requireNonNull(position, "position");
    }

    /** Without a missing-days allowance (the defaults of the statistic apply). */
    public AreaSeries(Statistic statistic, Identifier variable, RegionRef region, Period period, Step step, Optional<UnitRef> unit, Optional<Comparison> comparison, Optional<Coverage> coverage, Position position) {
        this(statistic, variable, region, period, step, unit, comparison, Optional.empty(), coverage, position);
    }
}
