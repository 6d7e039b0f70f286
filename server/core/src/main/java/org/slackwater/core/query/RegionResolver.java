package org.slackwater.core.query;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygonal;
import org.locationtech.jts.io.ParseException;
import org.locationtech.jts.io.WKTReader;
import org.locationtech.jts.operation.valid.IsValidOp;
import org.locationtech.jts.operation.valid.TopologyValidationError;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.region.GeodesicCircle;
import org.slackwater.core.region.Region;
import org.slackwater.query.QueryException;
import org.slackwater.query.Suggestions;
import org.slackwater.query.ast.BoxRegion;
import org.slackwater.query.ast.CircleRegion;
import org.slackwater.query.ast.ClippedRegion;
import org.slackwater.query.ast.NamedRegion;
import org.slackwater.query.ast.RegionRef;
import org.slackwater.query.ast.WktRegion;

/**
 * Turns a region reference of a query into a polygonal geometry in lon/lat degrees, with errors at
 * the reference's position: unknown names (with the nearest known name), bad WKT, empty
 * intersections.
 */
final class RegionResolver {
  private static final GeometryFactory GF = new GeometryFactory();

  private final Catalog catalog;
  private final String source;

  RegionResolver(Catalog catalog, String source) {
    this.catalog = catalog;
    this.source = source;
  }

  /** The resolved outline and a short human label for titles. */
  record Resolved(Geometry geometry, String label) {}

  Resolved resolve(RegionRef ref) {
    if (ref instanceof NamedRegion n) {
      List<Region> all = catalog.regions();
      Optional<Region> hit = all.stream().filter(r -> r.name().equalsIgnoreCase(n.name())).findFirst();
      if (hit.isEmpty()) {
        List<String> names = all.stream().map(Region::name).toList();
        Optional<String> near = Suggestions.nearest(n.name(), names);
        throw QueryException.at(n, source, "unknown region \"" + n.name() + "\"",
            near.map(s -> "did you mean \"" + s + "\"?")
                .orElse(names.isEmpty() ? "no regions are loaded; add one with PUT /api/regions/{name}" : "known regions: " + String.join(", ", names)));
      }
      return new Resolved(hit.get().geometry(), hit.get().name());
    }
    if (ref instanceof CircleRegion c) {
      double metres = distanceMetres(c);
      double lon = normaliseLon(c.center().longitude());
      Geometry g = GeodesicCircle.around(c.center().latitude(), lon, metres, GF);
      return new Resolved(g, String.format(Locale.ROOT, "circle of %s %s around %.4f, %.4f",
          trim(c.radius().value()), c.radius().unit(), c.center().latitude(), lon));
    }
    if (ref instanceof BoxRegion b) {
      if (!(b.south() < b.north())) {
        throw QueryException.at(b, source, "the box's south edge (" + b.south() + ") must be below its north edge (" + b.north() + ")",
            "write box(south, west, north, east)");
      }
      double w = normaliseLon(b.west()), e = normaliseLon(b.east());
      if (!(w < e)) {
        throw QueryException.at(b, source, "the box's west edge (" + b.west() + ") must be west of its east edge (" + b.east() + ")",
            "boxes across the 180th meridian are not supported; split the box in two");
      }
      Geometry g = GF.createPolygon(new Coordinate[] {
        new Coordinate(w, b.south()), new Coordinate(e, b.south()), new Coordinate(e, b.north()),
        new Coordinate(w, b.north()), new Coordinate(w, b.south())});
      return new Resolved(g, String.format(Locale.ROOT, "box %.4f..%.4f N, %.4f..%.4f E", b.south(), b.north(), w, e));
    }
    if (ref instanceof WktRegion wkt) {
      Geometry g;
      try {
        g = new WKTReader(GF).read(wkt.wkt());
      } catch (ParseException e) {
        throw QueryException.at(wkt, source, "the WKT text is not valid: " + e.getMessage(),
            "write e.g. wkt \"POLYGON((lon lat, lon lat, lon lat, lon lat))\" with the first point repeated last");
      }
      if (!(g instanceof Polygonal) || g.isEmpty()) {
        throw QueryException.at(wkt, source, "a WKT region must be a POLYGON or MULTIPOLYGON, found " + g.getGeometryType(), "");
      }
      TopologyValidationError err = new IsValidOp(g).getValidationError();
      if (err != null) {
        throw QueryException.at(wkt, source, "the WKT polygon is not valid: " + err.getMessage()
            + (err.getCoordinate() != null ? " near " + err.getCoordinate().x + " " + err.getCoordinate().y : ""),
            "rings must be closed and must not cross themselves");
      }
      return new Resolved(g, "WKT polygon");
    }
    ClippedRegion c = (ClippedRegion) ref;
    Resolved a = resolve(c.region()), b = resolve(c.clip());
    Geometry g = a.geometry().intersection(b.geometry());
    if (g.isEmpty() || g.getArea() == 0) {
      throw QueryException.at(c, source, a.label() + " and " + b.label() + " do not overlap", "");
    }
    return new Resolved(g, a.label() + " clipped to " + b.label());
  }

  private double distanceMetres(CircleRegion c) {
    String unit = c.radius().unit().toLowerCase(Locale.ROOT);
    double v = c.radius().value();
    double m = switch (unit) {
      case "m" -> v;
      case "km" -> v * 1000;
      default -> throw QueryException.at(c.radius(), source, "a radius must be in m or km, not '" + c.radius().unit() + "'", "e.g. 3 km");
    };
    if (!(m > 0) || m > 2_000_000) {
      throw QueryException.at(c.radius(), source, "a radius must be above 0 and at most 2000 km", "");
    }
    return m;
  }

  private static double normaliseLon(double lon) {
    return lon >= 180 ? lon - 360 : lon;
  }

  private static String trim(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
