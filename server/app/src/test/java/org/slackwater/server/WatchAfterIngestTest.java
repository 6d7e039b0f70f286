package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;
import org.slackwater.core.ingest.IngestOptions;

/**
 * A stored watch runs by itself when an ingest extends a variable it reads, on the new days only
 * (the first time: the last days of data), and an ingest that changes nothing runs nothing. The
 * files are written by ncgen from the committed CDL (see DropFolderFiles).
 */
class WatchAfterIngestTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static final String WATCH = "watch \"Auto\" over box(43.6 N, 31.4 W, 44.4 N, 30.4 W) when mean water_temp above 10.9 degC severity notice";

  @TempDir Path dir;

  private static HttpResponse<String> send(String method, String url, String body) throws Exception {
    return HTTP.send(HttpRequest.newBuilder(URI.create(url)).header("Authorization", "Bearer tok")
        .method(method, HttpRequest.BodyPublishers.ofString(body)).build(), HttpResponse.BodyHandlers.ofString());
  }

  @Test
  void anIngestThatExtendsAWatchedVariableRunsTheWatchOnTheNewDays() throws Exception {
    try (Workspace ws = Workspace.open(dir.resolve("store"));
        HttpServer server = HttpServer.start(ws, new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.of("tok"), Optional.empty()))) {
      ws.ingestor().ingest(DropFolderFiles.nc("wrenmouth_temp_20240101_20240110"), IngestOptions.defaults());
      assertEquals(201, send("POST", server.url() + "/api/watches", WATCH).statusCode());
      JsonNode before = JSON.readTree(send("GET", server.url() + "/api/watches/Auto", "").body());
      assertTrue(before.path("evaluated_to").isMissingNode(), "not run before an ingest");

      ws.ingestor().ingest(DropFolderFiles.nc("wrenmouth_temp_20240111_20240115"), IngestOptions.defaults());
      JsonNode after = JSON.readTree(send("GET", server.url() + "/api/watches/Auto", "").body());
      assertEquals("2024-01-15", after.path("evaluated_to").asText());

      // The expected transitions, from the daily area means and the rule written out by hand:
      // the first automatic run covers the last 7 days (2024-01-09 to 01-15), the day before decides 01-09.
      JsonNode rows = JSON.readTree(send("POST", server.url() + "/api/query?format=json",
          "mean water_temp over box(43.6 N, 31.4 W, 44.4 N, 30.4 W) from 2024-01-08 to 2024-01-15 by day").body())
          .path("results").get(0).path("rows");
      List<String> expected = new ArrayList<>();
      boolean previous = rows.get(0).get(1).asDouble() > 10.9;
      for (int i = 1; i < rows.size(); i++) {
        boolean holds = !rows.get(i).get(1).isNull() && rows.get(i).get(1).asDouble() > 10.9;
        if (holds != previous) {
          expected.add(rows.get(i).get(0).asText() + " " + (holds ? "raised" : "cleared"));
        }
        previous = holds;
      }
      List<String> recorded = new ArrayList<>();
      for (JsonNode t : after.path("transitions")) {
        recorded.add(t.path("day").asText() + " " + t.path("state").asText());
        assertTrue(!LocalDate.parse(t.path("day").asText()).isBefore(LocalDate.of(2024, 1, 9)));
      }
      assertEquals(expected, recorded);
      assertTrue(!recorded.isEmpty(), "the test field crosses 10.9 degC in those days");

      // The same file again changes nothing, so nothing runs and nothing is recorded.
      ws.ingestor().ingest(DropFolderFiles.nc("wrenmouth_temp_20240111_20240115"), IngestOptions.defaults());
      JsonNode again = JSON.readTree(send("GET", server.url() + "/api/watches/Auto", "").body());
      assertEquals(after.path("transitions"), again.path("transitions"));
    }
  }
}
