package org.slackwater.server;

import io.netty.channel.ChannelOption;
import io.netty.channel.WriteBufferWaterMark;
import io.netty.bootstrap.ServerBootstrap;
import io.netty.channel.Channel;
import io.netty.channel.group.ChannelGroup;
import io.netty.channel.group.DefaultChannelGroup;
import io.netty.util.concurrent.GlobalEventExecutor;
import io.netty.channel.EventLoopGroup;
import io.netty.channel.MultiThreadIoEventLoopGroup;
import io.netty.channel.nio.NioIoHandler;
import io.netty.channel.socket.nio.NioServerSocketChannel;
import io.netty.util.concurrent.DefaultEventExecutorGroup;
import io.netty.util.concurrent.EventExecutorGroup;
import java.net.InetSocketAddress;
import java.util.concurrent.TimeUnit;
import org.slackwater.core.Workspace;

/**
 * The HTTP server's bootstrap: event loops, bind, graceful shutdown. Requests are answered by
 * {@link ApiHandler} on a worker group sized to the machine, off the I/O threads.
 */
public final class HttpServer implements AutoCloseable {
  private final EventLoopGroup boss = new MultiThreadIoEventLoopGroup(1, NioIoHandler.newFactory());
  private final EventLoopGroup io = new MultiThreadIoEventLoopGroup(0, NioIoHandler.newFactory());
  private final EventExecutorGroup workers = new DefaultEventExecutorGroup(Math.max(2, Runtime.getRuntime().availableProcessors()));
  private final Channel channel;
  /** Every open connection, so that closing waits for them before the executors go away. */
  private final ChannelGroup connections = new DefaultChannelGroup(GlobalEventExecutor.INSTANCE);

  private final WatchService watches;
  private final org.slackwater.core.ingest.Ingestor.Subscription afterIngest;

  private HttpServer(Workspace workspace, ServerConfig config, org.slackwater.alerts.RetryPolicy retry) throws InterruptedException {
    this.watches = new WatchService(workspace, java.time.Clock.systemUTC(), java.time.Duration.ofSeconds(5), retry);
    // Every ingest that changes a cube (HTTP, drop folder) runs the watches reading it on the new days.
    this.afterIngest = workspace.onIngest(r -> watches.afterIngest(r.cube()));
    ServerBootstrap b = new ServerBootstrap()
        .group(boss, io)
        .channel(NioServerSocketChannel.class)
        // A streamed result waits while a connection holds more than the high mark unsent (ChunkedBody).
        .childOption(ChannelOption.WRITE_BUFFER_WATER_MARK, new WriteBufferWaterMark(1 << 20, 4 << 20))
        .childHandler(new HttpInitializer(new Endpoints(workspace, config, watches), config, workers, connections));
    try {
      this.channel = b.bind(config.host(), config.port()).sync().channel();
    } catch (RuntimeException | InterruptedException e) {
      afterIngest.close();
      watches.close();
      throw e;
    }
  }

  /** The watch runner, e.g. for the drop folder to call after an ingest. */
  WatchService watches() {
    return watches;
  }

  public static HttpServer start(Workspace workspace, ServerConfig config) throws InterruptedException {
    return new HttpServer(workspace, config, org.slackwater.alerts.RetryPolicy.DEFAULT);
  }

  /** With another retry schedule for alert deliveries (tests use seconds, not the default minutes). */
  static HttpServer start(Workspace workspace, ServerConfig config, org.slackwater.alerts.RetryPolicy retry) throws InterruptedException {
    return new HttpServer(workspace, config, retry);
  }

  /** The line the commands print at start: which correlation-map kernel runs, and how to get the vector one. */
  static String kernelLine() {
    String a = org.slackwater.core.analytics.CorrelationMap.arithmetic();
    return "correlation maps use " + a + " arithmetic" + (a.equals("VECTOR") ? ""
        : " (start Java with --add-modules=jdk.incubator.vector for the faster vector kernel)");
  }

  public int port() {
    return ((InetSocketAddress) channel.localAddress()).getPort();
  }

  public String url() {
    InetSocketAddress a = (InetSocketAddress) channel.localAddress();
    return "http://" + a.getHostString() + ":" + a.getPort();
  }

  /** Blocks until the server channel closes. */
  public void awaitClose() throws InterruptedException {
    channel.closeFuture().sync();
  }

  @Override
  public void close() {
    channel.close().awaitUninterruptibly();
    // Close open keep-alive connections while every executor still runs, then stop the executors.
    connections.close().awaitUninterruptibly();
    boss.shutdownGracefully(0, 2, TimeUnit.SECONDS).awaitUninterruptibly();
    io.shutdownGracefully(0, 2, TimeUnit.SECONDS).awaitUninterruptibly();
    workers.shutdownGracefully(0, 2, TimeUnit.SECONDS).awaitUninterruptibly();
    afterIngest.close();
    watches.close();
  }
}
