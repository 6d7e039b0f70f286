package org.slackwater.demo;

/**
 * The seasonal shapes shared by the models. Mid-latitude North Atlantic climate, invented but
 * plausible: wettest and cloudiest in January, water warmest in mid-August.
 */
final class Seasons {

  private static final double YEAR = 365.25;

  private Seasons() {
  }

  /** +1 in mid-January, -1 in mid-July: positive roughly October to April (the wet season). */
  static double winter(int dayOfYear) {
    return Math.cos(2 * Math.PI * (dayOfYear - 15) / YEAR);
  }

  /** -1 around 10 February, +1 around 12 August: the phase of water temperature. */
  static double warmth(int dayOfYear) {
    return -Math.cos(2 * Math.PI * (dayOfYear - 41) / YEAR);
  }

  /** 0..1 potential evaporation shape: 0 from autumn to spring equinox, 1 at midsummer. */
  static double evaporation(int dayOfYear) {
    return Math.max(0, Math.sin(2 * Math.PI * (dayOfYear - 80) / YEAR));
  }

  /** 0..1 daylight shape for algal growth: short days in December, long in June. */
  static double daylight(int dayOfYear) {
    return 0.5 - 0.5 * Math.cos(2 * Math.PI * (dayOfYear - 355) / YEAR);
  }
}
