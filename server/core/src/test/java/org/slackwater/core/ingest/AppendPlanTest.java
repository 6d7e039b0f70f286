package org.slackwater.core.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.slackwater.core.cube.TimeAxis;

/** How a file's steps combine with a cube's: the index arithmetic the appender relies on, and gap reporting. */
class AppendPlanTest {

  private static long day(String iso) {
    return LocalDate.parse(iso).toEpochDay() * 86_400L;
  }

  private static TimeAxis axis(TimeAxis.Alignment a, String... days) {
    long[] s = new long[days.length];
    for (int i = 0; i < days.length; i++) {
      s[i] = day(days[i]);
    }
    return new TimeAxis(a == TimeAxis.Alignment.EXACT ? "standard" : "noleap", "days since 2024-01-01", a, s);
  }

  private static TimeAxis daily(String first, int n) {
    LocalDate d = LocalDate.parse(first);
    return axis(TimeAxis.Alignment.EXACT, IntStream.range(0, n).mapToObj(i -> d.plusDays(i).toString()).toArray(String[]::new));
  }

  @Test
  void aFileFillingAGapAndReDeliveringItsNeighboursSitsAsOneBlock() throws Exception {
    // Cube: 1, 2, 3, 6, 7 January; file: 3 (held), 4, 5 (new), 6 (held).
    TimeAxis cube = axis(TimeAxis.Alignment.EXACT, "2024-01-01", "2024-01-02", "2024-01-03", "2024-01-06", "2024-01-07");
    TimeAxis file = daily("2024-01-03", 4);
    AppendPlan p = AppendPlan.of(cube, file, false, "temp", "file f");
    assertEquals(7, p.combinedSize());
    assertArrayEquals(daily("2024-01-01", 7).epochSeconds(), p.combinedAxis());
    assertEquals(2, p.shift());
    assertArrayEquals(new int[] {0, 3}, p.overlapFileSteps());
    assertArrayEquals(new int[] {2, 3}, p.overlapCubeSteps());
    // Combined 0,1 from cube 0,1; 2..5 from file 0..3; 6 from cube 4.
    assertEquals(List.of(false, false, true, true, true, true, false), IntStream.range(0, 7).mapToObj(p::fromFile).toList());
    assertEquals(List.of(0, 1), List.of(p.cubeStep(0), p.cubeStep(1)));
    assertEquals(4, p.cubeStep(6));
    assertEquals(List.of(0, 3), List.of(p.fileStep(2), p.fileStep(5)));
    // Not reprocessed: the held steps keep their values, so the change is the two new days.
    assertEquals(List.of(3, 4), List.of(p.firstChanged(), p.lastChanged()));
    assertEquals(List.of(3, 4, 2), List.of(p.appended().get().firstIndex(), p.appended().get().lastIndex(), p.appended().get().count()));
    assertTrue(p.replaced().isEmpty());
    AppendPlan r = AppendPlan.of(cube, file, true, "temp", "file f");
    assertEquals(List.of(2, 5), List.of(r.firstChanged(), r.lastChanged()));
    // Replaced: combined 2 and 5, with the new days between them.
    assertEquals(List.of(2, 5, 2), List.of(r.replaced().get().firstIndex(), r.replaced().get().lastIndex(), r.replaced().get().count()));
  }

  @Test
  void aFileOfHeldStepsOnlyChangesNothingUnlessReprocessed() throws Exception {
    AppendPlan p = AppendPlan.of(daily("2024-01-01", 10), daily("2024-01-04", 3), false, "temp", "file f");
    assertTrue(p.changesNothing());
    assertEquals(-1, p.firstChanged());
    AppendPlan r = AppendPlan.of(daily("2024-01-01", 10), daily("2024-01-04", 3), true, "temp", "file f");
    assertEquals(0, r.shift());
    assertEquals(List.of(3, 5), List.of(r.firstChanged(), r.lastChanged()));
  }

  @Test
  void stepsAreMatchedByExactInstantSoNoonStepsInterleaveWithMidnightOnes() {
    TimeAxis noon = new TimeAxis("standard", "hours since 2024-01-01", TimeAxis.Alignment.EXACT,
        new long[] {day("2024-01-05") + 43_200, day("2024-01-06") + 43_200});
    IngestException e = assertThrows(IngestException.class, () -> AppendPlan.of(daily("2024-01-01", 10), noon, false, "temp", "file f"));
    assertTrue(e.getMessage().startsWith("file f: its time steps interleave with those of cube 'temp': the cube has 1 step(s)"
        + " (2024-01-06) between the file's first step 2024-01-05T12:00:00Z and its last 2024-01-06T12:00:00Z"), e.getMessage());
  }

  @Test
  void gapsAreSpacingsAboveOneAndAHalfUsualStepsOnARealCalendar() {
    // Monthly means (mid-month, 28-31 day spacings), March missing: about one step.
    TimeAxis monthly = axis(TimeAxis.Alignment.EXACT, "2024-01-16", "2024-02-15", "2024-04-16", "2024-05-16");
    List<StepGap> g = StepGaps.around(monthly.epochSeconds(), new boolean[] {false, false, true, true}, monthly.alignment());
    assertEquals(List.of(new StepGap(monthly.instant(1), monthly.instant(2), 1)), g);
    // The same spacing not touching a new step is not reported: only gaps next to new steps are.
    assertTrue(StepGaps.around(monthly.epochSeconds(), new boolean[] {false, false, false, true}, monthly.alignment()).isEmpty());
  }

  @Test
  void aModelCalendarsTwoDaySpacingIsNoGapButALongerOneIs() {
    // noleap placed on real dates: 28 February to 1 March 2024 is two real days (no 29 February in
    // the model calendar, CF 4.4.1), which is no gap; 1 to 5 March is.
    TimeAxis noleap = axis(TimeAxis.Alignment.SAME_LABEL, "2024-02-26", "2024-02-27", "2024-02-28", "2024-03-01", "2024-03-05");
    List<StepGap> g = StepGaps.around(noleap.epochSeconds(), new boolean[] {false, false, true, true, true}, noleap.alignment());
    assertEquals(List.of(new StepGap(noleap.instant(3), noleap.instant(4), 3)), g);
    TimeAxis real = axis(TimeAxis.Alignment.EXACT, "2024-02-26", "2024-02-27", "2024-02-28", "2024-03-01");
    assertEquals(1, StepGaps.around(real.epochSeconds(), new boolean[] {false, false, true, true}, real.alignment()).size());
  }
}
