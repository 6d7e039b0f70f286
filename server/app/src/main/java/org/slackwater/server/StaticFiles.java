package org.slackwater.server;

import io.netty.handler.codec.http.HttpMethod;
import io.netty.handler.codec.http.HttpResponseStatus;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.net.URL;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.regex.Pattern;

/**
 * The web page's files, served read-only from one classpath folder at the server root:
 * {@code GET /} is {@code index.html}, {@code GET /app.js} is {@code <folder>/app.js}.
 *
 * <p>Semantics: only GET and HEAD (anything else is 405 with {@code Allow}); only names made of
 * ASCII letters, digits, {@code _ - .} in segments that start with a letter or digit, ending in an
 * extension of {@link #TYPES}. Anything else, including every percent-encoded, dot-dot, backslash
 * or empty segment, is refused as 404 before the classpath is asked, so a request can never reach
 * a resource outside the folder (the server's own classes and configuration live on the same
 * classpath). Answers carry {@code Cache-Control: no-cache} with a strong {@code ETag} (files
 * change only with the server, so revalidating is cheap and an upgrade shows at once);
 * {@code If-None-Match} with the current tag is 304. A HEAD answer has the GET headers; Netty's
 * server codec drops the body of HEAD and 304 answers.
 *
 * <p>Failure modes: a missing file is a 404 problem document naming the page's address; a file
 * that exists but cannot be read is an {@link UncheckedIOException} (the caller's 500).
 */
final class StaticFiles {
  /** Media types by extension; anything not listed is not served. */
  static final Map<String, String> TYPES = Map.of(
      "html", "text/html; charset=utf-8",
      "js", "text/javascript; charset=utf-8",
      "css", "text/css; charset=utf-8",
      "json", "application/json",
      "svg", "image/svg+xml",
      "png", "image/png",
      "ico", "image/x-icon",
      "txt", "text/plain; charset=utf-8");

  /** The page loads only its own files and talks only to its own server. */
  private static final String CSP = "default-src 'self'; img-src 'self' blob: data:; script-src 'self'; style-src 'self'; "
      + "connect-src 'self'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

  private static final Pattern SAFE = Pattern.compile("(?:[A-Za-z0-9][A-Za-z0-9_.-]*/)*[A-Za-z0-9][A-Za-z0-9_-]*(?:\\.[A-Za-z0-9_-]+)*\\.([A-Za-z0-9]+)");

  private final String folder;
  private final ClassLoader loader;
  /** Hits only: misses are not cached, so arbitrary names cannot grow the map. */
  private final Map<String, Asset> cache = new ConcurrentHashMap<>();

  private record Asset(byte[] body, String type, String etag) {}

  /**
   * @param folder classpath folder without leading or trailing slash, e.g. {@code web}
   * @param loader where to look it up
   */
  StaticFiles(String folder, ClassLoader loader) {
    this.folder = folder;
    this.loader = loader;
  }

  /** The files packed into the server's jar under {@code web/} (see server/app/pom.xml). */
  static StaticFiles packaged() {
    return new StaticFiles("web", StaticFiles.class.getClassLoader());
  }

  /**
   * Answers one request.
   *
   * @param method the request method
   * @param rawUri the request target exactly as sent (not percent-decoded)
   * @param ifNoneMatch the If-None-Match header, or null
   */
  Reply serve(HttpMethod method, String rawUri, String ifNoneMatch) {
    if (!method.equals(HttpMethod.GET) && !method.equals(HttpMethod.HEAD)) {
      Reply r = Problem.of(HttpResponseStatus.METHOD_NOT_ALLOWED, "Method not allowed", "the page's files answer GET and HEAD");
      return new Reply(r.status(), r.contentType(), r.body(), Map.of("Allow", "GET, HEAD"));
    }
    Optional<Asset> asset = name(rawUri).flatMap(this::load);
    if (asset.isEmpty()) {
      return Problem.of(HttpResponseStatus.NOT_FOUND, "No such page",
          "there is no file '" + pathOf(rawUri) + "'; the web page is at / and the API under /api/");
    }
    Asset a = asset.get();
    Map<String, String> headers = new java.util.HashMap<>(Map.of(
        "Cache-Control", "no-cache",
        "ETag", a.etag(),
        "X-Content-Type-Options", "nosniff"));
    if (a.type().startsWith("text/html")) {
      headers.put("Content-Security-Policy", CSP);
      headers.put("Referrer-Policy", "no-referrer");
    }
    if (ifNoneMatch != null && matches(ifNoneMatch, a.etag())) {
      // RFC 9110 15.4.5: a 304 may carry Content-Length only as the length the 200 would have.
      headers.put("Content-Length", Integer.toString(a.body().length));
      return new Reply(HttpResponseStatus.NOT_MODIFIED, a.type(), new byte[0], headers);
    }
    return new Reply(HttpResponseStatus.OK, a.type(), a.body(), headers);
  }

  /** The file name inside the folder, or empty when the target is not one we would ever serve. */
  static Optional<String> name(String rawUri) {
    String path = pathOf(rawUri);
    if (path.equals("/")) {
      return Optional.of("index.html");
    }
    if (!path.startsWith("/")) {
      return Optional.empty();
    }
    String name = path.substring(1);
    var m = SAFE.matcher(name);
    if (!m.matches() || !TYPES.containsKey(m.group(1).toLowerCase(Locale.ROOT))) {
      return Optional.empty();
    }
    return Optional.of(name);
  }

  private static String pathOf(String rawUri) {
    int q = rawUri.indexOf('?');
    int h = rawUri.indexOf('#');
    int end = q < 0 ? (h < 0 ? rawUri.length() : h) : (h < 0 ? q : Math.min(q, h));
    String p = rawUri.substring(0, end);
    // Keep the echo in the 404 short and printable.
    return p.length() > 200 ? p.substring(0, 200) + "..." : p.replaceAll("[^\\x20-\\x7e]", "?");
  }

  private Optional<Asset> load(String name) {
    Asset cached = cache.get(name);
    if (cached != null) {
      return Optional.of(cached);
    }
    URL url = loader.getResource(folder + "/" + name);
    if (url == null) {
      return Optional.empty();
    }
    byte[] body;
    try (InputStream in = url.openStream()) {
      body = in.readAllBytes();
    } catch (IOException e) {
      throw new UncheckedIOException("reading " + folder + "/" + name + " from the classpath", e);
    }
    String ext = name.substring(name.lastIndexOf('.') + 1).toLowerCase(Locale.ROOT);
    Asset a = new Asset(body, TYPES.get(ext), etag(body));
    cache.put(name, a);
    return Optional.of(a);
  }

  private static String etag(byte[] body) {
    try {
      byte[] d = MessageDigest.getInstance("SHA-256").digest(body);
      return "\"" + HexFormat.of().formatHex(d, 0, 16) + "\"";
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is part of every JDK", e);
    }
  }

  /** RFC 9110 13.1.2: a list of entity tags or {@code *}; weak comparison is allowed for If-None-Match. */
  private static boolean matches(String header, String etag) {
    for (String part : header.split(",")) {
      String t = part.trim();
      if (t.equals("*") || t.equals(etag) || t.equals("W/" + etag)) {
        return true;
      }
    }
    return false;
  }
}
