package org.slackwater.alerts;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.locks.ReentrantLock;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A durable queue of alert deliveries in one SQLite file: one row per (idempotency key, channel id).
 *
 * <h2>Why at least once</h2>
 * An alert is first written ({@link #enqueue}, one transaction for all its channels, committed
 * with {@code synchronous=FULL} so it survives a power cut), then sent, then marked sent. A crash
 * before the send leaves the row pending and the next {@link #deliverDue} (in this or a later
 * process) sends it. A crash after the send but before the mark (or a send whose answer was lost)
 * also leaves it pending, and the alert is sent again. Marking before sending would instead lose
 * the alert in that window, which an early warning cannot afford. So a receiver may see an alert
 * more than once, always with the same idempotency key, and drops a key it has already seen.
 *
 * <h2>Retries</h2>
 * A failed send counts an attempt, records the error and waits per the {@link RetryPolicy}; after
 * the last attempt the row is {@code failed}: kept, never tried again by itself, listed by
 * {@link #failed()}. Enqueueing a key and channel that is already in the file (pending, sent or
 * failed) changes nothing, so an evaluator may re-run a day after a restart.
 *
 * <h2>Concurrency and the file</h2>
 * Methods are thread-safe; a delivery pass runs one at a time and does not block {@link #enqueue}
 * while it waits on the network. One process should deliver from a file at a time (a second one
 * would repeat sends, which receivers drop, but doubles traffic). The file holds channel secrets and
 * passwords, so a new file is created readable by its owner only (on POSIX file systems). WAL
 * mode lets readers inspect the file while the server writes; a busy timeout rides out a short lock.
 *
 * <p>Failure modes: {@link OutboxException} naming the file when it cannot be opened (missing
 * directory, a directory, not an SQLite database, written by a newer version) or written.
 */
public final class Outbox implements AutoCloseable {

  private static final Logger LOG = LoggerFactory.getLogger(Outbox.class);
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final int SCHEMA_VERSION = 1;
  private static final int BUSY_TIMEOUT_MS = 5000;
  private static final int ERROR_LENGTH = 1000;

  private final Path file;
  private final RetryPolicy policy;
  private final Clock clock;
  private final Connection db;
  private final ReentrantLock delivering = new ReentrantLock();
  // closing stops a delivery pass between rows; closed (set once the connection is closed) refuses every call.
  private volatile boolean closing;
  private volatile boolean closed;

  private Outbox(Path file, RetryPolicy policy, Clock clock, Connection db) {
    this.file = file;
    this.policy = policy;
    this.clock = clock;
    this.db = db;
  }

  /** Opens (creating if absent) the outbox at {@code file} with the default retry policy and the system clock. */
  public static Outbox open(Path file) {
    return open(file, RetryPolicy.DEFAULT, Clock.systemUTC());
  }

  public static Outbox open(Path file, RetryPolicy policy, Clock clock) {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(policy, "policy");
    Objects.requireNonNull(clock, "clock");
    Path abs = file.toAbsolutePath();
    if (Files.isDirectory(abs)) {
      throw new OutboxException("outbox " + abs + " is a directory; give the path of a file, such as " + abs.resolve("outbox.sqlite"));
    }
    Path dir = abs.getParent();
    if (dir != null && !Files.isDirectory(dir)) {
      throw new OutboxException("outbox " + abs + ": directory " + dir + " does not exist; create it or choose another path");
    }
    createPrivate(abs);
    Connection c = null;
    try {
      c = DriverManager.getConnection("jdbc:sqlite:" + abs);
      try (Statement s = c.createStatement()) {
        s.execute("PRAGMA busy_timeout = " + BUSY_TIMEOUT_MS);
        int version = intPragma(s, "user_version");
        if (version > SCHEMA_VERSION) {
          throw new OutboxException("outbox " + abs + " was written by a newer Slackwater (schema " + version + ", this one reads "
              + SCHEMA_VERSION + "); run the newer version or move the file aside");
        }
        try (ResultSet r = s.executeQuery("PRAGMA journal_mode = WAL")) {
          String mode = r.next() ? r.getString(1) : "";
          if (!"wal".equalsIgnoreCase(mode)) {
            throw new OutboxException("outbox " + abs + ": SQLite refused WAL mode (mode is '" + mode
                + "'); keep the file on a local file system");
          }
        }
        // FULL makes each commit durable in WAL mode too; NORMAL could lose the last alerts on power loss.
        s.execute("PRAGMA synchronous = FULL");
        s.execute("""
            CREATE TABLE IF NOT EXISTS alert_outbox (
              idempotency_key TEXT NOT NULL,
              channel_id      TEXT NOT NULL,
              channel_kind    TEXT NOT NULL,
              watch           TEXT NOT NULL,
              channel_json    TEXT NOT NULL,
              alert_json      TEXT NOT NULL,
              status          TEXT NOT NULL CHECK (status IN ('pending', 'sent', 'failed')),
              attempts        INTEGER NOT NULL DEFAULT 0,
              enqueued_at     INTEGER NOT NULL,
              next_attempt_at INTEGER NOT NULL,
              sent_at         INTEGER,
              last_error      TEXT,
              PRIMARY KEY (idempotency_key, channel_id)
            )""");
        s.execute("CREATE INDEX IF NOT EXISTS alert_outbox_due ON alert_outbox (status, next_attempt_at)");
        s.execute("PRAGMA user_version = " + SCHEMA_VERSION);
      }
      return new Outbox(abs, policy, clock, c);
    } catch (SQLException e) {
      closeQuietly(c);
      throw new OutboxException(describe(abs, e), e);
    } catch (RuntimeException e) {
      closeQuietly(c);
      throw e;
    }
  }

  public Path file() {
    return file;
  }

  /**
   * Writes one pending row per channel for {@code a}, all or none. Returns whether any row was
   * new; a (key, channel) already in the file is left as it is, whatever its state.
   */
  public boolean enqueue(Alert a, List<Channel> channels) {
    Objects.requireNonNull(a, "alert");
    Objects.requireNonNull(channels, "channels");
    if (channels.isEmpty()) {
      throw new IllegalArgumentException("alert " + a.idempotencyKey() + " for watch '" + a.watch()
          + "' has no channels; give the watch at least one channel, or the alert would go nowhere");
    }
    Set<String> ids = new HashSet<>();
    for (Channel c : channels) {
      if (!ids.add(Objects.requireNonNull(c, "channel").id())) {
        throw new IllegalArgumentException("channel id '" + c.id() + "' appears twice for alert " + a.idempotencyKey()
            + "; give each channel its own id");
      }
    }
    String alertJson = new String(AlertJson.write(a), StandardCharsets.UTF_8);
    long now = clock.millis();
    synchronized (this) {
      checkOpen();
      int added = 0;
      try {
        db.setAutoCommit(false);
        try (PreparedStatement p = db.prepareStatement("""
            INSERT OR IGNORE INTO alert_outbox
              (idempotency_key, channel_id, channel_kind, watch, channel_json, alert_json, status, attempts, enqueued_at, next_attempt_at)
            VALUES (?, ?, ?, ?, ?, ?, 'pending', 0, ?, ?)""")) {
          for (Channel c : channels) {
            p.setString(1, a.idempotencyKey());
            p.setString(2, c.id());
            p.setString(3, c.kind().wireName());
            p.setString(4, a.watch());
            p.setString(5, JSON.writeValueAsString(ChannelCodec.toJson(c)));
            p.setString(6, alertJson);
            p.setLong(7, now);
            p.setLong(8, now);
            added += p.executeUpdate();
          }
        }
        db.commit();
      } catch (SQLException | IOException e) {
        rollbackQuietly();
        throw new OutboxException("could not write alert " + a.idempotencyKey() + " to the outbox: " + describe(file, e), e);
      } finally {
        autoCommitQuietly();
      }
      if (added > 0) {
        LOG.info("queued alert {} (watch '{}', {}) for {} of {} channels", a.idempotencyKey(), a.watch(), a.state(), added, channels.size());
      }
      return added > 0;
    }
  }

  /**
   * Sends every pending row whose next attempt is due at {@code now}, oldest first, with the
   * notifier for its channel's kind. A row is marked sent only after its notifier returned; a
   * failure (including a missing notifier or a notifier's runtime error) is recorded and retried.
   * An {@link Error} from a notifier propagates and leaves the row pending, like a crash.
   */
  public DeliveryReport deliverDue(Map<Channel.Kind, Notifier> notifiers, Instant now) {
    Objects.requireNonNull(notifiers, "notifiers");
    Objects.requireNonNull(now, "now");
    delivering.lock();
    try {
      List<DueRow> due = dueRows(now);
      int sent = 0, retrying = 0, failed = 0;
      for (DueRow row : due) {
        if (closing) {
          break;
        }
        Optional<String> error = attempt(row, notifiers);
        if (error.isEmpty()) {
          markSent(row, now);
          sent++;
        } else if (recordFailure(row, error.get(), now)) {
          failed++;
        } else {
          retrying++;
        }
      }
      return due.isEmpty() ? DeliveryReport.NOTHING : new DeliveryReport(sent, retrying, failed);
    } finally {
      delivering.unlock();
    }
  }

  /** Rows still to be delivered (due or waiting for a retry), oldest first. */
  public List<OutboxEntry> pending() {
    return entries("pending");
  }

  /** Rows delivered. */
  public List<OutboxEntry> sent() {
    return entries("sent");
  }

  /** Rows given up after the last attempt; they stay until an operator deals with them. */
  public List<OutboxEntry> failed() {
    return entries("failed");
  }

  /** When the earliest pending row is due, if any is pending. */
  public synchronized Optional<Instant> nextDue() {
    checkOpen();
    try (Statement s = db.createStatement();
         ResultSet r = s.executeQuery("SELECT min(next_attempt_at) FROM alert_outbox WHERE status = 'pending'")) {
      long t = r.next() ? r.getLong(1) : 0;
      return r.wasNull() ? Optional.empty() : Optional.of(Instant.ofEpochMilli(t));
    } catch (SQLException e) {
      throw new OutboxException(describe(file, e), e);
    }
  }

  /** Waits for a delivery pass in progress to finish its current send, then closes the file. */
  @Override
  public void close() {
    closing = true;
    delivering.lock();
    try {
      synchronized (this) {
        closed = true;
        closeQuietly(db);
      }
    } finally {
      delivering.unlock();
    }
  }

  private Optional<String> attempt(DueRow row, Map<Channel.Kind, Notifier> notifiers) {
    Channel channel;
    Alert alert;
    try {
      channel = ChannelCodec.fromJson(JSON.readTree(row.channelJson));
      alert = AlertJson.read(row.alertJson.getBytes(StandardCharsets.UTF_8));
    } catch (IOException | RuntimeException e) {
      return Optional.of("the stored row cannot be read (" + DeliveryException.describe(e) + "); it was damaged outside Slackwater");
    }
    Notifier n = notifiers.get(channel.kind());
    if (n == null) {
      return Optional.of("no notifier for " + channel.kind().wireName() + " channels was given to the outbox; add one to the notifier map");
    }
    try {
      n.send(alert, channel);
      return Optional.empty();
    } catch (DeliveryException e) {
      return Optional.of(e.getMessage());
    } catch (RuntimeException e) {
      LOG.error("notifier for channel '{}' failed unexpectedly", channel.id(), e);
      return Optional.of("the " + channel.kind().wireName() + " notifier failed: " + DeliveryException.describe(e));
    }
  }

  private synchronized List<DueRow> dueRows(Instant now) {
    checkOpen();
    List<DueRow> rows = new ArrayList<>();
    try (PreparedStatement p = db.prepareStatement("""
        SELECT idempotency_key, channel_id, attempts, channel_json, alert_json FROM alert_outbox
        WHERE status = 'pending' AND next_attempt_at <= ? ORDER BY next_attempt_at, enqueued_at, rowid""")) {
      p.setLong(1, now.toEpochMilli());
      try (ResultSet r = p.executeQuery()) {
        while (r.next()) {
          rows.add(new DueRow(r.getString(1), r.getString(2), r.getInt(3), r.getString(4), r.getString(5)));
        }
      }
    } catch (SQLException e) {
      throw new OutboxException("could not read due alerts: " + describe(file, e), e);
    }
    return rows;
  }

  private synchronized void markSent(DueRow row, Instant now) {
    checkOpen();
    try (PreparedStatement p = db.prepareStatement("""
        UPDATE alert_outbox SET status = 'sent', attempts = attempts + 1, sent_at = ?, last_error = NULL
        WHERE idempotency_key = ? AND channel_id = ? AND status = 'pending'""")) {
      p.setLong(1, now.toEpochMilli());
      p.setString(2, row.key);
      p.setString(3, row.channelId);
      p.executeUpdate();
    } catch (SQLException e) {
      // The alert went out; left pending it will go out again, which the key makes harmless.
      throw new OutboxException("alert " + row.key + " was delivered to channel '" + row.channelId
          + "' but could not be marked sent, so it will be repeated: " + describe(file, e), e);
    }
    LOG.info("delivered alert {} to channel '{}'", row.key, row.channelId);
  }

  /** Returns whether the row is now failed for good. */
  private synchronized boolean recordFailure(DueRow row, String error, Instant now) {
    checkOpen();
    int attempts = row.attempts + 1;
    boolean last = attempts >= policy.maxAttempts();
    Instant next = last ? now : now.plus(policy.delayAfter(attempts));
    String trimmed = error.length() > ERROR_LENGTH ? error.substring(0, ERROR_LENGTH) + "..." : error;
    try (PreparedStatement p = db.prepareStatement("""
        UPDATE alert_outbox SET status = ?, attempts = ?, next_attempt_at = ?, last_error = ?
        WHERE idempotency_key = ? AND channel_id = ? AND status = 'pending'""")) {
      p.setString(1, last ? "failed" : "pending");
      p.setInt(2, attempts);
      p.setLong(3, next.toEpochMilli());
      p.setString(4, trimmed);
      p.setString(5, row.key);
      p.setString(6, row.channelId);
      p.executeUpdate();
    } catch (SQLException e) {
      throw new OutboxException("could not record a failed delivery of alert " + row.key + ": " + describe(file, e), e);
    }
    if (last) {
      LOG.error("gave up on alert {} for channel '{}' after {} attempts: {}", row.key, row.channelId, attempts, trimmed);
    } else {
      LOG.warn("alert {} for channel '{}' failed (attempt {}), next try at {}: {}", row.key, row.channelId, attempts, next, trimmed);
    }
    return last;
  }

  private synchronized List<OutboxEntry> entries(String status) {
    checkOpen();
    List<OutboxEntry> out = new ArrayList<>();
    try (PreparedStatement p = db.prepareStatement("""
        SELECT idempotency_key, channel_id, channel_kind, watch, attempts, enqueued_at, next_attempt_at, sent_at, last_error
        FROM alert_outbox WHERE status = ? ORDER BY enqueued_at, rowid""")) {
      p.setString(1, status);
      try (ResultSet r = p.executeQuery()) {
        while (r.next()) {
          long sentAt = r.getLong(8);
          Optional<Instant> sent = r.wasNull() ? Optional.empty() : Optional.of(Instant.ofEpochMilli(sentAt));
          out.add(new OutboxEntry(r.getString(1), r.getString(2), Channel.Kind.ofWireName(r.getString(3)), r.getString(4),
              OutboxEntry.Status.valueOf(status.toUpperCase(java.util.Locale.ROOT)), r.getInt(5),
              Instant.ofEpochMilli(r.getLong(6)), Instant.ofEpochMilli(r.getLong(7)), sent, Optional.ofNullable(r.getString(9))));
        }
      }
    } catch (SQLException e) {
      throw new OutboxException(describe(file, e), e);
    }
    return List.copyOf(out);
  }

  private void checkOpen() {
    if (closed) {
      throw new OutboxException("outbox " + file + " is closed; open it again with Outbox.open");
    }
  }

  private static void createPrivate(Path file) {
    if (Files.exists(file)) {
      return;
    }
    try {
      if (file.getFileSystem().supportedFileAttributeViews().contains("posix")) {
        Files.createFile(file, PosixFilePermissions.asFileAttribute(PosixFilePermissions.fromString("rw-------")));
      }
    } catch (FileAlreadyExistsException e) {
      // Another process created it in between; SQLite opens it as it is.
    } catch (IOException e) {
      throw new OutboxException("could not create outbox " + file + ": " + DeliveryException.describe(e)
          + "; check that the directory is writable", e);
    }
  }

  private static String describe(Path file, Exception e) {
    String m = String.valueOf(e.getMessage());
    if (m.contains("SQLITE_NOTADB") || m.contains("not a database")) {
      return "outbox " + file + " is not an SQLite database (or is damaged); point the outbox at a new file, or restore this one from a backup";
    }
    if (m.contains("SQLITE_CANTOPEN") || m.contains("SQLITE_READONLY")) {
      return "outbox " + file + " cannot be opened for writing (" + m + "); check the file's and the directory's permissions";
    }
    if (m.contains("SQLITE_BUSY")) {
      return "outbox " + file + " stayed locked by another process for more than " + BUSY_TIMEOUT_MS + " ms (" + m
          + "); make sure only one server uses this file";
    }
    return "outbox " + file + ": " + m;
  }

  private static int intPragma(Statement s, String name) throws SQLException {
    try (ResultSet r = s.executeQuery("PRAGMA " + name)) {
      return r.next() ? r.getInt(1) : 0;
    }
  }

  private void rollbackQuietly() {
    try {
      db.rollback();
    } catch (SQLException e) {
      LOG.warn("rollback of outbox {} failed", file, e);
    }
  }

  private void autoCommitQuietly() {
    try {
      db.setAutoCommit(true);
    } catch (SQLException e) {
      LOG.warn("outbox {}: could not restore auto-commit", file, e);
    }
  }

  private static void closeQuietly(Connection c) {
    if (c == null) {
      return;
    }
    try {
      c.close();
    } catch (SQLException e) {
      LOG.warn("closing an outbox connection failed", e);
    }
  }

  private record DueRow(String key, String channelId, int attempts, String channelJson, String alertJson) {}
}
