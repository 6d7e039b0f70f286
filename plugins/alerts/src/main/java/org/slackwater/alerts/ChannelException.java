package org.slackwater.alerts;

/**
 * A channel definition is wrong. The message says which channel and field, what is wrong and how
 * to fix it; {@link #at} adds where the definition came from (file, line, column) as it travels up.
 */
public final class ChannelException extends IllegalArgumentException {

  public ChannelException(String message) {
    super(message);
  }

  /** The same error, its message prefixed by where it happened ("channels.json line 4, column 3"). */
  public ChannelException at(String where) {
    ChannelException e = new ChannelException(where + ": " + getMessage());
    e.setStackTrace(getStackTrace());
    return e;
  }
}
