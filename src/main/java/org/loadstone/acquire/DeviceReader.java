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
  }

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
  private long timeUs;

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
        timeUs += (deviceUs - lastDeviceUs) & 0xFFFF_FFFFL;
      }
      lastDeviceUs = deviceUs;
      ring.put(seq, deviceUs, timeUs, counts, hasPosition, pos);
      samplesAccepted++;
    }

    @Override
    public void onMessage(DeviceMessage message) {
      if (message instanceof DeviceMessage.Identity id) {
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
