package org.slackwater.core.spi;

/**
 * A file that cannot be read as a cube. The message is for people: it names the file, the
 * variable where relevant, what is wrong, and how to fix it.
 */
public class SourceException extends Exception {
  private static final long serialVersionUID = 1L;

  public SourceException(String message) {
    super(message);
  }

  public SourceException(String message, Throwable cause) {
    super(message, cause);
  }
}
