package org.slackwater.demo;

import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.locationtech.jts.geom.Coordinate;

/**
 * regions.geojson (RFC 7946): a FeatureCollection of the three bay segments and the watershed
 * (Polygons, counter-clockwise outer rings) and the intakes (Points with {@code radius_m}). Every
 * feature has {@code name} and {@code kind}; intakes also name their {@code segment}. LF line ends, so
 * the bytes do not depend on the platform.
 */
final class RegionsGeoJson {

  private RegionsGeoJson() {
  }

  static void write(Path file, WrenmouthGeography geo) throws IOException {
    ObjectMapper json = new ObjectMapper();
    ObjectNode root = json.createObjectNode();
    root.put("type", "FeatureCollection");
    ArrayNode features = root.putArray("features");
    for (Region r : geo.segments()) {
      features.add(polygon(json, r));
    }
    features.add(polygon(json, geo.watershed()));
    for (Intake i : geo.intakes()) {
      ObjectNode f = feature(json, i.name(), RegionKind.INTAKE);
      ((ObjectNode) f.get("properties")).put("radius_m", i.radiusM()).put("segment", i.segment());
      ObjectNode g = f.putObject("geometry");
      g.put("type", "Point");
      g.putArray("coordinates").add(number(i.lon())).add(number(i.lat()));
      features.add(f);
    }
    DefaultPrettyPrinter pretty = new DefaultPrettyPrinter()
        .withObjectIndenter(new DefaultIndenter("  ", "\n"))
        .withArrayIndenter(new DefaultIndenter("  ", "\n"));
    Files.writeString(file, json.writer(pretty).writeValueAsString(root) + "\n");
  }

  private static ObjectNode feature(ObjectMapper json, String name, RegionKind kind) {
    ObjectNode f = json.createObjectNode();
    f.put("type", "Feature");
    f.putObject("properties").put("name", name).put("kind", kind.geoJsonName());
    return f;
  }

  private static ObjectNode polygon(ObjectMapper json, Region r) {
    ObjectNode f = feature(json, r.name(), r.kind());
    ObjectNode g = f.putObject("geometry");
    g.put("type", "Polygon");
    ArrayNode ring = g.putArray("coordinates").addArray();
    for (Coordinate c : r.polygon().getExteriorRing().getCoordinates()) {
      ring.addArray().add(number(c.x)).add(number(c.y));
    }
    return f;
  }

  /** Degrees to 1e-6; Double.toString keeps them in plain notation for this range of magnitudes. */
  private static double number(double deg) {
    return WrenmouthGeography.round(deg);
  }
}
