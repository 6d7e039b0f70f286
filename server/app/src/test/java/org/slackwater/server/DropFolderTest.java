package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.slackwater.server.DropFolderFiles.assertSameDays;
import static org.slackwater.server.DropFolderFiles.days;
import static org.slackwater.server.DropFolderFiles.nc;
import static org.slackwater.server.DropFolderFiles.snapshot;
import static org.slackwater.server.DropFolderFiles.stored;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.IngestOptions;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.store.ChunkLayout;

/**
 * The drop folder end to end with ncgen-written CF-NetCDF files: what is taken when, where files
 * go, what the report and reason files say, and that a refused file changes nothing. All but the
 * first test poll by hand on a clock of their own, so they do not depend on timing.
 */
class DropFolderTest {
  private static final String FIRST = "wrenmouth_temp_20240101_20240110";
  private static final String NEXT = "wrenmouth_temp_20240111_20240115";
  private static final String V2 = "wrenmouth_temp_20240103_20240105_v2";
  private static final long SECOND = 1_000_000_000L;

  @TempDir Path tmp;
  private Path drop;
  private Workspace ws;
  private final AtomicLong clock = new AtomicLong();

  @BeforeEach
  void open() throws Exception {
    drop = Files.createDirectories(tmp.resolve("drop"));
    ws = Workspace.open(tmp.resolve("data"), 256L << 20, 16L << 20, new ChunkLayout(4, 2, 2));
  }

  @AfterEach
  void close() {
    ws.close();
  }

  private DropFolder manual() throws Exception {
    return new DropFolder(ws.ingestor(), drop, Duration.ofSeconds(2), clock::get);
  }

  private List<DropFolder.Outcome> pollAt(DropFolder d, double seconds) throws Exception {
    clock.set((long) (seconds * SECOND));
    return d.pollOnce();
  }

  /** Puts a reference file into the drop folder (or a subfolder), with a completion marker if asked. */
  private Path put(String name, String folder, boolean marker) throws Exception {
    Path target = drop.resolve(folder).resolve(name + ".nc");
    Files.copy(nc(name), target);
    if (marker) {
      Files.createFile(target.resolveSibling(name + ".nc.done"));
    }
    return target;
  }

  private static List<String> names(Path folder) throws Exception {
    try (Stream<Path> s = Files.list(folder)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  private static void await(Path file) throws Exception {
    long end = System.nanoTime() + 30 * SECOND;
    while (!Files.exists(file)) {
      if (System.nanoTime() > end) {
        throw new AssertionError(file + " did not appear within 30 s");
      }
      Thread.sleep(50);
    }
  }

  @Test
  void aFileCopiedInSlowlyIsTakenOnlyOnceCompleteAndTheNextDaysAreAppended() throws Exception {
    List<String> heard = new CopyOnWriteArrayList<>();
    ws.onIngest(r -> heard.add(r.summary()));
    byte[] bytes = Files.readAllBytes(nc(FIRST));
    Path target = drop.resolve(FIRST + ".nc");
    try (DropFolder d = DropFolder.start(ws.ingestor(), drop, Duration.ofMillis(100), Duration.ofSeconds(3))) {
      try (OutputStream out = Files.newOutputStream(target, StandardOpenOption.CREATE_NEW)) {
        out.write(bytes, 0, bytes.length / 2);
        out.flush();
        // A writer pausing mid-file, for less than the settle time: the half file must stay put.
        for (int i = 0; i < 8; i++) {
          Thread.sleep(100);
          assertTrue(Files.exists(target), "the half-written file was taken");
          assertEquals(List.of(), names(drop.resolve("done")));
          assertEquals(List.of(), names(drop.resolve("failed")));
        }
        out.write(bytes, bytes.length / 2, bytes.length - bytes.length / 2);
      }
      await(drop.resolve("done").resolve(FIRST + ".nc.report.txt"));
      await(drop.resolve("done").resolve(FIRST + ".nc"));
      assertFalse(Files.exists(target));
      assertSameDays(days(FIRST, "water_temp"), stored(ws, "water_temp"), 0f);

      // The next file the careful way: written as .part, renamed, then marked complete.
      Path part = drop.resolve(NEXT + ".nc.part");
      Files.copy(nc(NEXT), part);
      Files.move(part, drop.resolve(NEXT + ".nc"));
      Files.createFile(drop.resolve(NEXT + ".nc.done"));
      await(drop.resolve("done").resolve(NEXT + ".nc"));
    }
    String report = Files.readString(drop.resolve("done").resolve(NEXT + ".nc.report.txt"));
    assertTrue(report.startsWith("Slackwater ingested " + NEXT + ".nc at "), report);
    assertTrue(report.contains("\nSHA-256: " + org.slackwater.core.ingest.FileDigest.sha256(nc(NEXT)) + "\n"), report);
    assertTrue(report.endsWith("\ncube water_temp: appended 5 steps, 2024-01-11..2024-01-15 (version 1 -> 2, 15 steps)\n"), report);
    assertFalse(Files.exists(drop.resolve(NEXT + ".nc.done")), "the marker is removed with its file");
    Map<LocalDate, float[]> want = new TreeMap<>(days(FIRST, "water_temp"));
    want.putAll(days(NEXT, "water_temp"));
    assertSameDays(want, stored(ws, "water_temp"), 0f);
    assertEquals(List.of("cube water_temp: created with 10 steps, 2024-01-01..2024-01-10 (version new -> 1, 10 steps)",
        "cube water_temp: appended 5 steps, 2024-01-11..2024-01-15 (version 1 -> 2, 15 steps)"), heard);
  }

  @Test
  void anUnmarkedFileIsTakenWhenUnchangedOverTwoPollsTheSettleTimeApart() throws Exception {
    try (DropFolder d = manual()) {
      Path f = drop.resolve("notes.nc");
      Files.writeString(f, "abc");
      assertEquals(List.of(), pollAt(d, 0));
      Files.writeString(f, "def", StandardOpenOption.APPEND);
      assertEquals(List.of(), pollAt(d, 1.5), "it grew: seen anew");
      assertEquals(List.of(), pollAt(d, 3.0), "unchanged for 1.5 s only");
      List<DropFolder.Outcome> taken = pollAt(d, 3.5);
      assertEquals(1, taken.size());
      assertFalse(taken.get(0).ingested());
      String reason = Files.readString(drop.resolve("failed/notes.nc.reason.txt"));
      assertTrue(reason.startsWith("Slackwater could not ingest notes.nc (taken from the drop folder at "), reason);
      assertTrue(reason.contains(". Nothing was changed in the catalog.\n\nWhat is wrong:\n  file notes.nc is not in a format"
          + " Slackwater reads (readers: [netcdf]); CF-NetCDF files start with the bytes 'CDF' or '\\211HDF'\n\nTo try again,"), reason);
      assertEquals(List.of("notes.nc", "notes.nc.reason.txt"), names(drop.resolve("failed")));
    }
  }

  @Test
  void aRefusedFileGoesToFailedWithItsReasonAndTheCatalogIsUnchanged() throws Exception {
    ws.ingestor().ingest(nc(FIRST), IngestOptions.defaults());
    DropFolderFiles.Snapshot before = snapshot(ws);
    try (DropFolder d = manual()) {
      put("wrenmouth_temp_20240116_shifted_grid", "", true);
      List<DropFolder.Outcome> out = pollAt(d, 0);
      assertEquals(1, out.size());
      assertEquals(drop.resolve("failed/wrenmouth_temp_20240116_shifted_grid.nc"), out.get(0).movedTo());
    }
    String reason = Files.readString(drop.resolve("failed/wrenmouth_temp_20240116_shifted_grid.nc.reason.txt"));
    assertTrue(reason.contains("What is wrong:\n  file wrenmouth_temp_20240116_shifted_grid.nc, variable water_temp: its grid does not"
        + " match cube 'water_temp': column 0 spans longitudes -31.375..-31.125 in the cube but -31.625..-31.375 in the file."), reason);
    assertTrue(reason.contains("  - into reprocessed/, if it is a reprocessed version whose values replace steps the cube holds.\n"), reason);
    assertEquals(before, snapshot(ws));
    assertEquals(List.of("done", "failed", "reprocessed"), names(drop), "the file and its marker have left the folder");
  }

  @Test
  void aReprocessedFileIsRefusedAtTheTopAndReplacesItsDaysFromReprocessed() throws Exception {
    ws.ingestor().ingest(nc(FIRST), IngestOptions.defaults());
    try (DropFolder d = manual()) {
      put(V2, "", true);
      assertFalse(pollAt(d, 0).get(0).ingested());
      String reason = Files.readString(drop.resolve("failed/" + V2 + ".nc.reason.txt"));
      assertTrue(reason.contains("hold different values (2024-01-03, 2024-01-04, 2024-01-05;"), reason);
      assertTrue(reason.contains("(in the drop folder: put it in reprocessed/)"), reason);
      put(V2, "reprocessed", true);
      DropFolder.Outcome ok = pollAt(d, 1).get(0);
      assertTrue(ok.ingested());
      assertEquals(IngestReport.Change.REPROCESSED, ok.reports().get(0).change());
    }
    String report = Files.readString(drop.resolve("done/" + V2 + ".nc.report.txt"));
    assertTrue(report.contains(" as a reprocessed version (it was in reprocessed/).\n"), report);
    assertTrue(report.endsWith("cube water_temp: replaced 3 steps, 2024-01-03..2024-01-05 (version 1 -> 2, 10 steps)\n"), report);
    Map<LocalDate, float[]> want = new TreeMap<>(days(FIRST, "water_temp"));
    want.putAll(days(V2, "water_temp"));
    assertSameDays(want, stored(ws, "water_temp"), 0f);
  }

  @Test
  void theSameFileAgainIsAlreadyIngestedAndGetsAUniqueNameInDone() throws Exception {
    try (DropFolder d = manual()) {
      put(FIRST, "", true);
      assertTrue(pollAt(d, 0).get(0).ingested());
      put(FIRST, "", true);
      DropFolder.Outcome again = pollAt(d, 1).get(0);
      assertTrue(again.ingested());
      assertEquals(drop.resolve("done/" + FIRST + "-2.nc"), again.movedTo());
    }
    assertEquals(List.of(FIRST + "-2.nc", FIRST + "-2.nc.report.txt", FIRST + ".nc", FIRST + ".nc.report.txt"), names(drop.resolve("done")));
    String report = Files.readString(drop.resolve("done/" + FIRST + "-2.nc.report.txt"));
    assertTrue(report.contains("\ncube water_temp: unchanged (version 1): already ingested: version 1 of cube 'water_temp' came from "
        + FIRST + ".nc (the same SHA-256) at "), report);
    assertEquals(1, ws.catalog().cube("water_temp").orElseThrow().version());
  }

  @Test
  void hiddenPartialAndTemporaryFilesAndLoneMarkersAreLeftAlone() throws Exception {
    List<String> left = List.of(".hidden.nc", "incoming.nc.part", "incoming.tmp", "later.nc.done");
    for (String n : left.subList(0, 3)) {
      Files.copy(nc(FIRST), drop.resolve(n));
    }
    Files.createFile(drop.resolve("later.nc.done"));
    try (DropFolder d = manual()) {
      for (int s = 0; s <= 10; s += 5) {
        assertEquals(List.of(), pollAt(d, s));
      }
    }
    List<String> all = new java.util.ArrayList<>(left);
    all.addAll(List.of("done", "failed", "reprocessed"));
    assertEquals(all.stream().sorted().toList(), names(drop));
    assertTrue(ws.catalog().cubes().isEmpty());
  }

  @Test
  void filesLeftInTheFolderArePickedUpAfterARestartEvenIfAlreadyIngested() throws Exception {
    put(FIRST, "", false);
    try (DropFolder d = manual()) {
      assertEquals(List.of(), pollAt(d, 0));
    }
    // As if the server ingested NEXT and stopped before moving it.
    put(NEXT, "", false);
    ws.ingestor().ingest(drop.resolve(FIRST + ".nc"), IngestOptions.defaults());
    ws.ingestor().ingest(drop.resolve(NEXT + ".nc"), IngestOptions.defaults());
    clock.set(0);
    try (DropFolder d = manual()) {
      assertEquals(List.of(), pollAt(d, 100));
      List<DropFolder.Outcome> out = pollAt(d, 102);
      assertEquals(List.of(FIRST + ".nc", NEXT + ".nc"), out.stream().map(o -> o.file().getFileName().toString()).toList());
      assertTrue(out.stream().allMatch(o -> o.ingested() && !o.reports().get(0).changed()));
    }
    assertEquals(List.of("done", "failed", "reprocessed"), names(drop));
    assertEquals(2, ws.catalog().cube("water_temp").orElseThrow().version());
  }
}
