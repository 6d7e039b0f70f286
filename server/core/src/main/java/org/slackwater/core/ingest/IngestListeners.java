package org.slackwater.core.ingest;

import java.util.List;
import java.util.Objects;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.function.Consumer;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Who wants to know when a cube changed. Listeners run on the ingesting thread after the catalog
 * commit, in the order they subscribed; one that throws is logged and skipped, and neither the
 * ingest nor the other listeners notice. A listener with slow work (evaluating watches) should
 * hand it to its own thread. Thread-safe.
 */
final class IngestListeners {
  private static final Logger LOG = LoggerFactory.getLogger(IngestListeners.class);

  private final List<Consumer<IngestReport>> listeners = new CopyOnWriteArrayList<>();

  Ingestor.Subscription add(Consumer<IngestReport> listener) {
    Objects.requireNonNull(listener);
    // A wrapper per subscription, so the same listener subscribed twice unsubscribes one at a time.
    Consumer<IngestReport> entry = listener::accept;
    listeners.add(entry);
    return () -> listeners.remove(entry);
  }

  void deliver(IngestReport report) {
    for (Consumer<IngestReport> l : listeners) {
      try {
        l.accept(report);
      } catch (RuntimeException e) {
        LOG.warn("an ingest listener failed on the report for cube '{}' version {} (the ingest itself succeeded): {}",
            report.cube(), report.version(), e.toString(), e);
      }
    }
  }
}
