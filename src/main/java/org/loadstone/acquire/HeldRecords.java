package org.loadstone.acquire;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.WritableByteChannel;
import java.util.ArrayDeque;
import java.util.function.Consumer;
import org.loadstone.archive.JournalFormat;

/**
 * Journal records the disk refused, kept in memory in their order until they can be written
 * (the journal writer's thread, then the thread that stores the run after the writer ended).
 * Bounded: past the limit whole batches are dropped and counted, so what is kept stays one
 * stream of records.
 */
final class HeldRecords {
  private final ArrayDeque<ByteBuffer> queue = new ArrayDeque<>();
  private final long maxBytes;
  private volatile long bytes;
  private volatile long lost;

  /** @param maxBytes most bytes held; the first batch is held whatever its size */
  HeldRecords(long maxBytes) {
    this.maxBytes = maxBytes;
  }

  boolean isEmpty() {
    return queue.isEmpty();
  }

  /** @return bytes held (a record cut by the disk's refusal counts with its rest only) */
  long bytes() {
    return bytes;
  }

  /** @return records dropped because the limit was reached */
  long lost() {
    return lost;
  }

  /** Keeps a copy of the rest of {@code b} after what is held already. */
  void hold(ByteBuffer b) {
    int n = b.remaining();
    if (!queue.isEmpty() && bytes + n > maxBytes) {
      lost += n / JournalFormat.RECORD_BYTES; // whole records: the stream stays whole
      b.position(b.limit());
      return;
    }
    ByteBuffer copy = ByteBuffer.allocate(n);
    copy.put(b).flip();
    queue.addLast(copy);
    bytes += n;
  }

  /**
   * Hands what is held, in order, to {@code write}, which writes what it can and leaves the rest
   * in the buffer; stops at the first buffer not written whole.
   *
   * @return whether nothing is held any more
   */
  boolean writeThrough(Consumer<ByteBuffer> write) {
    while (!queue.isEmpty()) {
      ByteBuffer b = queue.peekFirst();
      int before = b.remaining();
      write.accept(b);
      bytes -= before - b.remaining();
      if (b.hasRemaining()) {
        return false;
      }
      queue.removeFirst();
    }
    return true;
  }

  /**
   * Appends bytes {@code from…to} of a file to {@code target}.
   *
   * @throws IOException when the file cannot be read, is shorter, or the target refuses them
   */
  static void copyRange(java.nio.file.Path file, long from, long to,
      java.nio.channels.FileChannel target) throws IOException {
    try (java.nio.channels.FileChannel in = java.nio.channels.FileChannel.open(file,
        java.nio.file.StandardOpenOption.READ)) {
      long pos = from;
      while (pos < to) {
        long n = in.transferTo(pos, to - pos, target);
        if (n <= 0) {
          throw new IOException("journal " + file + " is shorter than the records written to it");
        }
        pos += n;
      }
    }
  }

  /** Writes a copy of everything held to {@code target}, leaving it held. */
  void copyTo(WritableByteChannel target) throws IOException {
    for (ByteBuffer b : queue) {
      ByteBuffer d = b.duplicate();
      while (d.hasRemaining()) {
        target.write(d);
      }
    }
  }
}
