package org.slackwater.demo;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The planted events of the scenario: which years have a bloom (with its wet spring and warm, clear,
 * calm spell), which have a decoy spell without a bloom, and which autumns have an extreme storm.
 *
 * <p>The years are fixed so every span of years shows the same story (2013 no bloom, 2014 bloom); the
 * details (dates, amplitudes, places) are drawn from the seed with one stream per year, so the 2014
 * bloom of {@link DemoOptions#small()} and of {@link DemoOptions#full()} are the same event.
 *
 * <p>Immutable.
 */
final class EventPlan {

  static final int[] BLOOM_YEARS = {2009, 2014, 2018, 2023};
  static final int[] DECOY_YEARS = {2011, 2013, 2020};
  static final int[] STORM_YEARS = {2013, 2021};

  /** Days over which a spell ramps up, and the e-folding time of its fading after it ends. */
  private static final double RAMP_DAYS = 3;
  private static final double FADE_DAYS = 4;
  private static final int FADE_LIMIT_DAYS = 14;

  private final List<BloomEvent> blooms;
  private final List<Spell> spells;
  private final List<StormEvent> storms;

  EventPlan(DemoOptions options, WrenmouthGeography geo) {
    List<BloomEvent> b = new ArrayList<>();
    List<Spell> sp = new ArrayList<>();
    List<StormEvent> st = new ArrayList<>();
    for (int y = options.firstYear(); y <= options.lastYear(); y++) {
      if (contains(BLOOM_YEARS, y)) {
        BloomEvent e = bloom(y, Rng.stream(options.seed(), "bloom", y), geo);
        b.add(e);
        sp.add(new Spell(e.spellStart(), e.onset(), e.id()));
      }
      if (contains(DECOY_YEARS, y)) {
        Rng r = Rng.stream(options.seed(), "decoy", y);
        LocalDate start = LocalDate.of(y, 7, 1).plusDays(r.between(0, 30));
        sp.add(new Spell(start, start.plusDays(r.between(14, 28)), ""));
      }
      if (contains(STORM_YEARS, y)) {
        Rng r = Rng.stream(options.seed(), "storm", y);
        LocalDate start = LocalDate.of(y, 11, 15).plusDays(r.between(0, 30));
        st.add(new StormEvent("turbidity-" + y, start,
            List.of(r.uniform(40, 50), r.uniform(85, 100), r.uniform(55, 70), r.uniform(20, 30))));
      }
    }
    blooms = List.copyOf(b);
    spells = List.copyOf(sp);
    storms = List.copyOf(st);
  }

  private static boolean contains(int[] years, int y) {
    for (int v : years) {
      if (v == y) {
        return true;
      }
    }
    return false;
  }

  private static BloomEvent bloom(int year, Rng r, WrenmouthGeography geo) {
    boolean mid = r.bernoulli(0.5);
    double wetFactor = r.uniform(1.6, 2.0);
    LocalDate onset = LocalDate.of(year, 6, 5).plusDays(r.between(0, 40));
    LocalDate spellStart = onset.minusDays(r.between(14, 28));
    LocalDate peak = onset.plusDays(r.between(6, 10));
    double amplitude = r.uniform(27, 55);
    double s = (mid ? r.uniform(0.40, 0.55) : r.uniform(0.70, 0.88)) * geo.lengthKm();
    double n = r.uniform(-0.3, 0.3) * geo.halfWidthKm(s);
    double[] centre = geo.axisPoint(s, n);
    return new BloomEvent("bloom-" + year, mid ? WrenmouthGeography.MID_REACH : WrenmouthGeography.OUTER_BAY,
        wetFactor, LocalDate.of(year, 1, 1), spellStart, onset, peak, amplitude, centre[0], centre[1],
        mid ? 8 : 11);
  }

  List<BloomEvent> blooms() {
    return blooms;
  }

  List<Spell> spells() {
    return spells;
  }

  List<StormEvent> storms() {
    return storms;
  }

  /** Last day (inclusive) of the planted wet winter-spring. */
  static LocalDate wetEnd(int year) {
    return LocalDate.of(year, 5, 31);
  }

  /** The bloom whose wet winter-spring contains {@code d}, if any. */
  Optional<BloomEvent> wetSpringOf(LocalDate d) {
    for (BloomEvent e : blooms) {
      if (!d.isBefore(e.wetStart()) && !d.isAfter(wetEnd(e.wetStart().getYear()))) {
        return Optional.of(e);
      }
    }
    return Optional.empty();
  }

  /** True inside a warm, clear, calm spell, where rain is suppressed. */
  boolean inSpell(LocalDate d) {
    for (Spell s : spells) {
      if (!d.isBefore(s.start()) && d.isBefore(s.end())) {
        return true;
      }
    }
    return false;
  }

  /**
   * Strength 0..1 of the spell anomaly on {@code d}: ramping up over the first days of a spell and
   * fading after it, so the planted signal has no one-day cliffs.
   */
  double spellWeight(LocalDate d) {
    double w = 0;
    for (Spell s : spells) {
      long in = ChronoUnit.DAYS.between(s.start(), d);
      long after = ChronoUnit.DAYS.between(s.end(), d);
      if (in >= 0 && after < 0) {
        w = Math.max(w, Math.min(1, (in + 1) / RAMP_DAYS));
      } else if (after >= 0 && after < FADE_LIMIT_DAYS) {
        w = Math.max(w, Math.exp(-(after + 1) / FADE_DAYS));
      }
    }
    return w;
  }

  /** The storm rainfall planted for {@code d}, mm d-1. */
  OptionalDouble stormRain(LocalDate d) {
    for (StormEvent s : storms) {
      long i = ChronoUnit.DAYS.between(s.start(), d);
      if (i >= 0 && i < s.rainMm().size()) {
        return OptionalDouble.of(s.rainMm().get((int) i));
      }
    }
    return OptionalDouble.empty();
  }
}
