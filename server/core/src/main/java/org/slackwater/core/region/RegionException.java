package org.slackwater.core.region;

/** A region that cannot be used: invalid geometry, empty, or off the grid. The message is for people. */
public class RegionException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public RegionException(String message) {
    super(message);
  }
}
