package org.slackwater.core.cube;

import java.util.BitSet;
import java.util.Objects;

/**
 * The cells of a cube that hold a value at one step or more: water cells for a water variable,
 * every cell for rainfall. Coverage is measured against the footprint, so land cells inside a
 * bay polygon (always fill) do not make every day look half-missing, while cloud gaps over water
 * still count.
 *
 * @param cells the grid's cell count (row-major indices)
 * @param present cells with any value; copied in and out
 */
public record Footprint(int cells, BitSet present) {
  public Footprint {
    Objects.requireNonNull(present);
    present = (BitSet) present.clone();
    if (present.length() > cells) {
      throw new IllegalArgumentException("footprint names a cell beyond the grid");
    }
  }

  public boolean contains(int cell) {
    return present.get(cell);
  }

  public int count() {
    return present.cardinality();
  }

  @Override
  public BitSet present() {
    return (BitSet) present.clone();
  }

  public byte[] toBytes() {
    return present.toByteArray();
  }

  public static Footprint fromBytes(int cells, byte[] bytes) {
    return new Footprint(cells, BitSet.valueOf(bytes));
  }
}
