package org.slackwater.core.region;

import java.util.Objects;

/**
 * The cells of one grid that a region touches, each with the area of the cell inside the region.
 * Cells are listed in row-major order of the grid ({@code index = y * nx + x}); arrays are copied
 * in and kept private, so instances are immutable and safe to cache and share.
 *
 * @param nx the grid's column count, to turn an index back into (y, x)
 * @param cellIndex row-major indices of the cells touched, ascending
 * @param areaM2 area of each touched cell that lies inside the region, m²
 * @param fraction that area as a fraction of the whole cell's area (0, 1]
 * @param regionAreaM2 the region's own area, m² (larger than the sum where the region leaves the grid)
 */
public record CellWeights(int nx, int[] cellIndex, double[] areaM2, double[] fraction, double regionAreaM2) {

  public CellWeights {
    Objects.requireNonNull(cellIndex);
    if (cellIndex.length != areaM2.length || cellIndex.length != fraction.length) {
      throw new IllegalArgumentException("arrays differ in length");
    }
    cellIndex = cellIndex.clone();
    areaM2 = areaM2.clone();
    fraction = fraction.clone();
  }

  public int size() {
    return cellIndex.length;
  }

  public int index(int i) {
    return cellIndex[i];
  }

  public int row(int i) {
    return cellIndex[i] / nx;
  }

  public int column(int i) {
    return cellIndex[i] % nx;
  }

  public double area(int i) {
    return areaM2[i];
  }

  public double fraction(int i) {
    return fraction[i];
  }

  public double totalArea() {
    double s = 0;
    for (double a : areaM2) {
      s += a;
    }
    return s;
  }

  @Override
  public int[] cellIndex() {
    return cellIndex.clone();
  }

  @Override
  public double[] areaM2() {
    return areaM2.clone();
  }

  @Override
  public double[] fraction() {
    return fraction.clone();
  }
}
