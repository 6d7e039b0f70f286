package org.slackwater.demo;

/**
 * The metadata of one data file and its single variable.
 *
 * @param packed   true for int16 storage with scale_factor 0.01 and add_offset 0 (CF 8.1)
 * @param validMin smallest physical value, or NaN when there is no natural limit
 * @param validMax largest physical value, or NaN
 */
record VariableSpec(String fileName, String name, String standardName, String longName, String units,
                    boolean packed, TimeEncoding time, String title, double validMin, double validMax) {

  /** Fill of float variables: the netCDF default fill for floats (NC_FILL_FLOAT in netcdf.h). */
  static final float FLOAT_FILL = 9.9692099683868690e+36f;
  /** Fill of packed int16 variables: the most negative short, outside every packed value. */
  static final short SHORT_FILL = Short.MIN_VALUE;
  static final double PACK_SCALE = 0.01;
}
