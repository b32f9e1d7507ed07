package org.loadstone.acquire;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import org.loadstone.device.Transport;

/**
 * A text-mode device with faults: its identity lines never arrive, and (optionally) every
 * {@code dropEvery}-th sample line is lost on the way, as over a damaged link. Lines are passed
 * whole, so the decoder sees only complete records.
 */
final class FilteredTransport implements Transport {
  private final Transport inner;
  private final int dropEvery;
  private final byte[] chunk = new byte[8192];
  private final ByteArrayOutputStream partial = new ByteArrayOutputStream();
  private byte[] ready = new byte[0];
  private int readyAt;
  private long samples;

  /**
   * @param inner the device
   * @param dropEvery lose every n-th sample line (0: lose none)
   */
  FilteredTransport(Transport inner, int dropEvery) {
    this.inner = inner;
    this.dropEvery = dropEvery;
  }

  @Override
  public String name() {
    return inner.name();
  }

  @Override
  public int read(byte[] buf, int off, int len) throws IOException {
    while (readyAt == ready.length) {
      int n = inner.read(chunk, 0, chunk.length);
      if (n < 0) {
        return -1;
      }
      if (n == 0) {
        return 0;
      }
      ByteArrayOutputStream passed = new ByteArrayOutputStream();
      for (int i = 0; i < n; i++) {
        partial.write(chunk[i]);
        if (chunk[i] == '\n') {
          byte[] line = partial.toByteArray();
          partial.reset();
          if (keep(new String(line, StandardCharsets.US_ASCII))) {
            passed.write(line, 0, line.length);
          }
        }
      }
      ready = passed.toByteArray();
      readyAt = 0;
    }
    int n = Math.min(len, ready.length - readyAt);
    System.arraycopy(ready, readyAt, buf, off, n);
    readyAt += n;
    return n;
  }

  private boolean keep(String line) {
    if (line.startsWith("I ")) {
      return false;
    }
    if (line.startsWith("S ")) {
      samples++;
      return dropEvery == 0 || samples % dropEvery != 0;
    }
    return true;
  }

  @Override
  public void write(byte[] data) throws IOException {
    inner.write(data);
  }

  @Override
  public boolean isOpen() {
    return inner.isOpen();
  }

  @Override
  public void close() {
    inner.close();
  }
}
