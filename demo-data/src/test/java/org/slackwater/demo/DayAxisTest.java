package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import ucar.nc2.time.Calendar;
import ucar.nc2.time.CalendarDateUnit;

/** Time encodings checked against NetCDF-Java's own calendar arithmetic (CF 4.4.1 calendars). */
class DayAxisTest {

  @Test
  void noleapCountsDecodeToTheSameDatesInNetcdfJava() {
    DayAxis axis = new DayAxis(2006, 2025);
    CalendarDateUnit noleap = CalendarDateUnit.withCalendar(Calendar.noleap, "days since 2006-01-01");
    for (int d : axis.noleapDays()) {
      String iso = noleap.makeCalendarDate((double) axis.noleapDaysSinceReference(d)).toString().substring(0, 10);
      assertEquals(axis.date(d), LocalDate.parse(iso));
    }
    assertEquals(20 * 365, axis.noleapDays().length);
  }

  @Test
  void standardCountsDecodeInNetcdfJava() {
    DayAxis axis = new DayAxis(2012, 2013);
    CalendarDateUnit std = CalendarDateUnit.withCalendar(Calendar.gregorian, TimeEncoding.STANDARD_DAYS.units());
    CalendarDateUnit hours = CalendarDateUnit.withCalendar(Calendar.gregorian, TimeEncoding.NOON_HOURS.units());
    for (int d = 0; d < axis.size(); d++) {
      assertEquals(axis.date(d).toString(),
          std.makeCalendarDate(TimeEncoding.STANDARD_DAYS.value(axis, d)).toString().substring(0, 10));
      String noon = hours.makeCalendarDate(TimeEncoding.NOON_HOURS.value(axis, d)).toString();
      assertEquals(axis.date(d) + "T12:00", noon.substring(0, 16));
    }
    assertEquals(366 + 365, axis.size());
  }
}
