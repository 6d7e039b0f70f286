package org.slackwater.netcdf;

/**
 * Something in a file that keeps a variable from being read as a cube. The message says what is
 * wrong and how to fix it but not where; {@link NetCdfCubeSource} adds the file and variable when
 * it turns this into a {@link org.slackwater.core.spi.SourceException}.
 */
final class Problem extends Exception {
  private static final long serialVersionUID = 1L;

  Problem(String message) {
    super(message);
  }

  Problem(String message, Throwable cause) {
    super(message, cause);
  }
}
