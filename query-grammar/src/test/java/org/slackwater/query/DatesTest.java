package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.YearMonth;
import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.PartialDate;
import org.slackwater.query.ast.Period;
import org.slackwater.query.ast.Position;

/**
 * Dates against the reference: java.time implements the ISO 8601 calendar (proleptic
 * Gregorian), so a YYYY-MM-DD the language accepts must be exactly a date LocalDate accepts,
 * and the last day of a reduced date must be YearMonth's last day.
 */
class DatesTest {

    @Test
    void acceptedDaysAreExactlyTheIsoCalendarDays() {
        // 1900 is not a leap year and 2000 is (Gregorian rule: every 4th year, except centuries
        // not divisible by 400; ISO 8601 adopts it). 2014 common, 2016 leap, 2100 not.
        for (int year : new int[] {1900, 2000, 2014, 2016, 2100}) {
            for (int month = 1; month <= 12; month++) {
                for (int day = 0; day <= 32; day++) {
                    String date = String.format("%04d-%02d-%02d", year, month, day);
                    boolean iso = isIsoDate(year, month, day);
                    String query = "mean chlorophyll over \"Outer Bay\" during " + date + " by day";
                    if (iso) {
                        Period p = ((AreaSeries) QueryParser.parse(query).statements().get(0)).period();
                        assertEquals(LocalDate.of(year, month, day), p.start(), date);
                        assertEquals(LocalDate.of(year, month, day), p.endInclusive(), date);
                    } else {
                        QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse(query), date);
                        assertEquals(42, e.column());
                    }
                }
            }
        }
    }

    @Test
    void februaryLengthFollowsTheGregorianLeapRule() {
        assertEquals(LocalDate.of(1900, 2, 28), PartialDate.ofMonth(1900, 2, Position.NONE).last());
        assertEquals(LocalDate.of(2000, 2, 29), PartialDate.ofMonth(2000, 2, Position.NONE).last());
        assertEquals(LocalDate.of(2016, 2, 29), PartialDate.ofMonth(2016, 2, Position.NONE).last());
    }

    @Test
    void reducedDatesCoverWholeMonthsAndYears() {
        for (int month = 1; month <= 12; month++) {
            PartialDate d = PartialDate.ofMonth(2014, month, Position.NONE);
            assertEquals(YearMonth.of(2014, month).atDay(1), d.first());
            assertEquals(YearMonth.of(2014, month).atEndOfMonth(), d.last());
        }
        assertEquals(LocalDate.of(2014, 1, 1), PartialDate.ofYear(2014, Position.NONE).first());
        assertEquals(LocalDate.of(2014, 12, 31), PartialDate.ofYear(2014, Position.NONE).last());
    }

    @Test
    void textIsTheIsoExtendedForm() {
        assertEquals("2014", PartialDate.ofYear(2014, Position.NONE).text());
        assertEquals("2014-07", PartialDate.ofMonth(2014, 7, Position.NONE).text());
        assertEquals("2014-07-05", PartialDate.ofDay(2014, 7, 5, Position.NONE).text());
        assertEquals("0999", PartialDate.ofYear(999, Position.NONE).text());
    }

    @Test
    void periodEndsOnTheLastDayOfItsEndDate() {
        Period p = ((AreaSeries) QueryParser.parse(
                "mean chlorophyll over \"Outer Bay\" from 2014-07-15 to 2014-08 by day").statements().get(0)).period();
        assertEquals(LocalDate.of(2014, 7, 15), p.start());
        assertEquals(LocalDate.of(2014, 8, 31), p.endInclusive());
        // A period inside a single reduced date is fine: it ends after it starts.
        Period q = ((AreaSeries) QueryParser.parse(
                "mean chlorophyll over \"Outer Bay\" from 2014-07-15 to 2014-07 by day").statements().get(0)).period();
        assertEquals(LocalDate.of(2014, 7, 31), q.endInclusive());
    }

    @Test
    void recordsRejectImpossibleDates() {
        assertThrows(IllegalArgumentException.class, () -> PartialDate.ofDay(2014, 2, 29, Position.NONE));
        assertThrows(IllegalArgumentException.class, () -> new PartialDate(2014, 0, 5, Position.NONE));
        assertThrows(IllegalArgumentException.class, () -> PartialDate.ofMonth(2014, 13, Position.NONE));
        assertThrows(IllegalArgumentException.class, () -> new Period(PartialDate.ofYear(2015, Position.NONE),
                PartialDate.ofYear(2014, Position.NONE), Position.NONE));
    }

    private static boolean isIsoDate(int year, int month, int day) {
        try {
            LocalDate.of(year, month, day);
            return true;
        } catch (DateTimeException e) {
            return false;
        }
    }
}
