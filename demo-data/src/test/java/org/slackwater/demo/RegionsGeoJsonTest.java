package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.valid.IsValidOp;

/** regions.geojson: RFC 7946 structure, JTS validity (OGC Simple Features rules), tiling, intakes. */
class RegionsGeoJsonTest {

  private static RegionsFile regions;

  @BeforeAll
  static void read() throws IOException {
    regions = new RegionsFile(SmallScenario.get().regions());
  }

  @Test
  void isAFeatureCollectionWithTheNamedRegions() {
    assertEquals("FeatureCollection", regions.root.get("type").asText());
    assertEquals(Map.of("Upper Reach", "segment", "Mid Reach", "segment", "Outer Bay", "segment",
        "Harle Watershed", "watershed", "North Intake", "intake", "Harle Intake", "intake"), regions.kinds);
    for (JsonNode f : regions.root.get("features")) {
      assertEquals("Feature", f.get("type").asText());
    }
  }

  @Test
  void polygonsAreValidClosedAndCounterClockwise() {
    for (Map.Entry<String, Polygon> e : regions.polygons.entrySet()) {
      Polygon p = e.getValue();
      IsValidOp op = new IsValidOp(p);
      assertTrue(op.isValid(), e.getKey() + ": " + op.getValidationError());
      // RFC 7946 section 3.1.6: exterior rings are counter-clockwise (right-hand rule).
      assertTrue(Orientation.isCCW(p.getExteriorRing().getCoordinates()), e.getKey() + " ring is CCW");
      assertTrue(p.getExteriorRing().isClosed());
      // Coordinates are [lon, lat] (RFC 7946 section 3.1.1): all in the invented box near 44 N, 31 W.
      for (var c : p.getCoordinates()) {
        assertTrue(c.x > -33 && c.x < -30 && c.y > 43 && c.y < 45.5, e.getKey() + " vertex " + c);
      }
    }
  }

  @Test
  void segmentsTileTheWaterWithoutOverlap() {
    List<Polygon> segs = List.of(regions.polygons.get("Upper Reach"), regions.polygons.get("Mid Reach"),
        regions.polygons.get("Outer Bay"));
    double sum = 0;
    for (int i = 0; i < segs.size(); i++) {
      sum += segs.get(i).getArea();
      for (int j = i + 1; j < segs.size(); j++) {
        double overlap = segs.get(i).intersection(segs.get(j)).getArea();
        assertTrue(overlap < 1e-9 * sum, "segments " + i + " and " + j + " overlap by " + overlap);
      }
    }
    Geometry union = regions.water();
    assertEquals("Polygon", union.getGeometryType(), "segments touch along shared edges into one water body");
    assertEquals(sum, union.getArea(), 1e-9 * sum);
    // Widths grow seaward: Upper Reach narrow, Outer Bay widest.
    assertTrue(segs.get(0).getArea() < segs.get(1).getArea() && segs.get(1).getArea() < segs.get(2).getArea());
  }

  @Test
  void watershedIsIrregularInlandAndDry() {
    Polygon w = regions.polygons.get("Harle Watershed");
    int vertices = w.getExteriorRing().getNumPoints() - 1;
    assertTrue(vertices >= 15 && vertices <= 30, vertices + " vertices");
    var env = w.getEnvelopeInternal();
    assertTrue(env.getMinY() > 44.2 && env.getMaxY() < 45.0 && env.getMinX() > -32.25 && env.getMaxX() < -31.3,
        "watershed envelope " + env);
    assertTrue(w.intersection(regions.water()).getArea() < 1e-12, "watershed does not overlap the water");
  }

  @Test
  void intakesLieInsideTheirSegmentsWithRadius() {
    Map<String, String> segmentOf = Map.of("North Intake", "Mid Reach", "Harle Intake", "Upper Reach");
    Map<String, Double> radius = Map.of("North Intake", 3000.0, "Harle Intake", 2000.0);
    assertEquals(Set.of("North Intake", "Harle Intake"), regions.points.keySet());
    for (var e : regions.points.entrySet()) {
      assertTrue(regions.polygons.get(segmentOf.get(e.getKey())).contains(e.getValue()), e.getKey());
      assertEquals(radius.get(e.getKey()), regions.properties.get(e.getKey()).get("radius_m").asDouble());
    }
  }
}
