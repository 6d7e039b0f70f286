package org.slackwater.demo;


/**
 * Daily values of one variable on the active cells of one grid: all cells for atmospheric fields,
 * the water (or watershed) cells otherwise. {@code NaN} marks a value that is missing on purpose
 * (a satellite gap); inactive cells are simply not stored.
 *
 * <p>Values are in the units the file states. Immutable: the arrays are copied in and never handed
 * out.
 */
final class Field {

  private final GridSpec grid;
  private final int[] cells;
  private final float[] values;
  private final int days;

  /**
   * @param cells  flat indices (see {@link GridSpec}) of the active cells, ascending
   * @param values {@code values[day * cells.length + k]} for active cell k
   */
  Field(GridSpec grid, int[] cells, float[] values, int days) {
    if ((long) cells.length * days != values.length) {
      throw new IllegalArgumentException("field on " + grid.name() + ": " + values.length + " values for "
          + cells.length + " cells x " + days + " days");
    }
    this.grid = grid;
    this.cells = cells.clone();
    this.values = values.clone();
    this.days = days;
  }

  GridSpec grid() {
    return grid;
  }

  int days() {
    return days;
  }

  int cellCount() {
    return cells.length;
  }

  /** Flat grid index of active cell {@code k}. */
  int cell(int k) {
    return cells[k];
  }

  int[] cells() {
    return cells.clone();
  }

  float value(int day, int k) {
    return values[day * cells.length + k];
  }

  /** Mean over the active cells of one day, ignoring NaN; NaN when every value is missing. */
  double spatialMean(int day) {
    double sum = 0;
    int n = 0;
    for (int k = 0; k < cells.length; k++) {
      float v = values[day * cells.length + k];
      if (!Float.isNaN(v)) {
        sum += v;
        n++;
      }
    }
    return n == 0 ? Double.NaN : sum / n;
  }

  /** The daily mean over the active cells, as a series. */
  double[] spatialMeanSeries() {
    double[] s = new double[days];
    for (int d = 0; d < days; d++) {
      s[d] = spatialMean(d);
    }
    return s;
  }
}
