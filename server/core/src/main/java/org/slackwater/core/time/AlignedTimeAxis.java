package org.slackwater.core.time;

import java.util.Objects;
import org.slackwater.core.cube.TimeAxis;

/**
 * A decoded time axis together with the source positions it came from. Step {@code i} of {@code
 * axis} is value {@code sourceIndices[i]} of the time coordinate; the two differ only when steps
 * were dropped (29 February of non-leap years in {@code all_leap}, see {@link
 * TimeAxis.Alignment#SAME_LABEL}).
 *
 * @param axis the time axis on real instants
 * @param sourceIndices ascending source positions, one per step; copied in and out
 */
public record AlignedTimeAxis(TimeAxis axis, int[] sourceIndices) {

  public AlignedTimeAxis {
    Objects.requireNonNull(axis, "axis");
    sourceIndices = sourceIndices.clone();
    if (sourceIndices.length != axis.size()) {
      throw new IllegalArgumentException("one source index per step is needed");
    }
  }

  @Override
  public int[] sourceIndices() {
    return sourceIndices.clone();
  }

  public int sourceIndex(int step) {
    return sourceIndices[step];
  }

  /** How many source values were dropped. */
  public int droppedCount(int sourceLength) {
    return sourceLength - sourceIndices.length;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof AlignedTimeAxis a && axis.equals(a.axis) && java.util.Arrays.equals(sourceIndices, a.sourceIndices);
  }

  @Override
  public int hashCode() {
    return 31 * axis.hashCode() + java.util.Arrays.hashCode(sourceIndices);
  }

  @Override
  public String toString() {
    return "AlignedTimeAxis[" + axis + ", " + sourceIndices.length + " source steps kept]";
  }
}
