package org.slackwater.server;

import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import org.slackwater.alerts.Alert;
import org.slackwater.alerts.Channel;
import org.slackwater.alerts.ChannelCodec;
import org.slackwater.alerts.MailNotifier;
import org.slackwater.alerts.Notifier;
import org.slackwater.alerts.Outbox;
import org.slackwater.alerts.OutboxWorker;
import org.slackwater.alerts.WebhookNotifier;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.StoredWatch;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.watch.WatchLedger;
import org.slackwater.core.watch.WatchRun;
import org.slackwater.core.watch.WatchState;
import org.slackwater.query.QueryException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Runs stored watches and turns their transitions into alerts. Order of writes, so that no alert
 * is lost and none is sent twice for one transition: the run's raised and cleared days go into
 * the ledger ({@link WatchLedger#record}, once per key), then every transition of the run that has
 * an alert destination is enqueued in the outbox (idempotent per key and channel, so enqueueing a
 * transition recorded before a crash again is harmless), then the outbox worker is woken. The
 * worker marks a delivery sent only after it went out (at least once; receivers drop repeats by
 * the idempotency key, which is the ledger's transition key).
 *
 * <p>Automatic runs ({@link #afterIngest}) cover the days after the last automatic run of the
 * same watch version, or, the first time, the last {@value #FIRST_RUN_DAYS} days of data.
 */
final class WatchService implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(WatchService.class);
  static final int FIRST_RUN_DAYS = 7;

  private final Workspace workspace;
  private final WatchLedger ledger;
  private final Outbox outbox;
  private final OutboxWorker worker;
  private final Clock clock;

  WatchService(Workspace workspace, Clock clock, Duration deliveryPeriod, org.slackwater.alerts.RetryPolicy retry) {
    this.workspace = workspace;
    this.clock = clock;
    this.ledger = WatchLedger.open(workspace.root().resolve("watch-ledger.db"));
    this.outbox = Outbox.open(workspace.root().resolve("alert-outbox.db"), retry, clock);
    Map<Channel.Kind, Notifier> notifiers = Map.of(Channel.Kind.WEBHOOK, new WebhookNotifier(), Channel.Kind.EMAIL, new MailNotifier());
    this.worker = OutboxWorker.start(outbox, notifiers, deliveryPeriod);
  }

  WatchLedger ledger() {
    return ledger;
  }

  Outbox outbox() {
    return outbox;
  }

  Optional<StoredWatch> watch(String name) {
    return workspace.catalog().watches().stream().filter(w -> w.name().equalsIgnoreCase(name)).findFirst();
  }

  /** Evaluates over a range, records its transitions and sends their alerts. */
  synchronized WatchRun evaluate(StoredWatch w, LocalDate from, LocalDate to) {
    WatchRun run = workspace.engine().evaluateWatch(w.text(), from, to);
    List<WatchLedger.Transition> fresh = ledger.record(run, w.version(), clock.instant());
    enqueue(w, run);
    if (!fresh.isEmpty()) {
      LOG.info("watch '{}': {} new transition(s) from {} to {}", w.name(), fresh.size(), run.from(), run.to());
    }
    return run;
  }

  /** The watch over its whole record, nothing recorded or sent: for backtests. */
  WatchRun history(StoredWatch w) {
    return workspace.engine().evaluateWatch(w.text(), LocalDate.of(1, 1, 1), LocalDate.of(9999, 12, 31));
  }

  /** After an ingest that changed {@code cube}: every watch reading it runs on the days not yet run. */
  void afterIngest(String cube) {
    for (StoredWatch w : workspace.catalog().watches()) {
      if (!mentions(w.text(), cube)) {
        continue;
      }
      try {
        LocalDate last = workspace.engine().watchSpan(w.text())[1];
        LocalDate from = ledger.evaluatedTo(w.name(), w.version()).map(d -> d.plusDays(1)).orElse(last.minusDays(FIRST_RUN_DAYS - 1));
        if (!from.isAfter(last)) {
          evaluate(w, from, last);
          ledger.setEvaluatedTo(w.name(), w.version(), last);
        }
      } catch (RuntimeException e) {
        // A watch whose variable went away must not stop the others; the log says which.
        LOG.warn("watch '{}' could not be evaluated after ingest of {}: {}", w.name(), cube, e.getMessage());
      }
    }
  }

  private static boolean mentions(String text, String cube) {
    return java.util.regex.Pattern.compile("(?<![A-Za-z0-9_])" + java.util.regex.Pattern.quote(cube) + "(?![A-Za-z0-9_])").matcher(text).find();
  }

  /** Every raised and cleared day of the run, to each of the watch's destinations. */
  private void enqueue(StoredWatch w, WatchRun run) {
    Optional<String> json = ledger.channels(w.name());
    if (json.isEmpty()) {
      return;
    }
    List<Channel> channels = ChannelCodec.parseList(json.get(), "channels of watch '" + w.name() + "'");
    if (run.transitions().isEmpty()) {
      return;
    }
    Optional<byte[]> png = plot(run);
    boolean any = false;
    for (var d : run.transitions()) {
      String level = WatchLedger.level(d);
      String key = WatchLedger.key(run.watch(), w.version(), d);
      Map<String, String> values = new LinkedHashMap<>();
      d.values().forEach((k, v) -> values.put(k, v == null || v.isNaN() ? "no data" : Double.toString(v)));
      String condition = d.state() == WatchState.CLEARED ? "no rule holds any more"
          : "rules " + d.rulesHolding().stream().map(String::valueOf).collect(Collectors.joining(", ")) + " of: " + w.text();
      Alert a = new Alert(key, w.name(), d.state().label(), level, d.day(), condition, values, WatchStatements.CAUTION, clock.instant(), png);
      any |= outbox.enqueue(a, channels);
    }
    if (any) {
      worker.wake();
    }
  }

  /** The run as a picture for the alert (e-mail attachment); none if it cannot be drawn. */
  private static Optional<byte[]> plot(WatchRun run) {
    try {
      return Optional.of(org.slackwater.render.PngRenderer.render(List.of(org.slackwater.core.watch.WatchTables.of(run, false)),
          new org.slackwater.render.PlotOptions(900, 560, 1)));
    } catch (RuntimeException e) {
      // An alert without its picture still goes out: the text carries the values and the caution.
      LOG.warn("watch '{}': no picture for the alert: {}", run.watch(), e.getMessage());
      return Optional.empty();
    }
  }

  /** Validates and stores a watch's destinations (the JSON array of the alerts plugin). */
  void setChannels(String watch, String json) {
    List<Channel> parsed = ChannelCodec.parseList(json, "channels of watch '" + watch + "'");
    ledger.setChannels(watch, json);
    LOG.info("watch '{}': {} alert destination(s) stored", watch, parsed.size());
  }

  List<String> channelSummary(String watch) {
    List<String> out = new ArrayList<>();
    ledger.channels(watch).ifPresent(j -> ChannelCodec.parseList(j, "channels").forEach(c -> out.add(c.toString())));
    return out;
  }

  @Override
  public void close() {
    worker.close();
    outbox.close();
    ledger.close();
  }
}
