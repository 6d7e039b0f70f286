package org.slackwater.netcdf;

import java.util.Arrays;
import java.util.Objects;

/**
 * One grid axis in the orientation of {@link org.slackwater.core.cube.LatLonGrid}: cell {@code i}
 * spans {@code [lower[i], upper[i]]} and holds file position {@code fileIndex[i]}.
 *
 * @param note how the file's axis was changed, for provenance (empty if it was not)
 */
record NormalisedAxis(double[] lower, double[] upper, int[] fileIndex, String note) {

  NormalisedAxis {
    Objects.requireNonNull(note, "note");
    lower = lower.clone();
    upper = upper.clone();
    fileIndex = fileIndex.clone();
    if (lower.length != upper.length || lower.length != fileIndex.length) {
      throw new IllegalArgumentException("axis arrays differ in length");
    }
  }

  int size() {
    return fileIndex.length;
  }

  int fileIndex(int i) {
    return fileIndex[i];
  }

  @Override
  public double[] lower() {
    return lower.clone();
  }

  @Override
  public double[] upper() {
    return upper.clone();
  }

  @Override
  public int[] fileIndex() {
    return fileIndex.clone();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof NormalisedAxis a && Arrays.equals(lower, a.lower) && Arrays.equals(upper, a.upper)
        && Arrays.equals(fileIndex, a.fileIndex) && note.equals(a.note);
  }

  @Override
  public int hashCode() {
    return Objects.hash(Arrays.hashCode(lower), Arrays.hashCode(upper), Arrays.hashCode(fileIndex), note);
  }

  @Override
  public String toString() {
    return "NormalisedAxis" + Arrays.toString(lower) + ".." + Arrays.toString(upper) + " from " + Arrays.toString(fileIndex);
  }
}
