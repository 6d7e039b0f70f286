package org.slackwater.core.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.StepRange;
import org.slackwater.core.catalog.VersionRecord;
import org.slackwater.core.ingest.SpecSource.Spec;

/**
 * Cubes growing with daily files: appends, reprocessed replacements, refusals that change nothing,
 * gaps, and readers during appends. Expected values come from {@link SpecSource#value} of the seed
 * of the file that delivered each date; chunking is 4 steps x 2 rows x 3 columns, so a 7 x 5 grid
 * has 9 tiles and appends cross time-chunk boundaries.
 */
class CubeAppendTest {
  private static final LocalDate JAN1 = LocalDate.of(2024, 1, 1);

  @TempDir Path dir;
  private AppendFixture fx;
  private int files;

  @BeforeEach
  void open() throws Exception {
    fx = new AppendFixture(dir.resolve("store"), Duration.ofMinutes(10));
  }

  @AfterEach
  void close() {
    fx.close();
  }

  private Path file(Spec s) throws Exception {
    return s.write(dir.resolve("f" + (++files) + ".spec"));
  }

  private IngestReport ingest(Spec s) throws Exception {
    return ingest(s, IngestOptions.defaults());
  }

  private IngestReport ingest(Spec s, IngestOptions o) throws Exception {
    List<IngestReport> r = fx.ingestor.ingest(file(s), o);
    assertEquals(1, r.size());
    return r.get(0);
  }

  /** Checks every value of the current version against the seed each date was delivered with. */
  private void assertHolds(Map<LocalDate, Integer> seedByDate) throws Exception {
    CubeEntry c = fx.cube("temp");
    assertHolds(c, fx.values(c), seedByDate);
  }

  private static void assertHolds(CubeEntry c, float[][] v, Map<LocalDate, Integer> seedByDate) {
    List<LocalDate> dates = AppendFixture.dates(c);
    assertEquals(seedByDate.keySet().stream().sorted().toList(), dates, "steps of version " + c.version());
    int nx = c.descriptor().grid().nx();
    for (int t = 0; t < dates.size(); t++) {
      for (int cell = 0; cell < v[t].length; cell++) {
        float want = SpecSource.value(seedByDate.get(dates.get(t)), dates.get(t), cell / nx, cell % nx);
        assertEquals(want, v[t][cell], 0f, "v" + c.version() + " " + dates.get(t) + " cell " + cell);
      }
    }
  }

  private static Map<LocalDate, Integer> seeds(Map<LocalDate, Integer> into, LocalDate from, int days, int seed) {
    for (int i = 0; i < days; i++) {
      into.put(from.plusDays(i), seed);
    }
    return into;
  }

  private Path chunk(int version, String file) {
    return fx.store.versionDir("temp", version).resolve(file);
  }

  @Test
  void tenDaysThenAFiveDayContinuationMakeFifteenStepsAndReuseTheUntouchedChunks() throws Exception {
    IngestReport first = ingest(Spec.daily(JAN1, 10, 1));
    assertEquals(IngestReport.Change.CREATED, first.change());
    assertEquals(new StepRange(0, 9, 10, JAN1.atStartOfDay(java.time.ZoneOffset.UTC).toInstant(),
        JAN1.plusDays(9).atStartOfDay(java.time.ZoneOffset.UTC).toInstant()), first.appended().orElseThrow());

    IngestReport r = ingest(Spec.daily(JAN1.plusDays(10), 5, 2));
    assertEquals(IngestReport.Change.APPENDED, r.change());
    assertEquals(1, r.previousVersion());
    assertEquals(2, r.version());
    assertEquals(15, r.steps());
    StepRange a = r.appended().orElseThrow();
    assertEquals(List.of(10, 14, 5, LocalDate.of(2024, 1, 11), LocalDate.of(2024, 1, 15)),
        List.of(a.firstIndex(), a.lastIndex(), a.count(), a.firstDate(), a.lastDate()));
    assertTrue(r.replaced().isEmpty());
    assertTrue(r.gaps().isEmpty());
    assertEquals("cube temp: appended 5 steps, 2024-01-11..2024-01-15 (version 1 -> 2, 15 steps)", r.summary());
    assertHolds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.plusDays(10), 5, 2));

    // Time chunks of 4 steps: [0,4) and [4,8) are untouched and shared with version 1 (one file,
    // two names); [8,10) grew to [8,12), and [12,15) is new.
    CubeEntry c = fx.cube("temp");
    assertEquals(4 * 9, c.chunks().size());
    assertTrue(Files.isSameFile(chunk(1, "t000004_y0002_x0003.arrow"), chunk(2, "t000004_y0002_x0003.arrow")));
    assertFalse(Files.isSameFile(chunk(1, "t000008_y0002_x0003.arrow"), chunk(2, "t000008_y0002_x0003.arrow")));
    long shared = c.chunks().stream().filter(ch -> ch.key().t0() < 8).mapToLong(ch -> ch.bytes()).sum();
    assertEquals(c.bytes() - shared, r.bytesWritten(), "reused chunks are not written again");
    assertEquals(35, c.footprint().count(), "every cell holds a value on some day");
    // 5 new days x 35 cells from the file; the 2 kept days of the rewritten chunk come from the cube.
    assertEquals(5 * 35, r.values());

    List<VersionRecord> h = fx.catalog.history("temp");
    assertEquals(List.of(VersionRecord.Change.CREATED, VersionRecord.Change.APPENDED), h.stream().map(VersionRecord::change).toList());
    assertEquals(List.of("f1.spec", "f2.spec"), h.stream().map(x -> x.provenance().sourceFile()).toList());
    assertEquals(FileDigest.sha256(dir.resolve("f2.spec")), h.get(1).provenance().sourceSha256());
    assertEquals(r.appended(), h.get(1).appended());
    assertEquals(15, h.get(1).steps());
  }

  @Test
  void aReprocessedFileReplacesDaysThreeToFiveAndBumpsTheVersion() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    ingest(Spec.daily(JAN1.plusDays(10), 5, 2));
    AppendFixture.Snapshot before = fx.snapshot("temp");
    Spec days3to5 = Spec.daily(JAN1.plusDays(2), 3, 3);

    IngestException refused = assertThrows(IngestException.class, () -> ingest(days3to5));
    assertTrue(refused.getMessage().startsWith("file f3.spec, variable temp: 3 of the 3 step(s) it shares with cube 'temp' hold"
        + " different values (2024-01-03, 2024-01-04, 2024-01-05; first difference at 2024-01-03, row 0 column 0"), refused.getMessage());
    assertTrue(refused.getMessage().contains("ingest it with the 'reprocessed' option"), refused.getMessage());
    assertTrue(refused.getMessage().contains("slackwater_reprocessed = \"true\""), refused.getMessage());
    assertEquals(before, fx.snapshot("temp"), "a refused file changes neither the catalog nor the stored files");

    IngestReport r = ingest(days3to5, IngestOptions.defaults().asReprocessed());
    assertEquals(IngestReport.Change.REPROCESSED, r.change());
    assertEquals(List.of(2, 3), List.of(r.previousVersion(), r.version()));
    StepRange rep = r.replaced().orElseThrow();
    assertEquals(List.of(2, 4, 3, LocalDate.of(2024, 1, 3), LocalDate.of(2024, 1, 5)),
        List.of(rep.firstIndex(), rep.lastIndex(), rep.count(), rep.firstDate(), rep.lastDate()));
    assertTrue(r.appended().isEmpty());
    assertEquals("cube temp: replaced 3 steps, 2024-01-03..2024-01-05 (version 2 -> 3, 15 steps)", r.summary());
    assertHolds(seeds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.plusDays(10), 5, 2), JAN1.plusDays(2), 3, 3));
    // Steps 2..4 lie in time chunks [0,4) and [4,8); the later chunks are shared with version 2.
    assertTrue(Files.isSameFile(chunk(2, "t000008_y0000_x0000.arrow"), chunk(3, "t000008_y0000_x0000.arrow")));
    assertTrue(Files.isSameFile(chunk(2, "t000012_y0004_x0006.arrow"), chunk(3, "t000012_y0004_x0006.arrow")));
    assertFalse(Files.isSameFile(chunk(2, "t000004_y0000_x0000.arrow"), chunk(3, "t000004_y0000_x0000.arrow")));
    VersionRecord last = fx.catalog.history("temp").get(2);
    assertEquals(VersionRecord.Change.REPROCESSED, last.change());
    assertEquals(r.replaced(), last.replaced());
  }

  @Test
  void theFileCanDeclareItselfReprocessedAndABadDeclarationIsAnError() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    IngestException bad = assertThrows(IngestException.class,
        () -> ingest(Spec.daily(JAN1.plusDays(2), 3, 3).withAttribute(":slackwater_reprocessed", "yes")));
    assertEquals("file f2.spec, variable temp: the global attribute slackwater_reprocessed is 'yes'; write \"true\" (this file"
        + " replaces steps the cube holds) or \"false\"", bad.getMessage());
    IngestReport r = ingest(Spec.daily(JAN1.plusDays(2), 3, 3).withAttribute(":slackwater_reprocessed", "TRUE"));
    assertEquals(IngestReport.Change.REPROCESSED, r.change());
    assertHolds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.plusDays(2), 3, 3));
  }

  @Test
  void reDeliveredDaysWithTheSameValuesAreAcceptedAndOnlyTheNewDaysAppended() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    // A rolling product: days 8-12, of which 8-10 the cube holds with the same values.
    IngestReport r = ingest(Spec.daily(JAN1.plusDays(7), 5, 1));
    assertEquals(IngestReport.Change.APPENDED, r.change());
    assertEquals(List.of(10, 11, 2), List.of(r.appended().get().firstIndex(), r.appended().get().lastIndex(), r.appended().get().count()));
    assertTrue(r.replaced().isEmpty());
    assertHolds(seeds(new HashMap<>(), JAN1, 12, 1));
    // Days 9-12 again, another file but nothing new: unchanged, no version.
    IngestReport same = ingest(Spec.daily(JAN1.plusDays(8), 4, 1));
    assertEquals(IngestReport.Change.UNCHANGED, same.change());
    assertEquals(List.of(2, 2), List.of(same.previousVersion(), same.version()));
    assertEquals("cube temp: unchanged (version 2): its 4 step(s) are all in cube 'temp' already, with the same values", same.summary());
    assertEquals(2, fx.catalog.history("temp").size());
  }

  @Test
  void theSameFileTwiceIsANoOpThatChangesNothing() throws Exception {
    Path f = file(Spec.daily(JAN1, 10, 1));
    fx.ingestor.ingest(f, IngestOptions.defaults());
    List<IngestReport> heard = new CopyOnWriteArrayList<>();
    fx.ingestor.onIngest(heard::add);
    AppendFixture.Snapshot before = fx.snapshot("temp");
    for (IngestOptions o : List.of(IngestOptions.defaults(), IngestOptions.defaults().asReprocessed())) {
      IngestReport r = fx.ingestor.ingest(f, o).get(0);
      assertEquals(IngestReport.Change.UNCHANGED, r.change());
      assertFalse(r.changed());
      assertEquals(1, r.version());
      assertTrue(r.note().startsWith("already ingested: version 1 of cube 'temp' came from f1.spec (the same SHA-256) at "), r.note());
    }
    assertEquals(before, fx.snapshot("temp"));
    assertTrue(heard.isEmpty(), "listeners hear of changes only");
  }

  @Test
  void aGapIsAllowedAndReportedAndALaterFileFillsIt() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    IngestReport r = ingest(Spec.daily(JAN1.plusDays(12), 3, 2));
    assertEquals(IngestReport.Change.APPENDED, r.change());
    assertEquals(List.of(new StepGap(at(JAN1.plusDays(9)), at(JAN1.plusDays(12)), 2)), r.gaps());
    assertTrue(r.summary().endsWith("; gap: about 2 steps missing between 2024-01-10 and 2024-01-13"), r.summary());
    // Days 11-12 arrive late: they go between the cube's steps, which moves the later steps on.
    IngestReport fill = ingest(Spec.daily(JAN1.plusDays(10), 2, 3));
    assertEquals(IngestReport.Change.APPENDED, fill.change());
    assertEquals(List.of(10, 11, 2), List.of(fill.appended().get().firstIndex(), fill.appended().get().lastIndex(), fill.appended().get().count()));
    assertTrue(fill.gaps().isEmpty());
    assertHolds(seeds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.plusDays(12), 3, 2), JAN1.plusDays(10), 2, 3));
  }

  @Test
  void earlierDaysAreAddedBeforeTheCubesStart() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    IngestReport r = ingest(Spec.daily(JAN1.minusDays(3), 3, 2));
    assertEquals(List.of(0, 2, 3), List.of(r.appended().get().firstIndex(), r.appended().get().lastIndex(), r.appended().get().count()));
    assertHolds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.minusDays(3), 3, 2));
  }

  @Test
  void aFileWhoseStepsInterleaveWithTheCubesIsRefusedEvenWhenReprocessed() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    AppendFixture.Snapshot before = fx.snapshot("temp");
    // Every second day from 8 January: 8, 10, 12 spans the cube's 9 January without holding it.
    Spec everyOther = Spec.daily(JAN1.plusDays(7), 3, 2).withEvery(2);
    for (IngestOptions o : List.of(IngestOptions.defaults(), IngestOptions.defaults().asReprocessed())) {
      IngestException e = assertThrows(IngestException.class, () -> ingest(everyOther, o));
      assertTrue(e.getMessage().matches("file f\\d\\.spec, variable temp: its time steps interleave with those of cube 'temp': the cube"
          + " has 1 step\\(s\\) \\(2024-01-09\\) between the file's first step 2024-01-08 and its last 2024-01-12 that the file does"
          + " not hold\\. Nothing was changed\\. .*"), e.getMessage());
    }
    assertEquals(before, fx.snapshot("temp"));
  }

  @Test
  void anotherGridUnitOrCalendarIsAClearErrorAndChangesNothing() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    AppendFixture.Snapshot before = fx.snapshot("temp");
    Spec next = Spec.daily(JAN1.plusDays(10), 2, 2);
    Map<Spec, String> cases = Map.of(
        next.withWest(-31.95), "file f\\d\\.spec, variable temp: its grid does not match cube 'temp': column 0 spans longitudes"
            + " -32\\.\\.-31\\.9 in the cube but -31\\.95\\.\\.-31\\.85 in the file\\. Nothing was changed\\. Regrid the file .*",
        next.withUnits("K"), "file f\\d\\.spec, variable temp: its values are in 'K' \\(declared 'K'\\) but cube 'temp' holds 'degC',"
            + " which is not the same quantity\\. Nothing was changed\\. .*'replace cube' option.*",
        next.withCalendar("noleap"), "file f\\d\\.spec, variable temp: its time axis uses the calendar 'noleap' but cube 'temp' uses"
            + " 'standard'; steps of different calendars cannot share one axis\\. Nothing was changed\\. .*");
    for (Map.Entry<Spec, String> c : cases.entrySet()) {
      IngestException e = assertThrows(IngestException.class, () -> ingest(c.getKey()));
      assertTrue(e.getMessage().matches(c.getValue()), e.getMessage());
      assertEquals(before, fx.snapshot("temp"));
    }
  }

  @Test
  void listenersHearEachChangeAfterItsCommitAndAFailingListenerDoesNotFailTheIngest() throws Exception {
    List<String> heard = new CopyOnWriteArrayList<>();
    Ingestor.Subscription failing = fx.ingestor.onIngest(r -> {
      throw new IllegalStateException("listener bug");
    });
    Ingestor.Subscription sub = fx.ingestor.onIngest(r -> heard.add(r.change() + " v" + r.version()
        + " catalog v" + fx.cube(r.cube()).version() + " " + r.appended().map(StepRange::describe).orElse("-")));
    ingest(Spec.daily(JAN1, 10, 1));
    ingest(Spec.daily(JAN1.plusDays(10), 5, 2));
    failing.close();
    sub.close();
    ingest(Spec.daily(JAN1.plusDays(15), 1, 3));
    assertEquals(List.of("CREATED v1 catalog v1 10 steps, 2024-01-01..2024-01-10",
        "APPENDED v2 catalog v2 5 steps, 2024-01-11..2024-01-15"), heard);
    assertEquals(3, fx.cube("temp").version());
  }

  @Test
  void queriesReadingDuringAppendsSeeOneWholeVersionEachTime() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    Map<LocalDate, Integer> seedByDate = new ConcurrentHashMap<>(seeds(new HashMap<>(), JAN1, 10, 1));
    for (int f = 0; f < 8; f++) {
      seeds(seedByDate, JAN1.plusDays(10 + 2 * f), 2, 2 + f);
    }
    AtomicBoolean done = new AtomicBoolean();
    AtomicReference<Throwable> failure = new AtomicReference<>();
    List<Integer> versionsSeen = new CopyOnWriteArrayList<>();
    Thread reader = new Thread(() -> {
      try {
        while (!done.get()) {
          CubeEntry c = fx.cube("temp");
          float[][] v = fx.values(c);
          Map<LocalDate, Integer> expected = new HashMap<>();
          AppendFixture.dates(c).forEach(d -> expected.put(d, seedByDate.get(d)));
          assertHolds(c, v, expected);
          versionsSeen.add(c.version());
        }
      } catch (Throwable t) {
        failure.set(t);
      }
    });
    reader.start();
    for (int f = 0; f < 8; f++) {
      ingest(Spec.daily(JAN1.plusDays(10 + 2 * f), 2, 2 + f));
    }
    done.set(true);
    reader.join();
    if (failure.get() != null) {
      throw new AssertionError("a reader saw a mixture or failed", failure.get());
    }
    assertFalse(versionsSeen.isEmpty());
    assertHolds(seedByDate);
    assertEquals(9, fx.cube("temp").version());
  }

  @Test
  void appendsToOneCubeFromTwoThreadsTakeTurns() throws Exception {
    ingest(Spec.daily(JAN1, 10, 1));
    Path a = file(Spec.daily(JAN1.plusDays(10), 5, 2));
    Path b = file(Spec.daily(JAN1.plusDays(15), 5, 3));
    ExecutorService pool = Executors.newFixedThreadPool(2);
    try {
      List<Future<List<IngestReport>>> fs = new ArrayList<>();
      for (Path p : List.of(a, b)) {
        fs.add(pool.submit(() -> fx.ingestor.ingest(p, IngestOptions.defaults())));
      }
      for (Future<List<IngestReport>> f : fs) {
        assertTrue(f.get().get(0).changed());
      }
    } finally {
      pool.shutdown();
    }
    assertEquals(3, fx.cube("temp").version());
    assertHolds(seeds(seeds(seeds(new HashMap<>(), JAN1, 10, 1), JAN1.plusDays(10), 5, 2), JAN1.plusDays(15), 5, 3));
  }

  private static java.time.Instant at(LocalDate d) {
    return d.atStartOfDay(java.time.ZoneOffset.UTC).toInstant();
  }
}
