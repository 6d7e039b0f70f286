package org.slackwater.core.spi;

import org.slackwater.core.cube.CubeDescriptor;

/**
 * One variable of a source file, open for reading blocks of values. Not thread-safe; the caller
 * owns it and closes it.
 */
public interface SourceCube extends AutoCloseable {

  /** Names, units, grid and time axis, already normalised (see {@link org.slackwater.core.cube.LatLonGrid}). */
  CubeDescriptor descriptor();

  /**
   * Reads the block of steps {@code [t0, t0+nt)}, rows {@code [y0, y0+ny)} and columns {@code [x0,
   * x0+nx)} of the normalised grid into {@code dest}, in (time, row, column) order, converted to the
   * descriptor's canonical unit. Missing values (fill values, missing_value, outside valid_range,
   * NaN in the file) are written as {@link Float#NaN}.
   *
   * @param dest an array of at least {@code nt * ny * nx} values
   */
  void read(int t0, int nt, int y0, int ny, int x0, int nx, float[] dest) throws SourceException;

  @Override
  void close() throws SourceException;
}
