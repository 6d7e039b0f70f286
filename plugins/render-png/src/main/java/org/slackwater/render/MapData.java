package org.slackwater.render;

import java.util.Arrays;
import java.util.Optional;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.io.ParseException;
import org.locationtech.jts.io.WKTReader;
import org.slackwater.core.query.ResultKind;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;

/**
 * The cells of a map result: centres (lat, lon in degrees), the value to colour, the cell size
 * (the smallest spacing between distinct centre latitudes and longitudes, the grid's step) and the
 * region outline from the metadata {@code region_wkt} (WKT, lon/lat), if given. The value is, for a
 * map, the first column after {@code fraction_inside}; for a correlation map, {@code r}. It is
 * diverging (coloured around zero) for correlation maps, difference maps (metadata
 * {@code difference}) and anomalies (a value named difference_*, anomaly_* or standardized_anomaly_*).
 */
record MapData(ResultTable table, double[] lat, double[] lon, double[] value, Column valueColumn, double cellLat, double cellLon,
    boolean diverging, Optional<Geometry> region) {

  /** Centres closer than this (degrees) are one grid line: the server writes them from one formula. */
  private static final double SAME = 1e-9;
  /** Cell size when a map has a single row or column of cells and no other hint (degrees). */
  private static final double FALLBACK_CELL = 0.1;

  static MapData of(ResultTable t, ResultKind kind) {
    double[] lat = Tables.numbers(t, "lat"), lon = Tables.numbers(t, "lon");
    Column v = kind == ResultKind.CORRELATION_MAP ? Tables.find(t, "r").orElseThrow(() -> noValue(t)) : valueAfterFraction(t);
    double[] value = Tables.numbers(t, v);
    for (int i = 0; i < lat.length; i++) {
      if (!Double.isFinite(lat[i]) || !Double.isFinite(lon[i])) {
        throw new PlotException("row " + (i + 1) + " of the map '" + t.title() + "' has no cell position (lat, lon); ask for format=json or csv");
      }
    }
    Optional<Geometry> region = region(t);
    double sLat = spacing(lat), sLon = spacing(lon);
    if (Double.isNaN(sLat) && Double.isNaN(sLon)) {
      sLat = sLon = FALLBACK_CELL;
    } else if (Double.isNaN(sLat)) {
      sLat = sLon;
    } else if (Double.isNaN(sLon)) {
      sLon = sLat;
    }
    String name = v.name();
    boolean diverging = kind == ResultKind.CORRELATION_MAP || t.metadata().containsKey("difference")
        || name.startsWith("difference_") || name.startsWith("anomaly_") || name.startsWith("standardized_anomaly_");
    return new MapData(t, lat, lon, value, v, sLat, sLon, diverging, region);
  }

  int missing() {
    int k = 0;
    for (double x : value) {
      k += Double.isNaN(x) ? 1 : 0;
    }
    return k;
  }

  private static Column valueAfterFraction(ResultTable t) {
    for (int i = 0; i < t.columns().size() - 1; i++) {
      if (t.columns().get(i).name().equals("fraction_inside")) {
        Column c = t.columns().get(i + 1);
        if (c instanceof Column.Doubles || c instanceof Column.Longs) {
          return c;
        }
      }
    }
    throw noValue(t);
  }

  private static PlotException noValue(ResultTable t) {
    return new PlotException("the map '" + t.title() + "' has no value column (after fraction_inside, or r for a correlation map);"
        + " ask for format=json or csv");
  }

  /** The smallest gap between distinct values, NaN if there is only one. */
  static double spacing(double[] v) {
    double[] s = v.clone();
    Arrays.sort(s);
    double best = Double.NaN;
    for (int i = 1; i < s.length; i++) {
      double d = s[i] - s[i - 1];
      if (d > SAME && !(d >= best)) {
        best = d;
      }
    }
    return best;
  }

  private static Optional<Geometry> region(ResultTable t) {
    String wkt = t.metadata().get("region_wkt");
    if (wkt == null || wkt.isBlank()) {
      return Optional.empty();
    }
    try {
      return Optional.of(new WKTReader().read(wkt));
    } catch (ParseException e) {
      throw new PlotException("the region outline of the map '" + t.title() + "' (metadata region_wkt) is not valid WKT: " + e.getMessage()
          + "; ask for format=json or csv");
    }
  }
}
