package org.slackwater.core.region;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class GeoJsonRegionsTest {

  @Test
  void readsPolygonsAndPointsWithARadius() {
    String fc = """
        {"type":"FeatureCollection","features":[
          {"type":"Feature","properties":{"name":"Box","kind":"segment"},
           "geometry":{"type":"Polygon","coordinates":[[[-31,44],[-30.9,44],[-30.9,44.1],[-31,44.1],[-31,44]]]}},
          {"type":"Feature","properties":{"name":"Intake","kind":"intake","radius_m":2000},
           "geometry":{"type":"Point","coordinates":[-31.2,44.1]}}]}""";
    List<Region> rs = GeoJsonRegions.parse(fc);
    assertEquals(2, rs.size());
    assertEquals("Box", rs.get(0).name());
    assertEquals(SphericalArea.cell(44, 44.1, -31, -30.9), rs.get(0).areaM2(), 1e-3);
    // Spherical cap of 2 km, to the polygon's 0.04 % shortfall.
    assertEquals(Math.PI * 2000 * 2000, rs.get(1).areaM2(), 1e-3 * Math.PI * 2000 * 2000);
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
    "{\"type\":\"Feature\",\"properties\":{},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[[0,0],[1,0],[1,1],[0,0]]]}}"
        + "|the feature has no 'name' property; add \"properties\": {\"name\": \"...\"}",
    "{\"type\":\"Feature\",\"properties\":{\"name\":\"X\"},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[[0,0],[1,0],[1,1],[0,1]]]}}"
        + "|the feature ('X') outer ring is not closed: its last position must repeat the first",
    "{\"type\":\"Feature\",\"properties\":{\"name\":\"X\"},\"geometry\":{\"type\":\"Point\",\"coordinates\":[0,0]}}"
        + "|the feature ('X'): a Point region needs a positive 'radius_m' property (metres)",
    "{\"type\":\"Feature\",\"properties\":{\"name\":\"X\"},\"geometry\":{\"type\":\"LineString\",\"coordinates\":[[0,0],[1,1]]}}"
        + "|the feature ('X'): geometry type 'LineString' cannot be a region; use Polygon, MultiPolygon, or Point with radius_m",
    "{\"type\":\"Feature\",\"properties\":{\"name\":\"X\"},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[[0,0],[1,1],[1,0],[0,1],[0,0]]]}}"
        + "|the feature ('X') is not a valid polygon: Self-intersection near lon 0.5, lat 0.5; fix the outline (rings must be closed and must not cross themselves)",
    "{\"type\":\"Feature\",\"properties\":{\"name\":\"X\"},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[[44,-31],[44,-30],[45,-30],[45,200],[44,-31]]]}}"
        + "|the feature ('X') outer ring position 4: [45.0, 200.0] is out of range; positions are [longitude, latitude] in degrees",
    "[1,2]|expected a GeoJSON FeatureCollection or Feature object",
  })
  void badRegionsGetClearErrors(String json, String message) {
    RegionException e = assertThrows(RegionException.class, () -> GeoJsonRegions.parse(json));
    assertEquals(message, e.getMessage());
  }
}
