package org.slackwater.core.catalog;

/** The catalog database failed; the message says which operation. Nothing was half-changed. */
public class CatalogException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public CatalogException(String message) {
    super(message);
  }

  public CatalogException(String message, Throwable cause) {
    super(message, cause);
  }
}
