package org.slackwater.core.watch;

import java.time.LocalDate;
import java.util.List;
import java.util.Objects;

/**
 * A watch evaluated day by day over {@code [from, to]}: the days in order, the conditions'
 * labels (the keys of each day's values) and what the reader should know (data clipped, days
 * without data). Every run carries {@link #caution}.
 */
public record WatchRun(String watch, String text, LocalDate from, LocalDate to, List<String> conditions, List<WatchDay> days,
    List<String> warnings) {
  /** Level names by level: none, then the severities. */
  public static final List<String> LEVELS = List.of("none", "notice", "warning", "alert");

  public WatchRun {
    Objects.requireNonNull(watch);
    Objects.requireNonNull(text);
    conditions = List.copyOf(conditions);
    days = List.copyOf(days);
    warnings = List.copyOf(warnings);
  }

  /** The days that raised or cleared the watch. */
  public List<WatchDay> transitions() {
    return days.stream().filter(d -> d.state().transition()).toList();
  }
}
