package org.slackwater.server;

import io.netty.channel.ChannelHandlerContext;
import io.netty.channel.ChannelInitializer;
import io.netty.channel.ChannelPipeline;
import io.netty.channel.group.ChannelGroup;
import io.netty.channel.socket.SocketChannel;
import io.netty.handler.codec.http.FullHttpMessage;
import io.netty.handler.codec.http.HttpMessage;
import io.netty.handler.codec.http.HttpObjectAggregator;
import io.netty.handler.codec.http.HttpResponseStatus;
import io.netty.handler.codec.http.HttpServerCodec;
import io.netty.util.concurrent.EventExecutorGroup;

/** Builds each connection's pipeline: codec, size-limited aggregator, then the API on the worker group. */
final class HttpInitializer extends ChannelInitializer<SocketChannel> {
  private final Endpoints endpoints;
  private final ServerConfig config;
  private final EventExecutorGroup workers;
  private final ChannelGroup connections;

  HttpInitializer(Endpoints endpoints, ServerConfig config, EventExecutorGroup workers, ChannelGroup connections) {
    this.endpoints = endpoints;
    this.config = config;
    this.workers = workers;
    this.connections = connections;
  }

  @Override
  protected void initChannel(SocketChannel ch) {
    connections.add(ch);
    ChannelPipeline p = ch.pipeline();
    p.addLast("codec", new HttpServerCodec());
    p.addLast("aggregate", new LimitedAggregator(config.maxBodyBytes()));
    p.addLast(workers, "api", new ApiHandler(endpoints, config));
  }

  /** The aggregator, answering an oversized body with a problem document instead of a bare 413. */
  private static final class LimitedAggregator extends HttpObjectAggregator {
    private final int max;

    LimitedAggregator(int max) {
      super(max);
      this.max = max;
    }

    @Override
    protected void handleOversizedMessage(ChannelHandlerContext ctx, HttpMessage oversized) throws Exception {
      if (oversized instanceof FullHttpMessage) {
        super.handleOversizedMessage(ctx, oversized);
        return;
      }
      Reply r = Problem.of(HttpResponseStatus.REQUEST_ENTITY_TOO_LARGE, "Request body too large",
          "the body is larger than " + max + " bytes; send a shorter query or raise --max-body");
      ApiHandler.write(ctx, null, r);
    }
  }
}
