package org.slackwater.demo;

/**
 * An invented conceptual hydrological model for each watershed cell of the runoff grid (mm d-1).
 *
 * <p>Rain (bilinear from the rainfall grid) falls on a soil bucket of 150 mm: the fraction
 * 0.10 + 0.65 (wetness)^2 runs off at once, the rest infiltrates, evaporation takes 1 mm d-1 in winter
 * and up to 5 mm d-1 at midsummer (less once the bucket is below 70 % full), and a full bucket
 * overflows. The excess is split 60/40 between a
 * fast (k = 5 d) and a slow (k = 25 d) {@link LinearReservoir}; runoff is their summed outflow, so it
 * lags rain by at least a day and recedes over weeks.
 *
 * <p>The stores start from the state reached after running the first year once (spin-up), so the
 * series has no cold-start transient.
 */
final class RunoffModel {

  static final double FAST_K = 5;
  static final double SLOW_K = 25;
  private static final double FAST_SHARE = 0.6;
  private static final double BUCKET_MM = 150;

  private RunoffModel() {
  }

  static Field generate(GridSpec grid, int[] watershedCells, DayAxis days, Field rainfall) {
    double[] lons = new double[watershedCells.length];
    double[] lats = new double[watershedCells.length];
    for (int k = 0; k < watershedCells.length; k++) {
      lons[k] = grid.cellLon(watershedCells[k]);
      lats[k] = grid.cellLat(watershedCells[k]);
    }
    GridSampler rain = new GridSampler(rainfall, lons, lats);
    float[] values = new float[days.size() * watershedCells.length];
    int spinUp = Math.min(365, days.size());
    for (int k = 0; k < watershedCells.length; k++) {
      Cell warm = new Cell(0.6 * BUCKET_MM, 0, 0);
      for (int d = 0; d < spinUp; d++) {
        warm.step(RainfallModel.toMmPerDay(rain.sample(d, k)), days.dayOfYear(d));
      }
      Cell cell = new Cell(warm.soil, warm.fast.storage(), warm.slow.storage());
      for (int d = 0; d < days.size(); d++) {
        double q = cell.step(RainfallModel.toMmPerDay(rain.sample(d, k)), days.dayOfYear(d));
        values[d * watershedCells.length + k] = (float) q;
      }
    }
    return new Field(grid, watershedCells, values, days.size());
  }

  /** The stores of one cell. */
  private static final class Cell {
    private double soil;
    private final LinearReservoir fast;
    private final LinearReservoir slow;

    Cell(double soil, double fastStorage, double slowStorage) {
      this.soil = soil;
      this.fast = new LinearReservoir(FAST_K, fastStorage);
      this.slow = new LinearReservoir(SLOW_K, slowStorage);
    }

    double step(double rainMm, int dayOfYear) {
      double wetness = soil / BUCKET_MM;
      double excess = (0.10 + 0.65 * wetness * wetness) * rainMm;
      soil += rainMm - excess - (1.0 + 4.0 * Seasons.evaporation(dayOfYear)) * Math.min(1, wetness / 0.7);
      if (soil > BUCKET_MM) {
        excess += soil - BUCKET_MM;
        soil = BUCKET_MM;
      }
      soil = Math.max(0, soil);
      return fast.step(FAST_SHARE * excess) + slow.step((1 - FAST_SHARE) * excess);
    }
  }
}
