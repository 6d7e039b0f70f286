package org.slackwater.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import ucar.ma2.Array;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;
import ucar.nc2.dataset.NetcdfDataset;
import ucar.nc2.time.Calendar;
import ucar.nc2.time.CalendarDate;
import ucar.nc2.time.CalendarDateUnit;

/**
 * A generated NetCDF file read back with NetCDF-Java: the data variable unpacked by NetCDF-Java's
 * own CF handling (scale_factor, add_offset, _FillValue to NaN), the axes and the decoded dates.
 */
final class NcFile {

  final double[] lat;
  final double[] lon;
  final LocalDate[] dates;
  /** Hour of day of each time value. */
  final int[] hours;
  /** values[t][row][col], NaN for fill. */
  final double[][][] values;

  NcFile(Path file, String variable) throws IOException {
    try (NetcdfDataset ds = NetcdfDataset.openDataset(file.toString())) {
      lat = (double[]) ds.findVariable("lat").read().get1DJavaArray(double.class);
      lon = (double[]) ds.findVariable("lon").read().get1DJavaArray(double.class);
      Variable time = ds.findVariable("time");
      String calendar = time.findAttribute("calendar").getStringValue();
      CalendarDateUnit unit = CalendarDateUnit.withCalendar(Calendar.get(calendar),
          time.findAttribute("units").getStringValue());
      double[] t = (double[]) time.read().get1DJavaArray(double.class);
      dates = new LocalDate[t.length];
      hours = new int[t.length];
      for (int i = 0; i < t.length; i++) {
        // The ISO text is printed in the calendar's own chronology, so a noleap date reads as such.
        CalendarDate d = unit.makeCalendarDate(t[i]);
        dates[i] = LocalDate.parse(d.toString().substring(0, 10));
        hours[i] = d.getHourOfDay();
      }
      Array a = ds.findVariable(variable).read();
      int[] shape = a.getShape();
      values = new double[shape[0]][shape[1]][shape[2]];
      ucar.ma2.Index idx = a.getIndex();
      for (int i = 0; i < shape[0]; i++) {
        for (int j = 0; j < shape[1]; j++) {
          for (int k = 0; k < shape[2]; k++) {
            values[i][j][k] = a.getDouble(idx.set(i, j, k));
          }
        }
      }
    }
  }

  /** Raw (not enhanced) file for header checks. */
  static NetcdfFile raw(Path file) throws IOException {
    return NetcdfFile.open(file.toString());
  }

  static String text(Attribute a) {
    return a == null ? null : a.getStringValue();
  }

  int indexOf(LocalDate d) {
    for (int i = 0; i < dates.length; i++) {
      if (dates[i].equals(d)) {
        return i;
      }
    }
    return -1;
  }

  /** Longitude in -180..180 whatever the file convention. */
  double lon180(int col) {
    return lon[col] > 180 ? lon[col] - 360 : lon[col];
  }
}
