package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code cells of <variable> over <region> <period> [in <unit>]}: every value of the variable in
 * every grid cell touching the region, step by step over the period, one row per cell and step.
 * The rows are the cube's own values (no statistic), so a modeler can take them into another tool;
 * a server streams them rather than holding them.
 */
public record CellExport(Identifier variable, RegionRef region, Period period, Optional<UnitRef> unit, Position position)
        implements Statement {

    public CellExport {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(period, "period");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
    }
}
