package org.slackwater.netcdf;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.function.DoubleUnaryOperator;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/**
 * The ncgen-written reference files of src/test/resources (see regenerate.sh) and the CF rules
 * the tests use to compute expected values from the CDL text.
 */
final class ReferenceFiles {

  private ReferenceFiles() {}

  static Path nc(String name) {
    return resource("nc/" + name + ".nc");
  }

  static Cdl cdl(String name) {
    return Cdl.read(resource("cdl/" + name + ".cdl"));
  }

  private static Path resource(String name) {
    try {
      return Path.of(ReferenceFiles.class.getResource("/" + name).toURI());
    } catch (URISyntaxException | NullPointerException e) {
      throw new IllegalStateException("test resource " + name + " is missing; run src/test/resources/regenerate.sh", e);
    }
  }

  /** The value ncgen stores for a CDL constant in a variable of this type. */
  static double stored(Cdl.Var v, int i) {
    double d = v.data()[i];
    return switch (v.type()) {
      case "float" -> (float) d;
      case "short" -> (short) d;
      case "byte" -> (byte) d;
      case "int" -> (int) d;
      default -> d;
    };
  }

  /**
   * The delivered value of stored value {@code i}: CF 2.5.1 validity on the packed value
   * (_FillValue, missing_value, valid_range / valid_min / valid_max, NaN), then CF 8.1 unpacking
   * (packed * scale_factor + add_offset), then the physical unit conversion, rounded to float.
   */
  static float expected(Cdl.Var v, int i, DoubleUnaryOperator toCanonical) {
    double p = stored(v, i);
    if (Double.isNaN(p) || isListedMissing(v, p) || outsideValidRange(v, p)) {
      return Float.NaN;
    }
    double unpacked = p * v.number("scale_factor", 1) + v.number("add_offset", 0);
    return (float) toCanonical.applyAsDouble(unpacked);
  }

  private static boolean isListedMissing(Cdl.Var v, double p) {
    Cdl.Attr fill = v.attr("_FillValue");
    // netCDF User Guide appendix A: without _FillValue the type's default fill is missing;
    // NC_FILL_SHORT = -32767 (netcdf.h, from memory); the test files use no other default.
    double fillValue = fill != null ? fill.number() : v.type().equals("short") ? -32767 : Double.NaN;
    if (p == fillValue) {
      return true;
    }
    Cdl.Attr mv = v.attr("missing_value");
    if (mv != null) {
      for (double m : mv.numbers()) {
        if (p == (v.type().equals("float") ? (float) m : m)) {
          return true;
        }
      }
    }
    return false;
  }

  private static boolean outsideValidRange(Cdl.Var v, double p) {
    Cdl.Attr range = v.attr("valid_range");
    double lo = range != null ? range.numbers()[0] : v.number("valid_min", Double.NEGATIVE_INFINITY);
    double hi = range != null ? range.numbers()[1] : v.number("valid_max", Double.POSITIVE_INFINITY);
    return p < lo || p > hi;
  }

  /** Cell bounds from centres: midpoints, edge cells extended by half a spacing (the brief's rule). */
  static double[][] midpointBounds(double[] c) {
    int n = c.length;
    double[] lo = new double[n];
    double[] hi = new double[n];
    for (int i = 0; i < n; i++) {
      lo[i] = i == 0 ? c[0] - (c[1] - c[0]) / 2 : (c[i - 1] + c[i]) / 2;
      hi[i] = i == n - 1 ? c[n - 1] + (c[n - 1] - c[n - 2]) / 2 : (c[i] + c[i + 1]) / 2;
    }
    return new double[][] {lo, hi};
  }

  /** Reads the whole cube. */
  static float[] readAll(SourceCube cube) throws SourceException {
    int nt = cube.descriptor().time().size();
    int ny = cube.descriptor().grid().ny();
    int nx = cube.descriptor().grid().nx();
    float[] out = new float[nt * ny * nx];
    cube.read(0, nt, 0, ny, 0, nx, out);
    return out;
  }

  static void assertValue(float expected, float actual, String where) {
    if (Float.isNaN(expected)) {
      assertTrue(Float.isNaN(actual), where + ": expected missing (NaN) but was " + actual);
    } else {
      assertEquals(expected, actual, 1e-6f * Math.max(1f, Math.abs(expected)), where);
    }
  }
}
