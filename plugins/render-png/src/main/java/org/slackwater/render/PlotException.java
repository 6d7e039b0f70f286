package org.slackwater.render;

/**
 * A result that cannot be drawn as a PNG: a table that is not a plot (watch, definition, catalog),
 * a query whose results do not fit one picture, or a result missing the columns its kind needs.
 * The message says what cannot be plotted and what to ask for instead; the HTTP layer returns it
 * as a client error, never with a stack trace.
 */
public final class PlotException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public PlotException(String message) {
    super(message);
  }
}
