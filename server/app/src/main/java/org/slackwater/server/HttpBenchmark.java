package org.slackwater.server;

import java.io.ByteArrayOutputStream;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.apache.arrow.memory.BufferAllocator;
import org.slackwater.core.Workspace;
import org.slackwater.core.result.ArrowResultWriter;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.CsvWriter;
import org.slackwater.core.result.ResultTable;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code bench-http}: what the HTTP layer costs. On the small demo, a small query whose chunks are
 * cached is answered {@code --requests} times over one keep-alive connection; beside it, in the
 * same run, the same query through the engine and the CSV writer in-process (the baseline). The
 * overhead is the difference of the medians. Then the Arrow IPC writer's throughput on a
 * synthetic table of {@code --rows} rows (a day, a value and a count per row), written to a
 * counting sink, against the same run's baseline of copying the table's raw column bytes. Last,
 * the end-to-end export: a 10-million-row cell export ({@code cells of ...} over a {@link
 * LongRecord} of 5,000 days x 40 x 50 cells) streamed over HTTP as Arrow and read to the last
 * chunk by a plain socket client, against the same run's in-process baseline (the same query
 * through the engine and the Arrow writer into a counting sink).
 * Prints medians and ratios; nothing is asserted (timings belong in benchmarks, not tests).
 */
@Command(name = "bench-http", mixinStandardHelpOptions = true,
    description = "Measure HTTP overhead for a small cached query and the Arrow export rate.")
final class HttpBenchmark implements Callable<Integer> {
  static final String QUERY = "mean chlorophyll over \"Outer Bay\" during 2014-06 by week";

  @Option(names = "--requests", defaultValue = "2000", description = "Requests to time (default ${DEFAULT-VALUE}).")
  int requests;

  @Option(names = "--rows", defaultValue = "10000000", description = "Rows of the Arrow export table (default ${DEFAULT-VALUE}).")
  int rows;

  /** Read after the loops so the baseline's copies are not dead code. */
  private double kept;

  @Override
  public Integer call() throws Exception {
    Path dir = Files.createTempDirectory("slackwater-bench-http-");
    var manifest = DemoScenario.generate(dir.resolve("files"), DemoOptions.small());
    try (Workspace ws = Workspace.open(dir.resolve("store"))) {
      DemoCommand.prepare(ws, manifest);
      smallQuery(ws);
      arrowExport(ws);
      exportOverHttp(ws, dir);
    }
    return kept == Double.MIN_VALUE ? 1 : 0;
  }

  private void smallQuery(Workspace ws) throws Exception {
    ServerConfig config = new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.empty(), Optional.empty());
    try (HttpServer server = HttpServer.start(ws, config);
        java.net.Socket socket = new java.net.Socket("127.0.0.1", server.port())) {
      // A plain blocking HTTP/1.1 client on one keep-alive connection: the JDK's HttpClient adds
      // its own milliseconds of asynchronous machinery, which are not the server's.
      socket.setTcpNoDelay(true);
      byte[] body = QUERY.getBytes(StandardCharsets.UTF_8);
      byte[] request = ("POST /api/query HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: text/plain\r\nContent-Length: " + body.length
          + "\r\n\r\n" + QUERY).getBytes(StandardCharsets.UTF_8);
      java.io.InputStream in = new java.io.BufferedInputStream(socket.getInputStream());
      OutputStream out = socket.getOutputStream();
      long[] http = new long[requests], local = new long[requests];
      for (int i = 0; i < requests / 4; i++) {
        exchange(request, in, out);
        inProcess(ws);
      }
      // Interleaved, so that load from other work falls on both alike.
      for (int i = 0; i < requests; i++) {
        long t0 = System.nanoTime();
        exchange(request, in, out);
        long t1 = System.nanoTime();
        inProcess(ws);
        long t2 = System.nanoTime();
        http[i] = t1 - t0;
        local[i] = t2 - t1;
      }
      double h = median(http) / 1e6, l = median(local) / 1e6;
      System.out.printf("small cached query (%s), %d requests on one keep-alive connection:%n", QUERY, requests);
      System.out.printf("  HTTP round trip   median %.3f ms, p90 %.3f ms%n", h, percentile(http, 0.9) / 1e6);
      System.out.printf("  in-process (same run baseline: engine + CSV writer) median %.3f ms%n", l);
      System.out.printf("  HTTP overhead     median %.3f ms (target < 2 ms); round trip / in-process = %.2f%n", h - l, h / l);
    }
  }

  /** Sends one request and reads the whole answer (status line, headers, Content-Length body). */
  private static void exchange(byte[] request, java.io.InputStream in, OutputStream out) throws Exception {
    out.write(request);
    out.flush();
    String status = line(in);
    if (!status.startsWith("HTTP/1.1 200")) {
      throw new IllegalStateException("the benchmark query failed: " + status);
    }
    int length = -1;
    for (String h = line(in); !h.isEmpty(); h = line(in)) {
      if (h.regionMatches(true, 0, "content-length:", 0, 15)) {
        length = Integer.parseInt(h.substring(15).trim());
      }
    }
    if (in.readNBytes(length).length != length) {
      throw new IllegalStateException("short answer");
    }
  }

  private static String line(java.io.InputStream in) throws java.io.IOException {
    StringBuilder b = new StringBuilder();
    for (int c = in.read(); c != '\n'; c = in.read()) {
      if (c < 0) {
        throw new java.io.EOFException("connection closed");
      }
      if (c != '\r') {
        b.append((char) c);
      }
    }
    return b.toString();
  }

  private static void inProcess(Workspace ws) throws Exception {
    List<ResultTable> t = ws.engine().run(QUERY);
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    CsvWriter.write(t.get(0), new OutputStreamWriter(out, StandardCharsets.UTF_8));
  }

  private void arrowExport(Workspace ws) throws Exception {
    LocalDate[] day = new LocalDate[rows];
    double[] value = new double[rows];
    long[] count = new long[rows];
    LocalDate d0 = LocalDate.of(2006, 1, 1);
    for (int i = 0; i < rows; i++) {
      day[i] = d0.plusDays(i % 7305);
      value[i] = Math.sin(i * 1e-3) * 10 + 20;
      count[i] = i % 977;
    }
    ResultTable t = new ResultTable("export", List.of(new Column.Dates("time", day), new Column.Doubles("value", "mg m-3", value),
        new Column.Longs("cells", "", count)), Map.of("query", "synthetic"), List.of());
    long[] arrow = new long[5], copy = new long[5];
    long bytes = 0;
    for (int round = 0; round < 6; round++) {
      Counting sink = new Counting();
      long t0 = System.nanoTime();
      try (BufferAllocator a = ws.allocator().newChildAllocator("bench", 0, Long.MAX_VALUE)) {
        ArrowResultWriter.write(t, a, sink);
      }
      long t1 = System.nanoTime();
      // Baseline: the bytes of the same columns as flat arrays (what any writer must at least copy).
      long[] epoch = new long[rows];
      for (int i = 0; i < rows; i++) {
        epoch[i] = day[i].toEpochDay();
      }
      double[] v2 = Arrays.copyOf(value, rows);
      long[] c2 = Arrays.copyOf(count, rows);
      long t2 = System.nanoTime();
      if (round > 0) {
        arrow[round - 1] = t1 - t0;
        copy[round - 1] = t2 - t1;
      }
      bytes = sink.n;
      // Keep the copies alive so the JIT cannot drop them.
      kept += v2[rows - 1] + c2[rows - 1] + epoch[rows - 1];
    }
    double mb = bytes / 1e6, sa = median(arrow) / 1e9, sc = median(copy) / 1e9;
    System.out.printf("Arrow IPC stream of %,d rows (%.1f MB):%n", rows, mb);
    System.out.printf("  writer  median %.3f s = %.0f MB/s (target >= 200 MB/s)%n", sa, mb / sa);
    System.out.printf("  baseline (same run: copying the raw columns) median %.3f s; writer / baseline = %.1f%n", sc, sa / sc);
  }

  private void exportOverHttp(Workspace ws, Path dir) throws Exception {
    int nt = 5000, ny = 40, nx = 50;
    Path file = dir.resolve("long_record.nc");
    LongRecord.write(file, nt, ny, nx);
    ws.ingestor().ingest(file, Optional.empty());
    String query = LongRecord.exportQuery(nt, ny, nx);
    ServerConfig config = new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.empty(), Optional.empty());
    int rounds = 4;
    long[] http = new long[rounds], local = new long[rounds];
    long bytes = 0, localBytes = 0;
    try (HttpServer server = HttpServer.start(ws, config)) {
      for (int round = 0; round <= rounds; round++) {
        long t0 = System.nanoTime();
        long got = streamOnce(server.port(), query);
        long t1 = System.nanoTime();
        Counting sink = new Counting();
        try (var rows = ((org.slackwater.core.query.QueryEngine.Answer.Rows) ws.engine().open(query)).stream();
            BufferAllocator a = ws.allocator().newChildAllocator("bench", 0, Long.MAX_VALUE)) {
          ArrowResultWriter.write(rows, a, sink);
        }
        long t2 = System.nanoTime();
        if (round > 0) { // the first round warms up
          http[round - 1] = t1 - t0;
          local[round - 1] = t2 - t1;
        }
        bytes = got;
        localBytes = sink.n;
      }
    }
    if (bytes != localBytes) {
      throw new IllegalStateException("HTTP sent " + bytes + " bytes, the writer " + localBytes);
    }
    double mb = bytes / 1e6, sh = median(http) / 1e9, sl = median(local) / 1e9;
    System.out.printf("cell export of %,d rows as Arrow (%.1f MB):%n", (long) nt * ny * nx, mb);
    System.out.printf("  over HTTP, read to the last chunk  median %.3f s = %.0f MB/s (target >= 200 MB/s)%n", sh, mb / sh);
    System.out.printf("  in-process (same run baseline: engine + Arrow writer, counting sink) median %.3f s = %.0f MB/s;"
        + " HTTP / in-process = %.2f%n", sl, mb / sl, sh / sl);
  }

  /** POSTs the query for Arrow and reads the chunked answer to its last chunk; returns the body's bytes. */
  private static long streamOnce(int port, String query) throws Exception {
    try (java.net.Socket socket = new java.net.Socket("127.0.0.1", port)) {
      byte[] body = query.getBytes(StandardCharsets.UTF_8);
      OutputStream out = socket.getOutputStream();
      out.write(("POST /api/query?format=arrow HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\nContent-Length: "
          + body.length + "\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
      out.write(body);
      out.flush();
      java.io.InputStream in = new java.io.BufferedInputStream(socket.getInputStream(), 1 << 16);
      String status = line(in);
      if (!status.startsWith("HTTP/1.1 200")) {
        throw new IllegalStateException("the export failed: " + status);
      }
      boolean chunked = false;
      for (String h = line(in); !h.isEmpty(); h = line(in)) {
        chunked |= h.equalsIgnoreCase("transfer-encoding: chunked");
      }
      if (!chunked) {
        throw new IllegalStateException("the export was not streamed (no chunked transfer encoding)");
      }
      long total = 0;
      byte[] skip = new byte[1 << 16];
      for (int size = Integer.parseInt(line(in).trim(), 16); size > 0; size = Integer.parseInt(line(in).trim(), 16)) {
        for (int left = size; left > 0; ) {
          int n = in.read(skip, 0, Math.min(skip.length, left));
          if (n < 0) {
            throw new java.io.EOFException("the export ended inside a chunk");
          }
          left -= n;
        }
        total += size;
        line(in); // the CRLF after the chunk
      }
      return total;
    }
  }

  /** Counts bytes, keeps none: the export's own cost without a disk or a network. */
  private static final class Counting extends OutputStream {
    long n;

    @Override
    public void write(int b) {
      n++;
    }

    @Override
    public void write(byte[] b, int off, int len) {
      n += len;
    }
  }

  private static double median(long[] v) {
    return percentile(v, 0.5);
  }

  private static double percentile(long[] v, double p) {
    long[] s = v.clone();
    Arrays.sort(s);
    return s[(int) Math.min(s.length - 1, Math.floor(p * (s.length - 1)))];
  }
}
