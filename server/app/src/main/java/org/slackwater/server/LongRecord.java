package org.slackwater.server;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import ucar.ma2.Array;
import ucar.ma2.DataType;
import ucar.ma2.InvalidRangeException;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFileWriter;
import ucar.nc2.Variable;

/**
 * A long daily record for measuring exports (bench-http, and the streaming test): a CF-1.8
 * NetCDF-3 file with {@code record_temperature} (degC) on a 0.05 degree grid in the invented
 * Wrenmouth estuary from 2006-01-01, filled from {@link #value}, written by NetCDF-Java's {@code
 * NetcdfFileWriter}. Invented numbers: a seasonal cycle and a gradient, no missing values.
 */
final class LongRecord {
  static final LocalDate START = LocalDate.of(2006, 1, 1);
  static final String VARIABLE = "record_temperature";
  static final double SOUTH = 44.0, WEST = -32.0, CELL = 0.05;

  private LongRecord() {}

  static float value(int t, int y, int x) {
    return (float) (12 + 6 * Math.sin(2 * Math.PI * t / 365.25) + 0.02 * y - 0.01 * x);
  }

  /** The query exporting all {@code nt} days of the whole {@code ny x nx} grid. */
  static String exportQuery(int nt, int ny, int nx) {
    return "cells of " + VARIABLE + " over box(" + SOUTH + ", " + WEST + ", " + (SOUTH + ny * CELL) + ", " + (WEST + nx * CELL)
        + ") from " + START + " to " + START.plusDays(nt - 1);
  }

  static void write(Path file, int nt, int ny, int nx) throws IOException {
    NetcdfFileWriter w = NetcdfFileWriter.createNew(NetcdfFileWriter.Version.netcdf3, file.toString());
    try {
      w.addGroupAttribute(null, new Attribute("Conventions", "CF-1.8"));
      w.addGroupAttribute(null, new Attribute("title", "Wrenmouth estuary long test record (invented data)"));
      w.addDimension(null, "time", nt);
      w.addDimension(null, "lat", ny);
      w.addDimension(null, "lon", nx);
      Variable time = w.addVariable(null, "time", DataType.DOUBLE, "time");
      w.addVariableAttribute(time, new Attribute("standard_name", "time"));
      w.addVariableAttribute(time, new Attribute("units", "days since " + START));
      w.addVariableAttribute(time, new Attribute("calendar", "standard"));
      Variable lat = axis(w, "lat", "degrees_north", "latitude");
      Variable lon = axis(w, "lon", "degrees_east", "longitude");
      Variable v = w.addVariable(null, VARIABLE, DataType.FLOAT, "time lat lon");
      w.addVariableAttribute(v, new Attribute("units", "degC"));
      w.addVariableAttribute(v, new Attribute("standard_name", "sea_water_temperature"));
      w.addVariableAttribute(v, new Attribute("_FillValue", -999f));
      w.create();
      double[] days = new double[nt], lats = new double[ny], lons = new double[nx];
      for (int t = 0; t < nt; t++) {
        days[t] = t;
      }
      for (int y = 0; y < ny; y++) {
        lats[y] = SOUTH + CELL * (y + 0.5);
      }
      for (int x = 0; x < nx; x++) {
        lons[x] = WEST + CELL * (x + 0.5);
      }
      w.write(time, Array.factory(DataType.DOUBLE, new int[] {nt}, days));
      w.write(lat, Array.factory(DataType.DOUBLE, new int[] {ny}, lats));
      w.write(lon, Array.factory(DataType.DOUBLE, new int[] {nx}, lons));
      int slab = 500;
      for (int t0 = 0; t0 < nt; t0 += slab) {
        int n = Math.min(slab, nt - t0);
        float[] values = new float[n * ny * nx];
        for (int t = 0; t < n; t++) {
          for (int y = 0; y < ny; y++) {
            for (int x = 0; x < nx; x++) {
              values[(t * ny + y) * nx + x] = value(t0 + t, y, x);
            }
          }
        }
        w.write(v, new int[] {t0, 0, 0}, Array.factory(DataType.FLOAT, new int[] {n, ny, nx}, values));
      }
    } catch (InvalidRangeException e) {
      throw new IllegalStateException("the long record " + file + " is inconsistent", e);
    } finally {
      w.close();
    }
  }

  private static Variable axis(NetcdfFileWriter w, String name, String units, String standardName) {
    Variable c = w.addVariable(null, name, DataType.DOUBLE, name);
    w.addVariableAttribute(c, new Attribute("units", units));
    w.addVariableAttribute(c, new Attribute("standard_name", standardName));
    return c;
  }
}
