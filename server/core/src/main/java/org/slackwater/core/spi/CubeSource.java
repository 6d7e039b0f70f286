package org.slackwater.core.spi;

import java.nio.file.Path;
import java.util.List;

/**
 * Reads one file format into cubes. Implementations are found with {@link java.util.ServiceLoader}
 * (declare them in {@code META-INF/services/org.slackwater.core.spi.CubeSource}) and must have a
 * public no-argument constructor.
 *
 * <p>Every failure is a {@link SourceException} naming the file, the variable where relevant, the
 * problem and how to fix it; a source never lets a library's exception escape.
 */
public interface CubeSource {

  /** A short name for messages and configuration, e.g. {@code netcdf}. */
  String name();

  /** A cheap check (magic bytes, extension) that this source may read the file. */
  boolean accepts(Path file);

  /** The gridded variables with a time axis that the file holds, in file order. */
  List<String> variables(Path file) throws SourceException;

  /**
   * Opens one variable for reading. The caller closes the returned cube.
   *
   * @throws SourceException if the file or variable cannot be read as a cube
   */
  SourceCube open(Path file, String variable) throws SourceException;
}
