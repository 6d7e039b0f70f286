package org.slackwater.demo;

import java.time.LocalDate;

/**
 * A planted warm, clear and calm spell over [start, end). {@code bloomId} names the bloom it precedes,
 * or is empty for a decoy spell that is deliberately not followed by a bloom (no wet spring before it).
 */
record Spell(LocalDate start, LocalDate end, String bloomId) {

  boolean isDecoy() {
    return bloomId.isEmpty();
  }
}
