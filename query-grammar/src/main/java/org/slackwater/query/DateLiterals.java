package org.slackwater.query;

import java.time.Month;
import java.time.YearMonth;
import java.time.format.TextStyle;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.PartialDate;

/**
 * Reads the ISO 8601 calendar dates of the language, complete or reduced: {@code YYYY},
 * {@code YYYY-MM}, {@code YYYY-MM-DD} (extended format, four-digit years, proleptic Gregorian
 * calendar). Anything else fails with the date's position and what is wrong with it.
 */
final class DateLiterals {

    private static final Pattern FORM = Pattern.compile("(\\d{4})(?:-(\\d{2})(?:-(\\d{2}))?)?");

    private DateLiterals() {}

    static PartialDate read(Token token, String source) {
        String text = token.getText();
        Matcher m = FORM.matcher(text);
        if (!m.matches()) {
            throw error(token, source, "invalid date '" + text + "': write dates as YYYY, YYYY-MM or YYYY-MM-DD",
                    "for example 2014, 2014-07 or 2014-07-15");
        }
        int year = Integer.parseInt(m.group(1));
        int month = m.group(2) == null ? 0 : Integer.parseInt(m.group(2));
        int day = m.group(3) == null ? 0 : Integer.parseInt(m.group(3));
        if (m.group(2) != null && (month < 1 || month > 12)) {
            throw error(token, source, "invalid date '" + text + "': the month must be 01 to 12", "");
        }
        if (m.group(3) != null) {
            int length = YearMonth.of(year, month).lengthOfMonth();
            if (day < 1 || day > length) {
                String monthName = Month.of(month).getDisplayName(TextStyle.FULL, Locale.ENGLISH);
                throw error(token, source, String.format(
                        "invalid date '%s': the day must be 01 to %02d in %s %04d", text, length, monthName, year), "");
            }
        }
        return new PartialDate(year, month, day, Literals.position(token));
    }

    private static QueryException error(Token token, String source, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, source, hint);
    }
}
