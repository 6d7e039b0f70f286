package org.slackwater.demo;

/**
 * Spatially smooth, temporally persistent Gaussian noise at a fixed set of points: a sum of
 * {@code modes} random plane waves whose amplitudes each follow an AR(1) process with unit variance.
 *
 * <p>Why this shape: satellite-like fields need coherent patches tens of kilometres wide rather than
 * cell-by-cell salt and pepper, and a few plane waves give that at a cost linear in the number of
 * cells. Each value has mean 0 and, averaged over the points, variance 1 (each wave contributes
 * 1/modes).
 *
 * <p>Call {@link #next()} once per day, in order; the returned array is reused between calls.
 */
final class SmoothNoise {

  private final float[][] basis;
  private final double[] amplitude;
  private final double phi;
  private final double innovation;
  private final Rng rng;
  private final float[] out;
  private boolean started;

  /**
   * @param xKm             point x positions (east), kilometres
   * @param yKm             point y positions (north), kilometres
   * @param minWavelengthKm shortest wave, which sets the patch size
   * @param maxWavelengthKm longest wave
   * @param phi             day-to-day autocorrelation of the wave amplitudes, 0 for independent days
   */
  SmoothNoise(double[] xKm, double[] yKm, int modes, double minWavelengthKm, double maxWavelengthKm,
              double phi, Rng rng) {
    this.rng = rng;
    this.phi = phi;
    this.innovation = Math.sqrt(1 - phi * phi);
    this.basis = new float[modes][xKm.length];
    this.amplitude = new double[modes];
    this.out = new float[xKm.length];
    double norm = Math.sqrt(2.0 / modes);
    for (int m = 0; m < modes; m++) {
      double dir = rng.uniform(0, Math.PI);
      double lambda = minWavelengthKm * Math.pow(maxWavelengthKm / minWavelengthKm, rng.uniform());
      double phase = rng.uniform(0, 2 * Math.PI);
      double kx = 2 * Math.PI * Math.cos(dir) / lambda;
      double ky = 2 * Math.PI * Math.sin(dir) / lambda;
      for (int p = 0; p < xKm.length; p++) {
        basis[m][p] = (float) (norm * Math.cos(kx * xKm[p] + ky * yKm[p] + phase));
      }
    }
  }

  /** Noise for the next day. */
  float[] next() {
    for (int m = 0; m < amplitude.length; m++) {
      amplitude[m] = started ? phi * amplitude[m] + innovation * rng.normal() : rng.normal();
    }
    started = true;
    java.util.Arrays.fill(out, 0f);
    for (int m = 0; m < amplitude.length; m++) {
      float a = (float) amplitude[m];
      float[] b = basis[m];
      for (int p = 0; p < out.length; p++) {
        out[p] += a * b[p];
      }
    }
    return out;
  }

  /** Positions (km) of the given flat cells of a grid, for the constructor. */
  static double[][] cellPositionsKm(GridSpec grid, int[] cells) {
    double[] x = new double[cells.length];
    double[] y = new double[cells.length];
    for (int k = 0; k < cells.length; k++) {
      x[k] = LocalProjection.xKm(grid.cellLon(cells[k]));
      y[k] = LocalProjection.yKm(grid.cellLat(cells[k]));
    }
    return new double[][] {x, y};
  }
}
