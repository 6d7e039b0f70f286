package org.slackwater.query.ast;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.Objects;

/**
 * An ISO 8601 calendar date, complete ({@code 2014-07-15}) or reduced to a month
 * ({@code 2014-07}) or a year ({@code 2014}); month and day are 0 when absent. A reduced date
 * stands for the whole month or year: {@link #first()} and {@link #last()} are its first and
 * last day in the proleptic Gregorian calendar.
 *
 * @throws IllegalArgumentException if the year is outside 0..9999, the month outside 0..12,
 *     a day is given without a month, or the day does not exist in that month
 */
public record PartialDate(int year, int month, int day, Position position) implements Node {

    public PartialDate {
        Objects.requireNonNull(position, "position");
        if (year < 0 || year > 9999) {
            throw new IllegalArgumentException("year outside 0000..9999: " + year);
        }
        if (month < 0 || month > 12) {
            throw new IllegalArgumentException("month outside 1..12: " + month);
        }
        if (day != 0) {
            if (month == 0) {
                throw new IllegalArgumentException("day without month");
            }
            if (day < 1 || day > YearMonth.of(year, month).lengthOfMonth()) {
                throw new IllegalArgumentException("no day " + day + " in " + YearMonth.of(year, month));
            }
        }
    }

    public static PartialDate ofYear(int year, Position position) {
        return new PartialDate(year, 0, 0, position);
    }

    public static PartialDate ofMonth(int year, int month, Position position) {
        return new PartialDate(year, month, 0, position);
    }

    public static PartialDate ofDay(int year, int month, int day, Position position) {
        return new PartialDate(year, month, day, position);
    }

    public boolean hasMonth() {
        return month != 0;
    }

    public boolean hasDay() {
        return day != 0;
    }

    /** The first day this date stands for. */
    public LocalDate first() {
        return LocalDate.of(year, hasMonth() ? month : 1, hasDay() ? day : 1);
    }

    /** The last day this date stands for: the day itself, the month's last day or 31 December. */
    public LocalDate last() {
        if (hasDay()) {
            return LocalDate.of(year, month, day);
        }
        if (hasMonth()) {
            return YearMonth.of(year, month).atEndOfMonth();
        }
        return LocalDate.of(year, 12, 31);
    }

    /** The date as written in ISO 8601: {@code 2014}, {@code 2014-07} or {@code 2014-07-15}. */
    public String text() {
        StringBuilder text = new StringBuilder(String.format("%04d", year));
        if (hasMonth()) {
            text.append(String.format("-%02d", month));
        }
        if (hasDay()) {
            text.append(String.format("-%02d", day));
        }
        return text.toString();
    }
}
