package org.slackwater.server;

import java.util.Locale;
import java.util.Optional;

/**
 * The result formats, chosen by {@code ?format=} (which wins) or the Accept header. With neither,
 * or {@code *}{@code /*}, results are CSV. PNG is a plot of the results (org.slackwater.render),
 * sized by {@code width}, {@code height} and {@code scale} parameters.
 */
enum ResultFormat {
  CSV("csv", "text/csv"),
  JSON("json", "application/json"),
  ARROW("arrow", "application/vnd.apache.arrow.stream"),
  PNG("png", "image/png");

  final String name;
  final String mediaType;

  ResultFormat(String name, String mediaType) {
    this.name = name;
    this.mediaType = mediaType;
  }

  /** The format asked for, or empty if the request names only formats we cannot give. */
  static Optional<ResultFormat> choose(String formatParam, String accept) {
    if (formatParam != null && !formatParam.isBlank()) {
      String f = formatParam.trim().toLowerCase(Locale.ROOT);
      for (ResultFormat r : values()) {
        if (r.name.equals(f)) {
          return Optional.of(r);
        }
      }
      return Optional.empty();
    }
    if (accept == null || accept.isBlank()) {
      return Optional.of(CSV);
    }
    for (String part : accept.split(",")) {
      String media = part.split(";")[0].trim().toLowerCase(Locale.ROOT);
      if (media.equals("*/*") || media.equals("text/*")) {
        return Optional.of(CSV);
      }
      for (ResultFormat r : values()) {
        if (r.mediaType.equals(media)) {
          return Optional.of(r);
        }
      }
      if (media.equals("application/*")) {
        return Optional.of(JSON);
      }
    }
    return Optional.empty();
  }

  static String names() {
    return "csv (text/csv), json (application/json), arrow (application/vnd.apache.arrow.stream), png (image/png)";
  }
}
