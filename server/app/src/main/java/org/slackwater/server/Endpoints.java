package org.slackwater.server;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import io.netty.handler.codec.http.HttpResponseStatus;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.slackwater.core.Workspace;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.StoredWatch;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.ingest.IngestException;
import org.slackwater.core.ingest.IngestReport;
import org.slackwater.core.query.QueryEngine;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.region.GeoJsonRegions;
import org.slackwater.core.region.Region;
import org.slackwater.core.region.RegionException;
import org.apache.arrow.memory.BufferAllocator;
import org.slackwater.core.result.ArrowResultWriter;
import org.slackwater.core.result.CsvWriter;
import org.slackwater.core.result.JsonWriter;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.result.TableStream;
import org.slackwater.query.QueryException;

/** What each route does, independent of Netty: request parts in, a {@link Reply} out. */
final class Endpoints {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final String JSON_TYPE = "application/json";
  /** RFC 4180 with the header row (RFC 4180 section 3, optional header parameter). */
  private static final String CSV_TYPE = "text/csv; charset=utf-8; header=present";

  private final Workspace workspace;
  private final ServerConfig config;

  private final WatchService watchService;

  Endpoints(Workspace workspace, ServerConfig config, WatchService watchService) {
    this.workspace = workspace;
    this.config = config;
    this.watchService = watchService;
  }

  Reply health() {
    ObjectNode o = JSON.createObjectNode();
    o.put("status", "ok");
    o.put("cubes", workspace.catalog().cubes().size());
    o.put("regions", workspace.catalog().regions().size());
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, o.toString());
  }

  Reply query(String text, String formatParam, String accept) {
    return query(text, formatParam, accept, PlotSize.DEFAULT);
  }

  Reply query(String text, String formatParam, String accept, PlotSize size) {
    Optional<ResultFormat> format = ResultFormat.choose(formatParam, accept);
    if (format.isEmpty()) {
      return Problem.of(HttpResponseStatus.NOT_ACCEPTABLE, "No such result format",
          "results come as " + ResultFormat.names() + "; ask with ?format= or the Accept header");
    }
    if (text.isBlank()) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The query cannot be run",
          "the request body is empty; send the query text as the body, e.g. 'list variables'");
    }
    QueryEngine.Answer answer;
    try {
      answer = workspace.engine().open(text);
    } catch (QueryException e) {
      return Problem.query(e);
    }
    if (answer instanceof QueryEngine.Answer.Rows rows) {
      return stream(rows.stream(), format.get());
    }
    List<ResultTable> tables = ((QueryEngine.Answer.Tables) answer).tables();
    if (format.get() == ResultFormat.PNG) {
      return plot(tables, size);
    }
    return write(tables, format.get());
  }

  /** A cell export, written row batch by row batch while it is sent (no PNG: it is rows, not a picture). */
  private Reply stream(TableStream rows, ResultFormat format) {
    if (format == ResultFormat.PNG) {
      rows.close();
      return Problem.of(HttpResponseStatus.UNPROCESSABLE_ENTITY, "No plot for these results",
          "a cell export is the cube's values row by row and has no plot; ask for it as csv, json or arrow,"
              + " or draw a map ('map mean <variable> over <region> ...')");
    }
    String type = switch (format) {
      case ARROW -> ResultFormat.ARROW.mediaType;
      case CSV -> CSV_TYPE;
      default -> JSON_TYPE;
    };
    return Reply.streamed(type, out -> {
      try (rows) {
        switch (format) {
          case ARROW -> {
            try (BufferAllocator a = workspace.allocator().newChildAllocator("export", 0, Long.MAX_VALUE)) {
              ArrowResultWriter.write(rows, a, out);
            }
          }
          case CSV -> CsvWriter.write(rows, new java.io.BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16));
          default -> JsonWriter.write(rows, List.of(), out);
        }
      }
    });
  }

  /** One PNG for the query's results; a result without a plot (catalog, watch) is a 422. */
  static Reply plot(List<ResultTable> tables, PlotSize size) {
    org.slackwater.render.PlotOptions options;
    try {
      options = size.options();
    } catch (IllegalArgumentException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad plot size", e.getMessage());
    }
    try {
      return Reply.of(HttpResponseStatus.OK, ResultFormat.PNG.mediaType, org.slackwater.render.PngRenderer.render(tables, options));
    } catch (org.slackwater.render.PlotException e) {
      return Problem.of(HttpResponseStatus.UNPROCESSABLE_ENTITY, "No plot for these results", e.getMessage());
    }
  }

  private Reply write(List<ResultTable> tables, ResultFormat format) {
    if (format == ResultFormat.PNG) {
      return plot(tables, PlotSize.DEFAULT);
    }
    try {
      ByteArrayOutputStream out = new ByteArrayOutputStream();
      if (format != ResultFormat.JSON) {
        // Definitions (let) report themselves in JSON; a CSV or Arrow stream holds the one table the request computes.
        List<ResultTable> computed = tables.stream().filter(t -> !t.metadata().containsKey("definition_only")).toList();
        if (computed.size() == 1) {
          tables = computed;
        }
        if (tables.size() != 1) {
          return Problem.of(HttpResponseStatus.NOT_ACCEPTABLE, "One table per " + format.name,
              "the query has " + tables.size() + " statements but " + format.name + " holds one table; ask for ?format=json or send one statement");
        }
        if (format == ResultFormat.ARROW) {
          try (BufferAllocator a = workspace.allocator().newChildAllocator("result", 0, Long.MAX_VALUE)) {
            ArrowResultWriter.write(tables.get(0), a, out);
          }
          return Reply.of(HttpResponseStatus.OK, ResultFormat.ARROW.mediaType, out.toByteArray());
        }
        CsvWriter.write(tables.get(0), new OutputStreamWriter(out, StandardCharsets.UTF_8));
        return Reply.of(HttpResponseStatus.OK, CSV_TYPE, out.toByteArray());
      }
      // Watch checks (and, later, alerts) carry a caution; JSON puts it beside the results too.
      JsonWriter.write(tables, tables.stream().map(t -> t.metadata().get("caution")).filter(java.util.Objects::nonNull).distinct().toList(), out);
      return Reply.of(HttpResponseStatus.OK, JSON_TYPE, out.toByteArray());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Station samples (CSV body) against a cube; the result format follows the same rules as queries. */
  Reply matchUps(String body, String variable, String window, String formatParam, String accept) {
    Optional<ResultFormat> format = ResultFormat.choose(formatParam, accept);
    if (format.isEmpty()) {
      return Problem.of(HttpResponseStatus.NOT_ACCEPTABLE, "No such result format", "results come as " + ResultFormat.names());
    }
    if (variable == null || variable.isBlank()) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Which variable?", "add ?variable=NAME, e.g. ?variable=chlorophyll");
    }
    ResultTable t;
    try {
      t = workspace.engine().matchUps(variable, body, window == null ? 0 : Integer.parseInt(window));
    } catch (NumberFormatException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The match-up request is not valid", "window must be a whole number of days");
    } catch (IllegalArgumentException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The match-up request is not valid", e.getMessage());
    }
    return write(List.of(t), format.get());
  }

  Reply cubes() {
    ArrayNode a = JSON.createArrayNode();
    for (CubeEntry c : workspace.catalog().cubes()) {
      a.add(cubeJson(c));
    }
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, a.toString());
  }

  Reply cube(String name) {
    return workspace.catalog().cube(name)
        .map(c -> Reply.text(HttpResponseStatus.OK, JSON_TYPE, cubeJson(c).toString()))
        .orElseGet(() -> Problem.of(HttpResponseStatus.NOT_FOUND, "No such cube", "there is no cube named '" + name + "'; GET /api/cubes lists them"));
  }

  Reply regions() {
    ObjectNode fc = JSON.createObjectNode();
    fc.put("type", "FeatureCollection");
    ArrayNode features = fc.putArray("features");
    for (Region r : workspace.catalog().regions()) {
      try {
        JsonNode f = JSON.readTree(r.geoJson());
        ObjectNode feature = f.isObject() && "Feature".equals(f.path("type").asText()) ? (ObjectNode) f : wrap(f);
        ObjectNode props = feature.with("properties");
        props.put("name", r.name());
        props.put("kind", r.kind());
        props.put("area_km2", r.areaM2() / 1e6);
        features.add(feature);
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
    return Reply.text(HttpResponseStatus.OK, "application/geo+json", fc.toString());
  }

  Reply putRegion(String name, String body) {
    Region r;
    try {
      r = GeoJsonRegions.parseNamed(name, body);
    } catch (RegionException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The region cannot be stored", e.getMessage());
    }
    workspace.catalog().putRegion(r);
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, JSON.createObjectNode().put("region", r.name()).put("area_km2", r.areaM2() / 1e6).toString());
  }

  /** Ingests a file under the configured ingest root, named by a relative path in {"path": "..."}. */
  Reply ingest(String body) {
    if (config.ingestRoot().isEmpty()) {
      return Problem.of(HttpResponseStatus.FORBIDDEN, "Server-side ingest is off", "start the server with --ingest-root DIR to allow ingesting files under DIR");
    }
    String rel;
    org.slackwater.core.ingest.IngestOptions options = org.slackwater.core.ingest.IngestOptions.defaults();
    try {
      JsonNode req = JSON.readTree(body);
      rel = req.path("path").asText("");
      options = req.path("reprocessed").asBoolean(false) ? options.asReprocessed() : options;
      options = req.path("replace_cube").asBoolean(false) ? options.replacingCube() : options;
    } catch (IOException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The ingest request is not JSON",
          "send {\"path\": \"relative/path/file.nc\"}, optionally with \"reprocessed\": true or \"replace_cube\": true");
    }
    Path root = config.ingestRoot().get().toAbsolutePath().normalize();
    Path file = root.resolve(rel).normalize();
    if (rel.isBlank() || !file.startsWith(root)) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "The path is not under the ingest root", "give a path relative to the ingest root, without '..'");
    }
    if (!Files.isRegularFile(file)) {
      return Problem.of(HttpResponseStatus.NOT_FOUND, "No such file", "there is no file '" + rel + "' under the ingest root");
    }
    try {
      List<IngestReport> reports = workspace.ingestor().ingest(file, options);
      ArrayNode a = JSON.createArrayNode();
      for (IngestReport r : reports) {
        ObjectNode o = a.addObject().put("cube", r.cube()).put("change", r.change().name().toLowerCase(java.util.Locale.ROOT))
            .put("version", r.version()).put("values", r.values()).put("seconds", r.seconds()).put("summary", r.summary());
        o.put("previous_version", r.previousVersion());
        r.appended().ifPresent(x -> o.put("appended", x.toString()));
        r.replaced().ifPresent(x -> o.put("replaced", x.toString()));
        ArrayNode gaps = o.putArray("gaps");
        r.gaps().forEach(g -> gaps.add(g.toString()));
        o.put("note", r.note());
      }
      return Reply.text(HttpResponseStatus.OK, JSON_TYPE, a.toString());
    } catch (IngestException e) {
      return Problem.of(HttpResponseStatus.UNPROCESSABLE_ENTITY, "The file cannot be ingested", e.getMessage());
    }
  }

  Reply watches() {
    ObjectNode o = JSON.createObjectNode();
    ArrayNode a = o.putArray("watches");
    for (StoredWatch w : workspace.catalog().watches()) {
      a.addObject().put("name", w.name()).put("version", w.version()).put("created", w.created().toString()).put("text", w.text());
    }
    o.put("caution", WatchStatements.CAUTION);
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, o.toString());
  }

  /** Checks and stores a watch definition (the body is its text); the owner is recorded as the token's SHA-256. */
  Reply putWatch(String body, String token) {
    QueryEngine.CheckedWatch w;
    try {
      w = workspace.engine().checkWatch(body);
    } catch (QueryException e) {
      return Problem.query(e);
    }
    StoredWatch stored = workspace.catalog().putWatch(w.name(), w.text(), sha256(token));
    ObjectNode o = JSON.createObjectNode();
    o.put("name", stored.name()).put("version", stored.version()).put("created", stored.created().toString()).put("text", stored.text());
    o.put("caution", WatchStatements.CAUTION);
    return Reply.text(stored.version() == 1 ? HttpResponseStatus.CREATED : HttpResponseStatus.OK, JSON_TYPE, o.toString());
  }

  Reply deleteWatch(String name) {
    if (!workspace.catalog().removeWatch(name)) {
      return noSuchWatch(name);
    }
    watchService.ledger().forget(name);
    return Reply.of(HttpResponseStatus.NO_CONTENT, JSON_TYPE, new byte[0]);
  }

  private static Reply noSuchWatch(String name) {
    return Problem.of(HttpResponseStatus.NOT_FOUND, "No such watch", "there is no watch named '" + name + "'; GET /api/watches lists them");
  }

  /** One stored watch: its text, version, destinations (secrets hidden) and recorded transitions. */
  Reply watch(String name) {
    Optional<StoredWatch> w = watchService.watch(name);
    if (w.isEmpty()) {
      return noSuchWatch(name);
    }
    ObjectNode o = JSON.createObjectNode();
    o.put("name", w.get().name()).put("version", w.get().version()).put("created", w.get().created().toString()).put("text", w.get().text());
    watchService.ledger().evaluatedTo(w.get().name(), w.get().version()).ifPresent(d -> o.put("evaluated_to", d.toString()));
    ArrayNode ch = o.putArray("channels");
    watchService.channelSummary(w.get().name()).forEach(ch::add);
    ArrayNode tr = o.putArray("transitions");
    for (var t : watchService.ledger().transitions(w.get().name())) {
      ObjectNode n = tr.addObject().put("day", t.day().toString()).put("state", t.state().label()).put("level", t.level())
          .put("version", t.version()).put("key", t.key()).put("recorded_at", t.recordedAt().toString());
      ObjectNode v = n.putObject("values");
      t.values().forEach((k, x) -> {
        if (x == null) {
          v.putNull(k);
        } else {
          v.put(k, x);
        }
      });
    }
    o.put("caution", WatchStatements.CAUTION);
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, o.toString());
  }

  /** Evaluates a stored watch over {@code from..to} (default: its last 30 days of data), recording and alerting its transitions. */
  Reply evaluateWatch(String name, String from, String to, String formatParam, String accept, PlotSize size) {
    Optional<StoredWatch> w = watchService.watch(name);
    if (w.isEmpty()) {
      return noSuchWatch(name);
    }
    try {
      java.time.LocalDate last = workspace.engine().watchSpan(w.get().text())[1];
      java.time.LocalDate a = from == null ? last.minusDays(29) : day(from, "from");
      java.time.LocalDate b = to == null ? last : day(to, "to");
      if (b.isBefore(a)) {
        return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad date range", "'to' (" + b + ") is before 'from' (" + a + ")");
      }
      var run = watchService.evaluate(w.get(), a, b);
      return formatted(List.of(org.slackwater.core.watch.WatchTables.of(run, false)), formatParam, accept, size);
    } catch (IllegalArgumentException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad date", e.getMessage());
    } catch (QueryException e) {
      return Problem.query(e);
    }
  }

  /**
   * Runs a stored watch over its whole record against event dates (the body: one ISO date per
   * line, or a CSV whose first column holds them; a header line and lines starting with # are
   * skipped). Nothing is recorded or sent.
   */
  Reply backtestWatch(String name, String body, String lead, String formatParam, String accept, PlotSize size) {
    Optional<StoredWatch> w = watchService.watch(name);
    if (w.isEmpty()) {
      return noSuchWatch(name);
    }
    List<java.time.LocalDate> events = new java.util.ArrayList<>();
    int lineNo = 0;
    for (String line : body.split("\\R")) {
      lineNo++;
      String cell = line.split(",", 2)[0].trim().replace("\"", "");
      if (cell.isEmpty() || cell.startsWith("#")) {
        continue;
      }
      try {
        events.add(java.time.LocalDate.parse(cell));
      } catch (java.time.format.DateTimeParseException e) {
        if (lineNo == 1) {
          continue; // a header
        }
        return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad event date",
            "line " + lineNo + " of the event list: '" + cell + "' is not a date; give one YYYY-MM-DD per line (or as the first CSV column)");
      }
    }
    if (events.isEmpty()) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "No event dates", "send the event dates as the body, one YYYY-MM-DD per line");
    }
    int leadDays;
    try {
      leadDays = lead == null ? org.slackwater.core.watch.WatchBacktest.DEFAULT_LEAD_DAYS : Integer.parseInt(lead.trim());
      var result = org.slackwater.core.watch.WatchBacktest.of(watchService.history(w.get()), events, leadDays);
      return formatted(List.of(org.slackwater.core.watch.WatchBacktest.table(result)), formatParam, accept, size);
    } catch (NumberFormatException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad lead window", "lead must be a whole number of days, found '" + lead + "'");
    } catch (IllegalArgumentException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad lead window", e.getMessage());
    } catch (QueryException e) {
      return Problem.query(e);
    }
  }

  /**
   * The watch presets built on published guideline values, each with its source and limits; with
   * {@code region}, each preset's watch text for that region, checked against the data (ready to
   * store with POST /api/watches).
   */
  Reply watchPresets(String region) {
    ObjectNode o = JSON.createObjectNode();
    ArrayNode a = o.putArray("presets");
    for (var p : org.slackwater.core.watch.WatchPresets.ALL) {
      ObjectNode n = a.addObject().put("id", p.id()).put("title", p.title()).put("source", p.source()).put("limits", p.limits());
      if (region == null) {
        n.put("template", p.template());
        continue;
      }
      String text;
      try {
        text = p.text(region);
        workspace.engine().checkWatch(text);
      } catch (IllegalArgumentException e) {
        return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad region name", e.getMessage());
      } catch (QueryException e) {
        return Problem.of(HttpResponseStatus.UNPROCESSABLE_ENTITY, "The preset does not fit this server's data",
            "preset " + p.id() + " for region '" + region + "': " + e.detail() + (e.hint().isBlank() ? "" : " (" + e.hint() + ")"));
      }
      n.put("text", text);
    }
    o.put("caution", WatchStatements.CAUTION);
    return Reply.text(HttpResponseStatus.OK, JSON_TYPE, o.toString());
  }

  /** Stores a watch's alert destinations (a JSON array: webhook or e-mail channels). */
  Reply putWatchChannels(String name, String body) {
    Optional<StoredWatch> w = watchService.watch(name);
    if (w.isEmpty()) {
      return noSuchWatch(name);
    }
    try {
      watchService.setChannels(w.get().name(), body);
    } catch (org.slackwater.alerts.ChannelException e) {
      return Problem.of(HttpResponseStatus.BAD_REQUEST, "Bad alert destinations", e.getMessage());
    }
    return watch(w.get().name());
  }

  private Reply formatted(List<ResultTable> tables, String formatParam, String accept, PlotSize size) {
    Optional<ResultFormat> format = ResultFormat.choose(formatParam, accept == null || accept.isBlank() ? "application/json" : accept);
    if (format.isEmpty()) {
      return Problem.of(HttpResponseStatus.NOT_ACCEPTABLE, "No such result format", "results come as " + ResultFormat.names());
    }
    return format.get() == ResultFormat.PNG ? plot(tables, size) : write(tables, format.get());
  }

  private static java.time.LocalDate day(String text, String what) {
    try {
      return java.time.LocalDate.parse(text.trim());
    } catch (java.time.format.DateTimeParseException e) {
      throw new IllegalArgumentException(what + " must be a date YYYY-MM-DD, found '" + text + "'");
    }
  }

  private static String sha256(String s) {
    try {
      return java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256").digest(s.getBytes(StandardCharsets.UTF_8)));
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }

  Reply deleteCube(String name) {
    Optional<Integer> v = workspace.catalog().remove(name);
    if (v.isEmpty()) {
      return Problem.of(HttpResponseStatus.NOT_FOUND, "No such cube", "there is no cube named '" + name + "'");
    }
    try {
      workspace.store().deleteVersion(name, v.get());
    } catch (IOException e) {
      // The catalog no longer names it; the next start removes the files.
    }
    return Reply.of(HttpResponseStatus.NO_CONTENT, JSON_TYPE, new byte[0]);
  }

  private static ObjectNode wrap(JsonNode geometry) {
    ObjectNode f = JSON.createObjectNode();
    f.put("type", "Feature");
    f.set("geometry", geometry);
    f.putObject("properties");
    return f;
  }

  private static ObjectNode cubeJson(CubeEntry c) {
    CubeDescriptor d = c.descriptor();
    LatLonGrid g = d.grid();
    ObjectNode o = JSON.createObjectNode();
    o.put("name", c.name());
    o.put("version", c.version());
    o.put("units", d.units());
    o.put("source_units", d.sourceUnits());
    o.put("standard_name", d.standardName());
    o.put("long_name", d.longName());
    o.put("steps", d.time().size());
    if (d.time().size() > 0) {
      o.put("first", d.time().instant(0).toString());
      o.put("last", d.time().instant(d.time().size() - 1).toString());
    }
    o.put("calendar", d.time().calendar());
    o.put("time_alignment", d.time().alignment().name().toLowerCase());
    ObjectNode grid = o.putObject("grid");
    grid.put("rows", g.ny());
    grid.put("columns", g.nx());
    grid.put("south", g.latLower(0));
    grid.put("north", g.latUpper(g.ny() - 1));
    grid.put("west", g.lonLower(0));
    grid.put("east", g.lonUpper(g.nx() - 1));
    ObjectNode p = o.putObject("provenance");
    p.put("source_file", c.provenance().sourceFile());
    p.put("source_sha256", c.provenance().sourceSha256());
    p.put("source_variable", c.provenance().sourceVariable());
    p.put("reader", c.provenance().reader());
    p.put("ingested_at", c.provenance().ingestedAt().toString());
    o.put("chunks", c.chunks().size());
    o.put("stored_bytes", c.bytes());
    return o;
  }
}
