package org.slackwater.core.watch;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * What watches have done, kept in a SQLite file of its own beside the catalog: every raised and
 * cleared day once ({@code watch_transition}, keyed by a digest of watch, version, state, level
 * and day, so re-evaluating a period, restarting, or re-ingesting the same file adds nothing),
 * how far each watch was evaluated automatically ({@code watch_progress}), and each watch's
 * alert destinations ({@code watch_channels}, a JSON array read by the alerts plugin).
 *
 * <p>One writer at a time: methods are synchronized; the file is in WAL mode so readers in other
 * processes are not blocked. Failures are {@link IllegalStateException}s naming the file.
 */
public final class WatchLedger implements AutoCloseable {
  private static final ObjectMapper JSON = new ObjectMapper();

  /** A recorded transition; {@code key} is also the alert's idempotency key. */
  public record Transition(String key, String watch, int version, LocalDate day, WatchState state, String level,
      Map<String, Double> values, Instant recordedAt) {}

  private final Connection db;
  private final Path file;

  private WatchLedger(Connection db, Path file) {
    this.db = db;
    this.file = file;
  }

  public static WatchLedger open(Path file) {
    try {
      Connection c = DriverManager.getConnection("jdbc:sqlite:" + file);
      try (Statement s = c.createStatement()) {
        s.execute("PRAGMA journal_mode=WAL");
        s.execute("PRAGMA synchronous=FULL");
        s.execute("PRAGMA busy_timeout=5000");
        s.execute("CREATE TABLE IF NOT EXISTS watch_transition (key TEXT PRIMARY KEY, watch TEXT NOT NULL, version INTEGER NOT NULL,"
            + " day TEXT NOT NULL, state TEXT NOT NULL, level TEXT NOT NULL, values_json TEXT NOT NULL, recorded_at TEXT NOT NULL)");
        s.execute("CREATE INDEX IF NOT EXISTS watch_transition_by_watch ON watch_transition (watch, day)");
        s.execute("CREATE TABLE IF NOT EXISTS watch_progress (watch TEXT PRIMARY KEY COLLATE NOCASE, version INTEGER NOT NULL,"
            + " evaluated_to TEXT NOT NULL)");
        s.execute("CREATE TABLE IF NOT EXISTS watch_channels (watch TEXT PRIMARY KEY COLLATE NOCASE, channels_json TEXT NOT NULL)");
      }
      return new WatchLedger(c, file);
    } catch (SQLException e) {
      throw new IllegalStateException("cannot open the watch ledger " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }

  /** The transition key: stable for one watch version, state, level and day. */
  public static String key(String watch, int version, WatchState state, String level, LocalDate day) {
    String identity = watch.strip().toLowerCase(Locale.ROOT) + '\u0000' + version + '\u0000' + state.label() + '\u0000' + level + '\u0000' + day;
    try {
      byte[] d = MessageDigest.getInstance("SHA-256").digest(identity.getBytes(StandardCharsets.UTF_8));
      return "sw-" + day + "-" + HexFormat.of().formatHex(d, 0, 16);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 missing from this Java runtime", e);
    }
  }

  /** The key of a run's raised or cleared day (also the alert's idempotency key). */
  public static String key(String watch, int version, WatchDay d) {
    return key(watch, version, d.state(), level(d), d.day());
  }

  /** The level a transition is recorded with: a cleared day has none. */
  public static String level(WatchDay d) {
    return d.state() == WatchState.CLEARED ? "none" : d.levelName();
  }

  /**
   * Records the run's raised and cleared days that are not recorded yet, in one transaction.
   *
   * @return the transitions new to the ledger, in day order
   */
  public synchronized List<Transition> record(WatchRun run, int version, Instant now) {
    List<Transition> fresh = new ArrayList<>();
    try {
      db.setAutoCommit(false);
      try (PreparedStatement ins = db.prepareStatement("INSERT OR IGNORE INTO watch_transition"
          + " (key, watch, version, day, state, level, values_json, recorded_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)")) {
        for (WatchDay d : run.transitions()) {
          String level = level(d);
          String key = key(run.watch(), version, d);
          ins.setString(1, key);
          ins.setString(2, run.watch());
          ins.setInt(3, version);
          ins.setString(4, d.day().toString());
          ins.setString(5, d.state().label());
          ins.setString(6, level);
          ins.setString(7, JSON.writeValueAsString(finite(d.values())));
          ins.setString(8, now.toString());
          if (ins.executeUpdate() == 1) {
            fresh.add(new Transition(key, run.watch(), version, d.day(), d.state(), level, d.values(), now));
          }
        }
      }
      db.commit();
      return fresh;
    } catch (SQLException | com.fasterxml.jackson.core.JsonProcessingException e) {
      rollback();
      throw new IllegalStateException("cannot record transitions in " + file.getFileName() + ": " + e.getMessage(), e);
    } finally {
      autoCommit();
    }
  }

  /** The recorded transitions of a watch (case ignored), in day order. */
  public synchronized List<Transition> transitions(String watch) {
    List<Transition> out = new ArrayList<>();
    try (PreparedStatement q = db.prepareStatement("SELECT key, watch, version, day, state, level, values_json, recorded_at"
        + " FROM watch_transition WHERE watch = ? COLLATE NOCASE ORDER BY day, recorded_at")) {
      q.setString(1, watch);
      try (ResultSet r = q.executeQuery()) {
        while (r.next()) {
          @SuppressWarnings("unchecked")
          Map<String, Double> values = JSON.readValue(r.getString(7), LinkedHashMap.class);
          out.add(new Transition(r.getString(1), r.getString(2), r.getInt(3), LocalDate.parse(r.getString(4)),
              WatchState.valueOf(r.getString(5).toUpperCase(Locale.ROOT)), r.getString(6), values, Instant.parse(r.getString(8))));
        }
      }
      return out;
    } catch (SQLException | com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new IllegalStateException("cannot read transitions from " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }

  /** The last day evaluated automatically for this version of the watch, if any. */
  public synchronized Optional<LocalDate> evaluatedTo(String watch, int version) {
    try (PreparedStatement q = db.prepareStatement("SELECT evaluated_to FROM watch_progress WHERE watch = ? AND version = ?")) {
      q.setString(1, watch);
      q.setInt(2, version);
      try (ResultSet r = q.executeQuery()) {
        return r.next() ? Optional.of(LocalDate.parse(r.getString(1))) : Optional.empty();
      }
    } catch (SQLException e) {
      throw new IllegalStateException("cannot read " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }

  public synchronized void setEvaluatedTo(String watch, int version, LocalDate day) {
    update("INSERT INTO watch_progress (watch, version, evaluated_to) VALUES (?, ?, ?) ON CONFLICT(watch) DO UPDATE SET"
        + " version = excluded.version, evaluated_to = excluded.evaluated_to", watch, version, day.toString());
  }

  /** The watch's alert destinations as stored (a JSON array), if any. */
  public synchronized Optional<String> channels(String watch) {
    try (PreparedStatement q = db.prepareStatement("SELECT channels_json FROM watch_channels WHERE watch = ?")) {
      q.setString(1, watch);
      try (ResultSet r = q.executeQuery()) {
        return r.next() ? Optional.of(r.getString(1)) : Optional.empty();
      }
    } catch (SQLException e) {
      throw new IllegalStateException("cannot read " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }

  public synchronized void setChannels(String watch, String json) {
    update("INSERT INTO watch_channels (watch, channels_json) VALUES (?, ?) ON CONFLICT(watch) DO UPDATE SET channels_json = excluded.channels_json",
        watch, json);
  }

  /** Forgets a deleted watch's progress and channels; its transitions stay as history. */
  public synchronized void forget(String watch) {
    update("DELETE FROM watch_progress WHERE watch = ?", watch);
    update("DELETE FROM watch_channels WHERE watch = ?", watch);
  }

  private void update(String sql, Object... args) {
    try (PreparedStatement p = db.prepareStatement(sql)) {
      for (int i = 0; i < args.length; i++) {
        p.setObject(i + 1, args[i]);
      }
      p.executeUpdate();
    } catch (SQLException e) {
      throw new IllegalStateException("cannot write " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }

  /** JSON has no NaN: days without data keep their key with null. */
  private static Map<String, Double> finite(Map<String, Double> values) {
    Map<String, Double> out = new LinkedHashMap<>();
    values.forEach((k, v) -> out.put(k, v == null || v.isNaN() || v.isInfinite() ? null : v));
    return out;
  }

  private void rollback() {
    try {
      db.rollback();
    } catch (SQLException ignored) {
      // The original failure is the one to report.
    }
  }

  private void autoCommit() {
    try {
      db.setAutoCommit(true);
    } catch (SQLException ignored) {
      // Next statement will report a broken connection.
    }
  }

  @Override
  public synchronized void close() {
    try {
      db.close();
    } catch (SQLException e) {
      throw new IllegalStateException("cannot close " + file.getFileName() + ": " + e.getMessage(), e);
    }
  }
}
