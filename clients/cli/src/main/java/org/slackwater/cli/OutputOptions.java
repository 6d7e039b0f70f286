package org.slackwater.cli;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import picocli.CommandLine.Option;

/**
 * How a result is delivered: the format asked of the server (CSV, JSON, an Arrow IPC stream or a
 * PNG plot with its size), an optional aligned-table view of CSV for people, and where it goes
 * (standard output, or a file with {@code --out FILE}; {@code --out -} is standard output said
 * explicitly).
 *
 * <p>Standard output gets the server's bytes unchanged; text answers get a final line feed if they
 * lack one, so the prompt starts on a new line; binary answers (PNG, Arrow) are never touched. A
 * file gets exactly the server's bytes. {@code --table} replaces either with the aligned view.
 *
 * <p>Failure modes ({@link CliFailure}, {@link Cli#LOCAL}), all found before the request is sent:
 * {@code --table} with anything but CSV; {@code --width}, {@code --height} or {@code --scale}
 * without {@code --format png}, or not positive; a binary format bound for standard output when
 * that is a terminal and {@code --out -} was not given (the bytes would garble the terminal). A
 * file that cannot be written is also {@link Cli#LOCAL}.
 */
final class OutputOptions {
  enum Format {
    csv(false), json(false), arrow(true), png(true);

    final boolean binary;

    Format(boolean binary) {
      this.binary = binary;
    }
  }

  static final String STANDARD_OUTPUT = "-";

  @Option(names = "--format", defaultValue = "csv", paramLabel = "csv|json|arrow|png",
      description = {"Result format (default ${DEFAULT-VALUE}): csv, json, arrow (an Arrow IPC stream)",
          "or png (a plot); arrow and png need --out FILE, or --out - to write them to standard output."})
  Format format = Format.csv;

  @Option(names = {"-t", "--table"}, description = "Show CSV as aligned columns with the units in the header (for reading, not for scripts).")
  boolean table;

  @Option(names = {"-o", "--out"}, paramLabel = "FILE", description = "Write the result to FILE instead of standard output ('-': standard output).")
  Path out;

  @Option(names = "--width", paramLabel = "PIXELS", description = "Width of a PNG plot (server default if not given).")
  Integer width;

  @Option(names = "--height", paramLabel = "PIXELS", description = "Height of a PNG plot (server default if not given).")
  Integer height;

  @Option(names = "--scale", paramLabel = "FACTOR", description = "Pixel density of a PNG plot, e.g. 2 for high-density screens.")
  Double scale;

  /**
   * The URL query parameters for the server ({@code format=...} and, for PNG, the size), after
   * checking the options against each other and against where the bytes will go.
   */
  String parameters(Terminal terminal) throws CliFailure {
    if (table && format != Format.csv) {
      throw new CliFailure(Cli.LOCAL, "--table shows CSV results; drop --table or use --format csv");
    }
    boolean sized = width != null || height != null || scale != null;
    if (sized && format != Format.png) {
      throw new CliFailure(Cli.LOCAL, "--width, --height and --scale size a PNG plot; add --format png or drop them");
    }
    if ((width != null && width <= 0) || (height != null && height <= 0)) {
      throw new CliFailure(Cli.LOCAL, "--width and --height are pixels and must be positive, e.g. --width 800 --height 400");
    }
    if (scale != null && !(scale > 0 && Double.isFinite(scale))) {
      throw new CliFailure(Cli.LOCAL, "--scale must be a positive number, e.g. 2");
    }
    if (format.binary && out == null && terminal.stdout()) {
      throw new CliFailure(Cli.LOCAL, "not writing " + format.name().toUpperCase(Locale.ROOT) + " bytes to the terminal; save them with --out FILE."
          + format.name() + ", or give --out - to send them to standard output anyway (to pipe them on)");
    }
    StringBuilder p = new StringBuilder("format=").append(format.name());
    if (width != null) {
      p.append("&width=").append(width);
    }
    if (height != null) {
      p.append("&height=").append(height);
    }
    if (scale != null) {
      p.append("&scale=").append(scale);
    }
    return p.toString();
  }

  /**
   * A streamed answer (a cell export), copied as it arrives: to {@code --out FILE} through a
   * {@code FILE.part} renamed once the answer is complete (so an answer that breaks off leaves no
   * file that looks whole, and an older FILE stays as it was), or to standard output.
   */
  int deliver(ServerConnection.Streamed answer, PrintStream stdout, PrintStream stderr) throws CliFailure {
    boolean toFile = out != null && !out.toString().equals(STANDARD_OUTPUT);
    Path part = toFile ? out.resolveSibling(out.getFileName() + ".part") : null;
    long copied = 0;
    try (java.io.InputStream in = answer.body();
        java.io.OutputStream sink = toFile ? Files.newOutputStream(part) : unclosed(stdout)) {
      byte[] buffer = new byte[1 << 16];
      for (int n = in.read(buffer); n >= 0; n = in.read(buffer)) {
        sink.write(buffer, 0, n);
        copied += n;
      }
      sink.flush();
    } catch (IOException e) {
      deleteQuietly(part);
      throw new CliFailure(Cli.UNREACHABLE, "the server's answer broke off after " + copied + " bytes (" + Cli.describe(e) + ")"
          + (toFile ? "; '" + out + "' was not written" : "; what was printed is incomplete") + "; run the query again", e);
    }
    if (toFile) {
      try {
        Files.move(part, out, java.nio.file.StandardCopyOption.REPLACE_EXISTING, java.nio.file.StandardCopyOption.ATOMIC_MOVE);
      } catch (IOException e) {
        deleteQuietly(part);
        throw new CliFailure(Cli.LOCAL, "cannot write the result to '" + out + "' (" + Cli.describe(e)
            + "); check that the folder exists and is writable", e);
      }
      stderr.println("wrote " + out);
    }
    return Cli.OK;
  }

  /** Standard output for a try-with-resources: flushed at the end, never closed. */
  private static java.io.OutputStream unclosed(PrintStream stdout) {
    return new java.io.FilterOutputStream(stdout) {
      @Override
      public void write(byte[] b, int off, int len) {
        stdout.write(b, off, len);
      }

      @Override
      public void close() {
        stdout.flush();
      }
    };
  }

  private static void deleteQuietly(Path p) {
    if (p != null) {
      try {
        Files.deleteIfExists(p);
      } catch (IOException ignored) {
        // nothing more to do: the message names the failure that matters
      }
    }
  }

  int deliver(Answer answer, PrintStream stdout, PrintStream stderr) throws CliFailure {
    byte[] bytes = answer.body();
    if (table) {
      try {
        bytes = CsvTable.parse(answer.text()).render().getBytes(StandardCharsets.UTF_8);
      } catch (IllegalArgumentException e) {
        throw new CliFailure(Cli.REFUSED, "the server's answer is not CSV that --table can show (" + e.getMessage()
            + "); run without --table to see it as sent");
      }
    }
    if (out != null && !out.toString().equals(STANDARD_OUTPUT)) {
      try {
        Files.write(out, bytes);
      } catch (IOException e) {
        throw new CliFailure(Cli.LOCAL, "cannot write the result to '" + out + "' (" + Cli.describe(e)
            + "); check that the folder exists and is writable", e);
      }
      stderr.println("wrote " + out);
      return Cli.OK;
    }
    stdout.write(bytes, 0, bytes.length);
    if (!format.binary && bytes.length > 0 && bytes[bytes.length - 1] != '\n') {
      stdout.println();
    }
    stdout.flush();
    return Cli.OK;
  }
}
