package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slackwater.core.Workspace;

/** Status codes and problem documents (RFC 9457) of the HTTP API, over a real socket. */
class HttpContractTest {
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static final ObjectMapper JSON = new ObjectMapper();
  private static Workspace ws;
  private static HttpServer server;
  private static Path ingestRoot;

  @BeforeAll
  static void start() throws Exception {
    DemoFixture demo = DemoFixture.small();
    ws = demo.open();
    ingestRoot = Files.createTempDirectory("slackwater-ingest-root");
    ServerConfig config = new ServerConfig("127.0.0.1", 0, 4096, java.util.Optional.of("s3cret"), java.util.Optional.of(ingestRoot));
    server = HttpServer.start(ws, config);
  }

  @AfterAll
  static void stop() {
    server.close();
    ws.close();
  }

  private static HttpResponse<String> send(HttpRequest.Builder b) throws Exception {
    return HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
  }

  private static HttpRequest.Builder at(String path) {
    return HttpRequest.newBuilder(URI.create(server.url() + path));
  }

  private static JsonNode problem(HttpResponse<String> r, int status) throws Exception {
    assertEquals(status, r.statusCode(), r.body());
    assertEquals("application/problem+json", r.headers().firstValue("content-type").orElse(""));
    JsonNode p = JSON.readTree(r.body());
    assertEquals(status, p.get("status").asInt());
    assertTrue(p.hasNonNull("title") && p.hasNonNull("detail"));
    return p;
  }

  @Test
  void aSyntaxErrorIsAProblemWithLineAndColumn() throws Exception {
    JsonNode p = problem(send(at("/api/query").POST(HttpRequest.BodyPublishers.ofString("list variables;\nmean chlorophyll over \"Outer Bay\" during 2014"))), 400);
    assertEquals(2, p.get("line").asInt());
    assertTrue(p.get("column").asInt() >= 1);
    assertTrue(p.get("excerpt").asText().contains("^"));
  }

  @Test
  void anUnknownRegionNamesTheNearestOne() throws Exception {
    JsonNode p = problem(send(at("/api/query").POST(HttpRequest.BodyPublishers.ofString("mean chlorophyll over \"Outer Bya\" during 2014 by month"))), 400);
    assertEquals("unknown region \"Outer Bya\"", p.get("detail").asText());
    assertEquals("did you mean \"Outer Bay\"?", p.get("hint").asText());
    assertEquals(1, p.get("line").asInt());
    assertEquals(23, p.get("column").asInt());
  }

  @ParameterizedTest
  @CsvSource({
    "GET, /api/nowhere, 404",
    "GET, /api/query, 405",
    "DELETE, /api/health, 405",
    "GET, /api/cubes/nosuch, 404",
  })
  void routesAnswerWithProblems(String method, String path, int status) throws Exception {
    problem(send(at(path).method(method, HttpRequest.BodyPublishers.noBody())), status);
  }

  @Test
  void anUnknownFormatIs406() throws Exception {
    problem(send(at("/api/query?format=xls").POST(HttpRequest.BodyPublishers.ofString("list variables"))), 406);
    problem(send(at("/api/query").header("Accept", "application/xml").POST(HttpRequest.BodyPublishers.ofString("list variables"))), 406);
  }

  @Test
  void aBodyOverTheLimitIs413() throws Exception {
    problem(send(at("/api/query").POST(HttpRequest.BodyPublishers.ofString("list variables # " + "x".repeat(5000)))), 413);
  }

  @Test
  void adminEndpointsNeedTheToken() throws Exception {
    String poly = "{\"type\":\"Polygon\",\"coordinates\":[[[-31.3,44.0],[-31.1,44.0],[-31.1,44.1],[-31.3,44.0]]]}";
    problem(send(at("/api/regions/Test%20Patch").PUT(HttpRequest.BodyPublishers.ofString(poly))), 401);
    problem(send(at("/api/regions/Test%20Patch").header("Authorization", "Bearer wrong").PUT(HttpRequest.BodyPublishers.ofString(poly))), 401);
    try {
    HttpResponse<String> ok = send(at("/api/regions/Test%20Patch").header("Authorization", "Bearer s3cret").PUT(HttpRequest.BodyPublishers.ofString(poly)));
    assertEquals(200, ok.statusCode(), ok.body());
    HttpResponse<String> q = send(at("/api/query").POST(HttpRequest.BodyPublishers.ofString("mean rainfall over \"test patch\" during 2014-07 by month")));
    assertEquals(200, q.statusCode(), q.body());
    JsonNode bad = problem(send(at("/api/regions/Broken").header("Authorization", "Bearer s3cret")
        .PUT(HttpRequest.BodyPublishers.ofString("{\"type\":\"Polygon\",\"coordinates\":[[[0,0],[1,1],[1,0],[0,1],[0,0]]]}"))), 400);
    assertTrue(bad.get("detail").asText().contains("Self-intersection"), bad.toString());
    } finally {
      ws.catalog().removeRegion("Test Patch");
    }
  }

  @Test
  void watchesAreCheckedStoredVersionedAndCarryTheCaution() throws Exception {
    String w = "watch \"Test bloom\" over \"Outer Bay\" when mean chlorophyll above 10 mg/m3 for 3 days";
    problem(send(at("/api/watches").POST(HttpRequest.BodyPublishers.ofString(w))), 401);
    HttpResponse<String> created = send(at("/api/watches").header("Authorization", "Bearer s3cret").POST(HttpRequest.BodyPublishers.ofString(w)));
    assertEquals(201, created.statusCode(), created.body());
    JsonNode c = JSON.readTree(created.body());
    assertEquals(1, c.get("version").asInt());
    assertTrue(c.get("caution").asText().contains("Confirm with water sampling"));
    HttpResponse<String> again = send(at("/api/watches").header("Authorization", "Bearer s3cret").POST(HttpRequest.BodyPublishers.ofString(w)));
    assertEquals(200, again.statusCode());
    assertEquals(2, JSON.readTree(again.body()).get("version").asInt());
    JsonNode list = JSON.readTree(send(at("/api/watches").GET()).body());
    assertEquals("Test bloom", list.get("watches").get(0).get("name").asText());
    assertTrue(list.get("caution").asText().startsWith("Screening aid only"));
    JsonNode bad = problem(send(at("/api/watches").header("Authorization", "Bearer s3cret")
        .POST(HttpRequest.BodyPublishers.ofString("watch \"x\" over \"Outer Bay\" when mean chlorophyll above 10 for 3 days"))), 400);
    assertEquals("give the threshold's unit: the data are in 'mg m-3'", bad.get("detail").asText());
    assertEquals(50, bad.get("column").asInt()); // the threshold, at "above"
    assertEquals(204, send(at("/api/watches/Test%20bloom").header("Authorization", "Bearer s3cret").DELETE()).statusCode());
    problem(send(at("/api/watches/Test%20bloom").header("Authorization", "Bearer s3cret").DELETE()), 404);
  }

  @Test
  void aBadFileSentForIngestChangesNothing() throws Exception {
    Files.writeString(ingestRoot.resolve("notes.nc"), "this is not NetCDF");
    int before = ws.catalog().cubes().size();
    JsonNode p = problem(send(at("/api/cubes").header("Authorization", "Bearer s3cret")
        .POST(HttpRequest.BodyPublishers.ofString("{\"path\":\"notes.nc\"}"))), 422);
    assertTrue(p.get("detail").asText().startsWith("file notes.nc"), p.toString());
    // Messages name the file, never the server's directories.
    assertTrue(!p.toString().contains(ingestRoot.toString()), p.toString());
    assertEquals(before, ws.catalog().cubes().size());
    problem(send(at("/api/cubes").header("Authorization", "Bearer s3cret")
        .POST(HttpRequest.BodyPublishers.ofString("{\"path\":\"../etc/passwd\"}"))), 400);
  }
}
