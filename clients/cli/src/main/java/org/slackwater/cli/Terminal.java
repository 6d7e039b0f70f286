package org.slackwater.cli;

/**
 * Whether standard output and standard error reach a person at a terminal, decided once at start
 * and handed to the commands, so that tests can say either without a terminal.
 *
 * <p>Java 17 can only tell that the process has a console ({@link System#console()} is not null
 * when both standard input and standard output are a terminal); {@link #detect()} takes that as
 * the answer for both streams. So {@code cmd | slackwater-cli ...} counts as "not a terminal" even
 * when standard output still is one; binary output then is not refused and the progress line is
 * not drawn, which errs on the quiet side.
 *
 * @param stdout standard output is a terminal: binary results (PNG, Arrow) are refused there
 * @param stderr standard error is a terminal: progress lines may be drawn there
 */
record Terminal(boolean stdout, boolean stderr) {
  /** Neither stream is a terminal: streams handed in by a caller, files, pipes. */
  static final Terminal NONE = new Terminal(false, false);

  static Terminal detect() {
    boolean console = System.console() != null;
    return new Terminal(console, console);
  }
}
