package org.loadstone.acquire;

import java.io.IOException;
import java.util.Optional;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicReference;
import org.loadstone.device.Transport;
import org.loadstone.protocol.DecodeListener;
import org.loadstone.protocol.DecoderCounters;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.protocol.HostCommand;
import org.loadstone.protocol.StreamDecoder;
import org.loadstone.units.Precondition;

/**
 * The one thread that reads a device: bytes from the {@link Transport} go through a {@link
 * StreamDecoder} into a {@link SampleRing}. It never waits on a consumer. Device messages and the
 * loss of the device are reported to listeners on this thread; listeners must return quickly.
 *
 * <p>Loss of the device is handled once, on the reader thread: a failed read ends the loop there;
 * a failed {@link #send} on any other thread only leaves its reason for the reader thread, which
 * takes it up after its current read (at most one read time-out later). The first reason wins;
 * {@link #lostReason()} is set and the listeners are told exactly once.
 */
public final class DeviceReader implements AutoCloseable {
  /** Told about device events, on the reader thread. */
  public interface Listener {
    /** A non-sample record arrived. */
    default void onMessage(DeviceMessage message) {}

    /** The device is gone; {@code why} is a sentence for the user. No more samples will come. */
    default void onDeviceLost(String why) {}

    /**
     * The device restarted: samples from ring index {@code firstIndex} on come from the
     * restarted device; {@code why} says how it showed.
     */
    default void onDeviceReset(String why, long firstIndex) {}
  }

  /**
   * A device-time step between two samples longer than this is a clock jump (a restart), not a
   * pause: a device that streams never pauses, and a link that lost this much would leave no
   * usable run either. (Our own limit; 10 s is 800 samples of the slowest converter.)
   */
  public static final long CLOCK_JUMP_US = 10_000_000;

  private final Transport transport;
  private final SampleRing ring;
  private final StreamDecoder decoder;
  private final CopyOnWriteArrayList<Listener> listeners = new CopyOnWriteArrayList<>();
  private final Thread thread;
  private volatile boolean running;
  private volatile DecoderCounters counters;
  private volatile DeviceMessage.Identity identity;
  private volatile String lostReason; // written by the reader thread only
  private final AtomicReference<String> lossSeen = new AtomicReference<>();
  private volatile String unsupported;
  private volatile long firstArrivalNanos = -1;
  private volatile long lastArrivalNanos = -1;
  private volatile long samplesAccepted;

  private long lastDeviceUs = -1;
  private int lastSeq = -1;
  private long timeUs;
  private double period_us = Double.NaN; // typical device-time step of one sample
  private String resetPending; // an unasked-for identity arrived; the next sample is the restart
  private final java.util.concurrent.atomic.AtomicInteger identitiesAsked =
      new java.util.concurrent.atomic.AtomicInteger();
  private final CopyOnWriteArrayList<long[]> resets = new CopyOnWriteArrayList<>();
  private volatile int resetCount;
  private volatile String resetReason;

  /**
   * @param transport an open device link; closed by {@link #close()}
   * @param ring where samples go
   */
  public DeviceReader(Transport transport, SampleRing ring) {
    this.transport = Precondition.notNull(transport, "transport");
    this.ring = Precondition.notNull(ring, "ring");
    this.decoder = new StreamDecoder(new Sink());
    this.counters = decoder.counters();
    this.thread = new Thread(this::loop, "loadstone-reader-" + transport.name());
    this.thread.setDaemon(true);
  }

  /** @param l told about messages and loss of the device */
  public void addListener(Listener l) {
    listeners.add(Precondition.notNull(l, "listener"));
  }

  /** Starts reading, then asks the device who it is and to start streaming. */
  public void start() {
    running = true;
    thread.start();
    send(HostCommand.who());
    send(HostCommand.start());
  }

  /**
   * Sends a command; a failure to send is reported as loss of the device.
   *
   * @return whether it was sent
   */
  public boolean send(HostCommand command) {
    try {
      if (command.verb() == HostCommand.Verb.WHO) {
        identitiesAsked.incrementAndGet(); // its answer is not a restart
      }
      transport.write(command.toWire());
      return true;
    } catch (IOException e) {
      lossSeen.compareAndSet(null,
          "could not send " + command.verb() + " to " + transport.name() + ": " + e.getMessage());
      return false;
    }
  }

  /** @return the ring this reader fills */
  public SampleRing ring() {
    return ring;
  }

  /** @return the device link */
  public Transport transport() {
    return transport;
  }

  /** @return decoder counters as of the last read */
  public DecoderCounters counters() {
    return counters;
  }

  /** @return the device's identity once it has sent one */
  public Optional<DeviceMessage.Identity> identity() {
    return Optional.ofNullable(identity);
  }

  /** @return why the device was lost, if it was */
  public Optional<String> lostReason() {
    return Optional.ofNullable(lostReason);
  }

  /** @return how many times the device restarted while read (see {@link #firstResetFrom}) */
  public int resets() {
    return resetCount;
  }

  /**
   * @param index a ring index
   * @return the ring index of the first sample after the first restart at or after {@code
   *     index}, or {@link Long#MAX_VALUE} when the device has not restarted since
   */
  public long firstResetFrom(long index) {
    for (long[] r : resets) {
      if (r[0] >= index) {
        return r[0];
      }
    }
    return Long.MAX_VALUE;
  }

  /**
   * @param firstIndex a restart's first ring index ({@link #firstResetFrom})
   * @return the decoder's count of dropped samples before that restart (a sequence that started
   *     over is not a loss), or -1 for an index that is no restart
   */
  public long droppedBeforeReset(long firstIndex) {
    for (long[] r : resets) {
      if (r[0] == firstIndex) {
        return r[1];
      }
    }
    return -1;
  }

  /** @return how the last restart of the device showed, if it restarted */
  public Optional<String> resetReason() {
    return Optional.ofNullable(resetReason);
  }

  /** @return a message when the device speaks a protocol version this host does not */
  public Optional<String> unsupportedVersion() {
    return Optional.ofNullable(unsupported);
  }

  /** @return samples put in the ring */
  public long samplesAccepted() {
    return samplesAccepted;
  }

  /**
   * @return when the last read that brought samples returned, on the {@link System#nanoTime()}
   *     clock, or −1 before the first sample (see {@link SampleFreshness})
   */
  public long lastArrivalNanos() {
    return lastArrivalNanos;
  }

  /**
   * Sample rate measured from the arrival of the first to the last sample, so idle time before the
   * stream starts does not count.
   *
   * @return samples per second, or 0 before two samples have arrived
   */
  public double measuredRateHz() {
    long a = firstArrivalNanos;
    long b = lastArrivalNanos;
    long n = samplesAccepted;
    if (a < 0 || b <= a || n < 2) {
      return 0;
    }
    return (n - 1) / ((b - a) / 1e9);
  }

  private void loop() {
    byte[] buf = new byte[64 * 1024];
    while (running && lossSeen.get() == null) {
      int n;
      try {
        n = transport.read(buf, 0, buf.length);
      } catch (IOException | RuntimeException e) {
        lossSeen.compareAndSet(null, "reading " + transport.name() + " failed: " + e.getMessage());
        break;
      }
      if (n < 0) {
        if (running) {
          lossSeen.compareAndSet(null, "the device on " + transport.name() + " stopped answering"
              + " (cable pulled or board reset); reconnect it and connect again");
        }
        break;
      }
      if (n > 0) {
        long now = System.nanoTime();
        long before = samplesAccepted;
        decoder.feed(buf, 0, n);
        if (samplesAccepted > before) {
          if (firstArrivalNanos < 0) {
            firstArrivalNanos = now;
          }
          lastArrivalNanos = now;
        }
        counters = decoder.counters();
      }
    }
    String why = lossSeen.get();
    if (why != null) {
      lostReason = why; // the loop has ended: this runs once, on this thread
      for (Listener l : listeners) {
        l.onDeviceLost(why);
      }
    }
    running = false;
  }

  private final class Sink implements DecodeListener {
    @Override
    public void onSample(int seq, long deviceUs, int counts, boolean hasPosition, int pos) {
      if (unsupported != null) {
        return;
      }
      if (lastDeviceUs >= 0) {
        long dt = (deviceUs - lastDeviceUs) & 0xFFFF_FFFFL;
        int missing = (seq - lastSeq - 1) & 0xFFFF;
        String restart = resetPending != null ? resetPending : restartShown(dt, missing);
        if (restart != null) {
          // the time axis goes on by one sample: the restarted clock means nothing to it
          timeUs += Double.isNaN(period_us) ? 0 : Math.round(period_us);
          // the decoder counted the jump of the sequence as lost samples unless an identity came
          reset(restart, decoder.counters().dropped() - (resetPending != null ? 0 : missing));
        } else {
          timeUs += dt;
          if (missing == 0 && dt > 0) {
            period_us = Double.isNaN(period_us) ? dt : 0.9 * period_us + 0.1 * dt;
          }
        }
      }
      resetPending = null;
      lastDeviceUs = deviceUs;
      lastSeq = seq;
      ring.put(seq, deviceUs, timeUs, counts, hasPosition, pos);
      samplesAccepted++;
    }

    /**
     * @return how the samples show a restart, or null: the device clock jumped (back, or forward
     *     by more than {@link #CLOCK_JUMP_US}), or the sequence moved far ahead of the clock
     */
    private String restartShown(long dt, int missing) {
      if (dt > CLOCK_JUMP_US) {
        return "the device clock jumped by " + describeJump(dt) + " between two samples";
      }
      if (missing > 0 && !Double.isNaN(period_us)
          && (missing + 1) * period_us > 4.0 * dt + 4.0 * period_us) {
        return "the device's sample sequence started over";
      }
      return null;
    }

    private String describeJump(long dt) {
      long back = (1L << 32) - dt;
      return back < dt ? "-" + String.format(java.util.Locale.ROOT, "%.3f s", back / 1e6)
          : String.format(java.util.Locale.ROOT, "%.3f s", dt / 1e6);
    }

    private void reset(String why, long droppedBefore) {
      long first = ring.written();
      String text = "the device on " + transport.name() + " restarted (" + why + ")";
      resets.add(new long[] {first, droppedBefore}); // before the sample is published: a reader of it sees the restart
      resetReason = text;
      resetCount++;
      for (Listener l : listeners) {
        l.onDeviceReset(text, first);
      }
    }

    @Override
    public void onMessage(DeviceMessage message) {
      if (message instanceof DeviceMessage.Identity id) {
        boolean asked = identitiesAsked.getAndUpdate(n -> Math.max(0, n - 1)) > 0;
        if (!asked && samplesAccepted > 0) {
          resetPending = "it sent its identity again";
        }
        identity = id;
        if (!id.supported()) {
          unsupported = "the device on " + transport.name() + " speaks protocol version "
              + id.protocol() + " but this Loadstone speaks version "
              + DeviceMessage.Identity.SUPPORTED_PROTOCOL
              + ": flash the matching firmware or update Loadstone";
        } else {
          unsupported = null;
        }
      }
      for (Listener l : listeners) {
        l.onMessage(message);
      }
    }
  }

  /** Stops the device streaming, ends the thread and closes the link. */
  @Override
  public void close() {
    org.loadstone.units.SlowWork.check("closing the device (waiting for its reader thread)");
    if (running && transport.isOpen()) {
      try {
        transport.write(HostCommand.stop().toWire());
      } catch (IOException ignored) {
        // closing anyway
      }
    }
    running = false;
    try {
      thread.join(2000);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    transport.close();
  }
}
