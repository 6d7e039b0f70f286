package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.BigIntVector;
import org.apache.arrow.vector.DateDayVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowStreamReader;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slackwater.core.Workspace;

/**
 * A 10-million-row export over HTTP from a server with a small heap: the server runs in its own
 * JVM with {@code -Xmx128m} while the Arrow stream it sends is about 520 MB, so it can only answer
 * by streaming. The client reads the stream with Arrow's own {@link ArrowStreamReader} as it
 * arrives and checks every row against the formula the NetCDF file ({@link LongRecord}, written by
 * NetCDF-Java's {@code NetcdfFileWriter}) was filled from. Also: CSV and JSON exports are streamed in the same
 * shape as whole results, a plot of an export is a 422 problem, and the server still answers
 * afterwards. The server JVM runs without the vector module, as {@code java -jar} starts it, so
 * the correlation maps' scalar kernel serves a map there.
 */
class StreamingExportTest {
  private static final int NT = 5000, NY = 40, NX = 50;
  private static final LocalDate START = LongRecord.START;
  private static final HttpClient HTTP = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();

  @TempDir static Path dir;
  private static Process server;
  private static String url;

  static float value(int t, int y, int x) {
    return LongRecord.value(t, y, x);
  }

  @BeforeAll
  static void startSmallServer() throws Exception {
    Path file = dir.resolve("long_record_temperature.nc");
    LongRecord.write(file, NT, NY, NX);
    Path data = dir.resolve("data");
    try (Workspace ws = Workspace.open(data)) {
      ws.ingestor().ingest(file, Optional.empty());
    }
    Files.delete(file);
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    // No --add-modules: the server runs as 'java -jar' starts it, with the scalar correlation-map kernel.
    // The server's own logging (INFO), not the tests' (WARN): the test reads what it says.
    String logging = Path.of(StreamingExportTest.class.getClassLoader().getResource("logback.xml").toURI()).toString();
    List<String> cmd = new ArrayList<>(List.of(java, "-Xmx128m", "-Dlogback.configurationFile=" + logging));
    for (String pkg : List.of("java.nio", "sun.nio.ch", "java.lang", "java.util", "java.lang.invoke")) {
      cmd.add("--add-opens=java.base/" + pkg + "=ALL-UNNAMED");
    }
    cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), Main.class.getName(), "serve", "--data", data.toString(),
        "--port", "0"));
    server = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("server.log").toFile()).start();
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
    while (url == null && System.nanoTime() < deadline && server.isAlive()) {
      for (String line : Files.readAllLines(dir.resolve("server.log"))) {
        if (line.startsWith("listening on ")) {
          url = line.substring("listening on ".length()).trim();
        }
      }
      Thread.sleep(100);
    }
    assertTrue(url != null, "the server did not start: " + Files.readString(dir.resolve("server.log")));
  }

  @AfterAll
  static void stopServer() throws Exception {
    if (server != null) {
      server.destroy();
      server.waitFor(10, TimeUnit.SECONDS);
    }
  }

  @Test
  void tenMillionRowsStreamFromASmallHeapAndReadBackWithArrowsReader() throws Exception {
    String q = LongRecord.exportQuery(NT, NY, NX);
    HttpResponse<InputStream> res = post(q, "arrow");
    assertEquals(200, res.statusCode());
    assertEquals("chunked", res.headers().firstValue("transfer-encoding").orElse(""));
    long rows = 0;
    long started = System.nanoTime();
    CountingInput counted = new CountingInput(res.body());
    try (BufferAllocator a = new RootAllocator(256L << 20); ArrowStreamReader reader = new ArrowStreamReader(counted, a)) {
      VectorSchemaRoot root = reader.getVectorSchemaRoot();
      assertEquals("10000000", root.getSchema().getCustomMetadata().get("rows"));
      assertEquals("degC", root.getSchema().findField("record_temperature").getMetadata().get("unit"));
      while (reader.loadNextBatch()) {
        DateDayVector time = (DateDayVector) root.getVector("time");
        BigIntVector row = (BigIntVector) root.getVector("row");
        BigIntVector col = (BigIntVector) root.getVector("column");
        Float8Vector v = (Float8Vector) root.getVector("record_temperature");
        for (int i = 0; i < root.getRowCount(); i++, rows++) {
          int t = (int) (rows / (NY * NX)), cell = (int) (rows % (NY * NX));
          int y = cell / NX, x = cell % NX;
          if (time.get(i) != START.plusDays(t).toEpochDay() || row.get(i) != y || col.get(i) != x || v.get(i) != value(t, y, x)) {
            throw new AssertionError("row " + rows + ": " + LocalDate.ofEpochDay(time.get(i)) + " (" + row.get(i) + ", "
                + col.get(i) + ") = " + v.get(i) + ", expected " + START.plusDays(t) + " (" + y + ", " + x + ") = " + value(t, y, x));
          }
        }
      }
    }
    double seconds = (System.nanoTime() - started) / 1e9;
    assertEquals(10_000_000L, rows);
    assertTrue(counted.bytes > 128L << 20, "the stream (" + counted.bytes + " bytes) is larger than the server's whole heap");
    // Not a speed test (see bench-http); printed to show what the stream carried.
    System.out.printf("streamed %d rows, %.0f MB in %.1f s to a reader checking every row%n", rows, counted.bytes / 1e6, seconds);
    assertTrue(server.isAlive(), "the server survived");
    assertEquals(200, HTTP.send(HttpRequest.newBuilder(URI.create(url + "/api/health")).build(),
        HttpResponse.BodyHandlers.discarding()).statusCode());
  }

  @Test
  void withoutTheVectorModuleCorrelationMapsRunOnTheScalarKernel() throws Exception {
    // A cell correlated with the box's own mean: r > 0 everywhere, from the FUSED (or PLAIN) loops.
    String q = "map correlation of record_temperature over box(44, -32, 44.2, -31.8) with mean record_temperature"
        + " over box(44, -32, 44.2, -31.8) during 2006 by day at lag 0 days";
    HttpResponse<InputStream> res = post(q, "json");
    assertEquals(200, res.statusCode());
    JsonNode result = new ObjectMapper().readTree(res.body()).get("results").get(0);
    assertEquals(16, result.get("rows").size()); // 4 x 4 cells of 0.05 degrees
    String log = Files.readString(dir.resolve("server.log"));
    assertTrue(log.contains("correlation maps use FUSED arithmetic (start Java with --add-modules=jdk.incubator.vector")
        || log.contains("correlation maps use PLAIN arithmetic"), log);
  }

  @Test
  void aClientThatLeavesMidExportStopsTheExportAndTheServerGoesOn() throws Exception {
    URI base = URI.create(url);
    byte[] body = LongRecord.exportQuery(NT, NY, NX).getBytes(StandardCharsets.UTF_8);
    try (java.net.Socket socket = new java.net.Socket(base.getHost(), base.getPort())) {
      socket.getOutputStream().write(("POST /api/query?format=csv HTTP/1.1\r\nHost: x\r\nContent-Length: " + body.length
          + "\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
      socket.getOutputStream().write(body);
      socket.getOutputStream().flush();
      // Read a little of the answer (the export is some 600 MB of CSV), then leave.
      byte[] some = socket.getInputStream().readNBytes(1 << 20);
      assertTrue(new String(some, 0, 200, StandardCharsets.US_ASCII).startsWith("HTTP/1.1 200"), "the export started");
    }
    // The producer sees the closed channel at its next chunk and stops (ChunkedBody), and says so.
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
    while (!Files.readString(dir.resolve("server.log")).contains("client left") && System.nanoTime() < deadline) {
      Thread.sleep(100);
    }
    assertTrue(Files.readString(dir.resolve("server.log")).contains("client left"), Files.readString(dir.resolve("server.log")));
    HttpResponse<InputStream> after = post("cells of record_temperature over box(44, -32, 44.1, -31.9) during 2006-03-01", "json");
    assertEquals(200, after.statusCode());
    assertEquals(4, new ObjectMapper().readTree(after.body()).get("results").get(0).get("rows").size());
  }

  @Test
  void csvExportStreamsHeaderAndOneLinePerRow() throws Exception {
    HttpResponse<InputStream> res = post("cells of record_temperature over box(44, -32, 46, -29.5) during 2010", "csv");
    assertEquals(200, res.statusCode());
    long lines = 0;
    String header;
    String first;
    try (BufferedReader r = new BufferedReader(new InputStreamReader(res.body(), StandardCharsets.UTF_8))) {
      header = r.readLine();
      first = r.readLine();
      lines = 1;
      while (r.readLine() != null) {
        lines++;
      }
    }
    assertEquals("time,row,column,lat [degrees_north],lon [degrees_east],fraction_inside [1],record_temperature [degC]", header);
    assertEquals(365L * NY * NX, lines);
    String[] f = first.split(",");
    int t = (int) (LocalDate.of(2010, 1, 1).toEpochDay() - START.toEpochDay());
    assertEquals("2010-01-01", f[0]);
    assertEquals(value(t, 0, 0), Float.parseFloat(f[6]), 1e-5);
  }

  @Test
  void jsonExportHasTheShapeOfAWholeResult() throws Exception {
    HttpResponse<InputStream> res = post("cells of record_temperature over box(44, -32, 44.1, -31.9) during 2006-03-01", "json");
    assertEquals(200, res.statusCode());
    JsonNode doc = new ObjectMapper().readTree(res.body());
    JsonNode result = doc.get("results").get(0);
    assertEquals(4, result.get("rows").size()); // the 2 x 2 cells of 0.05 degrees touching the box
    assertEquals("cells", result.get("metadata").get("result_kind").asText());
    assertEquals("record_temperature", result.get("columns").get(6).get("name").asText());
  }

  @Test
  void aPlotOfAnExportIsAProblemNotAPicture() throws Exception {
    HttpResponse<InputStream> res = post("cells of record_temperature over box(44, -32, 44.1, -31.9) during 2006-03-01", "png");
    assertEquals(422, res.statusCode());
    JsonNode doc = new ObjectMapper().readTree(res.body());
    assertTrue(doc.get("detail").asText().contains("has no plot"), doc.toString());
  }

  private static HttpResponse<InputStream> post(String query, String format) throws IOException, InterruptedException {
    HttpRequest req = HttpRequest.newBuilder(URI.create(url + "/api/query?format=" + format))
        .POST(HttpRequest.BodyPublishers.ofString(query)).build();
    return HTTP.send(req, HttpResponse.BodyHandlers.ofInputStream());
  }

  /** Counts the bytes the reader takes. */
  private static final class CountingInput extends java.io.FilterInputStream {
    long bytes;

    CountingInput(InputStream in) {
      super(in);
    }

    @Override
    public int read() throws IOException {
      int b = super.read();
      if (b >= 0) {
        bytes++;
      }
      return b;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
      int n = super.read(b, off, len);
      if (n > 0) {
        bytes += n;
      }
      return n;
    }
  }

}
