package org.slackwater.core.catalog;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.region.Region;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkLayout;
import org.slackwater.core.store.ChunkRecord;

/**
 * The embedded, transactional catalog (SQLite over JDBC): which cube versions are published,
 * their descriptions, chunk files with checksums, provenance, each cube's version history; and
 * the named regions.
 *
 * <p>Only the current version of each cube is listed; publishing a new version replaces the row
 * and adds its history entry in one transaction, so readers see the old version or the new one,
 * never a mixture. The history ({@code cube_history}, one {@link VersionRecord} per version) is
 * kept when a cube is removed, so version numbers are never reused and a version directory name
 * always means one set of files. A catalog written before the history existed gets one {@code
 * CREATED} entry per cube when opened. Methods are synchronized: one connection, few writers,
 * short transactions.
 */
public final class Catalog implements AutoCloseable {

  private final Connection db;
  /**
   * What the database holds, read once and dropped on every write. This process is the catalog's
   * only writer, so the cache cannot go stale; it keeps queries from re-reading cube descriptions
   * and re-parsing region outlines on every statement.
   */
  private List<CubeEntry> cubeCache;
  private List<Region> regionCache;

  private Catalog(Connection db) {
    this.db = db;
  }

  public static Catalog open(Path file) throws IOException {
    try {
      Files.createDirectories(file.toAbsolutePath().getParent());
      Connection c = DriverManager.getConnection("jdbc:sqlite:" + file.toAbsolutePath());
      try (Statement s = c.createStatement()) {
        s.execute("PRAGMA journal_mode=WAL");
        s.execute("PRAGMA synchronous=FULL");
        s.execute("PRAGMA foreign_keys=ON");
        s.execute("""
            CREATE TABLE IF NOT EXISTS cube (
              name TEXT PRIMARY KEY, version INTEGER NOT NULL, descriptor TEXT NOT NULL,
              chunk_steps INTEGER NOT NULL, chunk_rows INTEGER NOT NULL, chunk_columns INTEGER NOT NULL,
              source_file TEXT NOT NULL, source_sha256 TEXT NOT NULL, source_variable TEXT NOT NULL,
              reader TEXT NOT NULL, ingested_at TEXT NOT NULL, footprint BLOB NOT NULL)""");
        s.execute("""
            CREATE TABLE IF NOT EXISTS chunk (
              cube TEXT NOT NULL REFERENCES cube(name) ON DELETE CASCADE, version INTEGER NOT NULL,
              t0 INTEGER NOT NULL, y0 INTEGER NOT NULL, x0 INTEGER NOT NULL,
              nt INTEGER NOT NULL, ny INTEGER NOT NULL, nx INTEGER NOT NULL,
              file TEXT NOT NULL, sha256 TEXT NOT NULL, bytes INTEGER NOT NULL, valid INTEGER NOT NULL,
              PRIMARY KEY (cube, version, t0, y0, x0))""");
        s.execute("""
            CREATE TABLE IF NOT EXISTS watch (
              name TEXT PRIMARY KEY COLLATE NOCASE, text TEXT NOT NULL, owner_sha256 TEXT NOT NULL,
              created_at TEXT NOT NULL, version INTEGER NOT NULL)""");
        s.execute("""
            CREATE TABLE IF NOT EXISTS cube_history (
              cube TEXT NOT NULL, version INTEGER NOT NULL, previous_version INTEGER NOT NULL, change TEXT NOT NULL,
              source_file TEXT NOT NULL, source_sha256 TEXT NOT NULL, source_variable TEXT NOT NULL,
              reader TEXT NOT NULL, ingested_at TEXT NOT NULL, steps INTEGER NOT NULL,
              appended_first_index INTEGER, appended_last_index INTEGER, appended_count INTEGER,
              appended_first TEXT, appended_last TEXT,
              replaced_first_index INTEGER, replaced_last_index INTEGER, replaced_count INTEGER,
              replaced_first TEXT, replaced_last TEXT,
              PRIMARY KEY (cube, version))""");
        s.execute("""
            CREATE TABLE IF NOT EXISTS region (
              name TEXT PRIMARY KEY COLLATE NOCASE, kind TEXT NOT NULL, geojson TEXT NOT NULL, updated_at TEXT NOT NULL)""");
      }
      Catalog catalog = new Catalog(c);
      catalog.recordHistoryOfOlderCubes();
      return catalog;
    } catch (SQLException e) {
      throw new IOException("cannot open the catalog " + file + ": " + e.getMessage(), e);
    }
  }

  /** Every published cube, by name. */
  public synchronized List<CubeEntry> cubes() {
    if (cubeCache == null) {
      cubeCache = List.copyOf(readCubes());
    }
    return cubeCache;
  }

  private List<CubeEntry> readCubes() {
    List<CubeEntry> out = new ArrayList<>();
    try (PreparedStatement ps = db.prepareStatement("SELECT * FROM cube ORDER BY name"); ResultSet rs = ps.executeQuery()) {
      while (rs.next()) {
        out.add(entry(rs));
      }
    } catch (SQLException e) {
      throw new CatalogException("reading the cube list failed: " + e.getMessage(), e);
    }
    return out;
  }

  public synchronized Optional<CubeEntry> cube(String name) {
    for (CubeEntry c : cubes()) {
      if (c.name().equals(name)) {
        return Optional.of(c);
      }
    }
    return Optional.empty();
  }

  /**
   * The next version number for {@code name}: one more than any version it ever had, current or
   * in its history (1 for a name never used).
   */
  public synchronized int nextVersion(String name) {
    int current = cube(name).map(CubeEntry::version).orElse(0);
    try (PreparedStatement ps = db.prepareStatement("SELECT MAX(version) FROM cube_history WHERE cube = ?")) {
      ps.setString(1, name);
      try (ResultSet rs = ps.executeQuery()) {
        return Math.max(current, rs.next() ? rs.getInt(1) : 0) + 1;
      }
    } catch (SQLException e) {
      throw new CatalogException("reading the history of cube '" + name + "' failed: " + e.getMessage(), e);
    }
  }

  /**
   * Makes {@code entry} the current version of its cube and adds {@code record} to its history, in
   * one transaction.
   *
   * @param expectedPrevious the version the caller built on (empty for a new cube); if the cube's
   *     current version is another, nothing is written
   * @return the version it replaced, if any (its files may be retired now)
   * @throws CatalogException if the cube changed meanwhile or the database fails; nothing changed
   */
  public synchronized Optional<Integer> publish(CubeEntry entry, VersionRecord record, OptionalInt expectedPrevious) {
    if (!record.cube().equals(entry.name()) || record.version() != entry.version()) {
      throw new IllegalArgumentException("history record " + record.cube() + " v" + record.version()
          + " does not describe entry " + entry.name() + " v" + entry.version());
    }
    cubeCache = null;
    try {
      db.setAutoCommit(false);
      Optional<Integer> previous = Optional.empty();
      try (PreparedStatement ps = db.prepareStatement("SELECT version FROM cube WHERE name = ?")) {
        ps.setString(1, entry.name());
        try (ResultSet rs = ps.executeQuery()) {
          if (rs.next()) {
            previous = Optional.of(rs.getInt(1));
          }
        }
      }
      if (!previous.map(OptionalInt::of).orElse(OptionalInt.empty()).equals(expectedPrevious)) {
        throw new CatalogException("cube '" + entry.name() + "' changed while this file was being ingested (it is now "
            + previous.map(v -> "version " + v).orElse("absent") + "); nothing changed, ingest the file again");
      }
      insertHistory(record);
      try (PreparedStatement del = db.prepareStatement("DELETE FROM cube WHERE name = ?")) {
        del.setString(1, entry.name());
        del.executeUpdate();
      }
      try (PreparedStatement ps = db.prepareStatement("INSERT INTO cube VALUES (?,?,?,?,?,?,?,?,?,?,?,?)")) {
        ps.setString(1, entry.name());
        ps.setInt(2, entry.version());
        ps.setString(3, DescriptorJson.write(entry.descriptor()));
        ps.setInt(4, entry.layout().steps());
        ps.setInt(5, entry.layout().rows());
        ps.setInt(6, entry.layout().columns());
        Provenance p = entry.provenance();
        ps.setString(7, p.sourceFile());
        ps.setString(8, p.sourceSha256());
        ps.setString(9, p.sourceVariable());
        ps.setString(10, p.reader());
        ps.setString(11, p.ingestedAt().toString());
        ps.setBytes(12, entry.footprint().toBytes());
        ps.executeUpdate();
      }
      try (PreparedStatement ps = db.prepareStatement("INSERT INTO chunk VALUES (?,?,?,?,?,?,?,?,?,?,?,?)")) {
        for (ChunkRecord c : entry.chunks()) {
          ChunkKey k = c.key();
          ps.setString(1, entry.name());
          ps.setInt(2, entry.version());
          ps.setInt(3, k.t0());
          ps.setInt(4, k.y0());
          ps.setInt(5, k.x0());
          ps.setInt(6, k.nt());
          ps.setInt(7, k.ny());
          ps.setInt(8, k.nx());
          ps.setString(9, c.file());
          ps.setString(10, c.sha256());
          ps.setLong(11, c.bytes());
          ps.setLong(12, c.validCount());
          ps.addBatch();
        }
        ps.executeBatch();
      }
      db.commit();
      return previous;
    } catch (SQLException e) {
      rollback();
      throw new CatalogException("publishing cube '" + entry.name() + "' failed, nothing changed: " + e.getMessage(), e);
    } catch (CatalogException e) {
      rollback();
      throw e;
    } finally {
      autoCommit();
    }
  }

  /** Every version {@code cube} ever had, oldest first, including versions of a removed cube of that name. */
  public synchronized List<VersionRecord> history(String cube) {
    List<VersionRecord> out = new ArrayList<>();
    try (PreparedStatement ps = db.prepareStatement("SELECT * FROM cube_history WHERE cube = ? ORDER BY version")) {
      ps.setString(1, cube);
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          out.add(historyRecord(rs));
        }
      }
    } catch (SQLException e) {
      throw new CatalogException("reading the history of cube '" + cube + "' failed: " + e.getMessage(), e);
    }
    return out;
  }

  /**
   * The history of the cube's current content: its current version's record and those before it
   * back to the one that created or replaced the cube. Empty when no cube has the name.
   */
  public synchronized List<VersionRecord> lineage(String cube) {
    Optional<CubeEntry> current = cube(cube);
    if (current.isEmpty()) {
      return List.of();
    }
    List<VersionRecord> all = history(cube);
    List<VersionRecord> out = new ArrayList<>();
    for (int i = all.size() - 1; i >= 0; i--) {
      VersionRecord r = all.get(i);
      if (r.version() > current.get().version()) {
        continue;
      }
      out.add(0, r);
      if (r.startsLineage()) {
        break;
      }
    }
    return List.copyOf(out);
  }

  private void insertHistory(VersionRecord r) throws SQLException {
    try (PreparedStatement ps = db.prepareStatement("INSERT INTO cube_history VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?)")) {
      ps.setString(1, r.cube());
      ps.setInt(2, r.version());
      ps.setInt(3, r.previousVersion());
      ps.setString(4, r.change().name());
      Provenance p = r.provenance();
      ps.setString(5, p.sourceFile());
      ps.setString(6, p.sourceSha256());
      ps.setString(7, p.sourceVariable());
      ps.setString(8, p.reader());
      ps.setString(9, p.ingestedAt().toString());
      ps.setInt(10, r.steps());
      setRange(ps, 11, r.appended());
      setRange(ps, 16, r.replaced());
      ps.executeUpdate();
    }
  }

  private static void setRange(PreparedStatement ps, int at, Optional<StepRange> range) throws SQLException {
    if (range.isPresent()) {
      StepRange s = range.get();
      ps.setInt(at, s.firstIndex());
      ps.setInt(at + 1, s.lastIndex());
      ps.setInt(at + 2, s.count());
      ps.setString(at + 3, s.first().toString());
      ps.setString(at + 4, s.last().toString());
    } else {
      for (int i = 0; i < 5; i++) {
        ps.setNull(at + i, java.sql.Types.NULL);
      }
    }
  }

  private static VersionRecord historyRecord(ResultSet rs) throws SQLException {
    Provenance p = new Provenance(rs.getString("source_file"), rs.getString("source_sha256"), rs.getString("source_variable"),
        rs.getString("reader"), Instant.parse(rs.getString("ingested_at")));
    return new VersionRecord(rs.getString("cube"), rs.getInt("version"), rs.getInt("previous_version"),
        VersionRecord.Change.valueOf(rs.getString("change")), p, rs.getInt("steps"), range(rs, "appended"), range(rs, "replaced"));
  }

  private static Optional<StepRange> range(ResultSet rs, String prefix) throws SQLException {
    String first = rs.getString(prefix + "_first");
    if (first == null) {
      return Optional.empty();
    }
    return Optional.of(new StepRange(rs.getInt(prefix + "_first_index"), rs.getInt(prefix + "_last_index"), rs.getInt(prefix + "_count"),
        Instant.parse(first), Instant.parse(rs.getString(prefix + "_last"))));
  }

  /**
   * Gives each cube published before the history existed one CREATED entry for its current
   * version, from its provenance, so that its source file is known to the history as well.
   */
  private synchronized void recordHistoryOfOlderCubes() {
    List<CubeEntry> missing = new ArrayList<>();
    for (CubeEntry c : cubes()) {
      if (history(c.name()).stream().noneMatch(r -> r.version() == c.version())) {
        missing.add(c);
      }
    }
    for (CubeEntry c : missing) {
      int steps = c.descriptor().time().size();
      Optional<StepRange> all = steps == 0 ? Optional.empty()
          : Optional.of(new StepRange(0, steps - 1, steps, c.descriptor().time().instant(0), c.descriptor().time().instant(steps - 1)));
      try {
        insertHistory(new VersionRecord(c.name(), c.version(), 0, VersionRecord.Change.CREATED, c.provenance(), steps, all, Optional.empty()));
      } catch (SQLException e) {
        throw new CatalogException("recording the history of cube '" + c.name() + "' failed: " + e.getMessage(), e);
      }
    }
  }

  /**
   * Removes a cube from the catalog; returns the version it had, if any (retire its files). Its
   * history stays, so a cube later created under the name continues the version numbers.
   */
  public synchronized Optional<Integer> remove(String name) {
    Optional<Integer> v = cube(name).map(CubeEntry::version);
    cubeCache = null;
    try (PreparedStatement ps = db.prepareStatement("DELETE FROM cube WHERE name = ?")) {
      ps.setString(1, name);
      ps.executeUpdate();
    } catch (SQLException e) {
      throw new CatalogException("removing cube '" + name + "' failed: " + e.getMessage(), e);
    }
    return v;
  }

  /** {@code cube/vN} for every published version: what the store must keep. */
  public synchronized Set<String> liveVersionDirs() {
    Set<String> out = new HashSet<>();
    for (CubeEntry c : cubes()) {
      out.add(c.name() + "/v" + c.version());
    }
    return out;
  }

  public synchronized void putRegion(Region region) {
    regionCache = null;
    try (PreparedStatement ps = db.prepareStatement("INSERT OR REPLACE INTO region VALUES (?,?,?,?)")) {
      ps.setString(1, region.name());
      ps.setString(2, region.kind());
      ps.setString(3, region.geoJson());
      ps.setString(4, Instant.now().toString());
      ps.executeUpdate();
    } catch (SQLException e) {
      throw new CatalogException("storing region '" + region.name() + "' failed: " + e.getMessage(), e);
    }
  }

  /** Every region, in name order, re-read from the stored GeoJSON. */
  public synchronized List<Region> regions() {
    if (regionCache == null) {
      regionCache = readRegions();
    }
    return regionCache;
  }

  private List<Region> readRegions() {
    Map<String, Region> out = new LinkedHashMap<>();
    try (PreparedStatement ps = db.prepareStatement("SELECT name, geojson FROM region ORDER BY name COLLATE NOCASE"); ResultSet rs = ps.executeQuery()) {
      while (rs.next()) {
        out.put(rs.getString(1), GeoJsonRegions.parseNamed(rs.getString(1), rs.getString(2)));
      }
    } catch (SQLException e) {
      throw new CatalogException("reading regions failed: " + e.getMessage(), e);
    }
    return List.copyOf(out.values());
  }

  public synchronized boolean removeRegion(String name) {
    regionCache = null;
    try (PreparedStatement ps = db.prepareStatement("DELETE FROM region WHERE name = ?")) {
      ps.setString(1, name);
      return ps.executeUpdate() > 0;
    } catch (SQLException e) {
      throw new CatalogException("removing region '" + name + "' failed: " + e.getMessage(), e);
    }
  }

  /** Stores a watch, replacing one of the same name with the next version; returns what was stored. */
  public synchronized StoredWatch putWatch(String name, String text, String ownerSha256) {
    int version = watches().stream().filter(w -> w.name().equalsIgnoreCase(name)).mapToInt(StoredWatch::version).max().orElse(0) + 1;
    StoredWatch w = new StoredWatch(name, text, ownerSha256, Instant.now(), version);
    try (PreparedStatement ps = db.prepareStatement("INSERT OR REPLACE INTO watch VALUES (?,?,?,?,?)")) {
      ps.setString(1, w.name());
      ps.setString(2, w.text());
      ps.setString(3, w.ownerSha256());
      ps.setString(4, w.created().toString());
      ps.setInt(5, w.version());
      ps.executeUpdate();
    } catch (SQLException e) {
      throw new CatalogException("storing watch '" + name + "' failed: " + e.getMessage(), e);
    }
    return w;
  }

  public synchronized List<StoredWatch> watches() {
    List<StoredWatch> out = new ArrayList<>();
    try (PreparedStatement ps = db.prepareStatement("SELECT * FROM watch ORDER BY name COLLATE NOCASE"); ResultSet rs = ps.executeQuery()) {
      while (rs.next()) {
        out.add(new StoredWatch(rs.getString("name"), rs.getString("text"), rs.getString("owner_sha256"),
            Instant.parse(rs.getString("created_at")), rs.getInt("version")));
      }
    } catch (SQLException e) {
      throw new CatalogException("reading watches failed: " + e.getMessage(), e);
    }
    return out;
  }

  public synchronized boolean removeWatch(String name) {
    try (PreparedStatement ps = db.prepareStatement("DELETE FROM watch WHERE name = ?")) {
      ps.setString(1, name);
      return ps.executeUpdate() > 0;
    } catch (SQLException e) {
      throw new CatalogException("removing watch '" + name + "' failed: " + e.getMessage(), e);
    }
  }

  private CubeEntry entry(ResultSet rs) throws SQLException {
    String name = rs.getString("name");
    int version = rs.getInt("version");
    ChunkLayout layout = new ChunkLayout(rs.getInt("chunk_steps"), rs.getInt("chunk_rows"), rs.getInt("chunk_columns"));
    Provenance p = new Provenance(rs.getString("source_file"), rs.getString("source_sha256"), rs.getString("source_variable"),
        rs.getString("reader"), Instant.parse(rs.getString("ingested_at")));
    CubeDescriptor d = DescriptorJson.read(rs.getString("descriptor"));
    Footprint fp = Footprint.fromBytes(d.grid().cells(), rs.getBytes("footprint"));
    return new CubeEntry(name, version, d, layout, chunks(name, version), fp, p);
  }

  private List<ChunkRecord> chunks(String cube, int version) throws SQLException {
    List<ChunkRecord> out = new ArrayList<>();
    try (PreparedStatement ps = db.prepareStatement("SELECT * FROM chunk WHERE cube = ? AND version = ? ORDER BY t0, y0, x0")) {
      ps.setString(1, cube);
      ps.setInt(2, version);
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          ChunkKey k = new ChunkKey(rs.getInt("t0"), rs.getInt("y0"), rs.getInt("x0"), rs.getInt("nt"), rs.getInt("ny"), rs.getInt("nx"));
          out.add(new ChunkRecord(k, rs.getString("file"), rs.getString("sha256"), rs.getLong("bytes"), rs.getLong("valid")));
        }
      }
    }
    return out;
  }

  private void rollback() {
    try {
      db.rollback();
    } catch (SQLException ignored) {
      // The original failure is what the caller needs to see.
    }
  }

  private void autoCommit() {
    try {
      db.setAutoCommit(true);
    } catch (SQLException ignored) {
      // Next statement will fail loudly if the connection is broken.
    }
  }

  @Override
  public synchronized void close() {
    try {
      db.close();
    } catch (SQLException e) {
      throw new CatalogException("closing the catalog failed: " + e.getMessage(), e);
    }
  }
}
