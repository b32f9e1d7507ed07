package org.loadstone.files;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.MappedByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.ReadableByteChannel;
import java.nio.channels.WritableByteChannel;
import java.util.concurrent.atomic.AtomicLong;

/**
 * A real file channel whose writes fail as on a full disk once the shared budget is spent. Only
 * bytes that make the file longer are counted: writing over bytes the file holds needs no room.
 */
final class LimitedChannel extends FileChannel {
  private final FileChannel ch;
  private final AtomicLong left;

  LimitedChannel(FileChannel ch, AtomicLong left) {
    this.ch = ch;
    this.left = left;
  }

  /** As {@link #allow}, but 0 rather than a failure when nothing is allowed. */
  private int allowSome(ByteBuffer src) {
    try {
      return allow(src);
    } catch (IOException e) {
      return 0;
    }
  }

  /** Cuts {@code src} to what the budget allows; throws when nothing is allowed. */
  private int allow(ByteBuffer src) throws IOException {
    int want = src.remaining();
    long granted;
    while (true) {
      long l = left.get();
      granted = Math.min(l, want);
      if (left.compareAndSet(l, l - granted)) {
        break;
      }
    }
    if (granted == 0 && want > 0) {
      throw new IOException("No space left on device");
    }
    return (int) granted;
  }

  private int limited(ByteBuffer src, long position) throws IOException {
    // bytes written over what the file already holds take no new room, as on a real disk
    long at = position < 0 ? ch.position() : position;
    int inPlace = (int) Math.max(0, Math.min(src.remaining(), ch.size() - at));
    int n;
    if (inPlace == src.remaining()) {
      n = inPlace;
    } else {
      ByteBuffer beyond = src.duplicate();
      beyond.position(src.position() + inPlace);
      n = inPlace == 0 ? allow(beyond) : inPlace + allowSome(beyond);
    }
    ByteBuffer part = src.duplicate();
    part.limit(part.position() + n);
    int written = position < 0 ? ch.write(part) : ch.write(part, position);
    src.position(src.position() + written);
    return written;
  }

  @Override public int read(ByteBuffer dst) throws IOException {
    return ch.read(dst);
  }

  @Override public long read(ByteBuffer[] dsts, int offset, int length) throws IOException {
    return ch.read(dsts, offset, length);
  }

  @Override public int write(ByteBuffer src) throws IOException {
    return limited(src, -1);
  }

  @Override public long write(ByteBuffer[] srcs, int offset, int length) throws IOException {
    long n = 0;
    for (int i = offset; i < offset + length; i++) {
      n += write(srcs[i]);
    }
    return n;
  }

  @Override public long position() throws IOException {
    return ch.position();
  }

  @Override public FileChannel position(long newPosition) throws IOException {
    ch.position(newPosition);
    return this;
  }

  @Override public long size() throws IOException {
    return ch.size();
  }

  @Override public FileChannel truncate(long size) throws IOException {
    ch.truncate(size);
    return this;
  }

  @Override public void force(boolean metaData) throws IOException {
    ch.force(metaData);
  }

  @Override public long transferTo(long position, long count, WritableByteChannel target)
      throws IOException {
    ByteBuffer b = ByteBuffer.allocate((int) Math.min(count, 1 << 16));
    int n = ch.read(b, position);
    if (n <= 0) {
      return 0;
    }
    b.flip();
    while (b.hasRemaining()) {
      target.write(b);
    }
    return n;
  }

  @Override public long transferFrom(ReadableByteChannel src, long position, long count)
      throws IOException {
    ByteBuffer b = ByteBuffer.allocate((int) Math.min(count, 1 << 16));
    int n = src.read(b);
    if (n <= 0) {
      return 0;
    }
    b.flip();
    long done = 0;
    while (b.hasRemaining()) {
      done += limited(b, position + done);
    }
    return done;
  }

  @Override public int read(ByteBuffer dst, long position) throws IOException {
    return ch.read(dst, position);
  }

  @Override public int write(ByteBuffer src, long position) throws IOException {
    return limited(src, position);
  }

  @Override public MappedByteBuffer map(MapMode mode, long position, long size)
      throws IOException {
    throw new UnsupportedOperationException("the fake disk maps no files");
  }

  @Override public FileLock lock(long position, long size, boolean shared) throws IOException {
    return ch.lock(position, size, shared);
  }

  @Override public FileLock tryLock(long position, long size, boolean shared)
      throws IOException {
    return ch.tryLock(position, size, shared);
  }

  @Override protected void implCloseChannel() throws IOException {
    ch.close();
  }
}
