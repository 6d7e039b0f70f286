package org.slackwater.server;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;
import org.slackwater.core.Workspace;
import org.slackwater.demo.DemoManifest;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;

/**
 * The demo scenario, generated and ingested once per test JVM into a temporary directory (removed
 * when the JVM exits). Tests open their own {@link Workspace} on {@link #store} and close it, so
 * each test class still checks its own Arrow allocator for leaks.
 */
final class DemoFixture {
  private static DemoFixture small;
  private static DemoFixture full;

  final DemoManifest manifest;
  final Path store;

  private DemoFixture(DemoOptions options, String name) {
    try {
      Path root = Files.createTempDirectory("slackwater-test-" + name + "-");
      Runtime.getRuntime().addShutdownHook(new Thread(() -> delete(root)));
      this.manifest = DemoScenario.generate(root.resolve("files"), options);
      this.store = root.resolve("store");
      try (Workspace ws = Workspace.open(store)) {
        DemoCommand.prepare(ws, manifest);
      }
    } catch (Exception e) {
      throw new IllegalStateException("preparing the " + name + " demo scenario failed: " + e.getMessage(), e);
    }
  }

  /** 2013-2014 on coarse grids: seconds to build. */
  static synchronized DemoFixture small() {
    if (small == null) {
      small = new DemoFixture(DemoOptions.small(), "small");
    }
    return small;
  }

  /** The whole 2006-2025 scenario the documentation's examples are written for. */
  static synchronized DemoFixture full() {
    if (full == null) {
      full = new DemoFixture(DemoOptions.full(), "full");
    }
    return full;
  }

  Workspace open() {
    try {
      return Workspace.open(store);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static void delete(Path root) {
    try (Stream<Path> w = Files.walk(root)) {
      w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    } catch (IOException ignored) {
      // Best effort at exit.
    }
  }
}
