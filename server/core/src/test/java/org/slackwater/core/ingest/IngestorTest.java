package org.slackwater.core.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.core.store.CubeStore;

class IngestorTest {
  @TempDir Path dir;

  private Workspace open() throws Exception {
    return Workspace.open(dir.resolve("store"), 256L << 20, 64L << 20, new ChunkLayout(100, 4, 3));
  }

  @Test
  void ingestWritesChunksThatReadBackExactly() throws Exception {
    Path f = FakeSource.write(dir.resolve("temp.fake"), "temp", 9, 7, 250, 0);
    try (Workspace ws = open()) {
      List<IngestReport> r = ws.ingestor().ingest(f, Optional.empty());
      assertEquals(1, r.size());
      assertEquals(9L * 7 * 250, r.get(0).values());
      CubeEntry c = ws.catalog().cube("temp").orElseThrow();
      assertEquals(1, c.version());
      // 3 time chunks x 3 row tiles x 3 column tiles.
      assertEquals(27, c.chunks().size());
      for (ChunkRecord ch : c.chunks()) {
        float[] v = new float[ch.key().values()];
        ws.store().read("temp", 1, ch, v);
        int i = 0;
        for (int t = 0; t < ch.key().nt(); t++) {
          for (int y = 0; y < ch.key().ny(); y++) {
            for (int x = 0; x < ch.key().nx(); x++) {
              assertEquals(FakeSource.value(ch.key().t0() + t, ch.key().y0() + y, ch.key().x0() + x), v[i++], 0f);
            }
          }
        }
      }
      assertEquals("temp.fake", c.provenance().sourceFile());
      assertEquals(FileDigest.sha256(f), c.provenance().sourceSha256());
    }
  }

  @Test
  void aFailedIngestLeavesThePreviousVersionAndNoFiles() throws Exception {
    Path good = FakeSource.write(dir.resolve("temp.fake"), "temp", 9, 7, 250, 0);
    Path bad = FakeSource.write(dir.resolve("temp-bad.fake"), "temp", 9, 7, 250, 4);
    try (Workspace ws = open()) {
      ws.ingestor().ingest(good, Optional.empty());
      CubeEntry before = ws.catalog().cube("temp").orElseThrow();
      IngestException e = assertThrows(IngestException.class, () -> ws.ingestor().ingest(bad, Optional.empty()));
      assertEquals("file temp-bad.fake, variable temp: the file is truncated", e.getMessage());
      assertEquals(before, ws.catalog().cube("temp").orElseThrow());
      try (Stream<Path> s = Files.list(dir.resolve("store/cubes/temp"))) {
        assertEquals(List.of("v1"), s.map(p -> p.getFileName().toString()).toList());
      }
    }
  }

  @Test
  void theSameFileTwiceIsANoOpAndReplacingTheCubeRetiresVersionOne() throws Exception {
    Path f = FakeSource.write(dir.resolve("temp.fake"), "temp", 3, 3, 10, 0);
    try (Workspace ws = open()) {
      ws.ingestor().ingest(f, Optional.empty());
      IngestReport again = ws.ingestor().ingest(f, Optional.empty()).get(0);
      assertEquals(IngestReport.Change.UNCHANGED, again.change());
      assertTrue(again.note().startsWith("already ingested: version 1 of cube 'temp' came from temp.fake"), again.note());
      assertEquals(1, ws.catalog().cube("temp").orElseThrow().version());
      // The same bytes under another name, as a whole-cube replacement: version 2; version 1 is
      // retired, kept while queries may still read it (the workspace's grace period).
      Path copy = Files.copy(f, dir.resolve("temp-copy.fake"));
      IngestReport replaced = ws.ingestor().ingest(copy, IngestOptions.defaults().replacingCube()).get(0);
      assertEquals(IngestReport.Change.UNCHANGED, replaced.change(), "one file made the cube: replacing it with itself changes nothing");
      Files.writeString(copy, Files.readString(f).replace("FAKE temp 3 3 10 0", "FAKE temp 3 3 12 0"));
      replaced = ws.ingestor().ingest(copy, IngestOptions.defaults().replacingCube()).get(0);
      assertEquals(IngestReport.Change.REPLACED, replaced.change());
      assertEquals(2, ws.catalog().cube("temp").orElseThrow().version());
      assertTrue(Files.exists(dir.resolve("store/cubes/temp/v2")));
      assertEquals(java.util.Set.of("temp/v1"), ws.store().retiredVersions());
    }
    try (Workspace ws = open()) {
      assertFalse(Files.exists(dir.resolve("store/cubes/temp/v1")), "a retired version is removed at the next start");
      assertEquals(2, ws.catalog().cube("temp").orElseThrow().version());
    }
  }

  @Test
  void workspaceListenersHearOfNewCubesAfterTheCommitButNotOfNoOps() throws Exception {
    Path a = FakeSource.write(dir.resolve("a.fake"), "temp", 3, 3, 10, 0);
    Path b = FakeSource.write(dir.resolve("b.fake"), "salt", 3, 3, 10, 0);
    try (Workspace ws = open()) {
      List<String> heard = new java.util.concurrent.CopyOnWriteArrayList<>();
      Ingestor.Subscription broken = ws.onIngest(r -> {
        throw new IllegalStateException("a listener's own bug");
      });
      Ingestor.Subscription sub = ws.onIngest(r -> heard.add(r.cube() + " " + r.change() + " committed as v"
          + ws.catalog().cube(r.cube()).orElseThrow().version()));
      ws.ingestor().ingest(a, Optional.empty());
      ws.ingestor().ingest(a, Optional.empty());
      sub.close();
      broken.close();
      ws.ingestor().ingest(b, Optional.empty());
      assertEquals(List.of("temp CREATED committed as v1"), heard);
      assertTrue(ws.catalog().cube("salt").isPresent());
    }
  }

  @Test
  void leftoversOfACrashedIngestAreRemovedAtTheNextStart() throws Exception {
    Path f = FakeSource.write(dir.resolve("temp.fake"), "temp", 3, 3, 10, 0);
    try (Workspace ws = open()) {
      ws.ingestor().ingest(f, Optional.empty());
    }
    // As if a process died after writing a staging directory, and another after renaming but before the commit.
    Files.createDirectories(dir.resolve("store/cubes/temp/.staging-1234/x"));
    Files.createDirectories(dir.resolve("store/cubes/temp/v2"));
    try (Workspace ws = open()) {
      try (Stream<Path> s = Files.list(dir.resolve("store/cubes/temp"))) {
        assertEquals(List.of("v1"), s.map(p -> p.getFileName().toString()).toList());
      }
      assertEquals(1, ws.catalog().cube("temp").orElseThrow().version());
    }
  }

  @Test
  void unreadableInputsAreClearErrorsAndChangeNothing() throws Exception {
    Path text = Files.writeString(dir.resolve("notes.txt"), "not a cube");
    try (Workspace ws = open()) {
      IngestException e = assertThrows(IngestException.class, () -> ws.ingestor().ingest(text, Optional.empty()));
      assertTrue(e.getMessage().startsWith("file notes.txt is not in a format Slackwater reads (readers: [fake"), e.getMessage());
      IngestException missing = assertThrows(IngestException.class, () -> ws.ingestor().ingest(dir.resolve("nope.nc"), Optional.empty()));
      assertEquals("file nope.nc does not exist or is not a regular file", missing.getMessage());
      assertTrue(ws.catalog().cubes().isEmpty());
    }
  }

  @Test
  void aTileAsWideAsTheGridIsWrittenStraightFromTheBand() throws Exception {
    // 3 columns and a 3-column tile: each band is one chunk, read straight into a writer buffer.
    Path f = FakeSource.write(dir.resolve("temp.fake"), "temp", 10, 3, 230, 0);
    try (Workspace ws = open()) {
      ws.ingestor().ingest(f, Optional.empty());
      CubeEntry c = ws.catalog().cube("temp").orElseThrow();
      // 3 time chunks (100, 100, 30 steps) x 3 row tiles (4, 4, 2 rows), one column tile each.
      assertEquals(9, c.chunks().size());
      assertChunksHold(ws, c, false);
    }
  }

  @Test
  void theFootprintIsTheCellsThatEverHoldAValue() throws Exception {
    // Every 7th cell-step is missing everywhere, so water cells still have values; land cells none.
    Path f = FakeSource.writeWithLand(dir.resolve("temp.fake"), "temp", 9, 7, 250);
    try (Workspace ws = open()) {
      ws.ingestor().ingest(f, Optional.empty());
      CubeEntry c = ws.catalog().cube("temp").orElseThrow();
      for (int y = 0; y < 9; y++) {
        for (int x = 0; x < 7; x++) {
          assertEquals(!FakeSource.isLand(y, x), c.footprint().contains(y * 7 + x), "cell y=" + y + " x=" + x);
        }
      }
      assertChunksHold(ws, c, true);
    }
  }

  @Test
  void aChunkTheWriterCannotWriteFailsTheIngestAndLeavesNoFiles() throws Exception {
    try (Workspace ws = open()) {
      CubeStore.Staging staging = ws.store().stage("temp");
      Path staged;
      try (Stream<Path> s = Files.list(dir.resolve("store/cubes/temp"))) {
        staged = s.findFirst().orElseThrow();
      }
      try (staging; ChunkWriter writer = new ChunkWriter(staging, 8, "temp")) {
        writer.write(new ChunkKey(0, 0, 0, 2, 2, 2), writer.buffer());
        // 27 values do not fit the 8-value buffer: the writer thread fails, and finish says so.
        writer.write(new ChunkKey(2, 0, 0, 3, 3, 3), writer.buffer());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, writer::finish);
        assertTrue(e.getMessage().contains("needs 27 values, got 8"), e.getMessage());
      }
      assertFalse(Files.exists(staged), "the staging directory is deleted");
    }
  }

  /** Every chunk of version 1 holds the source's values (with land cells missing if {@code land}). */
  private static void assertChunksHold(Workspace ws, CubeEntry c, boolean land) throws Exception {
    for (ChunkRecord ch : c.chunks()) {
      float[] v = new float[ch.key().values()];
      ws.store().read(c.name(), c.version(), ch, v);
      int i = 0;
      for (int t = 0; t < ch.key().nt(); t++) {
        for (int y = 0; y < ch.key().ny(); y++) {
          for (int x = 0; x < ch.key().nx(); x++) {
            int gy = ch.key().y0() + y;
            int gx = ch.key().x0() + x;
            float want = land && FakeSource.isLand(gy, gx) ? Float.NaN : FakeSource.value(ch.key().t0() + t, gy, gx);
            assertEquals(want, v[i++], 0f, ch.file() + " t=" + t + " y=" + y + " x=" + x);
          }
        }
      }
    }
  }
}
