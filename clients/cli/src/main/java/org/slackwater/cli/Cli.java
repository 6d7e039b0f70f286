package org.slackwater.cli;

import java.io.InputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;
import java.time.InstantSource;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * The command-line client. Talks only HTTP to a Slackwater server, so it needs nothing but a JDK.
 *
 * <p>Exit codes: 0 success; 1 the server refused the request (its problem detail is printed);
 * 2 the query or watch text has an error (printed with its line, column, the line with a caret,
 * and the hint); 3 the server cannot be reached; 4 a local problem (a file that cannot be read or
 * written, a bad line in an events file, a bad option, binary output bound for a terminal); 5 not
 * allowed (the admin token is missing or wrong, or the server has the function off); 6 not found
 * (no such watch, cube or file under the ingest root). Everything but results goes to standard
 * error, as {@code error: ...}, {@code hint: ...} and {@code caution: ...} lines; no stack traces.
 *
 * <p>Environment: {@code SLACKWATER_URL} the server (when {@code --server} is not given),
 * {@code SLACKWATER_TOKEN} the admin token for the commands that change the server.
 */
@Command(name = "slackwater-cli", mixinStandardHelpOptions = true, version = "Slackwater CLI 0.1.0",
    description = "Ask a Slackwater server questions about estuary data.",
    subcommands = {QueryCommand.class, DescribeCommand.class, CatalogCommand.class, CubesCommand.class, RegionsCommand.class,
        IngestCommand.class, WatchCommand.class, HealthCommand.class, CommandLine.HelpCommand.class},
    footerHeading = "%nEnvironment:%n",
    footer = {"  SLACKWATER_URL    the server, when --server is not given",
        "  SLACKWATER_TOKEN  admin token for regions add, ingest, and watch create,",
        "                    evaluate, channels and delete",
        "",
        "Watch results are a screening aid built from remote-sensing and model data;",
        "confirm with water sampling, and follow local drinking-water regulations and",
        "licensed operators."},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:success", "1:the server refused the request", "2:the query or watch text has an error",
        "3:the server cannot be reached", "4:local problem (file, events file, option, binary output to a terminal)",
        "5:not allowed (admin token missing or wrong, or the function is off on the server)",
        "6:not found (no such watch, cube or file)"})
public final class Cli implements Callable<Integer> {
  static final int OK = 0, REFUSED = 1, QUERY_ERROR = 2, UNREACHABLE = 3, LOCAL = 4, NOT_ALLOWED = 5, NOT_FOUND = 6;

  @Option(names = "--server", paramLabel = "URL", scope = CommandLine.ScopeType.INHERIT,
      description = {"Server URL (default: $SLACKWATER_URL,", "else " + ServerConnection.DEFAULT_URL + ")."})
  String server;

  InputStream in = System.in;
  PrintStream out = System.out;
  PrintStream err = System.err;
  Map<String, String> env = Map.of();
  Terminal terminal = Terminal.NONE;
  InstantSource clock = InstantSource.system();

  public static void main(String[] args) {
    System.exit(run(args, System.in, System.out, System.err, System.getenv(), Terminal.detect(), InstantSource.system()));
  }

  /** Runs the CLI with the process's standard input and environment; returns the exit code. */
  public static int run(String[] args, PrintStream out, PrintStream err) {
    return run(args, System.in, out, err, System.getenv());
  }

  /**
   * Runs the CLI with the given streams and environment variables; returns the exit code. The
   * streams count as no terminal (no progress line; binary results are written where asked).
   */
  public static int run(String[] args, InputStream in, PrintStream out, PrintStream err, Map<String, String> env) {
    return run(args, in, out, err, env, Terminal.NONE, InstantSource.system());
  }

  /** As above, saying which streams are a terminal and which clock times the progress line. */
  static int run(String[] args, InputStream in, PrintStream out, PrintStream err, Map<String, String> env,
      Terminal terminal, InstantSource clock) {
    Cli cli = new Cli();
    cli.in = in;
    cli.out = out;
    cli.err = err;
    cli.env = Map.copyOf(env);
    cli.terminal = terminal;
    cli.clock = clock;
    CommandLine cl = new CommandLine(cli);
    cl.setCaseInsensitiveEnumValuesAllowed(true);
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    cl.setParameterExceptionHandler((ex, arguments) -> {
      err.println("error: " + ex.getMessage());
      err.println("see '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help'");
      return LOCAL;
    });
    cl.setExecutionExceptionHandler((ex, commandLine, parsed) -> {
      if (ex instanceof CliFailure f) {
        err.println("error: " + f.getMessage());
        return f.exitCode();
      }
      err.println("error: " + describe(ex));
      return LOCAL;
    });
    int code = cl.execute(args);
    out.flush();
    err.flush();
    return code;
  }

  /** Without a subcommand: the usage, on standard error, as for any other incomplete command line. */
  @Override
  public Integer call() {
    new CommandLine(this).usage(err);
    return LOCAL;
  }

  ServerConnection connection() throws CliFailure {
    return ServerConnection.of(server, env);
  }

  /** Prints a successful text answer, or the problem; returns the exit code. */
  int show(Answer a) {
    if (!a.ok()) {
      return Problems.print(a.text(), a.status(), err);
    }
    String text = a.text();
    out.print(text.endsWith("\n") || text.isEmpty() ? text : text + "\n");
    out.flush();
    return OK;
  }

  /** Prints the problem of a refused admin request, with what to do about the token. */
  int refusedAdmin(Answer a, ServerConnection c) {
    int code = Problems.print(a.text(), a.status(), err);
    if (a.status() == 401) {
      err.println(c.hasToken()
          ? "hint: " + ServerConnection.TOKEN_VARIABLE + " is not the server's admin token"
          : "hint: set " + ServerConnection.TOKEN_VARIABLE + " to the server's admin token");
    }
    return code;
  }

  /** A path segment, percent-encoded (RFC 3986: spaces as %20, not '+'). */
  static String segment(String s) {
    return URLEncoder.encode(s, StandardCharsets.UTF_8).replace("+", "%20");
  }

  /** An exception in plain words, for messages. */
  static String describe(Throwable e) {
    if (e instanceof NoSuchFileException) {
      return "no such file or folder";
    }
    if (e instanceof AccessDeniedException) {
      return "permission denied";
    }
    return e.getMessage() == null || e.getMessage().isBlank() ? e.getClass().getSimpleName() : e.getMessage();
  }
}
