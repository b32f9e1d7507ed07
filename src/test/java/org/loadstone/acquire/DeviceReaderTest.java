package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import org.junit.jupiter.api.Test;
import org.loadstone.device.Transport;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.WireEncoder;

/** The reader thread's handling of what a device says about itself. */
class DeviceReaderTest {
  /** A device that sends fixed bytes once, then nothing. */
  static final class Canned implements Transport {
    private final byte[] bytes;
    private boolean sent;
    private volatile boolean open = true;

    Canned(byte[] bytes) {
      this.bytes = bytes;
    }

    @Override
    public String name() {
      return "canned";
    }

    @Override
    public int read(byte[] buf, int off, int len) {
      if (!open) {
        return -1;
      }
      if (sent) {
        try {
          Thread.sleep(5);
        } catch (InterruptedException e) {
          Thread.currentThread().interrupt();
        }
        return 0;
      }
      sent = true;
      System.arraycopy(bytes, 0, buf, off, bytes.length);
      return bytes.length;
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

  static byte[] stream(String identity, int samples) {
    WireEncoder e = new WireEncoder(Encoding.TEXT);
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    out.writeBytes(e.body(identity));
    byte[] b = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (int i = 0; i < samples; i++) {
      out.write(b, 0, e.sample(b, 0, i, 1000L * i, 100 + i, false, 0));
    }
    return out.toByteArray();
  }

  @Test
  void anUnknownProtocolVersionIsNamedAndItsSamplesAreNotUsed() throws Exception {
    DeviceReader r = new DeviceReader(new Canned(stream("I proto=2 fw=9.0 rate=80", 50)),
        new SampleRing(1024));
    r.start();
    Thread.sleep(300);
    assertThat(r.unsupportedVersion()).hasValueSatisfying(m -> assertThat(m)
        .contains("protocol version 2").contains("speaks version 1").contains("firmware"));
    assertThat(r.samplesAccepted()).isZero();
    assertThat(r.ring().written()).isZero();
    r.close();
  }

  @Test
  void aSupportedDeviceIsReadAndTimeUnwrapsAcrossTheClockWrap() throws Exception {
    WireEncoder e = new WireEncoder(Encoding.TEXT);
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    out.writeBytes(e.body("I proto=1 rate=80 ch=1"));
    byte[] b = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    long us = 0xFFFF_FFFFL - 1500; // 1.5 ms before the 32-bit microsecond clock wraps
    for (int i = 0; i < 4; i++) {
      out.write(b, 0, e.sample(b, 0, i, (us + 1000L * i) & 0xFFFF_FFFFL, 7, false, 0));
    }
    DeviceReader r = new DeviceReader(new Canned(out.toByteArray()), new SampleRing(1024));
    r.start();
    Thread.sleep(300);
    r.close();
    assertThat(r.samplesAccepted()).isEqualTo(4);
    // unwrapped time keeps increasing by 1000 µs through the wrap
    assertThat(r.ring().timeUsAt(3) - r.ring().timeUsAt(0)).isEqualTo(3000);
    assertThat(r.identity()).isPresent();
  }
}
