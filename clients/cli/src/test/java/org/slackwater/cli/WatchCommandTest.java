package org.slackwater.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.InstantSource;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.atomic.AtomicLong;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.query.WatchStatements;

/**
 * The watch commands, binary result formats and the ingest progress line against a stand-in
 * server ({@link StubServer}): the client must send the method, the percent-encoded path (RFC
 * 3986), the query parameters, the bearer token (admin requests only) and the body the server's
 * API expects, and map the server's answers to the documented output, exit codes and the
 * caution. The stand-in's answers have the server's shapes (problem documents per RFC 9457 as
 * {@code org.slackwater.server.Problem} writes them; the watch document was captured from a demo
 * server); the caution is the server's own constant.
 */
class WatchCommandTest {
  private static final String TOKEN = "wrenmouth-admin-token";
  private static final String NAME = "North Intake bloom risk";
  private static final String NAME_PATH = "/api/watches/North%20Intake%20bloom%20risk";
  private static final String CAUTION = WatchStatements.CAUTION;
  private static final String NL = System.lineSeparator();

  @TempDir Path dir;
  private StubServer stub;

  @BeforeEach
  void start() throws Exception {
    stub = StubServer.start();
  }

  @AfterEach
  void stop() {
    stub.close();
  }

  record Run(int code, byte[] outBytes, String err) {
    String out() {
      return new String(outBytes, StandardCharsets.UTF_8);
    }
  }

  private Run run(Map<String, String> env, InputStream in, Terminal terminal, InstantSource clock, String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    List<String> all = new ArrayList<>(List.of("--server", stub.url()));
    all.addAll(List.of(args));
    int code = Cli.run(all.toArray(String[]::new), in, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), env, terminal, clock);
    return new Run(code, out.toByteArray(), err.toString(StandardCharsets.UTF_8));
  }

  private Run admin(String... args) {
    return run(Map.of("SLACKWATER_TOKEN", TOKEN), InputStream.nullInputStream(), Terminal.NONE, InstantSource.system(), args);
  }

  private Run anonymous(String... args) {
    return run(Map.of(), InputStream.nullInputStream(), Terminal.NONE, InstantSource.system(), args);
  }

  /** A problem document as org.slackwater.server.Problem.of writes it. */
  private static StubServer.Reply problem(int status, String title, String detail) {
    return StubServer.Reply.json(status, "{\"type\":\"about:blank\",\"title\":" + FlatJson.quote(title) + ",\"status\":" + status
        + ",\"detail\":" + FlatJson.quote(detail) + "}");
  }

  private static StubServer.Reply unauthorized() {
    return problem(401, "Admin token required", "send 'Authorization: Bearer <token>' with the server's admin token");
  }

  private static StubServer.Reply noSuchWatch(String name) {
    return problem(404, "No such watch", "there is no watch named '" + name + "'; GET /api/watches lists them");
  }

  private static String storedJson(String name, int version) {
    return "{\"name\":" + FlatJson.quote(name) + ",\"version\":" + version + ",\"created\":\"2026-12-01T08:00:00Z\",\"text\":\"...\",\"caution\":"
        + FlatJson.quote(CAUTION) + "}";
  }

  /** The CSV of a watch run as the server writes it: RFC 4180, CRLF, the caution as the last column. */
  private static String runCsv() {
    String c = "\"" + CAUTION.replace("\"", "\"\"") + "\"";
    return "day,state,level,rules_holding,mean_chlorophyll_over_3_days [mg m-3],caution\r\n"
        + "2014-05-29,quiet,none,,8.25," + c + "\r\n"
        + "2014-05-30,raised,warning,1,11.5," + c + "\r\n";
  }

  // --- create ---------------------------------------------------------------------------------

  @Test
  void createPostsTheTextWithTheTokenAndPrintsNameAndVersion() throws Exception {
    String text = "# the intake on the north shore\nwatch \"" + NAME + "\" over \"North Intake\"\n"
        + "  when mean chlorophyll above 10 mg/m3 for 3 days severity warning\n";
    Path file = Files.writeString(dir.resolve("bloom.swq"), text);
    stub.on("POST", "/api/watches", StubServer.Reply.json(201, storedJson(NAME, 1)));
    Run r = admin("watch", "create", file.toString());
    assertEquals(0, r.code(), r.err());
    assertEquals("stored watch '" + NAME + "' version 1" + NL, r.out());
    assertEquals("caution: " + CAUTION + NL, r.err());
    StubServer.Request q = stub.only();
    assertEquals("POST", q.method());
    assertEquals("/api/watches", q.rawPath());
    assertEquals("Bearer " + TOKEN, q.header("Authorization").orElseThrow());
    assertTrue(q.header("Content-Type").orElseThrow().startsWith("text/plain"), q.headers().toString());
    assertArrayEquals(text.getBytes(StandardCharsets.UTF_8), q.body());
  }

  @Test
  void createFromStandardInputSaysWhichVersionItReplaces() {
    String text = "watch \"" + NAME + "\" over \"North Intake\" when mean chlorophyll above 12 mg/m3 for 2 days";
    stub.on("POST", "/api/watches", StubServer.Reply.json(200, storedJson(NAME, 3)));
    Run r = run(Map.of("SLACKWATER_TOKEN", TOKEN), new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), Terminal.NONE,
        InstantSource.system(), "watch", "create", "-");
    assertEquals(0, r.code(), r.err());
    assertEquals("stored watch '" + NAME + "' version 3 (replaces version 2)" + NL, r.out());
    assertEquals(text, stub.only().text());
  }

  @Test
  void createWithoutTokenExitsFiveAndSendsNoAuthorization() throws Exception {
    Path file = Files.writeString(dir.resolve("w.swq"), "watch \"x\" over \"North Intake\" when mean chlorophyll above 10 mg/m3");
    stub.on("POST", "/api/watches", unauthorized());
    Run r = anonymous("watch", "create", file.toString());
    assertEquals(5, r.code());
    assertEquals(List.of("error: send 'Authorization: Bearer <token>' with the server's admin token",
        "hint: set SLACKWATER_TOKEN to the server's admin token"), r.err().lines().toList());
    assertEquals(0, r.outBytes().length);
    assertTrue(stub.only().header("Authorization").isEmpty(), "no token, no Authorization header");
  }

  @Test
  void aMistakeInTheWatchTextExitsTwoWithTheCaret() throws Exception {
    String line = "watch \"x\" over \"North Intake\" when mean chlorophyll above 10 for 3 days";
    Path file = Files.writeString(dir.resolve("w.swq"), line + "\n");
    // The shape of org.slackwater.server.Problem.query: line, column, excerpt (line + caret), hint.
    int column = line.indexOf("10") + 1;
    String excerpt = line + "\n" + " ".repeat(column - 1) + "^";
    stub.on("POST", "/api/watches", StubServer.Reply.json(400, "{\"type\":\"about:blank\",\"title\":\"The query cannot be run\",\"status\":400,"
        + "\"detail\":\"the threshold 10 needs a unit\",\"line\":1,\"column\":" + column + ",\"excerpt\":" + FlatJson.quote(excerpt)
        + ",\"hint\":\"write it as 10 mg/m3\"}"));
    Run r = admin("watch", "create", file.toString());
    assertEquals(2, r.code());
    assertEquals(List.of("error: line 1:" + column + ": the threshold 10 needs a unit", "  " + line,
        "  " + " ".repeat(column - 1) + "^", "hint: write it as 10 mg/m3"), r.err().lines().toList());
  }

  @Test
  void anUnreadableOrEmptyWatchFileIsALocalProblemAndNothingIsSent() throws Exception {
    Run missing = admin("watch", "create", dir.resolve("absent.swq").toString());
    assertEquals(4, missing.code());
    assertEquals("error: cannot read the watch file '" + dir.resolve("absent.swq") + "': there is no such file", missing.err().strip());
    Path latin1 = Files.write(dir.resolve("latin1.swq"), new byte[] {'w', 'a', 't', 'c', 'h', ' ', (byte) 0xB0});
    Run notUtf8 = admin("watch", "create", latin1.toString());
    assertEquals(4, notUtf8.code());
    assertTrue(notUtf8.err().contains("it is not UTF-8 text"), notUtf8.err());
    Run empty = admin("watch", "create", Files.writeString(dir.resolve("empty.swq"), "\n  \n").toString());
    assertEquals(4, empty.code());
    assertTrue(empty.err().contains("is empty"), empty.err());
    assertEquals(List.of(), stub.requests());
  }

  // --- list and show --------------------------------------------------------------------------

  @Test
  void listPrintsATableAndTheCaution() {
    stub.on("GET", "/api/watches", StubServer.Reply.json(200, "{\"watches\":["
        + "{\"name\":\"" + NAME + "\",\"version\":1,\"created\":\"2026-12-01T21:31:15Z\",\"text\":\"...\"},"
        + "{\"name\":\"Harle Intake turbidity\",\"version\":12,\"created\":\"2026-12-02T06:00:00Z\",\"text\":\"...\"}],"
        + "\"caution\":" + FlatJson.quote(CAUTION) + "}"));
    Run r = anonymous("watch", "list");
    assertEquals(0, r.code(), r.err());
    assertEquals(List.of(
        "watch                    version  stored",
        "-----------------------  -------  --------------------",
        "North Intake bloom risk        1  2026-12-01T21:31:15Z",
        "Harle Intake turbidity        12  2026-12-02T06:00:00Z"), r.out().lines().toList());
    assertEquals("caution: " + CAUTION + NL, r.err());
    assertTrue(stub.only().header("Authorization").isEmpty(), "listing is not an admin request");
    Run json = anonymous("watch", "list", "--format", "json");
    assertTrue(json.out().startsWith("{\"watches\":["), json.out());
  }

  @Test
  void showEncodesTheNameAndShowsDefinitionChannelsAndTransitions() throws Exception {
    String doc = new String(Objects.requireNonNull(getClass().getResourceAsStream("watch_show.json")).readAllBytes(), StandardCharsets.UTF_8);
    stub.on("GET", NAME_PATH, StubServer.Reply.json(200, doc));
    Run r = anonymous("watch", "show", NAME);
    assertEquals(0, r.code(), r.err());
    assertEquals(NAME_PATH, stub.only().rawPath());
    // The reference for every value shown is the same document read with Jackson.
    JsonNode ref = new ObjectMapper().readTree(doc);
    List<String> lines = r.out().lines().toList();
    assertEquals("watch:         " + ref.get("name").asText(), lines.get(0));
    assertEquals("version:       " + ref.get("version").asText(), lines.get(1));
    assertEquals("stored:        " + ref.get("created").asText(), lines.get(2));
    assertEquals(ref.has("evaluated_to") ? "evaluated to:  " + ref.get("evaluated_to").asText() : "evaluated to:  (no automatic run yet)", lines.get(3));
    assertTrue(lines.contains("  " + ref.get("text").asText()), r.out());
    assertTrue(ref.get("transitions").size() > 0, "the captured document has transitions");
    for (JsonNode t : ref.get("transitions")) {
      String head = "  " + t.get("day").asText() + "  " + t.get("state").asText() + ", level " + t.get("level").asText()
          + ", watch version " + t.get("version").asText();
      int at = lines.indexOf(head);
      assertTrue(at > 0, head + " in:\n" + r.out());
      Iterator<Map.Entry<String, JsonNode>> values = t.get("values").fields();
      int k = 1;
      while (values.hasNext()) {
        Map.Entry<String, JsonNode> v = values.next();
        // Jackson's text of a double is its shortest round-trip form, as the server wrote it.
        assertEquals("      " + v.getKey() + " = " + v.getValue().asText(), lines.get(at + k++));
      }
    }
    assertEquals("caution: " + ref.get("caution").asText() + NL, r.err());
  }

  @Test
  void showOfAnUnknownWatchExitsSix() {
    stub.on("GET", "/api/watches/Outer%20Bya", noSuchWatch("Outer Bya"));
    Run r = anonymous("watch", "show", "Outer Bya");
    assertEquals(6, r.code());
    assertEquals("error: there is no watch named 'Outer Bya'; GET /api/watches lists them" + NL, r.err());
    assertEquals(0, r.outBytes().length);
  }

  @Test
  void namesArePercentEncodedAsOnePathSegment() {
    // RFC 3986 section 2.1 and 3.3: '+', '/', '%' and non-ASCII are reserved or unsafe in a segment.
    admin("watch", "delete", "Harle+Mid/Reach 100% \u00e9t\u00e9");
    assertEquals("/api/watches/Harle%2BMid%2FReach%20100%25%20%C3%A9t%C3%A9", stub.only().rawPath());
  }

  // --- evaluate -------------------------------------------------------------------------------

  @Test
  void evaluateSendsTheRangeAndFormatWithTheTokenAndPrintsTheResultThenTheCaution() {
    String csv = runCsv();
    stub.on("POST", NAME_PATH + "/evaluate", StubServer.Reply.of(200, "text/csv; charset=utf-8; header=present", csv.getBytes(StandardCharsets.UTF_8)));
    Run r = admin("watch", "evaluate", NAME, "--from", "2014-05-29", "--to", "2014-05-30");
    assertEquals(0, r.code(), r.err());
    assertEquals(csv, r.out());
    assertEquals("caution: " + CAUTION + NL, r.err());
    StubServer.Request q = stub.only();
    assertEquals("POST", q.method());
    assertEquals("from=2014-05-29&to=2014-05-30&format=csv", q.rawQuery());
    assertEquals("Bearer " + TOKEN, q.header("Authorization").orElseThrow());
    assertEquals(0, q.body().length);
  }

  @Test
  void evaluateAsJsonTakesTheCautionFromTheAnswer() {
    String json = "{\"results\":[{\"title\":\"watch\",\"columns\":[],\"rows\":[],\"metadata\":{\"caution\":" + FlatJson.quote(CAUTION)
        + "}}],\"cautions\":[" + FlatJson.quote(CAUTION) + "]}";
    stub.on("POST", NAME_PATH + "/evaluate", StubServer.Reply.json(200, json));
    Run r = admin("watch", "evaluate", NAME, "--format", "json");
    assertEquals(0, r.code(), r.err());
    assertEquals(json + "\n", r.out());
    assertEquals("format=json", stub.only().rawQuery(), "without dates the server picks the range");
    assertEquals("caution: " + CAUTION + NL, r.err());
  }

  @Test
  void evaluateWithoutTokenOrOfAnUnknownWatch() {
    stub.on("POST", NAME_PATH + "/evaluate", unauthorized());
    Run refused = anonymous("watch", "evaluate", NAME);
    assertEquals(5, refused.code());
    assertFalse(refused.err().contains("caution"), "nothing was evaluated: " + refused.err());
    stub.on("POST", "/api/watches/nope/evaluate", noSuchWatch("nope"));
    Run missing = admin("watch", "evaluate", "nope");
    assertEquals(6, missing.code());
    assertEquals("error: there is no watch named 'nope'; GET /api/watches lists them", missing.err().strip());
  }

  @Test
  void evaluateRefusesBadDatesBeforeSendingAnything() {
    Run shape = admin("watch", "evaluate", NAME, "--from", "2014-6-1");
    assertEquals(4, shape.code());
    assertTrue(shape.err().startsWith("error: Invalid value for option '--from': '2014-6-1' is not a date; write it as YYYY-MM-DD"), shape.err());
    // 2014 is not a leap year (Gregorian calendar, ISO 8601), so there is no 29 February.
    Run day = admin("watch", "evaluate", NAME, "--to", "2014-02-29");
    assertEquals(4, day.code());
    Run order = admin("watch", "evaluate", NAME, "--from", "2014-06-02", "--to", "2014-06-01");
    assertEquals(4, order.code());
    assertEquals("error: --to 2014-06-01 is before --from 2014-06-02; swap them", order.err().strip());
    assertEquals(List.of(), stub.requests());
  }

  @Test
  void pngGoesToTheFileWithTheSizeAndTheCautionStillPrints() throws Exception {
    byte[] png = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n', 0, 0, 0, 13}; // PNG signature (ISO/IEC 15948 5.2) + a length
    stub.on("POST", NAME_PATH + "/evaluate", StubServer.Reply.of(200, "image/png", png));
    Path file = dir.resolve("bloom.png");
    Run r = admin("watch", "evaluate", NAME, "--format", "png", "--width", "640", "--height", "320", "--out", file.toString());
    assertEquals(0, r.code(), r.err());
    assertArrayEquals(png, Files.readAllBytes(file));
    assertEquals("format=png&width=640&height=320", stub.only().rawQuery());
    // A PNG carries no readable caution, so the client's own (the server's wording) is printed.
    assertEquals("wrote " + file + NL + "caution: " + CAUTION + NL, r.err());
  }

  // --- backtest -------------------------------------------------------------------------------

  private StubServer.Reply backtestCsv() {
    String c = "\"" + CAUTION + "\"";
    return StubServer.Reply.of(200, "text/csv; charset=utf-8; header=present",
        ("kind,day,end,peak_level,outcome,matched,lead_days [day],caution\r\n"
            + "event,2014-06-20,,,caught,2014-05-30,21," + c + "\r\n").getBytes(StandardCharsets.UTF_8));
  }

  @Test
  void backtestSendsTheNamedDateColumnOneDatePerLine() throws Exception {
    // The layout of the demo's ground_truth.csv (demo-data GroundTruthCsv), invented values.
    Path events = Files.writeString(dir.resolve("ground_truth.csv"),
        "event_id,region,onset,peak,peak_chlorophyll_mg_m3,drivers,lead_days\n"
            + "bloom-2009,Outer Bay,2009-07-04,2009-07-14,50.85,rainfall+;runoff+,184;16\n"
            + "\"bloom-2014, late\",\"Outer Bay\",2014-06-20,2014-06-27,44.62,rainfall+,170\r\n"
            + "\n");
    stub.on("POST", NAME_PATH + "/backtest", backtestCsv());
    Run r = run(Map.of("SLACKWATER_TOKEN", TOKEN), InputStream.nullInputStream(), Terminal.NONE, InstantSource.system(),
        "watch", "backtest", NAME, "--events", events.toString(), "--date-column", "onset", "--lead", "30");
    assertEquals(0, r.code(), r.err());
    StubServer.Request q = stub.only();
    assertEquals("POST", q.method());
    assertEquals("lead=30&format=csv", q.rawQuery());
    assertEquals("2009-07-04\n2014-06-20\n", q.text());
    assertTrue(q.header("Authorization").isEmpty(), "a backtest records nothing, so it is not an admin request");
    assertEquals("caution: " + CAUTION + NL, r.err());
  }

  @Test
  void backtestReadsPlainDatesFromStandardInputSkippingHeaderAndComments() {
    String text = "date\n# planted events\n2009-07-04\n\n2018-06-28,first warm spell\n";
    stub.on("POST", NAME_PATH + "/backtest", backtestCsv());
    Run r = run(Map.of(), new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), Terminal.NONE, InstantSource.system(),
        "watch", "backtest", NAME, "--events", "-", "--format", "json");
    assertEquals(0, r.code(), r.err());
    assertEquals("2009-07-04\n2018-06-28\n", stub.only().text());
    assertEquals("format=json", stub.only().rawQuery());
  }

  @Test
  void aBadEventsLineIsReportedWithItsLineNumberAndNothingIsSent() throws Exception {
    Path events = Files.writeString(dir.resolve("onsets.txt"), "2009-07-04\n2014-06-20\n20/06/2018\n");
    Run r = anonymous("watch", "backtest", NAME, "--events", events.toString());
    assertEquals(4, r.code());
    assertEquals("error: events file '" + events + "' line 3: '20/06/2018' is not a date; write event dates as YYYY-MM-DD, one per line"
        + " or as the first CSV column (or name the column with --date-column)" + NL, r.err());
    Path columns = Files.writeString(dir.resolve("gt.csv"), "event_id,region,onset\nbloom-2009,Outer Bay,2009-07-04\n");
    Run unknown = anonymous("watch", "backtest", NAME, "--events", columns.toString(), "--date-column", "start");
    assertEquals(4, unknown.code());
    assertEquals("error: events file '" + columns + "' has no column 'start' in its header (line 1); its columns are 'event_id', 'region', 'onset'",
        unknown.err().strip());
    assertEquals(List.of(), stub.requests());
  }

  @Test
  void backtestOfAnUnknownWatchExitsSix() {
    stub.on("POST", "/api/watches/nope/backtest", noSuchWatch("nope"));
    Run r = run(Map.of(), new ByteArrayInputStream("2014-06-20\n".getBytes(StandardCharsets.UTF_8)), Terminal.NONE, InstantSource.system(),
        "watch", "backtest", "nope", "--events", "-");
    assertEquals(6, r.code());
    Run noEvents = anonymous("watch", "backtest", NAME);
    assertEquals(4, noEvents.code());
    assertTrue(noEvents.err().startsWith("error: Missing required option: '--events=FILE|-'"), noEvents.err());
  }

  // --- channels and delete --------------------------------------------------------------------

  @Test
  void channelsPutsTheFileAndListsWhatTheServerStored() throws Exception {
    String channels = "[\n  {\"id\": \"north-intake-ops\", \"kind\": \"webhook\",\n   \"url\": \"https://alerts.example.org/sw\", \"secret\": \"0123456789abcdef0123456789abcdef\"}\n]\n";
    Path file = Files.writeString(dir.resolve("channels.json"), channels);
    stub.on("PUT", NAME_PATH + "/channels", StubServer.Reply.json(200, "{\"name\":\"" + NAME + "\",\"version\":1,"
        + "\"channels\":[\"Channel[id=north-intake-ops, destination=Webhook[url=https://alerts.example.org/sw, secret=(hidden)]]\"],"
        + "\"transitions\":[],\"caution\":" + FlatJson.quote(CAUTION) + "}"));
    Run r = admin("watch", "channels", NAME, file.toString());
    assertEquals(0, r.code(), r.err());
    assertEquals(List.of("watch '" + NAME + "' sends alerts to 1 destination(s):",
        "  Channel[id=north-intake-ops, destination=Webhook[url=https://alerts.example.org/sw, secret=(hidden)]]"), r.out().lines().toList());
    StubServer.Request q = stub.only();
    assertEquals("PUT", q.method());
    assertEquals("application/json", q.header("Content-Type").orElseThrow());
    assertEquals("Bearer " + TOKEN, q.header("Authorization").orElseThrow());
    assertEquals(channels, q.text());
    assertEquals("caution: " + CAUTION + NL, r.err());
  }

  @Test
  void aChannelsFileThatIsNotAJsonArrayIsRefusedWithLineAndColumn() throws Exception {
    Path broken = Files.writeString(dir.resolve("broken.json"), "[\n  {\"id\": \"ops\",\n   \"kind\" \"webhook\"}\n]\n");
    Run r = admin("watch", "channels", NAME, broken.toString());
    assertEquals(4, r.code());
    // Line 3, column 11 is where the ':' after "kind" should be (RFC 8259 section 4: name-separator).
    assertEquals("error: channels file '" + broken + "' is not JSON: line 3, column 11: expected ':' after the member name \"kind\"", r.err().strip());
    Path object = Files.writeString(dir.resolve("object.json"), "{\"id\": \"ops\"}");
    Run notArray = admin("watch", "channels", NAME, object.toString());
    assertEquals(4, notArray.code());
    assertTrue(notArray.err().contains("must hold a JSON array of destinations"), notArray.err());
    assertEquals(List.of(), stub.requests());
  }

  @Test
  void deleteSendsDeleteWithTheToken() {
    stub.on("DELETE", "/api/watches/Harle%20Intake%20turbidity", StubServer.Reply.of(204, "application/json", new byte[0]));
    Run r = admin("watch", "delete", "Harle Intake turbidity");
    assertEquals(0, r.code(), r.err());
    assertEquals("deleted watch 'Harle Intake turbidity'" + NL, r.out());
    assertEquals("DELETE", stub.only().method());
    assertEquals("Bearer " + TOKEN, stub.only().header("Authorization").orElseThrow());
    stub.on("DELETE", "/api/watches/nope", noSuchWatch("nope"));
    assertEquals(6, admin("watch", "delete", "nope").code());
    stub.on("DELETE", "/api/watches/other", unauthorized());
    Run wrong = run(Map.of("SLACKWATER_TOKEN", "not-it"), InputStream.nullInputStream(), Terminal.NONE, InstantSource.system(),
        "watch", "delete", "other");
    assertEquals(5, wrong.code());
    assertTrue(wrong.err().contains("hint: SLACKWATER_TOKEN is not the server's admin token"), wrong.err());
  }

  @Test
  void watchWithoutSubcommandShowsUsageAndExitsFour() {
    Run r = anonymous("watch");
    assertEquals(4, r.code());
    assertTrue(r.err().contains("Usage: slackwater-cli watch"), r.err());
    assertTrue(r.err().contains("confirm with water sampling"), r.err());
  }

  // --- binary query results -------------------------------------------------------------------

  @Test
  void binaryResultsAreNotWrittenToATerminalUnlessOutDashSaysSo() {
    byte[] arrow = {(byte) 0xFF, (byte) 0xFF, (byte) 0xFF, (byte) 0xFF, 0x10, 0, 0, 0}; // IPC continuation marker + length (Arrow columnar format, "Encapsulated message format")
    stub.on("POST", "/api/query", StubServer.Reply.of(200, "application/vnd.apache.arrow.stream", arrow));
    Terminal tty = new Terminal(true, true);
    String q = "mean chlorophyll over \"Outer Bay\" during 2014 by month";
    Run refused = run(Map.of(), InputStream.nullInputStream(), tty, InstantSource.system(), "query", "--format", "arrow", q);
    assertEquals(4, refused.code());
    assertEquals("error: not writing ARROW bytes to the terminal; save them with --out FILE.arrow, or give --out - to send them"
        + " to standard output anyway (to pipe them on)" + NL, refused.err());
    assertEquals(List.of(), stub.requests(), "refused before asking the server");
    Run dash = run(Map.of(), InputStream.nullInputStream(), tty, InstantSource.system(), "query", "--format", "arrow", "--out", "-", q);
    assertEquals(0, dash.code(), dash.err());
    assertArrayEquals(arrow, dash.outBytes(), "binary bytes exactly, no line feed added");
    assertEquals("format=arrow", stub.only().rawQuery());
    assertEquals(q, stub.only().text());
    // Not a terminal (a pipe or a file): written as asked.
    Run piped = run(Map.of(), InputStream.nullInputStream(), Terminal.NONE, InstantSource.system(), "query", "--format", "png",
        "--width", "800", "--height", "400", "--scale", "2", q);
    assertEquals(0, piped.code(), piped.err());
    assertEquals("format=png&width=800&height=400&scale=2.0", stub.requests().get(1).rawQuery());
  }

  @Test
  void plotSizeOptionsNeedPng() {
    Run r = anonymous("query", "--width", "800", "list variables");
    assertEquals(4, r.code());
    assertEquals("error: --width, --height and --scale size a PNG plot; add --format png or drop them" + NL, r.err());
    Run zero = anonymous("query", "--format", "png", "--height", "0", "--out", dir.resolve("p.png").toString(), "list variables");
    assertEquals(4, zero.code());
    assertEquals(List.of(), stub.requests());
  }

  // --- ingest progress ------------------------------------------------------------------------

  /** A clock that moves one second each time it is read, so every frame has a later time than the one before. */
  private static InstantSource steppingClock() {
    AtomicLong reads = new AtomicLong();
    Instant t0 = Instant.parse("2026-12-01T08:00:00Z");
    return () -> t0.plusSeconds(reads.getAndIncrement());
  }

  @Test
  void ingestDrawsAProgressLineOnATerminalAndErasesIt() {
    stub.on("POST", "/api/cubes", StubServer.Reply.json(200,
        "[{\"cube\":\"cloud_fraction\",\"version\":2,\"values\":1499680,\"seconds\":1.25}]").after(Duration.ofMillis(900)));
    Run r = run(Map.of("SLACKWATER_TOKEN", TOKEN), InputStream.nullInputStream(), new Terminal(false, true), steppingClock(),
        "ingest", "cloud_fraction.nc");
    assertEquals(0, r.code(), r.err());
    assertEquals("ingested cloud_fraction version 2: 1,499,680 values in 1.25 s" + NL, r.out());
    assertEquals("{\"path\": \"cloud_fraction.nc\"}", stub.only().text());
    Matcher frame = Pattern.compile("\r([|/\\-\\\\]) ingesting cloud_fraction\\.nc \\((\\d+) s\\)").matcher(r.err());
    List<Long> seconds = new ArrayList<>();
    String spinner = "";
    while (frame.find()) {
      spinner += frame.group(1);
      seconds.add(Long.parseLong(frame.group(2)));
    }
    // 900 ms at one frame per 250 ms: at least three frames, the spinner turning, the seconds growing.
    assertTrue(seconds.size() >= 3, r.err());
    assertEquals("|/-\\|/-\\|/-\\".substring(0, spinner.length()), spinner);
    for (int i = 1; i < seconds.size(); i++) {
      assertTrue(seconds.get(i) > seconds.get(i - 1), seconds.toString());
    }
    // The line is erased at the end: carriage return, blanks over the widest frame, carriage return.
    String last = ProgressLine.frame(0, "ingesting cloud_fraction.nc", Duration.ofSeconds(seconds.get(seconds.size() - 1)));
    assertTrue(r.err().endsWith("\r" + " ".repeat(last.length()) + "\r"), r.err());
  }

  @Test
  void ingestDrawsNothingWhenStandardErrorIsNoTerminal() {
    stub.on("POST", "/api/cubes", StubServer.Reply.json(200,
        "[{\"cube\":\"cloud_fraction\",\"version\":2,\"values\":10,\"seconds\":0.5}]").after(Duration.ofMillis(600)));
    Run r = run(Map.of("SLACKWATER_TOKEN", TOKEN), InputStream.nullInputStream(), Terminal.NONE, steppingClock(), "ingest", "cloud_fraction.nc");
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.err());
  }

  @Test
  void anIngestThatChangesNothingSaysSo() {
    stub.on("POST", "/api/cubes", StubServer.Reply.json(200, "[{\"cube\":\"rainfall\",\"change\":\"UNCHANGED\",\"version\":1,"
        + "\"values\":6570,\"seconds\":0.01,\"note\":\"this file was ingested before\"},"
        + "{\"cube\":\"runoff\",\"change\":\"appended\",\"version\":3,\"values\":730,\"seconds\":0.2}]"));
    Run r = admin("ingest", "harle_2026.nc");
    assertEquals(0, r.code(), r.err());
    assertEquals(List.of("rainfall unchanged (version 1): this file was ingested before",
        "ingested runoff version 3 (appended): 730 values in 0.20 s"), r.out().lines().toList());
  }

  @Test
  void progressFramesAreSpinnerLabelAndWholeSeconds() {
    assertEquals("| ingesting rainfall.nc (0 s)", ProgressLine.frame(0, "ingesting rainfall.nc", Duration.ZERO));
    assertEquals("- ingesting rainfall.nc (61 s)", ProgressLine.frame(6, "ingesting rainfall.nc", Duration.ofMillis(61_999)));
    assertEquals("\\ x (3600 s)", ProgressLine.frame(-1, "x", Duration.ofHours(1)));
  }

  @Test
  void theFallbackCautionIsTheServersWording() {
    assertEquals(WatchStatements.CAUTION, Caution.FALLBACK);
  }
}
