package org.slackwater.server;

import io.netty.buffer.Unpooled;
import io.netty.channel.Channel;
import io.netty.channel.ChannelFuture;
import io.netty.handler.codec.http.DefaultHttpContent;
import io.netty.handler.codec.http.LastHttpContent;
import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayDeque;

/**
 * The body of a chunked HTTP response as an output stream, for a {@link Reply.Streamer}: bytes
 * are gathered into chunks of {@value #CHUNK_BYTES} bytes and handed to the channel, and the
 * writer waits while the channel is not writable (its outbound buffer above the high water mark,
 * see {@link HttpServer}), so a slow client slows the producer instead of filling the heap. What
 * the stream holds is one chunk being filled plus what the channel buffers up to the mark.
 *
 * <p>Runs on the request's worker thread, never on the channel's I/O thread (waiting there would
 * stop the very writes it waits for). A client that goes away makes the next write throw.
 */
final class ChunkedBody extends OutputStream {
  static final int CHUNK_BYTES = 1 << 17;

  private final Channel channel;
  private byte[] buffer = new byte[CHUNK_BYTES];
  private int filled;
  /** Writes handed to the channel and not yet known complete, oldest first. */
  private final ArrayDeque<ChannelFuture> pending = new ArrayDeque<>();
  private long sent;

  ChunkedBody(Channel channel) {
    this.channel = channel;
  }

  @Override
  public void write(int b) throws IOException {
    if (filled == buffer.length) {
      send();
    }
    buffer[filled++] = (byte) b;
  }

  @Override
  public void write(byte[] b, int off, int len) throws IOException {
    while (len > 0) {
      if (filled == buffer.length) {
        send();
      }
      int n = Math.min(len, buffer.length - filled);
      System.arraycopy(b, off, buffer, filled, n);
      filled += n;
      off += n;
      len -= n;
    }
  }

  /** Writers flush at their end; chunks go out when full, so a flush sends nothing by itself. */
  @Override
  public void flush() {}

  /** Sends what is left and the last chunk; returns the write of that last chunk. */
  ChannelFuture finish() throws IOException {
    send();
    return channel.writeAndFlush(LastHttpContent.EMPTY_LAST_CONTENT);
  }

  /** Body bytes handed to the channel so far. */
  long sent() {
    return sent;
  }

  private void send() throws IOException {
    if (filled == 0) {
      return;
    }
    if (!channel.isActive()) {
      throw new IOException("the client closed the connection after " + sent + " bytes");
    }
    // The channel owns the chunk from here: hand it this array and fill a new one.
    pending.add(channel.writeAndFlush(new DefaultHttpContent(Unpooled.wrappedBuffer(buffer, 0, filled))));
    sent += filled;
    buffer = new byte[CHUNK_BYTES];
    filled = 0;
    while (!pending.isEmpty() && pending.peek().isDone()) {
      check(pending.poll());
    }
    // Back-pressure: wait for the oldest writes until the channel takes more.
    while (!channel.isWritable() && !pending.isEmpty()) {
      ChannelFuture oldest = pending.poll();
      oldest.awaitUninterruptibly();
      check(oldest);
    }
  }

  private void check(ChannelFuture f) throws IOException {
    if (!f.isSuccess()) {
      throw new IOException("sending the result failed after " + sent + " bytes: " + f.cause(), f.cause());
    }
  }
}
