package org.slackwater.core.watch;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * One day of a watch: its level (0 = no rule holds, then {@link WatchRun#LEVELS} 1..3), its
 * state, the rules that held (1-based, in the order written) and the values that decided them
 * (each condition's compared quantity, in the threshold's unit, NaN where the data had none).
 */
public record WatchDay(LocalDate day, int level, WatchState state, List<Integer> rulesHolding, Map<String, Double> values) {
  public WatchDay {
    Objects.requireNonNull(day);
    Objects.requireNonNull(state);
    rulesHolding = List.copyOf(rulesHolding);
    values = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(values));
  }

  public String levelName() {
    return WatchRun.LEVELS.get(level);
  }
}
