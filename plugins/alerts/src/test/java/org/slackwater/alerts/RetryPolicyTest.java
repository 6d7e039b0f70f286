package org.slackwater.alerts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import org.junit.jupiter.api.Test;

class RetryPolicyTest {

  @Test
  void doublesFromTheBaseAndStopsAtTheCap() {
    RetryPolicy p = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(5), 10);
    // base * 2^(n-1): 30 s, 60 s, 120 s, 240 s, then capped at 300 s.
    long[] expected = {30, 60, 120, 240, 300, 300};
    for (int n = 1; n <= expected.length; n++) {
      assertEquals(Duration.ofSeconds(expected[n - 1]), p.delayAfter(n), "attempt " + n);
    }
    assertEquals(Duration.ofMinutes(5), p.delayAfter(Integer.MAX_VALUE), "no overflow for huge attempt counts");
  }

  @Test
  void badSettingsAreRefused() {
    assertTrue(assertThrows(IllegalArgumentException.class, () -> new RetryPolicy(Duration.ZERO, Duration.ofMinutes(1), 3))
        .getMessage().contains("base delay must be positive"));
    assertTrue(assertThrows(IllegalArgumentException.class, () -> new RetryPolicy(Duration.ofMinutes(2), Duration.ofMinutes(1), 3))
        .getMessage().contains("shorter than the base"));
    assertTrue(assertThrows(IllegalArgumentException.class, () -> new RetryPolicy(Duration.ofSeconds(1), Duration.ofMinutes(1), 0))
        .getMessage().contains("maxAttempts"));
  }
}
