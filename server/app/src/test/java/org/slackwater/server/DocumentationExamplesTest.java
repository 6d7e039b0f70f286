package org.slackwater.server;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;
import org.slackwater.core.Workspace;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryException;

/**
 * Runs every {@code swq} block of README.md and of the language reference against the full demo
 * scenario, so the documentation cannot drift from the code: each block must run without error
 * and every statement must return at least one row.
 */
class DocumentationExamplesTest {
  private static final Pattern SWQ = Pattern.compile("(?m)^```swq\\s*\\n(.*?)^```", Pattern.DOTALL);
  private static Workspace ws;

  @BeforeAll
  static void open() {
    ws = DemoFixture.full().open();
  }

  @AfterAll
  static void close() {
    ws.close();
  }

  static Path repoRoot() {
    Path p = Path.of("").toAbsolutePath();
    while (p != null && !Files.isRegularFile(p.resolve("DEVELOPERS.md"))) {
      p = p.getParent();
    }
    if (p == null) {
      throw new IllegalStateException("cannot find the repository root (DEVELOPERS.md) above " + Path.of("").toAbsolutePath());
    }
    return p;
  }

  static List<String> blocks(Path markdown) throws Exception {
    List<String> out = new ArrayList<>();
    Matcher m = SWQ.matcher(Files.readString(markdown));
    while (m.find()) {
      out.add(m.group(1));
    }
    return out;
  }

  @TestFactory
  Stream<DynamicTest> everySwqBlockRuns() throws Exception {
    List<DynamicTest> tests = new ArrayList<>();
    for (String doc : List.of("README.md", "query-grammar/README.md")) {
      List<String> blocks = blocks(repoRoot().resolve(doc));
      assertFalse(blocks.isEmpty(), doc + " has no swq block");
      for (int i = 0; i < blocks.size(); i++) {
        String q = blocks.get(i);
        tests.add(DynamicTest.dynamicTest(doc + " block " + (i + 1) + ": " + q.lines().findFirst().orElse(""), () -> {
          List<ResultTable> results;
          try {
            results = ws.engine().run(q);
          } catch (QueryException e) {
            fail(e.getMessage() + "\n" + e.excerpt());
            return;
          }
          for (ResultTable t : results) {
            assertTrue(t.rowCount() > 0, "no rows for: " + t.title());
          }
        }));
      }
    }
    return tests.stream();
  }
}
