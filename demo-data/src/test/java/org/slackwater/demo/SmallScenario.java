package org.slackwater.demo;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;

/** One {@link DemoOptions#small()} scenario per test JVM, shared by the read-only tests. */
final class SmallScenario {

  private static DemoManifest manifest;

  private SmallScenario() {
  }

  static synchronized DemoManifest get() {
    if (manifest == null) {
      try {
        Path dir = Files.createTempDirectory("wrenmouth-small");
        Runtime.getRuntime().addShutdownHook(new Thread(() -> deleteTree(dir)));
        manifest = DemoScenario.generate(dir, DemoOptions.small());
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
    return manifest;
  }

  static Path file(String name) {
    return get().dir().resolve(name);
  }

  static void deleteTree(Path dir) {
    try (Stream<Path> s = Files.walk(dir)) {
      s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    } catch (IOException ignored) {
      // best effort clean-up of a temporary directory
    }
  }
}
