package org.loadstone.acquire;

import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.locks.LockSupport;
import java.util.zip.CRC32C;
import org.loadstone.archive.JournalStream;
import org.loadstone.device.SimSetup;
import org.loadstone.files.FakeDisk;

/**
 * A program the kill test starts in its own JVM: it records one run of the simulated brittle
 * specimen into an archive on a {@link FakeDisk} that fills just as the run files are written,
 * so the store waits for room. It prints, in this order:
 *
 * <pre>
 * ended cause &lt;wire name&gt; break &lt;index or null&gt; samples &lt;n&gt; crc &lt;CRC-32C of the run's seq and counts&gt;
 * waiting
 * </pre>
 *
 * and then waits to be killed (or ends after 10 min, as a safety net). The CRC is taken over
 * the ring's samples from the run's first to its last, as the device sent them.
 *
 * <p>Argument: the archive folder.
 */
public final class SaveWaitChild {
  private SaveWaitChild() {}

  public static void main(String[] args) throws Exception {
    Path real = Path.of(args[0]);
    SimSetup setup = new SimSetup("brittle", 5, 1000, false, 8);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    FakeDisk disk = FakeDisk.create();
    AtomicLong first = new AtomicLong();
    AtomicBoolean filled = new AtomicBoolean();
    JournalRunStore store = new JournalRunStore(disk.path(real), null, (dir, j, last, meta) -> {
      if (filled.compareAndSet(false, true)) {
        long n = last + 1 - first.get();
        System.out.println("ended cause " + meta.cause().wireName() + " break "
            + meta.breakIndex() + " samples " + n + " crc " + crc(reader.ring(), first.get(), n));
        System.out.flush();
        disk.bytesLeft(0); // the disk fills just as the run files are written
      }
      return JournalStream.store(dir, j, last, meta);
    }, 20);
    double zero = Tare.counts(reader, 200, 60_000);
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, RunSettings.builder().startThreshold_N(5).pretrigger_s(0.3).ratedCapacity_N(500)
            .build(), RecorderSimTest.template("killed", 1000), store, new Recorder.Listener() {
              @Override
              public void onStarted(RunControl.Started s) {
                first.set(s.firstIndex());
              }

              @Override
              public void onWarning(String text) {
                if (text.contains("is stored as soon as space is freed")) {
                  System.out.println("waiting");
                  System.out.flush();
                }
              }
            });
    rec.arm();
    long until = System.nanoTime() + 600_000_000_000L;
    while (System.nanoTime() < until) {
      LockSupport.parkNanos(100_000_000L);
    }
    System.exit(3);
  }

  /** CRC-32C over each sample's sequence number and counts, big-endian. */
  static long crc(SampleRing ring, long first, long n) {
    CRC32C c = new CRC32C();
    java.nio.ByteBuffer b = java.nio.ByteBuffer.allocate(8);
    long[] k = {0};
    ring.cursorAt(first).drain((i, seq, dev, tUs, counts, hp, pos) -> {
      if (k[0]++ < n) {
        b.clear();
        b.putInt(seq).putInt(counts);
        c.update(b.array(), 0, 8);
      }
    }, (int) n);
    return c.getValue();
  }
}
