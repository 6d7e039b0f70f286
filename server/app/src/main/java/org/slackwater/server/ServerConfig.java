package org.slackwater.server;

import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;

/**
 * How the server runs.
 *
 * @param host address to bind (127.0.0.1 unless told otherwise)
 * @param port 0 for an ephemeral port
 * @param maxBodyBytes larger request bodies get 413
 * @param adminToken bearer token for the admin endpoints; empty = admin endpoints refused
 * @param ingestRoot directory under which {@code POST /api/cubes} may read files; empty = off
 * @param dropFolder directory watched for files to ingest (see {@link DropFolder}); empty = off
 */
public record ServerConfig(String host, int port, int maxBodyBytes, Optional<String> adminToken, Optional<Path> ingestRoot,
    Optional<Path> dropFolder) {
  public ServerConfig {
    Objects.requireNonNull(host);
    Objects.requireNonNull(adminToken);
    Objects.requireNonNull(ingestRoot);
    Objects.requireNonNull(dropFolder);
    if (port < 0 || port > 65535) {
      throw new IllegalArgumentException("port must be 0..65535");
    }
  }

  /** Without a drop folder. */
  public ServerConfig(String host, int port, int maxBodyBytes, Optional<String> adminToken, Optional<Path> ingestRoot) {
    this(host, port, maxBodyBytes, adminToken, ingestRoot, Optional.empty());
  }

  public static ServerConfig local(int port) {
    return new ServerConfig("127.0.0.1", port, 1 << 20, Optional.ofNullable(System.getenv("SLACKWATER_ADMIN_TOKEN")).filter(s -> !s.isBlank()), Optional.empty());
  }

  public ServerConfig withIngestRoot(Path root) {
    return new ServerConfig(host, port, maxBodyBytes, adminToken, Optional.of(root), dropFolder);
  }

  public ServerConfig withAdminToken(String token) {
    return new ServerConfig(host, port, maxBodyBytes, Optional.of(token), ingestRoot, dropFolder);
  }

  public ServerConfig withDropFolder(Path dir) {
    return new ServerConfig(host, port, maxBodyBytes, adminToken, ingestRoot, Optional.of(dir));
  }
}
