package org.slackwater.core.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.store.ChunkLayout;

/** The version history: committed with its version, kept past removal, and created for catalogs older than it. */
class CatalogHistoryTest {
  @TempDir Path dir;

  private static final Instant T = Instant.parse("2024-01-01T00:00:00Z");

  private static CubeEntry entry(int version, int steps, String file) {
    long[] secs = new long[steps];
    for (int i = 0; i < steps; i++) {
      secs[i] = T.getEpochSecond() + i * 86_400L;
    }
    CubeDescriptor d = new CubeDescriptor("temp", "", "", "degC", "degC", LatLonGrid.regular(43.5, -32, 0.1, 0.1, 2, 2),
        new TimeAxis("standard", "days since 2024-01-01", TimeAxis.Alignment.EXACT, secs), Map.of());
    return new CubeEntry("temp", version, d, new ChunkLayout(4, 2, 2), List.of(), new Footprint(4, new java.util.BitSet()),
        new Provenance(file, "sha-" + file, "temp", "test", T));
  }

  private static VersionRecord record(CubeEntry e, int previous, VersionRecord.Change change) {
    int n = e.descriptor().time().size();
    return new VersionRecord("temp", e.version(), previous, change, e.provenance(), n,
        Optional.of(new StepRange(0, n - 1, n, e.descriptor().time().instant(0), e.descriptor().time().instant(n - 1))), Optional.empty());
  }

  @Test
  void aPublishBuiltOnAnotherVersionThanTheCurrentOneChangesNothing() throws Exception {
    try (Catalog c = Catalog.open(dir.resolve("catalog.db"))) {
      CubeEntry v1 = entry(1, 3, "a.nc");
      c.publish(v1, record(v1, 0, VersionRecord.Change.CREATED), OptionalInt.empty());
      CubeEntry v2 = entry(2, 4, "b.nc");
      CatalogException e = assertThrows(CatalogException.class,
          () -> c.publish(v2, record(v2, 1, VersionRecord.Change.APPENDED), OptionalInt.empty()));
      assertEquals("cube 'temp' changed while this file was being ingested (it is now version 1); nothing changed, ingest the file again",
          e.getMessage());
      assertEquals(1, c.cube("temp").orElseThrow().version());
      assertEquals(1, c.history("temp").size());
      c.publish(v2, record(v2, 1, VersionRecord.Change.APPENDED), OptionalInt.of(1));
      assertEquals(List.of("a.nc", "b.nc"), c.history("temp").stream().map(r -> r.provenance().sourceFile()).toList());
    }
  }

  @Test
  void historyOutlivesARemovedCubeSoVersionNumbersAreNotReused() throws Exception {
    try (Catalog c = Catalog.open(dir.resolve("catalog.db"))) {
      CubeEntry v1 = entry(1, 3, "a.nc");
      c.publish(v1, record(v1, 0, VersionRecord.Change.CREATED), OptionalInt.empty());
      CubeEntry v2 = entry(2, 4, "b.nc");
      c.publish(v2, record(v2, 1, VersionRecord.Change.APPENDED), OptionalInt.of(1));
      assertEquals(Optional.of(2), c.remove("temp"));
      assertEquals(3, c.nextVersion("temp"));
      assertTrue(c.lineage("temp").isEmpty(), "a removed cube has no current content");
      CubeEntry v3 = entry(3, 2, "c.nc");
      c.publish(v3, record(v3, 0, VersionRecord.Change.CREATED), OptionalInt.empty());
      assertEquals(List.of("c.nc"), c.lineage("temp").stream().map(r -> r.provenance().sourceFile()).toList());
      assertEquals(3, c.history("temp").size());
      CubeEntry v4 = entry(4, 5, "d.nc");
      c.publish(v4, record(v4, 3, VersionRecord.Change.APPENDED), OptionalInt.of(3));
      assertEquals(List.of(3, 4), c.lineage("temp").stream().map(VersionRecord::version).toList());
      assertEquals(record(v4, 3, VersionRecord.Change.APPENDED), c.history("temp").get(3), "a record reads back as written");
    }
  }

  @Test
  void aCatalogFromBeforeTheHistoryGetsOneCreatedEntryPerCube() throws Exception {
    Path db = dir.resolve("catalog.db");
    try (Catalog c = Catalog.open(db)) {
      CubeEntry v5 = entry(5, 3, "old.nc");
      c.publish(v5, record(v5, 0, VersionRecord.Change.CREATED), OptionalInt.empty());
    }
    // As a catalog written before cube_history existed.
    try (Connection raw = DriverManager.getConnection("jdbc:sqlite:" + db); Statement s = raw.createStatement()) {
      s.execute("DROP TABLE cube_history");
    }
    try (Catalog c = Catalog.open(db)) {
      List<VersionRecord> h = c.history("temp");
      assertEquals(1, h.size());
      assertEquals(VersionRecord.Change.CREATED, h.get(0).change());
      assertEquals(5, h.get(0).version());
      assertEquals("sha-old.nc", h.get(0).provenance().sourceSha256());
      assertEquals(3, h.get(0).appended().orElseThrow().count());
      assertEquals(6, c.nextVersion("temp"));
    }
  }
}
