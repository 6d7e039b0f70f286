package org.slackwater.core.region;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.List;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.valid.IsValidOp;
import org.locationtech.jts.operation.valid.TopologyValidationError;

/**
 * Reads regions from GeoJSON (RFC 7946): a FeatureCollection or a single Feature whose geometry is
 * a Polygon or MultiPolygon, or a Point with a {@code radius_m} property (buffered into a {@link
 * GeodesicCircle}). Each feature needs a {@code name} property.
 *
 * <p>Every problem is a {@link RegionException} saying which feature and what to fix; invalid
 * polygons (self-intersections, unclosed rings) are refused rather than repaired, because a
 * silently repaired outline would change the area being averaged.
 */
public final class GeoJsonRegions {

  private static final ObjectMapper JSON = new ObjectMapper();
  private static final GeometryFactory GF = new GeometryFactory();

  private GeoJsonRegions() {}

  public static List<Region> parse(String text) {
    JsonNode root = object(text, "expected a GeoJSON FeatureCollection or Feature object");
    String type = root.path("type").asText("");
    List<Region> out = new ArrayList<>();
    switch (type) {
      case "FeatureCollection" -> {
        JsonNode features = root.path("features");
        if (!features.isArray()) {
          throw new RegionException("the FeatureCollection has no 'features' array");
        }
        for (int i = 0; i < features.size(); i++) {
          out.add(feature(features.get(i), "feature " + (i + 1), null));
        }
      }
      case "Feature" -> out.add(feature(root, "the feature", null));
      default -> throw new RegionException("expected a GeoJSON FeatureCollection or Feature, found type '" + type + "'");
    }
    return out;
  }

  /** Parses one Feature, or a bare geometry, naming it {@code name} (used by {@code PUT /api/regions/{name}}). */
  public static Region parseNamed(String name, String text) {
    JsonNode root = object(text, "expected a GeoJSON Feature or geometry object");
    if ("Feature".equals(root.path("type").asText())) {
      return feature(root, "the feature", name);
    }
    return new Region(name, "custom", geometry(root, JSON.createObjectNode(), "the geometry"), root.toString());
  }

  /** The text as a JSON object, or a RegionException saying where the JSON is broken. */
  private static JsonNode object(String text, String notAnObject) {
    JsonNode root;
    try {
      root = JSON.readTree(text);
    } catch (JsonProcessingException e) {
      throw new RegionException("not valid JSON at line " + e.getLocation().getLineNr() + ", column "
          + e.getLocation().getColumnNr() + ": " + e.getOriginalMessage());
    }
    if (root == null || !root.isObject()) {
      throw new RegionException(notAnObject);
    }
    return root;
  }

  private static Region feature(JsonNode f, String where, String forcedName) {
    if (!"Feature".equals(f.path("type").asText())) {
      throw new RegionException(where + " is not a GeoJSON Feature");
    }
    JsonNode props = f.path("properties");
    String name = forcedName != null ? forcedName : props.path("name").asText("").trim();
    if (name.isEmpty()) {
      throw new RegionException(where + " has no 'name' property; add \"properties\": {\"name\": \"...\"}");
    }
    String label = where + " ('" + name + "')";
    Geometry g = geometry(f.path("geometry"), props, label);
    return new Region(name, props.path("kind").asText("custom"), g, f.toString());
  }

  private static Geometry geometry(JsonNode g, JsonNode props, String where) {
    String type = g.path("type").asText("");
    JsonNode coords = g.path("coordinates");
    Geometry out = switch (type) {
      case "Polygon" -> polygon(coords, where);
      case "MultiPolygon" -> {
        if (!coords.isArray() || coords.isEmpty()) {
          throw new RegionException(where + ": a MultiPolygon needs a non-empty coordinates array");
        }
        Polygon[] parts = new Polygon[coords.size()];
        for (int i = 0; i < parts.length; i++) {
          parts[i] = polygon(coords.get(i), where + " part " + (i + 1));
        }
        yield GF.createMultiPolygon(parts);
      }
      case "Point" -> {
        JsonNode r = props.path("radius_m");
        if (!r.isNumber() || !(r.asDouble() > 0)) {
          throw new RegionException(where + ": a Point region needs a positive 'radius_m' property (metres)");
        }
        Coordinate c = position(coords, where);
        yield GeodesicCircle.around(c.y, c.x, r.asDouble(), GF);
      }
      case "" -> throw new RegionException(where + " has no geometry");
      default -> throw new RegionException(where + ": geometry type '" + type + "' cannot be a region; use Polygon, MultiPolygon, or Point with radius_m");
    };
    TopologyValidationError err = new IsValidOp(out).getValidationError();
    if (err != null) {
      Coordinate c = err.getCoordinate();
      throw new RegionException(where + " is not a valid polygon: " + err.getMessage()
          + (c != null ? " near lon " + c.x + ", lat " + c.y : "") + "; fix the outline (rings must be closed and must not cross themselves)");
    }
    return out;
  }

  private static Polygon polygon(JsonNode rings, String where) {
    if (!rings.isArray() || rings.isEmpty()) {
      throw new RegionException(where + ": a Polygon needs at least one ring of coordinates");
    }
    LinearRing shell = ring(rings.get(0), where + " outer ring");
    LinearRing[] holes = new LinearRing[rings.size() - 1];
    for (int i = 1; i < rings.size(); i++) {
      holes[i - 1] = ring(rings.get(i), where + " hole " + i);
    }
    return GF.createPolygon(shell, holes);
  }

  private static LinearRing ring(JsonNode pts, String where) {
    if (!pts.isArray() || pts.size() < 4) {
      throw new RegionException(where + " needs at least 4 positions (the first repeated at the end)");
    }
    Coordinate[] c = new Coordinate[pts.size()];
    for (int i = 0; i < c.length; i++) {
      c[i] = position(pts.get(i), where + " position " + (i + 1));
    }
    if (!c[0].equals2D(c[c.length - 1])) {
      throw new RegionException(where + " is not closed: its last position must repeat the first");
    }
    return GF.createLinearRing(c);
  }

  private static Coordinate position(JsonNode p, String where) {
    if (!p.isArray() || p.size() < 2 || !p.get(0).isNumber() || !p.get(1).isNumber()) {
      throw new RegionException(where + ": a position must be [longitude, latitude]");
    }
    double lon = p.get(0).asDouble(), lat = p.get(1).asDouble();
    if (lat < -90 || lat > 90 || lon < -180 || lon > 360) {
      throw new RegionException(where + ": [" + lon + ", " + lat + "] is out of range; positions are [longitude, latitude] in degrees");
    }
    return new Coordinate(lon, lat);
  }
}
