package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.WireEncoder;

/** The reader thread's handling of what a device says about itself. */
class DeviceReaderTest {
  /**
   * A device that sends fixed bytes once, then nothing. {@link #fed} opens when the reader asks
   * for more: by then every byte sent has gone through the decoder into the ring.
   */
  static final class Canned extends FakeLink {
    final CountDownLatch fed = new CountDownLatch(1);
    private final byte[] bytes;
    private boolean sent;

    Canned(byte[] bytes) {
      super("canned");
      this.bytes = bytes;
    }

    @Override
    public int read(byte[] buf, int off, int len) {
      if (!isOpen()) {
        return -1;
      }
      if (sent) {
        fed.countDown();
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
    Canned device = new Canned(stream("I proto=2 fw=9.0 rate=80", 50));
    DeviceReader r = new DeviceReader(device, new SampleRing(1024));
    r.start();
    assertThat(device.fed.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
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
    Canned device = new Canned(out.toByteArray());
    DeviceReader r = new DeviceReader(device, new SampleRing(1024));
    r.start();
    assertThat(device.fed.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    r.close();
    assertThat(r.samplesAccepted()).isEqualTo(4);
    // unwrapped time keeps increasing by 1000 µs through the wrap
    assertThat(r.ring().timeUsAt(3) - r.ring().timeUsAt(0)).isEqualTo(3000);
    assertThat(r.identity()).isPresent();
  }
}
