package org.slackwater.query.ast;

import java.util.Objects;

/** {@code region clipped to clip}: the intersection of two regions. */
public record ClippedRegion(RegionRef region, RegionRef clip, Position position) implements RegionRef {

    public ClippedRegion {
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(clip, "clip");
        Objects.requireNonNull(position, "position");
    }
}
