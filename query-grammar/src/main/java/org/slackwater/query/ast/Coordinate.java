package org.slackwater.query.ast;

import java.util.Objects;

/**
 * A point in signed decimal degrees, north and east positive (ISO 6709). The longitude is kept
 * as written, in -180..360; {@link #normalizedLongitude()} maps it to [-180, 180).
 *
 * @throws IllegalArgumentException if the latitude is outside -90..90 or the longitude outside
 *     -180..360
 */
public record Coordinate(double latitude, double longitude, Position position) implements Node {

    public Coordinate {
        Objects.requireNonNull(position, "position");
        latitude += 0.0; // no negative zero, so that -0 and 0 are the same point
        longitude += 0.0;
        checkLatitude(latitude);
        checkLongitude(longitude);
    }

    /** The longitude in [-180, 180). */
    public double normalizedLongitude() {
        return normalizeLongitude(longitude);
    }

    static double normalizeLongitude(double longitude) {
        double lon = ((longitude + 180) % 360 + 360) % 360 - 180;
        return lon + 0.0; // no negative zero
    }

    static void checkLatitude(double latitude) {
        if (!(latitude >= -90 && latitude <= 90)) {
            throw new IllegalArgumentException("latitude outside -90..90: " + latitude);
        }
    }

    static void checkLongitude(double longitude) {
        if (!(longitude >= -180 && longitude <= 360)) {
            throw new IllegalArgumentException("longitude outside -180..360: " + longitude);
        }
    }
}
