package org.slackwater.server;

import io.netty.buffer.Unpooled;
import io.netty.channel.Channel;
import io.netty.channel.ChannelFuture;
import io.netty.channel.ChannelFutureListener;
import io.netty.channel.ChannelHandlerContext;
import io.netty.channel.SimpleChannelInboundHandler;
import io.netty.handler.codec.http.DefaultFullHttpResponse;
import io.netty.handler.codec.http.DefaultHttpResponse;
import io.netty.handler.codec.http.FullHttpRequest;
import io.netty.handler.codec.http.FullHttpResponse;
import io.netty.handler.codec.http.HttpHeaderNames;
import io.netty.handler.codec.http.HttpMethod;
import io.netty.handler.codec.http.HttpResponse;
import io.netty.handler.codec.http.HttpResponseStatus;
import io.netty.handler.codec.http.HttpUtil;
import io.netty.handler.codec.http.HttpVersion;
import io.netty.handler.codec.http.QueryStringDecoder;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.List;
import java.util.Optional;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Routes a complete request to its endpoint and writes the reply. Runs on a separate executor
 * group (see {@link HttpInitializer}) because queries are CPU-bound and would stall the I/O loop.
 * Any failure that is not the user's becomes a 500 problem without internals; the stack trace
 * goes to the log only.
 */
final class ApiHandler extends SimpleChannelInboundHandler<FullHttpRequest> {
  private static final Logger LOG = LoggerFactory.getLogger(ApiHandler.class);

  private static final StaticFiles WEB = StaticFiles.packaged();

  private final Endpoints endpoints;
  private final ServerConfig config;

  ApiHandler(Endpoints endpoints, ServerConfig config) {
    this.endpoints = endpoints;
    this.config = config;
  }

  @Override
  protected void channelRead0(ChannelHandlerContext ctx, FullHttpRequest req) {
    Reply reply;
    try {
      reply = route(req);
    } catch (RuntimeException | LinkageError e) {
      // A LinkageError is a broken installation (a missing library): answer rather than drop the connection.
      LOG.error("request {} {} failed", req.method(), req.uri(), e);
      reply = Problem.of(HttpResponseStatus.INTERNAL_SERVER_ERROR, "Internal error",
          "the server failed while answering; the log has the details");
    }
    write(ctx, req, reply);
  }

  private Reply route(FullHttpRequest req) {
    QueryStringDecoder uri = new QueryStringDecoder(req.uri());
    String path = uri.path();
    HttpMethod m = req.method();
    String body = req.content().toString(StandardCharsets.UTF_8);
    if (!path.equals("/api") && !path.startsWith("/api/")) {
      return WEB.serve(m, req.uri(), req.headers().get(HttpHeaderNames.IF_NONE_MATCH));
    }
    if (path.equals("/api/health")) {
      return m.equals(HttpMethod.GET) ? endpoints.health() : notAllowed("GET");
    }
    if (path.equals("/api/query")) {
      if (!m.equals(HttpMethod.POST)) {
        return notAllowed("POST");
      }
      return endpoints.query(body, param(uri, "format"), req.headers().get(HttpHeaderNames.ACCEPT),
          new PlotSize(param(uri, "width"), param(uri, "height"), param(uri, "scale")));
    }
    if (path.equals("/api/matchups")) {
      if (!m.equals(HttpMethod.POST)) {
        return notAllowed("POST");
      }
      return endpoints.matchUps(body, param(uri, "variable"), param(uri, "window"), param(uri, "format"), req.headers().get(HttpHeaderNames.ACCEPT));
    }
    if (path.equals("/api/cubes")) {
      if (m.equals(HttpMethod.GET)) {
        return endpoints.cubes();
      }
      if (m.equals(HttpMethod.POST)) {
        return admin(req).orElseGet(() -> endpoints.ingest(body));
      }
      return notAllowed("GET, POST");
    }
    if (path.startsWith("/api/cubes/")) {
      String name = decode(path.substring("/api/cubes/".length()));
      if (m.equals(HttpMethod.GET)) {
        return endpoints.cube(name);
      }
      if (m.equals(HttpMethod.DELETE)) {
        return admin(req).orElseGet(() -> endpoints.deleteCube(name));
      }
      return notAllowed("GET, DELETE");
    }
    if (path.equals("/api/regions")) {
      return m.equals(HttpMethod.GET) ? endpoints.regions() : notAllowed("GET");
    }
    if (path.startsWith("/api/regions/")) {
      String name = decode(path.substring("/api/regions/".length()));
      if (m.equals(HttpMethod.PUT)) {
        return admin(req).orElseGet(() -> endpoints.putRegion(name, body));
      }
      return notAllowed("PUT");
    }
    if (path.equals("/api/watch-presets")) {
      return m.equals(HttpMethod.GET) ? endpoints.watchPresets(param(uri, "region")) : notAllowed("GET");
    }
    if (path.equals("/api/watches")) {
      if (m.equals(HttpMethod.GET)) {
        return endpoints.watches();
      }
      if (m.equals(HttpMethod.POST)) {
        return admin(req).orElseGet(() -> endpoints.putWatch(body, bearer(req)));
      }
      return notAllowed("GET, POST");
    }
    if (path.startsWith("/api/watches/")) {
      String rest = path.substring("/api/watches/".length());
      String accept = req.headers().get(HttpHeaderNames.ACCEPT);
      PlotSize size = new PlotSize(param(uri, "width"), param(uri, "height"), param(uri, "scale"));
      for (String action : List.of("/evaluate", "/backtest", "/channels")) {
        if (rest.endsWith(action)) {
          String name = decode(rest.substring(0, rest.length() - action.length()));
          return switch (action) {
            case "/evaluate" -> m.equals(HttpMethod.POST)
                ? admin(req).orElseGet(() -> endpoints.evaluateWatch(name, param(uri, "from"), param(uri, "to"), param(uri, "format"), accept, size))
                : notAllowed("POST");
            case "/backtest" -> m.equals(HttpMethod.POST)
                ? endpoints.backtestWatch(name, body, param(uri, "lead"), param(uri, "format"), accept, size) : notAllowed("POST");
            default -> m.equals(HttpMethod.PUT) ? admin(req).orElseGet(() -> endpoints.putWatchChannels(name, body)) : notAllowed("PUT");
          };
        }
      }
      String name = decode(rest);
      if (m.equals(HttpMethod.GET)) {
        return endpoints.watch(name);
      }
      if (m.equals(HttpMethod.DELETE)) {
        return admin(req).orElseGet(() -> endpoints.deleteWatch(name));
      }
      return notAllowed("GET, DELETE");
    }
    return Problem.of(HttpResponseStatus.NOT_FOUND, "No such endpoint",
        "the API has /api/query, /api/cubes, /api/regions, /api/watches and /api/health");
  }

  /** Empty if the request carries the admin token; otherwise the refusal. */
  private Optional<Reply> admin(FullHttpRequest req) {
    if (config.adminToken().isEmpty()) {
      return Optional.of(Problem.of(HttpResponseStatus.FORBIDDEN, "Admin endpoints are off",
          "set SLACKWATER_ADMIN_TOKEN (or --admin-token) when starting the server to enable them"));
    }
    String given = bearer(req);
    boolean ok = MessageDigest.isEqual(given.getBytes(StandardCharsets.UTF_8), config.adminToken().get().getBytes(StandardCharsets.UTF_8));
    if (!ok) {
      Reply r = Problem.of(HttpResponseStatus.UNAUTHORIZED, "Admin token required", "send 'Authorization: Bearer <token>' with the server's admin token");
      return Optional.of(new Reply(r.status(), r.contentType(), r.body(), java.util.Map.of("WWW-Authenticate", "Bearer")));
    }
    return Optional.empty();
  }

  private static String bearer(FullHttpRequest req) {
    String auth = req.headers().get(HttpHeaderNames.AUTHORIZATION, "");
    return auth.startsWith("Bearer ") ? auth.substring(7).trim() : "";
  }

  private static Reply notAllowed(String allowed) {
    Reply r = Problem.of(HttpResponseStatus.METHOD_NOT_ALLOWED, "Method not allowed", "this endpoint answers " + allowed);
    return new Reply(r.status(), r.contentType(), r.body(), java.util.Map.of("Allow", allowed));
  }

  private static String param(QueryStringDecoder uri, String name) {
    List<String> v = uri.parameters().get(name);
    return v == null || v.isEmpty() ? null : v.get(0);
  }

  /** Path segments arrive decoded already ({@link QueryStringDecoder#path()}): decoding again would turn %2B into a space. */
  private static String decode(String s) {
    return s;
  }

  static void write(ChannelHandlerContext ctx, FullHttpRequest req, Reply reply) {
    if (reply.streamer() != null) {
      writeStreamed(ctx, req, reply);
      return;
    }
    FullHttpResponse res = new DefaultFullHttpResponse(HttpVersion.HTTP_1_1, reply.status(), Unpooled.wrappedBuffer(reply.body()));
    res.headers().set(HttpHeaderNames.CONTENT_TYPE, reply.contentType());
    res.headers().setInt(HttpHeaderNames.CONTENT_LENGTH, reply.body().length);
    reply.headers().forEach(res.headers()::set);
    boolean keepAlive = req != null && HttpUtil.isKeepAlive(req);
    if (keepAlive) {
      res.headers().set(HttpHeaderNames.CONNECTION, "keep-alive");
      ctx.writeAndFlush(res);
    } else {
      res.headers().set(HttpHeaderNames.CONNECTION, "close");
      ctx.writeAndFlush(res).addListener(ChannelFutureListener.CLOSE);
    }
  }

  /**
   * A chunked response written while it is produced. The status and headers go first; a failure
   * after that cannot become a problem document any more, so the connection is closed without the
   * last chunk and the client sees an incomplete response, never a short one passed off as whole.
   */
  private static void writeStreamed(ChannelHandlerContext ctx, FullHttpRequest req, Reply reply) {
    Channel channel = ctx.channel();
    HttpResponse res = new DefaultHttpResponse(HttpVersion.HTTP_1_1, reply.status());
    res.headers().set(HttpHeaderNames.CONTENT_TYPE, reply.contentType());
    HttpUtil.setTransferEncodingChunked(res, true);
    reply.headers().forEach(res.headers()::set);
    boolean keepAlive = req != null && HttpUtil.isKeepAlive(req);
    res.headers().set(HttpHeaderNames.CONNECTION, keepAlive ? "keep-alive" : "close");
    channel.writeAndFlush(res);
    ChunkedBody body = new ChunkedBody(channel);
    try {
      reply.streamer().writeTo(body);
      ChannelFuture last = body.finish();
      if (!keepAlive) {
        last.addListener(ChannelFutureListener.CLOSE);
      }
    } catch (IOException | RuntimeException e) {
      if (channel.isActive()) {
        LOG.error("streaming {} {} failed after {} bytes; closing the connection", req == null ? "" : req.method(),
            req == null ? "" : req.uri(), body.sent(), e);
      } else {
        LOG.info("client left {} {} after {} bytes: {}", req == null ? "" : req.method(), req == null ? "" : req.uri(),
            body.sent(), e.toString());
      }
      channel.close();
    }
  }

  @Override
  public void exceptionCaught(ChannelHandlerContext ctx, Throwable cause) {
    LOG.warn("connection failed: {}", cause.toString());
    ctx.close();
  }
}
