package org.slackwater.demo;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;

/**
 * The invented landscape: the Wrenmouth estuary, a funnel running south-east from the Harle River
 * mouth (44.30 N, 31.40 W) to the outer bay (43.90 N, 30.85 W), split into three segments, plus the
 * Harle watershed inland to the north-west and two drinking-water intakes.
 *
 * <p>The shapes come from fixed formulas, not from the seed, so every scenario shares one map.
 * Coordinates are rounded to 1e-6 degree before use, so the masks computed here and the polygons
 * written to GeoJSON are the same. Rings are counter-clockwise (RFC 7946 section 3.1.6).
 *
 * <p>Along-estuary position: {@link #alongKm} projects a point on the straight mouth-to-bay axis, 0 at
 * the mouth and about 62 km at the outer bay; models use it for seaward decay.
 */
final class WrenmouthGeography {

  static final String UPPER_REACH = "Upper Reach";
  static final String MID_REACH = "Mid Reach";
  static final String OUTER_BAY = "Outer Bay";
  static final String WATERSHED = "Harle Watershed";

  static final double MOUTH_LON = -31.40;
  static final double MOUTH_LAT = 44.30;
  static final double BAY_LON = -30.85;
  static final double BAY_LAT = 43.90;

  private static final int INTERVALS_PER_SEGMENT = 8;
  private static final int ARC_POINTS = 9;
  private static final int WATERSHED_VERTICES = 22;

  private final GeometryFactory factory = new GeometryFactory();
  private final double mx = LocalProjection.xKm(MOUTH_LON);
  private final double my = LocalProjection.yKm(MOUTH_LAT);
  private final double length;
  private final double ux;
  private final double uy;
  private final List<Region> segments;
  private final Region watershed;
  private final List<Intake> intakes;
  private final List<Station> stations;
  private final List<PreparedGeometry> preparedSegments;
  private final PreparedGeometry preparedWatershed;

  WrenmouthGeography() {
    double dx = LocalProjection.xKm(BAY_LON) - mx;
    double dy = LocalProjection.yKm(BAY_LAT) - my;
    length = Math.hypot(dx, dy);
    ux = dx / length;
    uy = dy / length;
    segments = List.copyOf(buildSegments());
    watershed = new Region(WATERSHED, RegionKind.WATERSHED, buildWatershed());
    intakes = List.of(
        intake("North Intake", MID_REACH, 0.47 * length, 0.35, 3000),
        intake("Harle Intake", UPPER_REACH, 0.18 * length, 0.0, 2000));
    stations = List.of(
        station("WM1", 0.22, 0.0),
        station("WM2", 0.45, -0.3),
        station("WM3", 0.72, 0.3),
        station("WM4", 0.90, -0.2));
    List<PreparedGeometry> prepared = new ArrayList<>();
    for (Region r : segments) {
      prepared.add(PreparedGeometryFactory.prepare(r.polygon()));
    }
    preparedSegments = Collections.unmodifiableList(prepared);
    preparedWatershed = PreparedGeometryFactory.prepare(watershed.polygon());
  }

  /** Upper Reach, Mid Reach, Outer Bay, from the mouth seaward. */
  List<Region> segments() {
    return segments;
  }

  Region watershed() {
    return watershed;
  }

  List<Intake> intakes() {
    return intakes;
  }

  /** The four sampling stations, from the mouth seaward. */
  List<Station> stations() {
    return stations;
  }

  /** Estuary length along the straight axis, mouth to outer bay, in km. */
  double lengthKm() {
    return length;
  }

  /** The bay segment containing (lon, lat), if any: the water mask. */
  Optional<String> segmentAt(double lon, double lat) {
    org.locationtech.jts.geom.Point p = factory.createPoint(new Coordinate(lon, lat));
    for (int i = 0; i < segments.size(); i++) {
      if (preparedSegments.get(i).covers(p)) {
        return Optional.of(segments.get(i).name());
      }
    }
    return Optional.empty();
  }

  boolean isWater(double lon, double lat) {
    return segmentAt(lon, lat).isPresent();
  }

  boolean isInWatershed(double lon, double lat) {
    return preparedWatershed.covers(factory.createPoint(new Coordinate(lon, lat)));
  }

  /** Distance along the mouth-to-bay axis, km; negative upstream of the mouth. */
  double alongKm(double lon, double lat) {
    return (LocalProjection.xKm(lon) - mx) * ux + (LocalProjection.yKm(lat) - my) * uy;
  }

  /** Flat indices of the grid cells whose centre is water. */
  int[] waterCells(GridSpec grid) {
    return cellsWhere(grid, true);
  }

  /** Flat indices of the grid cells whose centre is in the watershed. */
  int[] watershedCells(GridSpec grid) {
    return cellsWhere(grid, false);
  }

  private int[] cellsWhere(GridSpec grid, boolean water) {
    List<Integer> found = new ArrayList<>();
    for (int flat = 0; flat < grid.cells(); flat++) {
      double lon = grid.cellLon(flat);
      double lat = grid.cellLat(flat);
      if (water ? isWater(lon, lat) : isInWatershed(lon, lat)) {
        found.add(flat);
      }
    }
    if (found.isEmpty()) {
      throw new IllegalArgumentException("grid " + grid.name() + " (" + grid.nLat() + " x " + grid.nLon()
          + " cells) has no cell centre in the " + (water ? "estuary" : "watershed")
          + "; use a smaller resolution divisor");
    }
    return found.stream().mapToInt(Integer::intValue).toArray();
  }

  /** (lon, lat) of the point {@code s} km along the axis and {@code n} km to its north-east side. */
  double[] axisPoint(double s, double n) {
    double x = mx + s * ux + n * -uy;
    double y = my + s * uy + n * ux;
    return new double[] {round(LocalProjection.lon(x)), round(LocalProjection.lat(y))};
  }

  /** Half-width of the funnel, km: narrow at the mouth, widening seaward. */
  double halfWidthKm(double s) {
    return 1.2 + 11.0 * Math.pow(Math.max(0, s) / length, 1.6);
  }

  private double meander(double s) {
    return 1.2 * Math.sin(1.5 * Math.PI * s / length);
  }

  private double[] bank(double s, boolean left) {
    double wiggle = left ? 0.07 * Math.sin(2 * Math.PI * s / 7.5 + 0.7) : 0.07 * Math.sin(2 * Math.PI * s / 6.1 + 2.1);
    double w = halfWidthKm(s) * (1 + wiggle);
    return axisPoint(s, meander(s) + (left ? w : -w));
  }

  private List<Region> buildSegments() {
    double[] cuts = {0, 0.32 * length, 0.62 * length, length};
    String[] names = {UPPER_REACH, MID_REACH, OUTER_BAY};
    List<Region> out = new ArrayList<>();
    for (int seg = 0; seg < 3; seg++) {
      List<double[]> ring = new ArrayList<>();
      for (int i = 0; i <= INTERVALS_PER_SEGMENT; i++) {
        ring.add(bank(station(cuts, seg, i), true));
      }
      if (seg == 2) {
        ring.addAll(seawardArc());
      }
      for (int i = INTERVALS_PER_SEGMENT; i >= 0; i--) {
        ring.add(bank(station(cuts, seg, i), false));
      }
      out.add(new Region(names[seg], RegionKind.SEGMENT, polygon(ring)));
    }
    return out;
  }

  /** Along-axis position of bank vertex i of a segment; the ends are the cuts themselves, so that
   * neighbouring segments share their boundary vertices bit for bit. */
  private static double station(double[] cuts, int seg, int i) {
    if (i == INTERVALS_PER_SEGMENT) {
      return cuts[seg + 1];
    }
    return cuts[seg] + (cuts[seg + 1] - cuts[seg]) * i / INTERVALS_PER_SEGMENT;
  }

  /** The open seaward edge of the outer bay, bulging beyond the axis end, from left bank to right. */
  private List<double[]> seawardArc() {
    double s = length;
    double c = meander(s);
    double[] left = bank(s, true);
    double[] right = bank(s, false);
    double wl = Math.hypot(LocalProjection.xKm(left[0]) - LocalProjection.xKm(axisPoint(s, c)[0]),
        LocalProjection.yKm(left[1]) - LocalProjection.yKm(axisPoint(s, c)[1]));
    double wr = Math.hypot(LocalProjection.xKm(right[0]) - LocalProjection.xKm(axisPoint(s, c)[0]),
        LocalProjection.yKm(right[1]) - LocalProjection.yKm(axisPoint(s, c)[1]));
    double bulge = 0.6 * halfWidthKm(s);
    List<double[]> arc = new ArrayList<>();
    for (int i = 1; i <= ARC_POINTS; i++) {
      double theta = Math.PI / 2 - Math.PI * i / (ARC_POINTS + 1);
      double w = theta >= 0 ? wl : wr;
      arc.add(axisPoint(s + bulge * Math.cos(theta), c + w * Math.sin(theta)));
    }
    return arc;
  }

  /**
   * A star-shaped, hence simple, polygon around the watershed centre, with one vertex pulled out to
   * the river outlet just north-west of the mouth.
   */
  private Polygon buildWatershed() {
    double cLon = -31.78;
    double cLat = 44.60;
    double rLon = 0.36;
    double rLat = 0.30;
    double outletLon = -31.415;
    double outletLat = 44.31;
    double outletAngle = Math.atan2((outletLat - cLat) / rLat, (outletLon - cLon) / rLon);
    List<double[]> ring = new ArrayList<>();
    ring.add(new double[] {outletLon, outletLat});
    for (int i = 1; i < WATERSHED_VERTICES; i++) {
      double a = outletAngle + 2 * Math.PI * i / WATERSHED_VERTICES;
      double rho = 1 + 0.10 * Math.sin(3 * a + 0.4) + 0.06 * Math.sin(5 * a + 1.3);
      ring.add(new double[] {round(cLon + rLon * rho * Math.cos(a)), round(cLat + rLat * rho * Math.sin(a))});
    }
    return polygon(ring);
  }

  private Intake intake(String name, String segment, double s, double fractionOfHalfWidth, double radiusM) {
    double[] p = axisPoint(s, meander(s) + fractionOfHalfWidth * halfWidthKm(s));
    return new Intake(name, segment, p[0], p[1], radiusM);
  }

  private Station station(String name, double fractionOfLength, double fractionOfHalfWidth) {
    double s = fractionOfLength * length;
    double[] p = axisPoint(s, meander(s) + fractionOfHalfWidth * halfWidthKm(s));
    return new Station(name, p[0], p[1]);
  }

  private Polygon polygon(List<double[]> ring) {
    Coordinate[] cs = new Coordinate[ring.size() + 1];
    for (int i = 0; i < ring.size(); i++) {
      cs[i] = new Coordinate(ring.get(i)[0], ring.get(i)[1]);
    }
    cs[ring.size()] = new Coordinate(cs[0]);
    if (!Orientation.isCCW(cs)) {
      for (int i = 0, j = cs.length - 1; i < j; i++, j--) {
        Coordinate t = cs[i];
        cs[i] = cs[j];
        cs[j] = t;
      }
    }
    return factory.createPolygon(cs);
  }

  static double round(double deg) {
    return Math.round(deg * 1e6) / 1e6;
  }
}
