package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * A variable taken as a series in the statements beyond the area series: the statistic of
 * the variable's values (over an area, or over time in a map) at each step. When the text
 * names no statistic, it is {@code mean}, placed at the variable.
 *
 * <p>{@code region} is the series' own area ({@code sum rainfall within "Harle Watershed"});
 * when empty, the series is taken over the region of the statement's {@code over} clause (see
 * {@link #regionOr}). Maps take every region from {@code over}, so the series of a map never
 * has one.
 */
public record SeriesTerm(Statistic statistic, Identifier variable, Optional<RegionRef> region, Position position)
        implements Node {

    public SeriesTerm {
        Objects.requireNonNull(statistic, "statistic");
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(position, "position");
    }

    /** The region the series is taken over: its own, or else the statement's. */
    public RegionRef regionOr(RegionRef statementRegion) {
        Objects.requireNonNull(statementRegion, "statementRegion");
        return region.orElse(statementRegion);
    }

    /**
     * Whether the two terms name the same series once each is placed in the statement's region:
     * the same statistic, variable and region, positions aside. {@code rainfall} and
     * {@code rainfall within "Outer Bay"} are the same series in a statement over "Outer Bay".
     */
    public boolean sameSeries(SeriesTerm other, RegionRef statementRegion) {
        return AstPositions.erase(statistic).equals(AstPositions.erase(other.statistic))
                && variable.name().equals(other.variable.name())
                && AstPositions.erase(regionOr(statementRegion)).equals(AstPositions.erase(other.regionOr(statementRegion)));
    }
}
