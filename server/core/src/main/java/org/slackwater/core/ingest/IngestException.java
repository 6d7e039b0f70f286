package org.slackwater.core.ingest;

/** An ingest that did not happen. The message names the file and the problem; nothing was changed. */
public class IngestException extends Exception {
  private static final long serialVersionUID = 1L;

  public IngestException(String message) {
    super(message);
  }

  public IngestException(String message, Throwable cause) {
    super(message, cause);
  }
}
