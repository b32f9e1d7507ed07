package org.loadstone.ui;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.concurrent.Executors;
import java.util.function.Consumer;
import java.util.function.Supplier;
import javafx.application.Platform;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.ForceScale;
import org.loadstone.acquire.LiveFeed;
import org.loadstone.acquire.RunSetup;
import org.loadstone.acquire.SampleRing;
import org.loadstone.device.Transport;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.units.LoadstoneException;

/**
 * The live window's device: opened and closed in order on a thread of its own (a serial board may
 * take seconds to reset, a reader's thread seconds to end), never on the JavaFX thread. Holds the
 * reader, its live feed and its run set-up while open.
 */
final class DeviceLink {
  /** Seconds of trace a new feed keeps until the chart asks for its own window. */
  private static final double WINDOW_S = 30;
  /** Opening and closing the device, in order, off the JavaFX thread. */
  private static final Executor LINK = Executors.newSingleThreadExecutor(r -> {
    Thread t = new Thread(r, "device link");
    t.setDaemon(true);
    return t;
  });

  private final ConsoleConfig config;
  private volatile DeviceReader reader;
  private volatile LiveFeed feed;
  private volatile RunSetup setup;
  /** The last open or close asked for: the next one runs after it. */
  private volatile CompletableFuture<Void> work = CompletableFuture.completedFuture(null);

  DeviceLink(ConsoleConfig config) {
    this.config = config;
  }

  /** The device, the feed and the set-up just opened. */
  record Opened(DeviceReader reader, LiveFeed feed, RunSetup setup) {}

  /**
   * Closes the device if open (after {@code beforeClose}), then opens it again.
   *
   * @param scale the live readout's scale, read on the link thread
   * @param window_s seconds of trace the feed keeps
   * @param beforeClose run on the link thread before a device is closed (store a run in progress)
   * @param opened told on the JavaFX thread once open, unless closed meanwhile
   * @param failed told on the JavaFX thread why it could not be opened
   * @return done when the device is open and streaming (or could not be opened)
   */
  CompletableFuture<Void> connect(Supplier<ForceScale> scale, double window_s,
      Runnable beforeClose, Consumer<Opened> opened, Consumer<String> failed) {
    work = work.thenRunAsync(() -> {
      close(beforeClose);
      open(scale.get(), window_s, opened, failed);
    }, LINK);
    return work;
  }

  /**
   * Closes the device off the JavaFX thread.
   *
   * @param beforeClose run on the link thread first (store a run in progress)
   * @return done when the device is closed
   */
  CompletableFuture<Void> disconnect(Runnable beforeClose) {
    work = work.thenRunAsync(() -> close(beforeClose), LINK);
    return work;
  }

  private void open(ForceScale scale, double window_s, Consumer<Opened> opened,
      Consumer<String> failed) {
    Transport t;
    try {
      t = config.connect().get();
    } catch (LoadstoneException e) {
      String why = ConsoleHints.withHow(e);
      Platform.runLater(() -> failed.accept(why));
      return;
    }
    DeviceReader r = new DeviceReader(t, new SampleRing(1 << 20));
    LiveFeed f = new LiveFeed(r, scale, WINDOW_S);
    f.setTraceWindow(window_s);
    r.addListener(new DeviceReader.Listener() {
      @Override
      public void onMessage(DeviceMessage m) {
        if (m instanceof DeviceMessage.Identity id) {
          f.setCountsPerMm(id.countsPerMm());
        }
      }
    });
    f.tare(20); // zero on connect, as the specimen is not yet loaded
    RunSetup s = new RunSetup(r, config.archive(), config.simulated(), config.deviceFields(),
        java.time.Clock.systemUTC());
    r.start();
    feed = f;
    setup = s;
    reader = r;
    Platform.runLater(() -> {
      if (reader == r) { // else disconnected meanwhile
        opened.accept(new Opened(r, f, s));
      }
    });
  }

  /** On the link thread: closes the device, if any. */
  private void close(Runnable beforeClose) {
    DeviceReader r = reader;
    reader = null;
    beforeClose.run();
    if (r != null) {
      r.close();
    }
  }

  /** @return the open device, or null */
  DeviceReader reader() {
    return reader;
  }

  /** @return the last device's live feed (kept after it is closed), or null */
  LiveFeed feed() {
    return feed;
  }

  /** @return the last device's run set-up, or null */
  RunSetup setup() {
    return setup;
  }
}
