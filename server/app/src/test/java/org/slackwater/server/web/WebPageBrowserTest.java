package org.slackwater.server.web;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.math.BigDecimal;
import java.math.MathContext;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.slackwater.core.query.WatchStatements;

/**
 * The web page in headless Chromium against the real server on the small demo scenario. What the
 * page shows is compared with what the HTTP API answers for the same request, fetched directly:
 * the page must show the server's results, errors and cautions, not its own.
 *
 * <p>Skipped, with the packages to install, when /usr/bin/chromium or /usr/bin/chromedriver is
 * missing (Debian: chromium, chromium-driver).
 */
class WebPageBrowserTest {
  private static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  private static final Path DRIVER = Path.of("/usr/bin/chromedriver");
  private static final String MONTHLY = "mean chlorophyll over \"Outer Bay\" during 2014 by month";
  private static final HttpClient HTTP = HttpClient.newHttpClient();
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final Dimension WIDE = new Dimension(1280, 900);

  private static WebFixture fixture;
  private static ChromeDriver driver;
  private static Path profile;
  private static Path downloads;

  @BeforeAll
  static void start() throws Exception {
    assumeTrue(Files.isExecutable(CHROMIUM) && Files.isExecutable(DRIVER),
        "browser tests skipped: " + CHROMIUM + " or " + DRIVER + " is missing; install the Debian packages"
            + " chromium and chromium-driver (apt-get install -y chromium chromium-driver)");
    fixture = WebFixture.smallDemo();
    profile = Files.createTempDirectory("slackwater-chromium-");
    downloads = Files.createDirectories(profile.resolve("downloads"));
    System.setProperty("webdriver.chrome.driver", DRIVER.toString());
    ChromeOptions options = new ChromeOptions();
    options.setBinary(CHROMIUM.toString());
    options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
        "--disable-background-networking", "--disable-component-update", "--disable-sync",
        "--disable-dev-shm-usage", "--user-data-dir=" + profile.resolve("user"), "--window-size=1280,900");
    options.setExperimentalOption("prefs", Map.of(
        "download.default_directory", downloads.toString(),
        "download.prompt_for_download", false));
    driver = new ChromeDriver(options);
  }

  @AfterAll
  static void stop() {
    if (driver != null) {
      driver.quit();
    }
    if (fixture != null) {
      fixture.close();
    }
    if (profile != null) {
      WebFixture.delete(profile);
    }
  }

  @BeforeEach
  void openThePage() {
    driver.manage().window().setSize(WIDE);
    driver.get(fixture.url() + "/");
    // Ready when the catalog and the examples have arrived.
    waitFor().until(d -> !d.findElements(By.cssSelector("#variables button.insert")).isEmpty()
        && !d.findElements(By.cssSelector("#regions button.insert")).isEmpty()
        && d.findElements(By.cssSelector("#examples option")).size() > 1);
  }

  private static WebDriverWait waitFor() {
    return new WebDriverWait(driver, Duration.ofSeconds(30));
  }

  private static WebElement editor() {
    return driver.findElement(By.id("editor"));
  }

  private static Object js(String script, Object... args) {
    return ((JavascriptExecutor) driver).executeScript(script, args);
  }

  private static void type(String text) {
    WebElement e = editor();
    e.clear();
    e.sendKeys(text);
  }

  /** Waits until the run has finished, with results or with a problem shown. */
  private static void awaitRun() {
    waitFor().until(d -> !d.findElements(By.cssSelector("#results article.result")).isEmpty()
        || d.findElement(By.id("error")).isDisplayed());
  }

  private static List<WebElement> rows(int result) {
    return driver.findElements(By.cssSelector("#results article.result:nth-of-type(" + (result + 1) + ") table.data tbody tr"));
  }

  private static HttpResponse<byte[]> post(String query, String params) throws Exception {
    HttpRequest req = HttpRequest.newBuilder(URI.create(fixture.url() + "/api/query" + params))
        .header("Content-Type", "text/plain; charset=utf-8")
        .POST(HttpRequest.BodyPublishers.ofString(query)).build();
    return HTTP.send(req, HttpResponse.BodyHandlers.ofByteArray());
  }

  private static JsonNode postJson(String query) throws Exception {
    return JSON.readTree(post(query, "?format=json").body());
  }

  @Test
  void anAnswerLargerThanThePageReadsIsOfferedAsDownloadsInstead() throws Exception {
    String export = "cells of turbidity over \"Outer Bay\" during 2013 to 2014";
    int size = post(export, "?format=json").body().length;
    assertTrue(size > 1 << 20, "the export's JSON (" + size + " bytes) is over the 1 MB the page is told to read");
    driver.get(fixture.url() + "/?read-limit-mb=1");
    waitFor().until(d -> d.findElements(By.cssSelector("#examples option")).size() > 1);
    type(export);
    driver.findElement(By.id("run")).click();
    WebElement note = waitFor().until(d -> d.findElements(By.cssSelector("#results p.too-large")).stream().findFirst().orElse(null));
    assertTrue(note.getText().contains("over 1 MB"), note.getText());
    assertTrue(driver.findElements(By.cssSelector("#results article.result")).isEmpty(), "no table of a partial answer");
    for (WebElement b : driver.findElements(By.cssSelector(".download"))) {
      assertEquals(b.getAttribute("data-kind").equals("png"), !b.isEnabled(), "download " + b.getAttribute("data-kind"));
    }
    // A short export of the same cells is shown as a table, as any result.
    type("cells of turbidity over \"Outer Bay\" during 2013-07-01");
    driver.findElement(By.id("run")).click();
    awaitRun();
    int cells = postJson("cells of turbidity over \"Outer Bay\" during 2013-07-01").get("results").get(0).get("rows").size();
    assertEquals(Math.min(cells, 500), rows(0).size());
  }

  @Test
  void aTypedQueryRunsWithCtrlEnterAndShowsTheServersRowsAndUnits() throws Exception {
    type(MONTHLY);
    editor().sendKeys(Keys.chord(Keys.CONTROL, Keys.ENTER));
    awaitRun();

    JsonNode expected = postJson(MONTHLY).get("results").get(0);
    JsonNode columns = expected.get("columns");
    JsonNode data = expected.get("rows");
    assertEquals(expected.get("title").asText(), driver.findElement(By.cssSelector("#results .result-title > span")).getText());
    List<WebElement> rows = rows(0);
    assertEquals(data.size(), rows.size(), "one table row per result row");
    assertEquals(12, rows.size(), "twelve months of 2014");

    List<WebElement> heads = driver.findElements(By.cssSelector("#results table.data thead th"));
    assertEquals(columns.size(), heads.size());
    int mean = -1;
    int period = -1;
    for (int j = 0; j < columns.size(); j++) {
      String name = columns.get(j).get("name").asText();
      String unit = columns.get(j).get("unit").asText();
      assertEquals(name, heads.get(j).findElement(By.className("col-name")).getText());
      List<WebElement> u = heads.get(j).findElements(By.className("col-unit"));
      assertEquals(unit, u.isEmpty() ? "" : u.get(0).getText(), "the unit of " + name + " from the JSON columns");
      mean = name.equals("mean_chlorophyll") ? j : mean;
      period = name.equals("period") ? j : period;
    }
    assertEquals("mg m-3", heads.get(mean).findElement(By.className("col-unit")).getText());
    for (int i = 0; i < rows.size(); i++) {
      List<WebElement> cells = rows.get(i).findElements(By.tagName("td"));
      assertEquals(data.get(i).get(period).asText(), cells.get(period).getText());
      double v = data.get(i).get(mean).asDouble();
      // The full value is kept (title) and the shown one is it to five significant digits.
      assertEquals(v, Double.parseDouble(cells.get(mean).getAttribute("title")), 0.0);
      assertEquals(new BigDecimal(v).round(new MathContext(5)).doubleValue(), Double.parseDouble(cells.get(mean).getText()), 0.0);
    }
    assertTrue(driver.findElement(By.cssSelector("#results details.metadata")).getText().contains("Metadata"));
    assertTrue(driver.findElements(By.cssSelector(".caution")).isEmpty(), "an area series carries no caution");
  }

  @Test
  void aSeriesIsPlottedAsAPng() throws Exception {
    type(MONTHLY);
    driver.findElement(By.id("run")).click();
    awaitRun();
    // The contract (shared DESIGN.md): POST /api/query?format=png answers image/png.
    try {
      // Done when the image has loaded or the page has given up on it (its note begins "No plot").
      waitFor().until(d -> {
        List<WebElement> img = d.findElements(By.cssSelector("#plot img"));
        boolean loaded = !img.isEmpty() && ((Number) js("return arguments[0].complete ? arguments[0].naturalWidth : 0", img.get(0))).intValue() > 0;
        return loaded || d.findElement(By.id("plot")).getText().startsWith("No plot");
      });
    } catch (org.openqa.selenium.TimeoutException e) {
      throw new AssertionError("the plot neither loaded nor failed within the wait", e);
    }
    assertFalse(driver.findElements(By.cssSelector("#plot img")).isEmpty(), "no PNG plot shown; the page says: '"
        + driver.findElement(By.id("plot")).getText() + "'; the server answers format=png with "
        + post(MONTHLY, "?format=png&width=800&height=450").statusCode());
    assertTrue(((Number) js("return arguments[0].naturalWidth", driver.findElement(By.cssSelector("#plot img")))).intValue() > 0);
    WebElement img = driver.findElement(By.cssSelector("#plot img"));
    assertTrue(img.getAttribute("src").startsWith("blob:"), "the image is the POST answer, held as an object URL");
    assertTrue(img.isDisplayed());
    assertFalse(img.getAttribute("alt").isBlank(), "the plot has a text alternative");
  }

  @Test
  void aCatalogListingHasNoPlotOnlyAQuietNote() throws Exception {
    type("list variables");
    driver.findElement(By.id("run")).click();
    awaitRun();
    HttpResponse<byte[]> png = post("list variables", "?format=png&width=800&height=450");
    // The lead's contract for plots: results without a plot are a 422 problem document.
    assertEquals(422, png.statusCode(), new String(png.body(), StandardCharsets.UTF_8));
    String detail = JSON.readTree(png.body()).get("detail").asText();
    waitFor().until(d -> d.findElement(By.id("plot")).getText().contains(detail));
    assertTrue(driver.findElements(By.cssSelector("#plot img")).isEmpty());
    assertFalse(driver.findElement(By.id("error")).isDisplayed(), "no plot is not an error of the query");
    assertEquals(postJson("list variables").get("results").get(0).get("rows").size(), rows(0).size());
  }

  @Test
  void anErrorShowsItsLineAndColumnAndSelectsTheMistake() throws Exception {
    String query = "list variables;\nmean chlorophyl over \"Outer Bay\" during 2014 by month";
    type(query);
    driver.findElement(By.id("run")).click();
    awaitRun();

    HttpResponse<byte[]> answer = post(query, "?format=json");
    assertEquals(400, answer.statusCode());
    JsonNode p = JSON.readTree(answer.body());
    int line = p.get("line").asInt();
    int column = p.get("column").asInt();
    WebElement error = driver.findElement(By.id("error"));
    assertTrue(error.isDisplayed());
    assertEquals("Line " + line + ", column " + column, error.findElement(By.className("where-text")).getText());
    assertEquals(p.get("detail").asText(), error.findElement(By.className("problem-detail")).getText());
    assertEquals(p.get("excerpt").asText(), error.findElement(By.className("excerpt")).getText());
    assertTrue(error.getText().contains(p.get("hint").asText()));

    int start = offset(query, line, column);
    assertEquals(start, ((Number) js("return arguments[0].selectionStart", editor())).intValue());
    assertEquals("chlorophyl", js("const e = arguments[0]; return e.value.substring(e.selectionStart, e.selectionEnd)", editor()));
    assertEquals(Boolean.TRUE, js("return document.activeElement === arguments[0]", editor()), "the cursor is in the editor");
    assertTrue(driver.findElements(By.cssSelector("#results article.result")).isEmpty(), "no stale results beside an error");
  }

  @Test
  void columnsCountCodePointsAsTheServerDoes() throws Exception {
    // A character outside the BMP is one column for the server but two UTF-16 units in the editor.
    // ChromeDriver cannot type such characters, so the text is set directly.
    String query = "# \uD83C\uDF0A\uD83C\uDF0A a comment\nmean chlorophyll over \"Outer \uD83C\uDF0A Bay\" during 2014 by mnth";
    js("arguments[0].value = arguments[1]", editor(), query);
    driver.findElement(By.id("run")).click();
    awaitRun();
    JsonNode p = JSON.readTree(post(query, "?format=json").body());
    int start = offset(query, p.get("line").asInt(), p.get("column").asInt());
    assertEquals(start, ((Number) js("return arguments[0].selectionStart", editor())).intValue(), p.toString());
    String selected = (String) js("const e = arguments[0]; return e.value.substring(e.selectionStart, e.selectionEnd)", editor());
    assertEquals(query.substring(start, start + selected.length()), selected);
    assertEquals("mnth", selected, "the mistake is selected: " + p);
  }

  /** Line and column (1-based, columns in code points, as in Problem's query errors) to a UTF-16 offset. */
  private static int offset(String text, int line, int column) {
    int at = 0;
    for (int l = 1; l < line; l++) {
      at = text.indexOf('\n', at) + 1;
    }
    return text.offsetByCodePoints(at, column - 1);
  }

  @Test
  void anExampleIsPickedAndRuns() throws Exception {
    String label = "Monthly mean chlorophyll, Outer Bay, 2014";
    String text = null;
    for (JsonNode ex : ExamplesTest.examples()) {
      text = ex.get("label").asText().equals(label) ? ex.get("text").asText() : text;
    }
    assertEquals(MONTHLY, text);
    type("something else");
    new Select(driver.findElement(By.id("examples"))).selectByVisibleText(label);
    driver.findElement(By.id("use-example")).click();
    assertEquals(text, editor().getAttribute("value"));
    driver.findElement(By.id("run")).click();
    awaitRun();
    assertEquals(postJson(text).get("results").get(0).get("rows").size(), rows(0).size());
  }

  @Test
  void aWatchShowsItsCautionAboveTheResults() throws Exception {
    String label = "Low cloud over the Outer Bay";
    new Select(driver.findElement(By.id("examples"))).selectByVisibleText(label);
    driver.findElement(By.id("use-example")).click();
    driver.findElement(By.id("run")).click();
    awaitRun();
    assertFalse(driver.findElement(By.id("error")).isDisplayed(), driver.findElement(By.id("error")).getText());
    List<WebElement> cautions = driver.findElements(By.cssSelector("#cautions .caution"));
    assertFalse(cautions.isEmpty(), "a watch result carries the public-health caution");
    WebElement caution = cautions.get(0);
    assertTrue(caution.isDisplayed(), "the caution is visible, not folded away");
    assertTrue(caution.getText().contains(WatchStatements.CAUTION), caution.getText());
    WebElement table = driver.findElement(By.cssSelector("#results table.data"));
    assertTrue(caution.getRect().getY() < table.getRect().getY(), "the caution comes before the table");
    List<String> fromServer = new ArrayList<>();
    postJson(driver.findElement(By.id("editor")).getAttribute("value")).get("cautions").forEach(c -> fromServer.add(c.asText()));
    assertEquals(fromServer, cautions.stream().map(c -> c.findElement(By.className("caution-text")).getText()).toList(),
        "the cautions of the JSON answer, each once");
  }

  @Test
  void choosingARegionOrAVariableInsertsItsName() throws Exception {
    JsonNode regions = JSON.readTree(HTTP.send(HttpRequest.newBuilder(URI.create(fixture.url() + "/api/regions")).build(),
        HttpResponse.BodyHandlers.ofString()).body());
    List<String> names = new ArrayList<>();
    regions.get("features").forEach(f -> names.add(f.get("properties").get("name").asText()));
    List<String> shown = driver.findElements(By.cssSelector("#regions button.insert")).stream().map(WebElement::getText).toList();
    assertEquals(names, shown, "every region of /api/regions is listed");

    type("mean chlorophyll over ");
    driver.findElement(By.cssSelector("#regions button[data-name='Outer Bay']")).click();
    assertEquals("mean chlorophyll over \"Outer Bay\"", editor().getAttribute("value"), "quoted, at the cursor");
    editor().sendKeys(" during 2014 by month");
    assertEquals(MONTHLY, editor().getAttribute("value"), "the cursor is after the inserted name");

    js("arguments[0].value = arguments[1]; arguments[0].setSelectionRange(5, 5)", editor(), "mean  over \"Outer Bay\" during 2014 by month");
    driver.findElement(By.cssSelector("#variables button[data-name='chlorophyll']")).click();
    assertEquals(MONTHLY, editor().getAttribute("value"), "a variable goes in bare");
    editor().sendKeys(Keys.chord(Keys.CONTROL, Keys.ENTER));
    awaitRun();
    assertEquals(12, rows(0).size());
  }

  @Test
  void theKeyboardAloneRunsAQueryAndInsertsNames() throws Exception {
    type("mean chlorophyll over ");
    // From a catalog entry, Enter inserts; from the editor, Tab reaches the Run button.
    js("arguments[0].focus()", driver.findElement(By.cssSelector("#regions button[data-name='Outer Bay']")));
    driver.switchTo().activeElement().sendKeys(Keys.ENTER);
    driver.switchTo().activeElement().sendKeys(" during 2014 by month");
    assertEquals(MONTHLY, editor().getAttribute("value"));
    driver.switchTo().activeElement().sendKeys(Keys.TAB);
    assertEquals("run", driver.switchTo().activeElement().getAttribute("id"));
    driver.switchTo().activeElement().sendKeys(Keys.ENTER);
    awaitRun();
    assertEquals(12, rows(0).size());
    assertEquals("run", driver.switchTo().activeElement().getAttribute("id"), "running keeps the keyboard focus where it was");
  }

  @Test
  void aNarrowScreenNeedsNoSidewaysScrolling() throws Exception {
    driver.manage().window().setSize(new Dimension(380, 800));
    type("map mean chlorophyll over \"Outer Bay\" during 2014-06");
    driver.findElement(By.id("run")).click();
    awaitRun();
    assertFalse(rows(0).isEmpty());
    long page = ((Number) js("return document.documentElement.scrollWidth")).longValue();
    long view = ((Number) js("return document.documentElement.clientWidth")).longValue();
    Object wide = js("const w = document.documentElement.clientWidth; return Array.from(document.querySelectorAll('body *'))"
        + ".filter(e => !e.closest('.table-wrap table') && e.getBoundingClientRect().right > w + 1).slice(0, 8)"
        + ".map(e => e.tagName + '#' + e.id + '.' + e.className + ' ' + Math.round(e.getBoundingClientRect().right)).join('; ')");
    assertTrue(page <= view, "the page is " + page + " px wide in a " + view + " px window (" + wide + "); wide tables scroll inside their box");
    WebElement editorBox = editor();
    assertTrue(editorBox.getRect().getWidth() <= view);
  }

  @Test
  void downloadsAreTheServersAnswers() throws Exception {
    type(MONTHLY);
    driver.findElement(By.id("run")).click();
    awaitRun();
    driver.findElement(By.cssSelector(".download[data-kind='csv']")).click();
    assertArrayEquals(post(MONTHLY, "?format=csv").body(), downloaded("slackwater-result.csv"));
    driver.findElement(By.cssSelector(".download[data-kind='arrow']")).click();
    byte[] arrow = downloaded("slackwater-result.arrows");
    // Arrow IPC stream format: each message starts with the continuation marker 0xFFFFFFFF.
    assertEquals(-1, java.nio.ByteBuffer.wrap(arrow, 0, 4).getInt());
    assertArrayEquals(post(MONTHLY, "?format=arrow").body(), arrow);
    driver.findElement(By.cssSelector(".download[data-kind='query']")).click();
    assertEquals(MONTHLY, new String(downloaded("query.swq"), StandardCharsets.UTF_8));
  }

  @Test
  void aDownloadTheServerRefusesSaysWhy() throws Exception {
    String two = "list variables;\nlist regions";
    type(two);
    driver.findElement(By.id("run")).click();
    awaitRun();
    assertEquals(2, driver.findElements(By.cssSelector("#results article.result")).size());
    HttpResponse<byte[]> csv = post(two, "?format=csv");
    assertEquals(406, csv.statusCode());
    String detail = JSON.readTree(csv.body()).get("detail").asText();
    driver.findElement(By.cssSelector(".download[data-kind='csv']")).click();
    waitFor().until(ExpectedConditions.textToBePresentInElementLocated(By.id("download-status"), detail));
  }

  private static byte[] downloaded(String name) throws Exception {
    Path file = downloads.resolve(name);
    waitFor().until(d -> Files.isRegularFile(file) && !Files.exists(downloads.resolve(name + ".crdownload")));
    byte[] bytes = Files.readAllBytes(file);
    Files.delete(file);
    return bytes;
  }
}
