package org.slackwater.demo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Point;
import org.locationtech.jts.geom.Polygon;

/** regions.geojson parsed independently of the generator: Jackson for the JSON, JTS for geometry. */
final class RegionsFile {

  final JsonNode root;
  final Map<String, Polygon> polygons = new LinkedHashMap<>();
  final Map<String, String> kinds = new LinkedHashMap<>();
  final Map<String, Point> points = new LinkedHashMap<>();
  final Map<String, JsonNode> properties = new LinkedHashMap<>();
  private final GeometryFactory gf = new GeometryFactory();

  RegionsFile(Path file) throws IOException {
    root = new ObjectMapper().readTree(file.toFile());
    for (JsonNode f : root.get("features")) {
      JsonNode props = f.get("properties");
      String name = props.get("name").asText();
      kinds.put(name, props.get("kind").asText());
      properties.put(name, props);
      JsonNode g = f.get("geometry");
      if (g.get("type").asText().equals("Polygon")) {
        JsonNode ring = g.get("coordinates").get(0);
        Coordinate[] cs = new Coordinate[ring.size()];
        for (int i = 0; i < ring.size(); i++) {
          cs[i] = new Coordinate(ring.get(i).get(0).asDouble(), ring.get(i).get(1).asDouble());
        }
        polygons.put(name, gf.createPolygon(cs));
      } else {
        JsonNode c = g.get("coordinates");
        points.put(name, gf.createPoint(new Coordinate(c.get(0).asDouble(), c.get(1).asDouble())));
      }
    }
  }

  Geometry water() {
    return gf.buildGeometry(polygons.entrySet().stream().filter(e -> kinds.get(e.getKey()).equals("segment"))
        .map(Map.Entry::getValue).toList()).union();
  }

  Point point(double lon, double lat) {
    return gf.createPoint(new Coordinate(lon, lat));
  }
}
