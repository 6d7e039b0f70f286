package org.slackwater.demo;

import java.time.LocalDate;
import java.util.OptionalDouble;

/**
 * The domain-wide daily weather every gridded model starts from: regional rainfall, water
 * temperature, cloudiness and wind, with the planted events of an {@link EventPlan} written in.
 *
 * <p>Rainfall: a two-state (wet/dry) Markov chain with seasonal transition probabilities and gamma
 * amounts (the classic Richardson-type weather generator, 1981). In a bloom year the January-May
 * chain is made wetter and its amounts are rescaled so that the Jan-May total equals the planted
 * factor times the climatological expectation exactly; planted spells are dry; storms overwrite
 * their days.
 *
 * <p>Temperature, cloud and wind anomalies are AR(1) processes; the spells add a warm, clear and calm
 * anomaly with a short ramp. Immutable once built.
 */
final class RegionalWeather {

  static final double GAMMA_SHAPE = 0.75;

  private final boolean[] wet;
  private final double[] rainMm;
  private final double[] tempC;
  private final double[] cloudLatent;
  private final double[] wind;
  private final boolean[] storm;

  RegionalWeather(DayAxis days, EventPlan plan, long seed) {
    int n = days.size();
    wet = new boolean[n];
    rainMm = new double[n];
    storm = new boolean[n];
    tempC = new double[n];
    cloudLatent = new double[n];
    wind = new double[n];
    generateRain(days, plan, Rng.stream(seed, "regional-rain"));
    plantWetSprings(days, plan);
    Rng tr = Rng.stream(seed, "regional-temperature");
    Rng cr = Rng.stream(seed, "regional-cloud");
    Rng wr = Rng.stream(seed, "regional-wind");
    double ta = 0;
    double ca = cr.normal();
    double wa = wr.normal();
    for (int d = 0; d < n; d++) {
      int doy = days.dayOfYear(d);
      double spell = plan.spellWeight(days.date(d));
      double c = Seasons.winter(doy);
      // AR(1) with phi 0.93 and innovation sd 0.33 K: stationary sd 0.33 / sqrt(1 - 0.93^2) = 0.90 K.
      ta = 0.93 * ta + 0.33 * tr.normal();
      tempC[d] = 16 + 6.5 * Seasons.warmth(doy) + ta + 2.0 * spell;
      ca = 0.7 * ca + Math.sqrt(1 - 0.49) * cr.normal();
      double rainy = wet[d] ? 1.3 + 0.06 * Math.min(rainMm[d], 25) : 0;
      cloudLatent[d] = -0.2 + 0.6 * c + ca + rainy - 3.5 * spell;
      wa = 0.6 * wa + Math.sqrt(1 - 0.36) * wr.normal();
      double w = Math.max(0, 0.9 + 0.4 * c + 0.7 * wa) + (storm[d] ? 0.5 : 0);
      wind[d] = w * (1 - 0.85 * spell);
    }
  }

  private static double p01(double c) {
    return 0.28 + 0.14 * c;
  }

  private static double p11(double c) {
    return 0.62 + 0.12 * c;
  }

  private static double meanAmount(double c) {
    return GAMMA_SHAPE * scale(c);
  }

  private static double scale(double c) {
    return 7.5 + 2.5 * c;
  }

  private void generateRain(DayAxis days, EventPlan plan, Rng r) {
    boolean prev = false;
    for (int d = 0; d < days.size(); d++) {
      LocalDate date = days.date(d);
      double c = Seasons.winter(days.dayOfYear(d));
      boolean boosted = plan.wetSpringOf(date).isPresent();
      double p = prev ? p11(c) + (boosted ? 0.08 : 0) : p01(c) + (boosted ? 0.10 : 0);
      boolean w = r.bernoulli(p);
      double amount = r.gamma(GAMMA_SHAPE, scale(c));
      if (plan.inSpell(date)) {
        w = false;
      }
      OptionalDouble s = plan.stormRain(date);
      if (s.isPresent()) {
        w = true;
        amount = s.getAsDouble();
        storm[d] = true;
      }
      wet[d] = w;
      rainMm[d] = w ? amount : 0;
      prev = w;
    }
  }

  /**
   * Expected Jan-May rainfall of a year without planting: the stationary wet-day probability of the
   * chain, p01 / (1 - p11 + p01), times the mean gamma amount, summed over the days.
   */
  static double climatologicalTotal(DayAxis days, int from, int to) {
    double total = 0;
    for (int d = from; d <= to; d++) {
      double c = Seasons.winter(days.dayOfYear(d));
      total += p01(c) / (1 - p11(c) + p01(c)) * meanAmount(c);
    }
    return total;
  }

  private void plantWetSprings(DayAxis days, EventPlan plan) {
    for (BloomEvent e : plan.blooms()) {
      int from = days.indexOf(e.wetStart());
      int to = days.indexOf(EventPlan.wetEnd(e.wetStart().getYear()));
      double actual = 0;
      for (int d = from; d <= to; d++) {
        actual += rainMm[d];
      }
      if (actual <= 0) {
        continue;
      }
      double scaleBy = e.wetFactor() * climatologicalTotal(days, from, to) / actual;
      for (int d = from; d <= to; d++) {
        rainMm[d] *= scaleBy;
      }
    }
  }

  boolean wet(int day) {
    return wet[day];
  }

  boolean storm(int day) {
    return storm[day];
  }

  /** Regional rainfall, mm d-1. */
  double rainMm(int day) {
    return rainMm[day];
  }

  /** Regional (estuary-mean) water temperature, deg C. */
  double tempC(int day) {
    return tempC[day];
  }

  /** Regional cloud latent variable; cloud fraction is its logistic. */
  double cloudLatent(int day) {
    return cloudLatent[day];
  }

  static double logistic(double x) {
    return 1 / (1 + Math.exp(-x));
  }

  /** Wind-driven resuspension index, 0 (calm) to about 4 (storm). */
  double wind(int day) {
    return wind[day];
  }
}
