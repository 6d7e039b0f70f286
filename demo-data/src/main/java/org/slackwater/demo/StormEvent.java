package org.slackwater.demo;

import java.time.LocalDate;
import java.util.List;

/**
 * A planted autumn storm: several days of extreme regional rainfall whose runoff drives a turbidity
 * plume down the estuary.
 *
 * @param rainMm regional rainfall of each storm day from {@code start}, mm d-1 (copied)
 */
record StormEvent(String id, LocalDate start, List<Double> rainMm) {

  StormEvent {
    rainMm = List.copyOf(rainMm);
  }

  LocalDate end() {
    return start.plusDays(rainMm.size() - 1);
  }
}
