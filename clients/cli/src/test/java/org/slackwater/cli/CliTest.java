package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.io.PrintStream;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.demo.DemoManifest;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;
import org.slackwater.server.DemoCommand;
import org.slackwater.server.HttpServer;
import org.slackwater.server.ServerConfig;

/**
 * The client against a real server on an ephemeral port, over the small generated Wrenmouth
 * scenario. The reference for every answer is the server itself asked over plain HTTP with the
 * JDK client: the CLI must hand results on unchanged, and print problems (RFC 9457 problem
 * documents) as the documented {@code error:} lines with the documented exit codes.
 */
class CliTest {
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static final String TOKEN = "harle-admin-token";
  private static final String MONTHLY = "mean chlorophyll over \"Outer Bay\" during 2014 by month";

  @TempDir static Path dir;
  private static Workspace ws;
  private static HttpServer server;
  private static Path ingestRoot;

  @BeforeAll
  static void start() throws Exception {
    DemoManifest manifest = DemoScenario.generate(dir.resolve("files"), DemoOptions.small());
    ingestRoot = manifest.dir();
    ws = Workspace.open(dir.resolve("store"));
    DemoCommand.prepare(ws, manifest);
    server = HttpServer.start(ws, new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.of(TOKEN), Optional.of(ingestRoot)));
  }

  @AfterAll
  static void stop() {
    if (server != null) {
      server.close();
    }
    if (ws != null) {
      ws.close();
    }
  }

  record Run(int code, byte[] outBytes, String err) {
    String out() {
      return new String(outBytes, StandardCharsets.UTF_8);
    }
  }

  private static Run cli(Map<String, String> env, InputStream in, String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Cli.run(args, in, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), env);
    return new Run(code, out.toByteArray(), err.toString(StandardCharsets.UTF_8));
  }

  /** The CLI pointed at the test server with --server, no token, empty standard input. */
  private static Run cli(String... args) {
    List<String> all = new ArrayList<>(List.of("--server", server.url()));
    all.addAll(List.of(args));
    return cli(Map.of(), InputStream.nullInputStream(), all.toArray(String[]::new));
  }

  private static Run admin(String... args) {
    List<String> all = new ArrayList<>(List.of("--server", server.url()));
    all.addAll(List.of(args));
    return cli(Map.of("SLACKWATER_TOKEN", TOKEN), InputStream.nullInputStream(), all.toArray(String[]::new));
  }

  /** What the server answers over plain HTTP, the reference for the CLI's output. */
  private static HttpResponse<byte[]> direct(String query, String format) throws Exception {
    return HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/query?format=" + format))
        .POST(HttpRequest.BodyPublishers.ofString(query)).build(), HttpResponse.BodyHandlers.ofByteArray());
  }

  private static String get(String path) throws Exception {
    return HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + path)).GET().build(),
        HttpResponse.BodyHandlers.ofString()).body();
  }

  @Test
  void queryPrintsExactlyWhatTheServerAnswers() throws Exception {
    HttpResponse<byte[]> ref = direct(MONTHLY, "csv");
    assertEquals(200, ref.statusCode());
    Run r = cli("query", MONTHLY);
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(ref.body(), r.outBytes());
    assertEquals("", r.err());
    // 12 months plus the header, RFC 4180 CRLF line ends as the server writes them.
    assertEquals(13, r.out().split("\r\n").length);
  }

  @Test
  void jsonFormatIsTheServersJsonWithAFinalLineFeed() throws Exception {
    HttpResponse<byte[]> ref = direct(MONTHLY, "json");
    Run r = cli("query", "--format", "json", MONTHLY);
    assertEquals(0, r.code(), r.err());
    String body = new String(ref.body(), StandardCharsets.UTF_8);
    assertEquals(body.endsWith("\n") ? body : body + "\n", r.out());
  }

  @Test
  void severalStatementsNeedJson() throws Exception {
    String two = "list variables; list regions";
    Run csv = cli("query", two);
    assertEquals(1, csv.code());
    assertTrue(csv.err().endsWith("hint: CSV holds one table; run several statements with --format json"
        + System.lineSeparator()), csv.err());
    Run json = cli("query", "--format", "json", two);
    assertEquals(0, json.code(), json.err());
    assertEquals(new String(direct(two, "json").body(), StandardCharsets.UTF_8).strip(), json.out().strip());
  }

  @Test
  void outWritesTheServersBytesToTheFile() throws Exception {
    Path file = dir.resolve("monthly.csv");
    Run r = cli("query", "--out", file.toString(), MONTHLY);
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(direct(MONTHLY, "csv").body(), Files.readAllBytes(file));
    assertEquals(0, r.outBytes().length);
    assertEquals("wrote " + file + System.lineSeparator(), r.err());
  }

  @Test
  void dashFReadsASwqFile() throws Exception {
    Path swq = Files.writeString(dir.resolve("bloom.swq"), "# monthly bloom check\n" + MONTHLY + "\n");
    HttpResponse<byte[]> ref = direct(Files.readString(swq), "csv");
    assertEquals(200, ref.statusCode(), new String(ref.body(), StandardCharsets.UTF_8));
    Run r = cli("query", "-f", swq.toString());
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(ref.body(), r.outBytes());
  }

  @Test
  void withoutTextTheQueryComesFromStandardInput() throws Exception {
    InputStream stdin = new ByteArrayInputStream(MONTHLY.getBytes(StandardCharsets.UTF_8));
    Run r = cli(Map.of(), stdin, "--server", server.url(), "query");
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(direct(MONTHLY, "csv").body(), r.outBytes());
  }

  @Test
  void theServerComesFromSlackwaterUrlWhenNoOptionIsGiven() throws Exception {
    Run r = cli(Map.of("SLACKWATER_URL", server.url() + "/"), InputStream.nullInputStream(), "query", MONTHLY);
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(direct(MONTHLY, "csv").body(), r.outBytes());
    // --server after the subcommand works too (the option is inherited by every subcommand).
    Run after = cli(Map.of(), InputStream.nullInputStream(), "query", "--server", server.url(), MONTHLY);
    assertEquals(0, after.code(), after.err());
  }

  @Test
  void aQueryErrorIsPrintedWithCaretAndHintAndExitsTwo() {
    String bad = "mean chlorophyl over \"Outer Bay\" during 2014 by month";
    Run r = cli("query", bad);
    assertEquals(2, r.code());
    assertEquals(0, r.outBytes().length);
    List<String> lines = r.err().lines().toList();
    assertEquals("error: line 1:6: unknown variable 'chlorophyl'", lines.get(0));
    assertEquals("  " + bad, lines.get(1));
    // The caret sits under column 6, shifted by the two-space indent of the excerpt block.
    assertEquals("  " + " ".repeat(5) + "^", lines.get(2));
    assertEquals("hint: did you mean 'chlorophyll'?", lines.get(3));
    assertEquals(4, lines.size(), r.err());
  }

  @Test
  void anUnreachableServerExitsThreeWithAClearMessage() throws Exception {
    int port;
    try (ServerSocket s = new ServerSocket(0)) {
      port = s.getLocalPort(); // free now, and closed again below: nothing listens there
    }
    String url = "http://127.0.0.1:" + port;
    Run r = cli(Map.of(), InputStream.nullInputStream(), "--server", url, "query", MONTHLY);
    assertEquals(3, r.code());
    assertTrue(r.err().startsWith("error: cannot reach the server at " + url + " ("), r.err());
    assertTrue(r.err().contains("is it running? Point the client at it with --server URL or SLACKWATER_URL"), r.err());
    assertEquals(1, r.err().lines().count(), r.err());
  }

  @Test
  void describeRunsTheDescribeQuery() throws Exception {
    HttpResponse<byte[]> ref = direct("describe chlorophyll", "csv");
    assertEquals(200, ref.statusCode());
    Run r = cli("describe", "chlorophyll");
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(ref.body(), r.outBytes());
    Run unknown = cli("describe", "chlorophyl");
    assertEquals(2, unknown.code());
    assertTrue(unknown.err().startsWith("error: line 1:10: unknown variable 'chlorophyl'"), unknown.err());
  }

  @Test
  void tableAlignsTheServersCsvColumns() throws Exception {
    String csv = new String(direct(MONTHLY, "csv").body(), StandardCharsets.UTF_8);
    assertFalse(csv.contains("\""), "this check splits on commas, so the reference must have no quoted fields");
    List<String[]> reference = csv.lines().map(l -> l.split(",", -1)).toList();
    Run r = cli("query", "--table", MONTHLY);
    assertEquals(0, r.code(), r.err());
    List<String> lines = r.out().lines().toList();
    assertEquals(reference.size() + 1, lines.size(), r.out());
    // The dashed rule under the header marks where each column lies; every line's text inside a
    // column's span, trimmed, must be the CSV field, and nothing may stick out between spans.
    List<int[]> spans = new ArrayList<>();
    Matcher m = Pattern.compile("-+").matcher(lines.get(1));
    while (m.find()) {
      spans.add(new int[] {m.start(), m.end()});
    }
    assertEquals(reference.get(0).length, spans.size(), lines.get(1));
    for (int i = 0; i < reference.size(); i++) {
      String line = lines.get(i == 0 ? 0 : i + 1);
      String[] fields = reference.get(i);
      for (int c = 0; c < spans.size(); c++) {
        int[] s = spans.get(c);
        String cell = line.substring(Math.min(s[0], line.length()), Math.min(s[1], line.length())).trim();
        assertEquals(fields[c], cell, "row " + i + " column " + c + " of:\n" + r.out());
        if (c > 0) {
          assertEquals("", line.substring(Math.min(spans.get(c - 1)[1], line.length()), Math.min(s[0], line.length())).trim());
        }
      }
    }
    assertTrue(lines.get(0).contains("[mg m-3]"), "units stay in the header: " + lines.get(0));
    assertEquals(4, cli("query", "--table", "--format", "json", MONTHLY).code());
  }

  @Test
  void regionsAddWithoutTokenIsRefusedWithTheProblemsDetail() throws Exception {
    Path outline = writeShoal();
    Run r = cli("regions", "add", "Pilot Shoal", outline.toString());
    assertEquals(5, r.code());
    List<String> lines = r.err().lines().toList();
    assertEquals("error: send 'Authorization: Bearer <token>' with the server's admin token", lines.get(0));
    assertEquals("hint: set SLACKWATER_TOKEN to the server's admin token", lines.get(1));
    assertFalse(get("/api/regions").contains("Pilot Shoal"));
    Run wrong = cli(Map.of("SLACKWATER_TOKEN", "not-it"), InputStream.nullInputStream(),
        "--server", server.url(), "regions", "add", "Pilot Shoal", outline.toString());
    assertEquals(5, wrong.code());
    assertTrue(wrong.err().contains("hint: SLACKWATER_TOKEN is not the server's admin token"), wrong.err());
  }

  @Test
  void regionsAddWithTokenStoresTheRegion() throws Exception {
    Path outline = writeShoal();
    Run r = admin("regions", "add", "Harle Test Shoal", outline.toString());
    assertEquals(0, r.code(), r.err());
    String listed = get("/api/regions");
    Matcher area = Pattern.compile("\"name\":\"Harle Test Shoal\".*?\"area_km2\":([0-9.eE+-]+)|\"area_km2\":([0-9.eE+-]+)[^}]*\"name\":\"Harle Test Shoal\"")
        .matcher(listed);
    assertTrue(area.find(), listed);
    double km2 = Double.parseDouble(area.group(1) != null ? area.group(1) : area.group(2));
    assertEquals(String.format(java.util.Locale.ROOT, "stored region 'Harle Test Shoal' (%.3f km2)", km2), r.out().strip());
    // The stored region is usable in a query at once.
    Run q = cli("query", "mean water_temperature over \"Harle Test Shoal\" during 2014-07 by month");
    assertEquals(0, q.code(), q.err());
    assertEquals(2, q.out().split("\r\n").length, q.out());
  }

  @Test
  void regionsListsTheServersGeoJson() throws Exception {
    Run r = cli("regions");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"Outer Bay\""), r.out());
    assertTrue(r.out().startsWith("{\"type\":\"FeatureCollection\""), r.out());
  }

  @Test
  void aRegionFileThatCannotBeReadIsALocalProblem() {
    Run r = admin("regions", "add", "Nowhere", dir.resolve("absent.geojson").toString());
    assertEquals(4, r.code());
    assertEquals("error: cannot read the region file '" + dir.resolve("absent.geojson") + "' (no such file or folder)",
        r.err().strip());
  }

  @Test
  void ingestPublishesANewVersionAndSaysSo() throws Exception {
    // Ingesting a file the cube already holds changes nothing (same SHA-256), so the cube is
    // removed first; the file then publishes it again under the next version number.
    int before = ws.catalog().cube("cloud_fraction").orElseThrow().version();
    HttpResponse<String> deleted = HTTP.send(HttpRequest.newBuilder(URI.create(server.url() + "/api/cubes/cloud_fraction"))
        .header("Authorization", "Bearer " + TOKEN).DELETE().build(), HttpResponse.BodyHandlers.ofString());
    assertEquals(204, deleted.statusCode(), deleted.body());
    Run r = admin("ingest", "cloud_fraction.nc");
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.err(), "no progress line: standard error is no terminal here");
    int after = ws.catalog().cube("cloud_fraction").orElseThrow().version();
    assertTrue(after > before, before + " -> " + after);
    Matcher m = Pattern.compile("ingested cloud_fraction version (\\d+)(?: \\(\\w+\\))?: ([0-9,]+) values in [0-9.]+ s").matcher(r.out().strip());
    assertTrue(m.matches(), r.out());
    assertEquals(after, Integer.parseInt(m.group(1)));
    var d = ws.catalog().cube("cloud_fraction").orElseThrow().descriptor();
    // values = time steps x rows x columns, as IngestReport counts them.
    long cells = (long) d.time().size() * d.grid().ny() * d.grid().nx();
    assertEquals(cells, Long.parseLong(m.group(2).replace(",", "")));
  }

  @Test
  void ingestOfABadFileExitsOneWithTheServersMessage() throws Exception {
    Files.writeString(ingestRoot.resolve("tide_notes.nc"), "high water 06:12, low water 12:30\n");
    List<String> cubesBefore = ws.catalog().cubes().stream().map(c -> c.name() + "@" + c.version()).toList();
    Run r = admin("ingest", "tide_notes.nc");
    assertEquals(1, r.code());
    assertTrue(r.err().startsWith("error: file tide_notes.nc is not in a format Slackwater reads"), r.err());
    assertEquals(cubesBefore, ws.catalog().cubes().stream().map(c -> c.name() + "@" + c.version()).toList());
    Run missing = admin("ingest", "no_such_file.nc");
    assertEquals(6, missing.code());
    assertEquals("error: there is no file 'no_such_file.nc' under the ingest root", missing.err().strip());
    Run noToken = cli("ingest", "cloud_fraction.nc");
    assertEquals(5, noToken.code());
    assertTrue(noToken.err().contains("hint: set SLACKWATER_TOKEN"), noToken.err());
  }

  @Test
  void localProblemsExitFour() {
    Run format = cli("query", "--format", "xml", MONTHLY);
    assertEquals(4, format.code());
    assertTrue(format.err().startsWith("error: Invalid value for option '--format'"), format.err());
    Run noFile = cli("query", "-f", dir.resolve("absent.swq").toString());
    assertEquals(4, noFile.code());
    assertEquals("error: cannot read the query file '" + dir.resolve("absent.swq") + "': there is no such file", noFile.err().strip());
    Run both = cli("query", "-f", dir.resolve("absent.swq").toString(), MONTHLY);
    assertEquals(4, both.code());
    Run empty = cli("query");
    assertEquals(4, empty.code());
    assertTrue(empty.err().startsWith("error: the query is empty"), empty.err());
    Run badUrl = cli(Map.of("SLACKWATER_URL", "ftp://example"), InputStream.nullInputStream(), "health");
    assertEquals(4, badUrl.code());
    assertEquals("error: SLACKWATER_URL 'ftp://example' is not a server URL; write it like http://127.0.0.1:8080", badUrl.err().strip());
    Run none = cli(Map.of(), InputStream.nullInputStream());
    assertEquals(4, none.code());
    assertTrue(none.err().contains("Usage: slackwater-cli"), none.err());
  }

  @Test
  void healthAndCubesShowTheServersJson() throws Exception {
    Run h = cli("health");
    assertEquals(0, h.code(), h.err());
    assertEquals(get("/api/health") + "\n", h.out());
    Run one = cli("cubes", "chlorophyll");
    assertEquals(0, one.code(), one.err());
    assertEquals(get("/api/cubes/chlorophyll") + "\n", one.out());
    Run none = cli("cubes", "chlorophyl");
    assertEquals(6, none.code());
    assertEquals("error: there is no cube named 'chlorophyl'; GET /api/cubes lists them", none.err().strip());
  }

  @Test
  void arrowGoesToTheFileAsTheServersBytes() throws Exception {
    HttpResponse<byte[]> ref = direct(MONTHLY, "arrow");
    assertEquals(200, ref.statusCode());
    Path file = dir.resolve("monthly.arrow");
    Run r = cli("query", "--format", "arrow", "--out", file.toString(), MONTHLY);
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(ref.body(), Files.readAllBytes(file));
    Run dash = cli("query", "--format", "arrow", "--out", "-", MONTHLY);
    assertArrayEquals(ref.body(), dash.outBytes());
  }

  @Test
  void aStreamedExportIsCopiedAsItArrivesToTheFileAndToStandardOutput() throws Exception {
    String export = "cells of chlorophyll over \"Outer Bay\" during 2014-07";
    HttpResponse<byte[]> ref = direct(export, "arrow");
    assertEquals(200, ref.statusCode());
    assertEquals("chunked", ref.headers().firstValue("Transfer-Encoding").orElse(""), "the server streams exports");
    Path file = dir.resolve("cells.arrow");
    Run r = cli("query", "--format", "arrow", "--out", file.toString(), export);
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(ref.body(), Files.readAllBytes(file));
    assertFalse(Files.exists(dir.resolve("cells.arrow.part")), "the partial file is renamed once complete");
    assertEquals("wrote " + file + System.lineSeparator(), r.err());
    Run csv = cli("query", export);
    assertEquals(0, csv.code(), csv.err());
    assertArrayEquals(direct(export, "csv").body(), csv.outBytes());
    assertTrue(csv.out().startsWith("time,row,column,lat [degrees_north],lon [degrees_east],fraction_inside [1],chlorophyll ["),
        csv.out().lines().findFirst().orElse(""));
  }

  @Test
  void catalogHasOneRowPerCubeWithTheServersValues() throws Exception {
    JsonNode cubes = new ObjectMapper().readTree(get("/api/cubes"));
    Run r = cli("catalog");
    assertEquals(0, r.code(), r.err());
    List<String> lines = r.out().lines().toList();
    assertEquals(cubes.size() + 2, lines.size(), r.out());
    assertEquals(List.of("cube", "units", "steps", "first", "last", "calendar", "grid", "version"), List.of(lines.get(0).split("\\s+")));
    for (int i = 0; i < cubes.size(); i++) {
      JsonNode c = cubes.get(i);
      // Unit strings hold spaces ("mg m-3"), so compare against the same alignment of the reference values.
      String expected = CsvTable.parse(String.join("\n", "h1,h2,h3,h4,h5,h6,h7,h8",
          String.join(",", c.get("name").asText(), c.get("units").asText(), c.get("steps").asText(), c.get("first").asText(),
              c.get("last").asText(), c.get("calendar").asText(), c.get("grid").get("rows").asText() + " x " + c.get("grid").get("columns").asText(),
              c.get("version").asText()))).rows().get(0).toString();
      List<String> cells = new ArrayList<>();
      Matcher col = Pattern.compile("-+").matcher(lines.get(1));
      String line = lines.get(i + 2);
      while (col.find()) {
        cells.add(line.substring(Math.min(col.start(), line.length()), Math.min(col.end(), line.length())).trim());
      }
      assertEquals(expected, cells.toString());
    }
    Run json = cli("catalog", "--format", "json");
    assertEquals(get("/api/cubes") + "\n", json.out());
  }

  @Test
  void watchesAreCreatedListedReplacedAndDeletedOnTheServer() throws Exception {
    String name = "Harle CLI test watch";
    Path file = Files.writeString(dir.resolve("test_watch.swq"),
        "watch \"" + name + "\" over \"North Intake\"\n  when mean chlorophyll above 10 mg/m3 for 3 days severity warning\n");
    Run created = admin("watch", "create", file.toString());
    assertEquals(0, created.code(), created.err());
    assertEquals("stored watch '" + name + "' version 1", created.out().strip());
    assertEquals("caution: " + WatchStatements.CAUTION, created.err().strip());
    Run again = admin("watch", "create", file.toString());
    assertEquals("stored watch '" + name + "' version 2 (replaces version 1)", again.out().strip());
    Run listed = cli("watch", "list");
    assertEquals(0, listed.code(), listed.err());
    assertTrue(listed.out().lines().anyMatch(l -> l.matches(Pattern.quote(name) + "\\s+2\\s+\\S+")), listed.out());
    Run noToken = cli("watch", "delete", name);
    assertEquals(5, noToken.code());
    Run deleted = admin("watch", "delete", name);
    assertEquals(0, deleted.code(), deleted.err());
    assertFalse(get("/api/watches").contains(name));
    Run gone = admin("watch", "delete", name);
    assertEquals(6, gone.code());
    assertEquals("error: there is no watch named '" + name + "'; GET /api/watches lists them", gone.err().strip());
  }

  @Test
  void aWatchStatementInAQueryPrintsTheServersCaution() {
    Run r = cli("query", "watch \"check\" over \"North Intake\" when mean chlorophyll above 10 mg/m3 for 3 days severity warning");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().startsWith("rule,"), r.out());
    assertEquals("caution: " + WatchStatements.CAUTION, r.err().strip());
    Run plain = cli("query", MONTHLY);
    assertEquals("", plain.err(), "no caution on a plain query");
  }

  @Test
  void backtestSendsTheOnsetColumnOfTheGeneratedGroundTruth() throws Exception {
    Path truth = ingestRoot.resolve("ground_truth.csv");
    List<String> lines = Files.readAllLines(truth);
    assertFalse(String.join("\n", lines).contains("\""), "this check splits on commas, so the file must have no quoted fields");
    int onset = List.of(lines.get(0).split(",")).indexOf("onset");
    assertTrue(onset >= 0, lines.get(0));
    String expected = lines.stream().skip(1).filter(l -> !l.isBlank()).map(l -> l.split(",")[onset] + "\n").reduce("", String::concat);
    assertFalse(expected.isEmpty());
    try (StubServer stub = StubServer.start()) {
      stub.on("POST", "/api/watches/North%20Intake%20bloom%20risk/backtest", StubServer.Reply.json(200, "{\"results\":[],\"cautions\":[]}"));
      Run r = cli(Map.of(), InputStream.nullInputStream(), "--server", stub.url(), "watch", "backtest", "North Intake bloom risk",
          "--events", truth.toString(), "--date-column", "onset", "--format", "json");
      assertEquals(0, r.code(), r.err());
      assertEquals(expected, stub.only().text());
      // The answer names no caution, so the client prints its own.
      assertEquals("caution: " + WatchStatements.CAUTION, r.err().strip());
    }
  }

  /** A small box in the outer Wrenmouth estuary (invented place), on the mouth-to-bay axis, as a GeoJSON Feature (RFC 7946 3.2). */
  private static Path writeShoal() throws Exception {
    String feature = "{\"type\":\"Feature\",\"properties\":{},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":"
        + "[[[-31.08,43.94],[-30.92,43.94],[-30.92,44.08],[-31.08,44.08],[-31.08,43.94]]]}}";
    return Files.writeString(dir.resolve("shoal.geojson"), feature);
  }
}
