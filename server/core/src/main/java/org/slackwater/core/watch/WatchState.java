package org.slackwater.core.watch;

/**
 * A watch's state on a day, from its level that day and the day before: {@code QUIET} (no rule
 * holds, nor did one the day before), {@code RAISED} (a rule holds and none did the day before, or
 * a rule of a higher severity than the day before holds), {@code ONGOING} (rules hold on both
 * days, the severity not higher than the day before), {@code CLEARED} (no rule holds, one did the
 * day before). Raised and cleared days are the transitions that alerts are sent for.
 */
public enum WatchState {
  QUIET, RAISED, ONGOING, CLEARED;

  /** The state of a day at {@code level} after a day at {@code previous} (0 = no rule holds). */
  public static WatchState of(int previous, int level) {
    if (level == 0) {
      return previous == 0 ? QUIET : CLEARED;
    }
    return previous == 0 || level > previous ? RAISED : ONGOING;
  }

  public boolean transition() {
    return this == RAISED || this == CLEARED;
  }

  public String label() {
    return name().toLowerCase(java.util.Locale.ROOT);
  }
}
