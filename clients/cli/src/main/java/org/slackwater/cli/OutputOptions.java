package org.slackwater.cli;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import picocli.CommandLine.Option;

/**
 * How a query result is delivered: the format asked of the server, an optional aligned-table view
 * of CSV for people, and an optional file instead of standard output.
 *
 * <p>Standard output gets the server's bytes unchanged (plus a final line feed if the answer lacks
 * one, so the prompt starts on a new line); a file gets exactly the server's bytes. {@code --table}
 * replaces either with the aligned view. Failure modes ({@link CliFailure}, {@link Cli#LOCAL}):
 * {@code --table} with JSON, a file that cannot be written.
 */
final class OutputOptions {
  enum Format { csv, json }

  @Option(names = "--format", defaultValue = "csv", paramLabel = "csv|json",
      description = "Result format: csv or json (default ${DEFAULT-VALUE}).")
  Format format = Format.csv;

  @Option(names = {"-t", "--table"}, description = "Show CSV as aligned columns with the units in the header (for reading, not for scripts).")
  boolean table;

  @Option(names = {"-o", "--out"}, paramLabel = "FILE", description = "Write the result to FILE instead of standard output.")
  Path out;

  /** The value of the server's {@code ?format=} parameter. */
  String formatParameter() throws CliFailure {
    if (table && format != Format.csv) {
      throw new CliFailure(Cli.LOCAL, "--table shows CSV results; drop --table or use --format csv");
    }
    return format.name();
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
    if (out != null) {
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
    if (bytes.length > 0 && bytes[bytes.length - 1] != '\n') {
      stdout.println();
    }
    stdout.flush();
    return Cli.OK;
  }
}
