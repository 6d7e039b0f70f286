package org.slackwater.cli;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;
import picocli.CommandLine.ParentCommand;

/**
 * {@code watch SUBCOMMAND}: stored early-warning watches over {@code /api/watches}. Creating,
 * evaluating (which records transitions and sends alerts), setting alert destinations and deleting
 * need the admin token; listing, showing and backtesting do not.
 *
 * <p>Every subcommand that prints watch results prints the caution as well ({@link Caution}): the
 * results are a screening aid, not a finding. Watch names are sent percent-encoded as one path
 * segment (RFC 3986), so names with spaces work.
 */
@Command(name = "watch", mixinStandardHelpOptions = true,
    description = {"Early-warning watches stored on the server.",
        "Watch results are a screening aid built from remote-sensing and model data;",
        "confirm with water sampling, and follow local drinking-water regulations and",
        "licensed operators."},
    subcommands = {WatchCreateCommand.class, WatchListCommand.class, WatchShowCommand.class, WatchEvaluateCommand.class,
        WatchBacktestCommand.class, WatchChannelsCommand.class, WatchDeleteCommand.class})
final class WatchCommand implements Callable<Integer> {
  @ParentCommand Cli cli;

  @Spec CommandSpec spec;

  /** Without a subcommand: the usage, on standard error. */
  @Override
  public Integer call() {
    spec.commandLine().usage(cli.err);
    return Cli.LOCAL;
  }

  /** The path of one watch, {@code /api/watches/NAME} with NAME percent-encoded, plus {@code suffix}. */
  static String path(String name, String suffix) {
    return "/api/watches/" + Cli.segment(name) + suffix;
  }

  /** A date option: ISO 8601 calendar dates only, so that 2014-6-1 or 06/01/2014 is refused before anything is sent. */
  static final class IsoDate implements CommandLine.ITypeConverter<LocalDate> {
    @Override
    public LocalDate convert(String value) {
      try {
        return LocalDate.parse(value.strip());
      } catch (DateTimeParseException e) {
        throw new CommandLine.TypeConversionException("'" + value + "' is not a date; write it as YYYY-MM-DD, e.g. 2014-06-01");
      }
    }
  }
}
