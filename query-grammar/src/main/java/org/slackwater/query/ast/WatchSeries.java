package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * The series a watch condition looks at: {@code [statistic] <variable> [over <region>]
 * [over <window>]}. The statistic (mean when none is written) is taken over the region (the
 * watch's region when empty) and, with a window, over the last {@code window} days or weeks as
 * well, so {@code sum runoff over 30 days} is the 30-day accumulation.
 */
public record WatchSeries(Statistic statistic, Identifier variable, Optional<RegionRef> region,
        Optional<Duration> window, Position position) implements Node {

    public WatchSeries {
        Objects.requireNonNull(statistic, "statistic");
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(window, "window");
        Objects.requireNonNull(position, "position");
    }
}
