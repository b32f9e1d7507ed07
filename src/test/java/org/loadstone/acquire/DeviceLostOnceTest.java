package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.CyclicBarrier;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.RepeatedTest;
import org.loadstone.protocol.HostCommand;

/**
 * The loss of the device is handled once, on the reader thread, however many threads run into
 * it at once: commands failing on eight threads while the read itself fails.
 */
@Tag("fault")
class DeviceLostOnceTest {
  /** A link that fails every write, and fails its read once {@link #cut} opens. */
  static final class Failing extends FakeLink {
    final CountDownLatch cut = new CountDownLatch(1);

    Failing() {
      super("failing");
    }

    @Override
    public int read(byte[] buf, int off, int len) throws IOException {
      try {
        if (cut.await(1, TimeUnit.MILLISECONDS)) {
          throw new IOException("Input/output error");
        }
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      return 0; // a read time-out
    }

    @Override
    public void write(byte[] data) throws IOException {
      throw new IOException("Broken pipe");
    }
  }

  @RepeatedTest(20)
  void listenersHearOfTheLossOnceOnTheReaderThread() throws Exception {
    Failing link = new Failing();
    DeviceReader reader = new DeviceReader(link, new SampleRing(16));
    List<String> heardOn = new CopyOnWriteArrayList<>();
    CountDownLatch heard = new CountDownLatch(1);
    reader.addListener(new DeviceReader.Listener() {
      @Override
      public void onDeviceLost(String why) {
        heardOn.add(Thread.currentThread().getName());
        heard.countDown();
      }
    });
    reader.start(); // its own identify and start commands fail already
    int senders = 8;
    CyclicBarrier go = new CyclicBarrier(senders + 1);
    List<Thread> threads = new CopyOnWriteArrayList<>();
    for (int k = 0; k < senders; k++) {
      Thread t = new Thread(() -> {
        await(go);
        assertThat(reader.send(HostCommand.halt())).isFalse();
      });
      threads.add(t);
      t.start();
    }
    await(go);
    link.cut.countDown(); // and the read fails at the same time
    assertThat(heard.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    for (Thread t : threads) {
      t.join();
    }
    reader.close(); // joins the reader thread: nothing more can be told after this
    assertThat(heardOn).containsExactly("loadstone-reader-failing");
    assertThat(reader.lostReason()).hasValueSatisfying(
        why -> assertThat(why).contains("failing"));
  }

  private static void await(CyclicBarrier b) {
    try {
      b.await();
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }
}
