package org.loadstone.acquire;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;

/**
 * Where the journal writer's records go: a file channel outside tests. A write that fails part
 * way leaves the buffer's position after the bytes that were written.
 */
interface JournalSink extends java.io.Closeable {
  void write(ByteBuffer records) throws IOException;

  void force() throws IOException;

  /** @return a sink over a file channel open for appending */
  static JournalSink of(FileChannel ch) {
    return new JournalSink() {
      @Override
      public void write(ByteBuffer records) throws IOException {
        while (records.hasRemaining()) {
          ch.write(records);
        }
      }

      @Override
      public void force() throws IOException {
        ch.force(false);
      }

      @Override
      public void close() throws IOException {
        ch.close();
      }
    };
  }
}
