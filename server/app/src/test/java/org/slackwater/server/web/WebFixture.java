package org.slackwater.server.web;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Optional;
import java.util.stream.Stream;
import org.slackwater.core.Workspace;
import org.slackwater.demo.DemoManifest;
import org.slackwater.demo.DemoOptions;
import org.slackwater.demo.DemoScenario;
import org.slackwater.server.DemoCommand;
import org.slackwater.server.HttpServer;
import org.slackwater.server.ServerConfig;

/**
 * A real server for the web page's tests: the small demo scenario (2013-2014, coarse grids),
 * generated and ingested once per test JVM into a temporary directory removed at exit, or an
 * empty store when only the static files matter. Each test class opens its own workspace and
 * closes it, so its Arrow allocator is checked for leaks.
 */
final class WebFixture implements AutoCloseable {
  private static Path smallStore;

  final Workspace workspace;
  final HttpServer server;

  private WebFixture(Path store) throws IOException, InterruptedException {
    this.workspace = Workspace.open(store);
    ServerConfig config = new ServerConfig("127.0.0.1", 0, 1 << 20, Optional.empty(), Optional.empty());
    this.server = HttpServer.start(workspace, config);
  }

  /** The server on the small demo scenario. */
  static WebFixture smallDemo() throws Exception {
    return new WebFixture(smallStore());
  }

  /** The server on a store of its own with nothing in it. */
  static WebFixture empty() throws Exception {
    return new WebFixture(tempRoot("empty").resolve("store"));
  }

  String url() {
    return server.url();
  }

  private static synchronized Path smallStore() throws Exception {
    if (smallStore == null) {
      Path root = tempRoot("small");
      DemoManifest manifest = DemoScenario.generate(root.resolve("files"), DemoOptions.small());
      Path store = root.resolve("store");
      try (Workspace ws = Workspace.open(store)) {
        DemoCommand.prepare(ws, manifest);
      }
      smallStore = store;
    }
    return smallStore;
  }

  private static Path tempRoot(String name) throws IOException {
    Path root = Files.createTempDirectory("slackwater-web-" + name + "-");
    Runtime.getRuntime().addShutdownHook(new Thread(() -> delete(root)));
    return root;
  }

  static void delete(Path root) {
    try (Stream<Path> w = Files.walk(root)) {
      w.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    } catch (IOException ignored) {
      // Best effort at exit.
    }
  }

  @Override
  public void close() {
    server.close();
    workspace.close();
  }
}
