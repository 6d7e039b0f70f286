package org.slackwater.core.time;

import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The {@code units} attribute of a CF time coordinate, {@code <unit> since <reference>} (CF
 * 4.4.1), e.g. {@code days since 2006-01-01 00:00:00 -6:00}.
 *
 * <p>Accepted units are the udunits spellings of second, minute, hour and day (a day is exactly
 * 86,400 s, CF 4.4.1), case-insensitive. The reference is {@code y-m-d} with an optional time
 * {@code H:M[:S[.fraction]]} (separated by a space or {@code T}) and, after the time, an optional
 * zone: {@code Z}, {@code UTC}, {@code GMT} or an offset {@code ±H}, {@code ±H:MM}, {@code ±HHMM}.
 * The offset is the local time's offset from UTC; it is subtracted to reach UTC (CF 4.4.1:
 * {@code 1989-12-31 18:00:00 -6} is 1990-01-01 00:00 UTC).
 *
 * <p>Failure modes: {@link #parse} throws {@link IllegalArgumentException} with a message that
 * quotes the text, names the problem and shows a correct form. {@code month} and {@code year} are
 * refused because udunits defines them as fractions of a tropical year, not calendar months or
 * years (CF 4.4.1). Whether the reference date exists in a calendar is checked when decoding.
 *
 * @param text the attribute as written (trimmed)
 * @param unit the time step unit
 * @param reference the reference label, in local time of the zone
 * @param zoneOffsetMinutes the zone's offset from UTC in minutes (0 if none given)
 */
public record CfTimeUnits(String text, Unit unit, CfDateTime reference, int zoneOffsetMinutes) {

  /** A time step unit and the spellings that name it. */
  public enum Unit {
    SECOND(1, "s", "sec", "secs", "second", "seconds"),
    MINUTE(60, "min", "mins", "minute", "minutes"),
    HOUR(3600, "h", "hr", "hrs", "hour", "hours"),
    DAY(86_400, "d", "day", "days");

    private final long seconds;
    private final Set<String> spellings;

    Unit(long seconds, String... spellings) {
      this.seconds = seconds;
      this.spellings = Set.of(spellings);
    }

    /** The length of the unit in SI seconds. */
    public long seconds() {
      return seconds;
    }

    static Unit of(String token) {
      String t = token.toLowerCase(Locale.ROOT);
      for (Unit u : values()) {
        if (u.spellings.contains(t)) {
          return u;
        }
      }
      return null;
    }
  }

  private static final Set<String> CALENDAR_UNITS = Set.of(
      "month", "months", "mon", "year", "years", "yr", "yrs", "a", "common_year", "common_years",
      "leap_year", "leap_years", "julian_year", "gregorian_year");
  private static final List<String> ACCEPTED = List.of(
      "s", "sec", "second(s)", "min", "minute(s)", "h", "hr", "hour(s)", "d", "day(s)");
  private static final Pattern UNITS = Pattern.compile("(\\S+)\\s+since\\s+(.+)", Pattern.CASE_INSENSITIVE);
  private static final Pattern REFERENCE = Pattern.compile(
      "(?<y>[+-]?\\d{1,9})-(?<mo>\\d{1,2})-(?<d>\\d{1,2})"
          + "(?:(?:[Tt]|\\s+)(?<h>\\d{1,2}):(?<mi>\\d{1,2})(?::(?<s>\\d{1,2})(?:\\.(?<f>\\d+))?)?)?"
          + "(?:(?<zs>\\s*)(?<z>[Zz]|(?i:utc|gmt)|[+-]\\d{1,2}(?::\\d{2}|\\d{2})?))?");
  private static final String EXAMPLE = "write e.g. 'days since 2000-01-01 00:00:00' (CF section 4.4.1)";

  public CfTimeUnits {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(reference, "reference");
    if (Math.abs(zoneOffsetMinutes) > 24 * 60) {
      throw new IllegalArgumentException("zone offset of " + zoneOffsetMinutes + " minutes is more than a day");
    }
  }

  /**
   * Parses a time units attribute.
   *
   * @throws IllegalArgumentException if it is not {@code <unit> since <reference>} with an
   *     accepted unit and a well-formed reference
   */
  public static CfTimeUnits parse(String units) {
    if (units == null || units.isBlank()) {
      throw new IllegalArgumentException("time units are missing; " + EXAMPLE);
    }
    String text = units.trim();
    Matcher m = UNITS.matcher(text);
    if (!m.matches()) {
      throw new IllegalArgumentException("time units '" + text + "' lack the form '<unit> since <reference date>'; " + EXAMPLE);
    }
    String token = m.group(1);
    Unit unit = Unit.of(token);
    if (unit == null) {
      if (CALENDAR_UNITS.contains(token.toLowerCase(Locale.ROOT))) {
        throw new IllegalArgumentException("time units '" + text + "' use '" + token
            + "', which is not a calendar unit: udunits defines month and year as fixed fractions of a tropical year"
            + " (CF section 4.4.1); store the times in days (or hours, minutes, seconds) since a reference date");
      }
      throw new IllegalArgumentException("time units '" + text + "' use '" + token + "', which is not a time unit; use one of "
          + String.join(", ", ACCEPTED) + "; " + EXAMPLE);
    }
    String reference = m.group(2).trim();
    Matcher r = REFERENCE.matcher(reference);
    // A zone straight after a bare date ("2000-01-01-6") is unreadable; it needs a space or a time.
    if (!r.matches() || (r.group("h") == null && r.group("z") != null && r.group("zs").isEmpty())) {
      throw new IllegalArgumentException("time units '" + text + "': reference '" + reference
          + "' is not 'y-m-d [H:M[:S[.fraction]] [zone]]'; " + EXAMPLE);
    }
    return new CfTimeUnits(text, unit, reference(text, reference, r), zoneMinutes(text, r.group("z")));
  }

  private static CfDateTime reference(String text, String reference, Matcher r) {
    int second = r.group("s") == null ? 0 : Integer.parseInt(r.group("s"));
    int nano = r.group("f") == null ? 0 : Integer.parseInt((r.group("f") + "000000000").substring(0, 9));
    try {
      return new CfDateTime(
          Integer.parseInt(r.group("y")),
          Integer.parseInt(r.group("mo")),
          Integer.parseInt(r.group("d")),
          r.group("h") == null ? 0 : Integer.parseInt(r.group("h")),
          r.group("mi") == null ? 0 : Integer.parseInt(r.group("mi")),
          second,
          nano);
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException("time units '" + text + "': reference '" + reference + "': " + e.getMessage()
          + "; " + EXAMPLE, e);
    }
  }

  private static int zoneMinutes(String text, String z) {
    if (z == null || z.equalsIgnoreCase("z") || z.equalsIgnoreCase("utc") || z.equalsIgnoreCase("gmt")) {
      return 0;
    }
    int sign = z.charAt(0) == '-' ? -1 : 1;
    String digits = z.substring(1).replace(":", "");
    int hours = Integer.parseInt(digits.length() <= 2 ? digits : digits.substring(0, digits.length() - 2));
    int minutes = digits.length() <= 2 ? 0 : Integer.parseInt(digits.substring(digits.length() - 2));
    if (hours > 14 || minutes > 59 || (hours == 14 && minutes > 0)) {
      throw new IllegalArgumentException("time units '" + text + "': zone offset '" + z
          + "' is not within -14:00..+14:00; " + EXAMPLE);
    }
    return sign * (hours * 60 + minutes);
  }

  /** The reference instant as seconds after midnight of the reference day, in UTC (zone subtracted). */
  double referenceSecondOfDayUtc() {
    return reference.secondOfDay() - zoneOffsetMinutes * 60.0;
  }

  @Override
  public String toString() {
    return text;
  }
}
