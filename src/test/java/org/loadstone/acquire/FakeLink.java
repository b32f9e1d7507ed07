package org.loadstone.acquire;

import java.io.IOException;
import org.loadstone.device.Transport;

/** A device link for tests: a name, open until closed, commands accepted and dropped. */
abstract class FakeLink implements Transport {
  private final String name;
  private volatile boolean open = true;

  FakeLink(String name) {
    this.name = name;
  }

  @Override
  public String name() {
    return name;
  }

  @Override
  public void write(byte[] data) throws IOException {}

  @Override
  public boolean isOpen() {
    return open;
  }

  @Override
  public void close() {
    open = false;
  }
}
