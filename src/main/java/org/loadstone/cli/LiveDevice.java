package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.Locale;
import org.loadstone.acquire.DeviceIdentity;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRate;
import org.loadstone.acquire.SampleRing;
import org.loadstone.calibration.CapturedReading;
import org.loadstone.calibration.StabilityDetector;
import org.loadstone.device.Transport;
import org.loadstone.device.WeightHandler;
import org.loadstone.sim.Scenario;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.units.LoadstoneException;

/**
 * An open device for the commands that capture settled readings: the reader thread fills a ring,
 * and {@link #settle} feeds the newest samples to a {@link StabilityDetector} while one terminal
 * line shows the live counts and the state of the judgement.
 */
final class LiveDevice implements AutoCloseable {
  /** The device went away during a command. */
  static final class DeviceLostException extends org.loadstone.acquire.DeviceLostException {
    private static final long serialVersionUID = 1L;

    DeviceLostException(String message) {
      super(message);
    }
  }

  private static final long SILENCE_LIMIT_MS = 5000;
  private static final long LINE_EVERY_MS = 100;

  private final DeviceReader reader;
  private final WeightHandler weights;
  private final double rateHz;
  private final String identity;
  private final PrintWriter status;
  private final boolean statusLines = Terminal.statusLines();

  private LiveDevice(DeviceReader reader, double rateHz, String identity, PrintWriter status) {
    this.reader = reader;
    this.weights = WeightHandler.forTransport(reader.transport());
    this.rateHz = rateHz;
    this.identity = identity;
    this.status = status;
  }

  /**
   * For the simulator: makes {@code dead-weight} the scenario unless one was given, and refuses
   * any other (only dead weights can be placed on the simulated cell).
   *
   * @param scenarioGiven whether --scenario was on the command line
   * @throws LoadstoneException for a simulated scenario other than dead-weight
   */
  static void useDeadWeight(DeviceOptions options, boolean scenarioGiven) {
    if (!options.simulated()) {
      return;
    }
    if (!scenarioGiven) {
      options.scenario = Scenario.DEAD_WEIGHT.cliName();
    } else if (Scenario.parse(options.scenario) != Scenario.DEAD_WEIGHT) {
      throw new LoadstoneException("--scenario " + options.scenario + " has no weights to"
          + " place: calibrate and verify on the simulator need --scenario dead-weight (the"
          + " default for these commands)");
    }
  }

  /**
   * Opens the device, starts streaming and learns its sample rate (the one rule of {@link
   * SampleRate}: from its identity, else from its clock).
   *
   * @param status standard error, where the live status line goes when it is a terminal
   * @throws LoadstoneException when the device cannot be opened, speaks another protocol version,
   *     or sends too few samples to measure its rate
   */
  static LiveDevice open(DeviceOptions options, PrintWriter status) {
    Transport t = options.open();
    DeviceReader r = new DeviceReader(t, new SampleRing(1 << 16));
    try {
      r.start();
      java.util.Optional<DeviceMessage.Identity> id;
      try {
        id = DeviceIdentity.await(r);
      } catch (org.loadstone.acquire.DeviceLostException e) {
        throw new DeviceLostException(e.getMessage());
      }
      SampleRate rate = SampleRate.await(r, DeviceIdentity.WAIT_MS);
      String text = id.isPresent()
          ? String.format(Locale.ROOT, "%s on %s, %s at %s", id.get().name(), t.name(),
              id.get().adc(), rate.describe())
          : String.format(Locale.ROOT, "device on %s (sent no identity), %s", t.name(),
              rate.describe());
      return new LiveDevice(r, rate.rate_Hz(), text, status);
    } catch (RuntimeException e) {
      r.close();
      throw e;
    }
  }

  /** @return who places the weights */
  WeightHandler weights() {
    return weights;
  }

  /** @return the device's nominal sample rate, samples/s */
  double rateHz() {
    return rateHz;
  }

  /** @return a one-line description of the device */
  String identity() {
    return identity;
  }

  /**
   * Feeds samples that arrive from now on to {@code detector} until it reports a stable window,
   * showing the progress on one line of standard error (rewritten with a carriage return) when
   * that is a terminal.
   *
   * @param detector a fresh (or reset) detector
   * @return the reading of the stable window
   * @throws LoadstoneException from the detector when the time-out is reached, or when no
   *     sample has arrived for 5 s
   * @throws DeviceLostException when the device goes away
   */
  CapturedReading settle(StabilityDetector detector) {
    return settle(detector, detector::offer);
  }

  /**
   * As {@link #settle(StabilityDetector)}, with each sample going through {@code judge} (e.g. a
   * calibration session's offer, which feeds {@code detector} and names its step in a time-out).
   */
  CapturedReading settle(StabilityDetector detector,
      java.util.function.DoubleFunction<StabilityDetector.State> judge) {
    SampleRing.Cursor cursor = reader.ring().cursorAtEnd();
    StabilityDetector.State[] state = {StabilityDetector.State.FILLING};
    int[] last = new int[1];
    SampleRing.Consumer feed = (i, s, d, tu, c, hp, p) -> {
      last[0] = c;
      state[0] = judge.apply(c);
    };
    long lastSample = System.nanoTime();
    long lastLine = 0;
    long seen = 0;
    try {
      while (true) {
        boolean any = false;
        while (state[0] != StabilityDetector.State.STABLE && cursor.drain(feed, 1) > 0) {
          any = true;
          seen++;
        }
        long now = System.nanoTime();
        if (state[0] == StabilityDetector.State.STABLE) {
          if (statusLines) {
            showLine(last[0], detector, state[0], seen);
            status.println();
            status.flush();
          }
          return detector.reading();
        }
        if (statusLines && now - lastLine > LINE_EVERY_MS * 1_000_000 && seen > 0) {
          showLine(last[0], detector, state[0], seen);
          lastLine = now;
        }
        if (any) {
          lastSample = now;
        } else {
          checkAlive(now - lastSample);
          sleep(5);
        }
      }
    } catch (LoadstoneException e) {
      if (statusLines && seen > 0) {
        status.println();
        status.flush();
      }
      throw e;
    }
  }

  private void checkAlive(long silentNanos) {
    if (reader.lostReason().isPresent()) {
      throw new DeviceLostException(reader.lostReason().get());
    }
    if (silentNanos > SILENCE_LIMIT_MS * 1_000_000) {
      throw new LoadstoneException("no samples from " + identity + " for "
          + SILENCE_LIMIT_MS / 1000 + " s: check the cable and that the board is powered");
    }
  }

  private void showLine(int counts, StabilityDetector d, StabilityDetector.State s, long seen) {
    String judged = switch (s) {
      case FILLING -> "filling";
      case SETTLING -> "settling";
      case STABLE -> "STABLE";
    };
    String text = Double.isNaN(d.lastSd_counts())
        ? String.format(Locale.ROOT, "  counts %9d   [%-8s]", counts, judged)
        : String.format(Locale.ROOT, "  counts %9d   sd %8.1f   drift %+9.1f/s   [%-8s]",
            counts, d.lastSd_counts(), d.lastDrift_counts_per_s(), judged);
    status.print("\r" + text + "   ");
    status.flush();
  }

  private static void sleep(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new LoadstoneException("interrupted while waiting for the device");
    }
  }

  @Override
  public void close() {
    reader.close();
  }
}
