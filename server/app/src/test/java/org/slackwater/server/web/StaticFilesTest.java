package org.slackwater.server.web;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.net.URI;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The page's files as the server serves them (StaticFiles behind the real router), over a raw
 * socket so that request targets reach the server exactly as written, unnormalised. The store is
 * empty: nothing here needs data.
 */
class StaticFilesTest {
  /** The page's sources, relative to the module directory Surefire runs in. */
  static final Path WEB = Path.of("../../clients/web");
  private static final ObjectMapper JSON = new ObjectMapper();
  private static WebFixture fixture;

  @BeforeAll
  static void start() throws Exception {
    fixture = WebFixture.empty();
  }

  @AfterAll
  static void stop() {
    fixture.close();
  }

  /** One HTTP/1.1 exchange on its own connection; the server closes it after answering. */
  record Raw(int status, Map<String, String> headers, byte[] body) {
    String header(String name) {
      return headers.get(name.toLowerCase(Locale.ROOT));
    }

    String text() {
      return new String(body, StandardCharsets.UTF_8);
    }
  }

  static Raw exchange(String method, String target, String... headerLines) throws IOException {
    URI base = URI.create(fixture.url());
    try (Socket s = new Socket(base.getHost(), base.getPort())) {
      s.setSoTimeout(10_000);
      StringBuilder req = new StringBuilder(method + " " + target + " HTTP/1.1\r\nHost: " + base.getAuthority() + "\r\nConnection: close\r\n");
      for (String h : headerLines) {
        req.append(h).append("\r\n");
      }
      req.append("\r\n");
      OutputStream out = s.getOutputStream();
      out.write(req.toString().getBytes(StandardCharsets.ISO_8859_1));
      out.flush();
      byte[] all = readAll(s.getInputStream());
      int end = indexOf(all, "\r\n\r\n".getBytes(StandardCharsets.ISO_8859_1));
      assertTrue(end > 0, "no header block in the answer to " + method + " " + target);
      String[] lines = new String(all, 0, end, StandardCharsets.ISO_8859_1).split("\r\n");
      int status = Integer.parseInt(lines[0].split(" ")[1]);
      Map<String, String> headers = new LinkedHashMap<>();
      for (String line : Arrays.asList(lines).subList(1, lines.length)) {
        int colon = line.indexOf(':');
        headers.put(line.substring(0, colon).trim().toLowerCase(Locale.ROOT), line.substring(colon + 1).trim());
      }
      return new Raw(status, headers, Arrays.copyOfRange(all, end + 4, all.length));
    }
  }

  private static byte[] readAll(InputStream in) throws IOException {
    ByteArrayOutputStream b = new ByteArrayOutputStream();
    in.transferTo(b);
    return b.toByteArray();
  }

  private static int indexOf(byte[] hay, byte[] needle) {
    outer:
    for (int i = 0; i + needle.length <= hay.length; i++) {
      for (int j = 0; j < needle.length; j++) {
        if (hay[i + j] != needle[j]) {
          continue outer;
        }
      }
      return i;
    }
    return -1;
  }

  private static JsonNode problem(Raw r, int status) throws IOException {
    assertEquals(status, r.status(), r.text());
    // RFC 9457 section 3: problem details are application/problem+json with title, status and detail.
    assertEquals("application/problem+json", r.header("Content-Type"));
    JsonNode p = JSON.readTree(r.body());
    assertEquals(status, p.get("status").asInt());
    assertTrue(p.hasNonNull("title") && p.hasNonNull("detail"), r.text());
    return p;
  }

  @Test
  void theRootIsTheIndexPage() throws Exception {
    Raw root = exchange("GET", "/");
    assertEquals(200, root.status());
    // WHATWG HTML, "text/html" media type registration; UTF-8 stated so no sniffing is needed.
    assertEquals("text/html; charset=utf-8", root.header("Content-Type"));
    assertArrayEquals(Files.readAllBytes(WEB.resolve("index.html")), root.body());
    assertArrayEquals(root.body(), exchange("GET", "/index.html").body());
    assertArrayEquals(root.body(), exchange("GET", "/?from=bookmark").body());
  }

  @ParameterizedTest
  @CsvSource({
    // RFC 9239 section 6: text/javascript is the media type of JavaScript.
    "app.js, text/javascript; charset=utf-8",
    // RFC 2318: text/css.
    "style.css, text/css; charset=utf-8",
    // RFC 8259 section 11: application/json (no charset parameter is defined for it).
    "examples.json, application/json",
  })
  void eachFileHasTheTypeOfItsExtensionAndTheSourceBytes(String name, String type) throws Exception {
    Raw r = exchange("GET", "/" + name);
    assertEquals(200, r.status());
    assertEquals(type, r.header("Content-Type"));
    assertEquals("nosniff", r.header("X-Content-Type-Options"));
    assertArrayEquals(Files.readAllBytes(WEB.resolve(name)), r.body(), name + " as packed into the jar");
    assertEquals(Integer.toString(r.body().length), r.header("Content-Length"));
  }

  @Test
  void answersRevalidateWithAnEntityTag() throws Exception {
    Raw first = exchange("GET", "/app.js");
    assertEquals("no-cache", first.header("Cache-Control"));
    String etag = first.header("ETag");
    assertNotNull(etag);
    // RFC 9110 section 8.8.3: an entity tag is a quoted string, optionally prefixed W/.
    assertTrue(etag.matches("\"[\\x21\\x23-\\x7e]+\""), etag);
    assertEquals(etag, exchange("GET", "/app.js").header("ETag"), "the same bytes give the same tag");
    assertFalse(etag.equals(exchange("GET", "/style.css").header("ETag")), "different files, different tags");

    // RFC 9110 section 13.1.2: If-None-Match matching the current tag (weak comparison) gives 304.
    for (String given : List.of(etag, "W/" + etag, "\"other\", " + etag, "*")) {
      Raw again = exchange("GET", "/app.js", "If-None-Match: " + given);
      assertEquals(304, again.status(), given);
      // RFC 9110 section 15.4.5: a 304 has no content; Content-Length, if sent, is that of the 200.
      assertEquals(0, again.body().length);
      assertEquals(Integer.toString(first.body().length), again.header("Content-Length"));
      assertEquals(etag, again.header("ETag"));
    }
    Raw changed = exchange("GET", "/app.js", "If-None-Match: \"an-older-version\"");
    assertEquals(200, changed.status());
    assertArrayEquals(first.body(), changed.body());
  }

  @Test
  void thePageMayOnlyLoadFromItsOwnServer() throws Exception {
    String csp = exchange("GET", "/").header("Content-Security-Policy");
    assertNotNull(csp);
    assertTrue(csp.contains("default-src 'self'") && csp.contains("script-src 'self'") && csp.contains("connect-src 'self'"), csp);
  }

  @Test
  void headHasTheHeadersOfGetAndNoContent() throws Exception {
    for (String target : List.of("/", "/app.js", "/style.css")) {
      Raw get = exchange("GET", target);
      Raw head = exchange("HEAD", target);
      // RFC 9110 section 9.3.2: HEAD is GET without content; the header fields are the same.
      assertEquals(200, head.status());
      assertEquals(0, head.body().length, target);
      assertEquals(get.header("Content-Type"), head.header("Content-Type"));
      assertEquals(Integer.toString(get.body().length), head.header("Content-Length"));
      assertEquals(get.header("ETag"), head.header("ETag"));
    }
    Raw missing = exchange("HEAD", "/nothing.html");
    assertEquals(404, missing.status());
    assertEquals(0, missing.body().length);
  }

  @ParameterizedTest
  @ValueSource(strings = {"/nothing.html", "/nothing", "/app.exe", "/index.htm", "/APP.JS", "/app.js/", "/images/"})
  void unknownFilesAre404Problems(String target) throws Exception {
    JsonNode p = problem(exchange("GET", target), 404);
    assertTrue(p.get("detail").asText().contains("/api/"), p.toString());
  }

  @Test
  void nothingOutsideTheWebFolderIsServed() throws Exception {
    // These exist on the test classpath, beside the web folder: a traversal would reach them.
    ClassLoader loader = StaticFilesTest.class.getClassLoader();
    assertNotNull(loader.getResource("META-INF/LICENSE.txt"), "a dependency's licence at the classpath root");
    assertNotNull(loader.getResource("org/slackwater/server/StaticFiles.class"));
    for (String target : List.of(
        "/META-INF/LICENSE.txt",
        "/../META-INF/LICENSE.txt",
        "/%2e%2e/META-INF/LICENSE.txt",
        "/%2E%2E/META-INF/LICENSE.txt",
        "/..%2fMETA-INF%2fLICENSE.txt",
        "/%2e%2e%2fMETA-INF%2fLICENSE.txt",
        "/.%2e/META-INF/LICENSE.txt",
        "/..\\META-INF\\LICENSE.txt",
        "/%5c..%5cMETA-INF%5cLICENSE.txt",
        "/web/../META-INF/LICENSE.txt",
        "//META-INF/LICENSE.txt",
        "/./index.html",
        "/../pom.xml",
        "/../../../pom.xml",
        "/%2e%2e/%2e%2e/%2e%2e/pom.xml",
        "/../org/slackwater/server/StaticFiles.class",
        "/index.html%00.txt",
        "/%69ndex.html",
        "http://127.0.0.1/../META-INF/LICENSE.txt")) {
      Raw r = exchange("GET", target);
      assertEquals(404, r.status(), target + " was served: " + r.text());
      problem(r, 404);
      String body = r.text();
      assertFalse(body.contains("<project") || body.contains("License") || body.contains("LICENSE\n"), target + " leaked: " + body);
    }
  }

  @ParameterizedTest
  @CsvSource({"POST, /", "PUT, /app.js", "DELETE, /index.html", "PATCH, /nothing.html"})
  void onlyGetAndHeadAreAllowed(String method, String target) throws Exception {
    Raw r = exchange(method, target, "Content-Length: 0");
    problem(r, 405);
    // RFC 9110 section 15.5.6: a 405 lists the allowed methods in Allow.
    assertEquals("GET, HEAD", r.header("Allow"));
  }

  @Test
  void theApiKeepsItsOwnRoutes() throws Exception {
    Raw health = exchange("GET", "/api/health");
    assertEquals(200, health.status());
    assertEquals("ok", JSON.readTree(health.body()).get("status").asText());
    JsonNode p = problem(exchange("GET", "/api/index.html"), 404);
    assertTrue(p.get("detail").asText().contains("/api/query"), "the API's own 404, not the page's");
    problem(exchange("GET", "/api"), 404);
  }

  @Test
  void everyFileThePageNamesIsServedAndNoneIsRemote() throws Exception {
    String html = Files.readString(WEB.resolve("index.html"));
    Matcher m = Pattern.compile("(?:src|href)=\"([^\"#]+)\"").matcher(html);
    int local = 0;
    while (m.find()) {
      String ref = m.group(1);
      if (ref.startsWith("data:")) {
        continue;
      }
      assertFalse(ref.contains("//"), "the page must work offline, without other hosts: " + ref);
      assertEquals(200, exchange("GET", "/" + ref).status(), ref);
      local++;
    }
    assertTrue(local >= 2, "index.html names its script and its style sheet");
    try (Stream<Path> files = Files.list(WEB)) {
      for (Path f : files.toList()) {
        String text = Files.readString(f);
        assertFalse(text.contains("http://") || text.contains("https://"), f + " names another host");
      }
    }
  }
}
