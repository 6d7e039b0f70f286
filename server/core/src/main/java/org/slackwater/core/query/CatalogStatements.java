package org.slackwater.core.query;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.region.Region;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;
import org.slackwater.query.Suggestions;
import org.slackwater.query.ast.DescribeVariable;

/** The catalog questions: {@code list variables}, {@code describe <variable>}, {@code list regions}. */
final class CatalogStatements {
  private final Catalog catalog;
  private final String source;

  CatalogStatements(Catalog catalog, String source) {
    this.catalog = catalog;
    this.source = source;
  }

  ResultTable listVariables() {
    List<CubeEntry> cubes = catalog.cubes();
    int n = cubes.size();
    String[] name = new String[n], units = new String[n], std = new String[n], first = new String[n], last = new String[n],
        calendar = new String[n], grid = new String[n];
    long[] steps = new long[n], version = new long[n];
    for (int i = 0; i < n; i++) {
      CubeEntry c = cubes.get(i);
      CubeDescriptor d = c.descriptor();
      name[i] = c.name();
      units[i] = d.units();
      std[i] = d.standardName();
      first[i] = d.time().size() > 0 ? d.time().date(0).toString() : null;
      last[i] = d.time().size() > 0 ? d.time().date(d.time().size() - 1).toString() : null;
      steps[i] = d.time().size();
      calendar[i] = d.time().calendar();
      grid[i] = d.grid().ny() + " x " + d.grid().nx();
      version[i] = c.version();
    }
    return new ResultTable("variables", List.of(
        new Column.Strings("variable", name), new Column.Strings("units", units), new Column.Strings("standard_name", std),
        new Column.Strings("first", first), new Column.Strings("last", last), new Column.Longs("steps", "", steps),
        new Column.Strings("calendar", calendar), new Column.Strings("grid", grid), new Column.Longs("version", "", version)),
        Map.of(), List.of());
  }

  /** Fails with a positioned error if the variable is unknown. */
  CubeEntry check(DescribeVariable d) {
    Optional<CubeEntry> hit = catalog.cube(d.variable().name());
    if (hit.isEmpty()) {
      throw SeriesPlanner.unknownVariable(catalog, d.variable(), source);
    }
    return hit.get();
  }

  ResultTable describe(DescribeVariable d) {
    CubeEntry c = check(d);
    CubeDescriptor desc = c.descriptor();
    LatLonGrid g = desc.grid();
    Map<String, String> p = new LinkedHashMap<>();
    p.put("variable", c.name());
    p.put("version", Integer.toString(c.version()));
    p.put("units", desc.units());
    p.put("source_units", desc.sourceUnits());
    p.put("standard_name", desc.standardName());
    p.put("long_name", desc.longName());
    p.put("first", desc.time().size() > 0 ? desc.time().instant(0).toString() : "");
    p.put("last", desc.time().size() > 0 ? desc.time().instant(desc.time().size() - 1).toString() : "");
    p.put("steps", Integer.toString(desc.time().size()));
    p.put("calendar", desc.time().calendar());
    p.put("time_units", desc.time().units());
    p.put("time_alignment", desc.time().alignment().name().toLowerCase());
    p.put("grid", g.ny() + " rows x " + g.nx() + " columns");
    p.put("latitude", g.latLower(0) + " .. " + g.latUpper(g.ny() - 1));
    p.put("longitude", g.lonLower(0) + " .. " + g.lonUpper(g.nx() - 1));
    p.put("chunking", c.layout().steps() + " steps x " + c.layout().rows() + " x " + c.layout().columns());
    p.put("chunks", Integer.toString(c.chunks().size()));
    p.put("stored_bytes", Long.toString(c.bytes()));
    p.put("source_file", c.provenance().sourceFile());
    p.put("source_sha256", c.provenance().sourceSha256());
    p.put("source_variable", c.provenance().sourceVariable());
    p.put("reader", c.provenance().reader());
    p.put("ingested_at", c.provenance().ingestedAt().toString());
    desc.attributes().forEach((k, v) -> p.put("attribute:" + k, v));
    List<String> keys = new ArrayList<>(p.keySet());
    return new ResultTable("description of " + c.name(), List.of(
        new Column.Strings("property", keys.toArray(String[]::new)),
        new Column.Strings("value", keys.stream().map(p::get).toArray(String[]::new))), Map.of(), List.of());
  }

  ResultTable listRegions() {
    List<Region> regions = catalog.regions();
    int n = regions.size();
    String[] name = new String[n], kind = new String[n];
    double[] area = new double[n];
    for (int i = 0; i < n; i++) {
      name[i] = regions.get(i).name();
      kind[i] = regions.get(i).kind();
      area[i] = regions.get(i).areaM2() / 1e6;
    }
    return new ResultTable("regions", List.of(new Column.Strings("region", name), new Column.Strings("kind", kind),
        new Column.Doubles("area", "km2", area)), Map.of(), List.of());
  }

  static QueryException unknown(String what, String name, List<String> known, org.slackwater.query.ast.Node at, String source) {
    Optional<String> near = Suggestions.nearest(name, known);
    return QueryException.at(at, source, "unknown " + what + " '" + name + "'",
        near.map(s -> "did you mean '" + s + "'?").orElse(known.isEmpty() ? "nothing is loaded yet" : "known: " + String.join(", ", known)));
  }
}
