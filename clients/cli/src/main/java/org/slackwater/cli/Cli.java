package org.slackwater.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.net.ConnectException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * The command-line client. Talks only HTTP to a Slackwater server, so it needs nothing but a JDK.
 *
 * <p>Exit codes: 0 success; 1 the server refused the request (the problem is printed); 2 the
 * query has an error (printed with its line, column and a caret); 3 the server cannot be reached;
 * 4 a local problem (file not readable, bad option).
 */
@Command(name = "slackwater-cli", mixinStandardHelpOptions = true, version = "Slackwater CLI 0.1.0",
    description = "Ask a Slackwater server questions about estuary data.",
    subcommands = {Cli.Query.class, Cli.Cubes.class, Cli.Regions.class, Cli.Health.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:success", "1:the server refused the request", "2:the query has an error",
        "3:the server cannot be reached", "4:local problem (file, option)"})
public final class Cli implements Runnable {
  static final int REFUSED = 1, QUERY_ERROR = 2, UNREACHABLE = 3, LOCAL = 4;

  @Option(names = "--server", description = "Server URL (default: $SLACKWATER_URL or http://127.0.0.1:8080).", scope = CommandLine.ScopeType.INHERIT)
  String server;

  PrintStream out = System.out;
  PrintStream err = System.err;

  public static void main(String[] args) {
    System.exit(run(args, System.out, System.err));
  }

  /** Runs the CLI with the given streams; returns the exit code. */
  public static int run(String[] args, PrintStream out, PrintStream err) {
    Cli cli = new Cli();
    cli.out = out;
    cli.err = err;
    CommandLine cl = new CommandLine(cli);
    cl.setOut(new java.io.PrintWriter(out, true));
    cl.setErr(new java.io.PrintWriter(err, true));
    cl.setExecutionExceptionHandler((ex, line, parsed) -> {
      err.println("error: " + ex.getMessage());
      return LOCAL;
    });
    return cl.execute(args);
  }

  @Override
  public void run() {
    new CommandLine(this).usage(out);
  }

  URI base() {
    String s = server != null ? server : System.getenv().getOrDefault("SLACKWATER_URL", "http://127.0.0.1:8080");
    return URI.create(s.endsWith("/") ? s.substring(0, s.length() - 1) : s);
  }

  /** Sends a request; prints the body (or writes it to {@code outFile}) or the problem; returns the exit code. */
  int send(HttpRequest.Builder req, Path outFile) {
    HttpClient client = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
    HttpResponse<InputStream> res;
    try {
      res = client.send(req.build(), HttpResponse.BodyHandlers.ofInputStream());
    } catch (ConnectException e) {
      err.println("error: cannot reach the server at " + base() + " (is it running? set --server or SLACKWATER_URL)");
      return UNREACHABLE;
    } catch (IOException e) {
      err.println("error: talking to " + base() + " failed: " + e.getMessage());
      return UNREACHABLE;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return UNREACHABLE;
    }
    try (InputStream body = res.body()) {
      if (res.statusCode() >= 400) {
        return Problems.print(new String(body.readAllBytes(), StandardCharsets.UTF_8), res.statusCode(), err);
      }
      if (outFile != null) {
        Files.copy(body, outFile, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        err.println("wrote " + outFile);
      } else {
        body.transferTo(out);
        out.flush();
      }
      return 0;
    } catch (IOException e) {
      err.println("error: reading the answer failed: " + e.getMessage());
      return UNREACHABLE;
    }
  }

  @Command(name = "query", mixinStandardHelpOptions = true, description = "Run a query and print (or save) the result.")
  static final class Query implements Callable<Integer> {
    @CommandLine.ParentCommand Cli cli;

    @Parameters(arity = "0..1", paramLabel = "TEXT", description = "The query text; '-' or nothing reads standard input.")
    String text;

    @Option(names = {"-f", "--file"}, description = "Read the query from a .swq file.")
    Path file;

    @Option(names = "--format", defaultValue = "csv", description = "csv or json (default ${DEFAULT-VALUE}).")
    String format;

    @Option(names = {"-o", "--out"}, description = "Write the result to this file instead of standard output.")
    Path out;

    @Override
    public Integer call() throws IOException {
      String q;
      if (file != null) {
        q = Files.readString(file);
      } else if (text == null || text.equals("-")) {
        q = new String(System.in.readAllBytes(), StandardCharsets.UTF_8);
      } else {
        q = text;
      }
      HttpRequest.Builder req = HttpRequest.newBuilder(cli.base().resolve("/api/query?format=" + format))
          .header("Content-Type", "text/plain; charset=utf-8")
          .POST(HttpRequest.BodyPublishers.ofString(q, StandardCharsets.UTF_8));
      return cli.send(req, out);
    }
  }

  @Command(name = "cubes", mixinStandardHelpOptions = true, description = "List the cubes the server holds (JSON).")
  static final class Cubes implements Callable<Integer> {
    @CommandLine.ParentCommand Cli cli;

    @Override
    public Integer call() {
      return cli.send(HttpRequest.newBuilder(cli.base().resolve("/api/cubes")).GET(), null);
    }
  }

  @Command(name = "regions", mixinStandardHelpOptions = true, description = "List the regions (GeoJSON).")
  static final class Regions implements Callable<Integer> {
    @CommandLine.ParentCommand Cli cli;

    @Override
    public Integer call() {
      return cli.send(HttpRequest.newBuilder(cli.base().resolve("/api/regions")).GET(), null);
    }
  }

  @Command(name = "health", mixinStandardHelpOptions = true, description = "Check that the server answers.")
  static final class Health implements Callable<Integer> {
    @CommandLine.ParentCommand Cli cli;

    @Override
    public Integer call() {
      return cli.send(HttpRequest.newBuilder(cli.base().resolve("/api/health")).GET(), null);
    }
  }
}
