package org.slackwater.core.catalog;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.LinkedHashMap;
import java.util.Map;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;

/** The catalog's JSON form of a {@link CubeDescriptor}; round-trips exactly (doubles as JSON numbers). */
final class DescriptorJson {
  private static final ObjectMapper JSON = new ObjectMapper();

  private DescriptorJson() {}

  static String write(CubeDescriptor d) {
    ObjectNode o = JSON.createObjectNode();
    o.put("variable", d.variable());
    o.put("standardName", d.standardName());
    o.put("longName", d.longName());
    o.put("units", d.units());
    o.put("sourceUnits", d.sourceUnits());
    ObjectNode g = o.putObject("grid");
    array(g.putArray("latLower"), d.grid().latLower());
    array(g.putArray("latUpper"), d.grid().latUpper());
    array(g.putArray("lonLower"), d.grid().lonLower());
    array(g.putArray("lonUpper"), d.grid().lonUpper());
    ObjectNode t = o.putObject("time");
    t.put("calendar", d.time().calendar());
    t.put("units", d.time().units());
    t.put("alignment", d.time().alignment().name());
    ArrayNode s = t.putArray("epochSeconds");
    for (long v : d.time().epochSeconds()) {
      s.add(v);
    }
    ObjectNode a = o.putObject("attributes");
    d.attributes().forEach(a::put);
    return o.toString();
  }

  static CubeDescriptor read(String text) {
    try {
      JsonNode o = JSON.readTree(text);
      JsonNode g = o.get("grid");
      LatLonGrid grid = new LatLonGrid(doubles(g.get("latLower")), doubles(g.get("latUpper")), doubles(g.get("lonLower")), doubles(g.get("lonUpper")));
      JsonNode t = o.get("time");
      JsonNode s = t.get("epochSeconds");
      long[] secs = new long[s.size()];
      for (int i = 0; i < secs.length; i++) {
        secs[i] = s.get(i).asLong();
      }
      TimeAxis time = new TimeAxis(t.get("calendar").asText(), t.get("units").asText(), TimeAxis.Alignment.valueOf(t.get("alignment").asText()), secs);
      Map<String, String> attrs = new LinkedHashMap<>();
      o.path("attributes").fields().forEachRemaining(e -> attrs.put(e.getKey(), e.getValue().asText()));
      return new CubeDescriptor(o.get("variable").asText(), o.get("standardName").asText(), o.get("longName").asText(),
          o.get("units").asText(), o.get("sourceUnits").asText(), grid, time, attrs);
    } catch (Exception e) {
      throw new IllegalStateException("the catalog holds a cube description it cannot read: " + e.getMessage(), e);
    }
  }

  private static void array(ArrayNode a, double[] v) {
    for (double d : v) {
      a.add(d);
    }
  }

  private static double[] doubles(JsonNode a) {
    double[] v = new double[a.size()];
    for (int i = 0; i < v.length; i++) {
      v[i] = a.get(i).asDouble();
    }
    return v;
  }
}
