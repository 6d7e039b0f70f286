package org.slackwater.demo;

/**
 * The six grids of the scenario, deliberately all different (resolution, extent, latitude order,
 * longitude convention), at nominal resolution divided by the options' divisor.
 */
record ScenarioGrids(GridSpec rainfall, GridSpec runoff, GridSpec temperature, GridSpec cloud,
                     GridSpec turbidity, GridSpec chlorophyll) {

  /** The estuary box shared by the water grids: 43.75-44.45 N, 31.55-30.65 W. */
  static final double[] ESTUARY_BOX = {43.75, 44.45, -31.55, -30.65};

  static ScenarioGrids forDivisor(int divisor) {
    double s = ESTUARY_BOX[0];
    double n = ESTUARY_BOX[1];
    double w = ESTUARY_BOX[2];
    double e = ESTUARY_BOX[3];
    return new ScenarioGrids(
        GridSpec.of("rainfall", 43.75, 45.0, -32.25, -30.5, 0.25, divisor, false, false),
        GridSpec.of("runoff", 44.25, 45.0, -32.25, -31.25, 0.125, divisor, false, false),
        GridSpec.of("water_temperature", s, n, w, e, 0.05, divisor, true, false),
        GridSpec.of("cloud_fraction", 43.7, 45.0, -32.3, -30.7, 0.1, divisor, false, true),
        GridSpec.of("turbidity", s, n, w, e, 0.01, divisor, false, false),
        GridSpec.of("chlorophyll", s, n, w, e, 0.02, divisor, false, false));
  }
}
