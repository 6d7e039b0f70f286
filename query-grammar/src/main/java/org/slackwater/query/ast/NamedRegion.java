package org.slackwater.query.ast;

import java.util.Objects;

/** A region known to the server by name, e.g. {@code "Outer Bay"}; the name is kept as written. */
public record NamedRegion(String name, Position position) implements RegionRef {

    public NamedRegion {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(position, "position");
        if (name.isBlank()) {
            throw new IllegalArgumentException("region name is blank");
        }
    }
}
