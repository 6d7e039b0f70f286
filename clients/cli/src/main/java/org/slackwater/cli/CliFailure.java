package org.slackwater.cli;

/**
 * A command that cannot go on, with the exit code it ends with and the message for the person at
 * the terminal (printed as {@code error: <message>}, never with a stack trace).
 */
final class CliFailure extends Exception {
  private static final long serialVersionUID = 1L;

  private final int exitCode;

  CliFailure(int exitCode, String message) {
    super(message);
    this.exitCode = exitCode;
  }

  CliFailure(int exitCode, String message, Throwable cause) {
    super(message, cause);
    this.exitCode = exitCode;
  }

  int exitCode() {
    return exitCode;
  }
}
