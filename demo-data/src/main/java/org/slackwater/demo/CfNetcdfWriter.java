package org.slackwater.demo;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import ucar.ma2.Array;
import ucar.ma2.DataType;
import ucar.ma2.InvalidRangeException;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFileWriter;
import ucar.nc2.Variable;

/**
 * Writes one {@link Field} as a CF-1.8 NetCDF-3 classic file with dimensions (time, lat, lon),
 * coordinate variables with bounds, and the variable's metadata. Inactive cells (land) and NaN values
 * (gaps) become _FillValue.
 *
 * <p>Deterministic: nothing time- or host-dependent is written. Data go out a year at a time to keep
 * memory flat. Failure: an {@link IOException} naming the file; a half-written file is deleted.
 */
final class CfNetcdfWriter {

  private static final int DAYS_PER_SLAB = 366;

  private CfNetcdfWriter() {
  }

  static void write(Path file, VariableSpec spec, Field field, DayAxis axis, String history) throws IOException {
    GridSpec g = field.grid();
    int[] days = spec.time().days(axis);
    NetcdfFileWriter w = NetcdfFileWriter.createNew(NetcdfFileWriter.Version.netcdf3, file.toString());
    boolean done = false;
    try {
      w.setFill(false);
      w.addDimension(null, "time", days.length);
      w.addDimension(null, "lat", g.nLat());
      w.addDimension(null, "lon", g.nLon());
      w.addDimension(null, "bnds", 2);

      Variable vt = w.addVariable(null, "time", DataType.DOUBLE, "time");
      attr(w, vt, "standard_name", "time");
      attr(w, vt, "long_name", "time");
      attr(w, vt, "units", spec.time().units());
      attr(w, vt, "calendar", spec.time().calendar());
      attr(w, vt, "axis", "T");
      attr(w, vt, "bounds", "time_bnds");
      Variable vtb = w.addVariable(null, "time_bnds", DataType.DOUBLE, "time bnds");

      Variable vlat = w.addVariable(null, "lat", DataType.DOUBLE, "lat");
      attr(w, vlat, "standard_name", "latitude");
      attr(w, vlat, "long_name", "latitude");
      attr(w, vlat, "units", "degrees_north");
      attr(w, vlat, "axis", "Y");
      attr(w, vlat, "bounds", "lat_bnds");
      Variable vlatb = w.addVariable(null, "lat_bnds", DataType.DOUBLE, "lat bnds");

      Variable vlon = w.addVariable(null, "lon", DataType.DOUBLE, "lon");
      attr(w, vlon, "standard_name", "longitude");
      attr(w, vlon, "long_name", "longitude");
      attr(w, vlon, "units", "degrees_east");
      attr(w, vlon, "axis", "X");
      attr(w, vlon, "bounds", "lon_bnds");
      Variable vlonb = w.addVariable(null, "lon_bnds", DataType.DOUBLE, "lon bnds");

      Variable v = w.addVariable(null, spec.name(), spec.packed() ? DataType.SHORT : DataType.FLOAT, "time lat lon");
      attr(w, v, "standard_name", spec.standardName());
      attr(w, v, "long_name", spec.longName());
      attr(w, v, "units", spec.units());
      if (spec.packed()) {
        w.addVariableAttribute(v, new Attribute("scale_factor", (float) VariableSpec.PACK_SCALE));
        w.addVariableAttribute(v, new Attribute("add_offset", 0.0f));
        w.addVariableAttribute(v, new Attribute("_FillValue", VariableSpec.SHORT_FILL));
        addPackedRange(w, v, spec);
      } else {
        w.addVariableAttribute(v, new Attribute("_FillValue", VariableSpec.FLOAT_FILL));
        if (!Double.isNaN(spec.validMin())) {
          w.addVariableAttribute(v, new Attribute("valid_min", (float) spec.validMin()));
        }
        if (!Double.isNaN(spec.validMax())) {
          w.addVariableAttribute(v, new Attribute("valid_max", (float) spec.validMax()));
        }
      }
      attr(w, v, "cell_methods", "time: mean");

      w.addGroupAttribute(null, new Attribute("Conventions", "CF-1.8"));
      w.addGroupAttribute(null, new Attribute("title", spec.title()));
      w.addGroupAttribute(null, new Attribute("source", "Slackwater demo generator (invented data)"));
      w.addGroupAttribute(null, new Attribute("history", history));
      w.addGroupAttribute(null, new Attribute("comment",
          "Invented data for the fictional Wrenmouth estuary; not a real place."));
      w.create();

      double[] tv = new double[days.length];
      double[] tb = new double[days.length * 2];
      for (int i = 0; i < days.length; i++) {
        tv[i] = spec.time().value(axis, days[i]);
        double[] b = spec.time().bounds(axis, days[i]);
        tb[2 * i] = b[0];
        tb[2 * i + 1] = b[1];
      }
      w.write(vt, Array.factory(DataType.DOUBLE, new int[] {days.length}, tv));
      w.write(vtb, Array.factory(DataType.DOUBLE, new int[] {days.length, 2}, tb));
      double[] la = new double[g.nLat()];
      double[] lab = new double[g.nLat() * 2];
      for (int i = 0; i < g.nLat(); i++) {
        la[i] = g.lat(i);
        lab[2 * i] = g.latBounds(i)[0];
        lab[2 * i + 1] = g.latBounds(i)[1];
      }
      w.write(vlat, Array.factory(DataType.DOUBLE, new int[] {g.nLat()}, la));
      w.write(vlatb, Array.factory(DataType.DOUBLE, new int[] {g.nLat(), 2}, lab));
      double[] lo = new double[g.nLon()];
      double[] lob = new double[g.nLon() * 2];
      for (int j = 0; j < g.nLon(); j++) {
        lo[j] = g.fileLon(j);
        lob[2 * j] = g.fileLonBounds(j)[0];
        lob[2 * j + 1] = g.fileLonBounds(j)[1];
      }
      w.write(vlon, Array.factory(DataType.DOUBLE, new int[] {g.nLon()}, lo));
      w.write(vlonb, Array.factory(DataType.DOUBLE, new int[] {g.nLon(), 2}, lob));

      for (int start = 0; start < days.length; start += DAYS_PER_SLAB) {
        int count = Math.min(DAYS_PER_SLAB, days.length - start);
        int[] shape = {count, g.nLat(), g.nLon()};
        Array slab = spec.packed() ? packedSlab(field, days, start, count) : floatSlab(field, days, start, count);
        w.write(v, new int[] {start, 0, 0}, Array.factory(spec.packed() ? DataType.SHORT : DataType.FLOAT, shape,
            slab.getStorage()));
      }
      done = true;
    } catch (InvalidRangeException e) {
      throw new IllegalStateException("slab outside variable " + spec.name() + " in " + file, e);
    } finally {
      try {
        w.close();
      } finally {
        if (!done) {
          Files.deleteIfExists(file);
        }
      }
    }
  }

  private static void attr(NetcdfFileWriter w, Variable v, String name, String value) {
    w.addVariableAttribute(v, new Attribute(name, value));
  }

  private static void addPackedRange(NetcdfFileWriter w, Variable v, VariableSpec spec) {
    // CF 8.1: valid_min / valid_max of a packed variable are stated in the packed type.
    if (!Double.isNaN(spec.validMin())) {
      w.addVariableAttribute(v, new Attribute("valid_min", pack(spec.validMin())));
    }
    if (!Double.isNaN(spec.validMax())) {
      w.addVariableAttribute(v, new Attribute("valid_max", pack(spec.validMax())));
    }
  }

  static short pack(double value) {
    long p = Math.round(value / VariableSpec.PACK_SCALE);
    return (short) Math.max(Short.MIN_VALUE + 1, Math.min(Short.MAX_VALUE, p));
  }

  private static Array floatSlab(Field f, int[] days, int start, int count) {
    int plane = f.grid().cells();
    float[] out = new float[count * plane];
    Arrays.fill(out, VariableSpec.FLOAT_FILL);
    for (int t = 0; t < count; t++) {
      int d = days[start + t];
      for (int k = 0; k < f.cellCount(); k++) {
        float x = f.value(d, k);
        if (!Float.isNaN(x)) {
          out[t * plane + f.cell(k)] = x;
        }
      }
    }
    return Array.factory(out);
  }

  private static Array packedSlab(Field f, int[] days, int start, int count) {
    int plane = f.grid().cells();
    short[] out = new short[count * plane];
    Arrays.fill(out, VariableSpec.SHORT_FILL);
    for (int t = 0; t < count; t++) {
      int d = days[start + t];
      for (int k = 0; k < f.cellCount(); k++) {
        float x = f.value(d, k);
        if (!Float.isNaN(x)) {
          out[t * plane + f.cell(k)] = pack(x);
        }
      }
    }
    return Array.factory(out);
  }
}
