package org.slackwater.query.ast;

import java.util.Objects;

/**
 * A polygon given as WKT text (longitude before latitude, as WKT has it). The text is only
 * checked to be non-blank here; the analyzer parses the geometry.
 */
public record WktRegion(String wkt, Position position) implements RegionRef {

    public WktRegion {
        Objects.requireNonNull(wkt, "wkt");
        Objects.requireNonNull(position, "position");
        if (wkt.isBlank()) {
            throw new IllegalArgumentException("WKT text is blank");
        }
    }
}
