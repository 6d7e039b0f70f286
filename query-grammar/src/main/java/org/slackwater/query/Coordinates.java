package org.slackwater.query;

import java.util.Locale;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.Coordinate;
import org.slackwater.query.parser.SlackwaterParser.AngleContext;
import org.slackwater.query.parser.SlackwaterParser.CoordinateContext;

/**
 * Reads a latitude, longitude pair. Either both angles carry a hemisphere letter (N or S for
 * the latitude, E or W for the longitude, no sign; S and W are negative, as in ISO 6709) or
 * neither does, and then they are signed decimal degrees. The latitude always comes first.
 * Latitudes must lie in -90..90; longitudes in -180..180, or 0..360 without letters.
 */
final class Coordinates {

    private final String source;

    Coordinates(String source) {
        this.source = source;
    }

    Coordinate read(CoordinateContext ctx) {
        AngleContext lat = ctx.latitude().angle();
        AngleContext lon = ctx.longitude().angle();
        checkLetters(lat, "a latitude", "N or S", 'N', 'S');
        checkLetters(lon, "a longitude", "E or W", 'E', 'W');
        if ((lat.hemisphere() == null) != (lon.hemisphere() == null)) {
            AngleContext bare = lat.hemisphere() == null ? lat : lon;
            throw error(bare.getStart(), "give both coordinates a hemisphere letter, or neither",
                    "for example 44.10 N, 31.20 W or 44.10, -31.20");
        }
        double latitude = value(lat);
        double longitude = value(lon);
        boolean letters = lat.hemisphere() != null;
        if (!(Math.abs(latitude) <= 90)) {
            throw error(lat.getStart(), letters
                    ? "latitude must be at most 90 degrees N or S, found " + written(lat)
                    : "latitude must be between -90 and 90 degrees, found " + written(lat), "");
        }
        if (letters && !(Math.abs(longitude) <= 180)) {
            throw error(lon.getStart(), "longitude must be at most 180 degrees E or W, found " + written(lon), "");
        }
        if (!letters && !(longitude >= -180 && longitude <= 360)) {
            throw error(lon.getStart(),
                    "longitude must be between -180 and 180 degrees (or 0 and 360), found " + written(lon), "");
        }
        return new Coordinate(latitude, longitude, Literals.position(ctx.getStart()));
    }

    private void checkLetters(AngleContext angle, String what, String letters, char positive, char negative) {
        if (angle.hemisphere() == null) {
            return;
        }
        Token letter = angle.hemisphere().getStart();
        char c = letter.getText().toUpperCase(Locale.ROOT).charAt(0);
        if (c != positive && c != negative) {
            throw error(letter, what + " takes " + letters + ", found '" + letter.getText() + "'",
                    "write the latitude first, then the longitude, e.g. 44.10 N, 31.20 W");
        }
        if (angle.MINUS() != null) {
            throw error(angle.MINUS().getSymbol(), "write a sign or a hemisphere letter, not both",
                    "for example 31.20 W or -31.20");
        }
    }

    /** Signed degrees: the sign or the letter S/W makes it negative. */
    private static double value(AngleContext angle) {
        double magnitude = Literals.number(angle.NUMBER().getSymbol());
        boolean negative = angle.MINUS() != null
                || (angle.hemisphere() != null && "SW".contains(angle.hemisphere().getText().toUpperCase(Locale.ROOT)));
        return negative ? -magnitude : magnitude;
    }

    private static String written(AngleContext angle) {
        String text = (angle.MINUS() != null ? "-" : "") + angle.NUMBER().getText();
        return angle.hemisphere() == null ? text : text + " " + angle.hemisphere().getText().toUpperCase(Locale.ROOT);
    }

    private QueryException error(Token token, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, source, hint);
    }
}
