package org.loadstone.acquire;

import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import org.loadstone.archive.RunMetadata;
import org.loadstone.device.SimSetup;
import org.loadstone.archive.TestType;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;
import org.loadstone.units.Setting;

/**
 * Sets up each run on one connected device, the same way for the command line and the console:
 * the device's identity (one wait, one time-out), its sample rate ({@link SampleRate}), the scale
 * and the rated capacity ({@link ScalePolicy}), the simulated specimen's sizes ({@link
 * SimulatedSpecimen}), a fresh zero before every run sized from the rate, and the zero check
 * against the last tare ({@link ZeroCheck}), and the room the run needs on the archive's disk
 * ({@link DiskSpace}). One instance per connection; it remembers the last
 * tare, and before its first tare looks for the newest run of the same device in the archive
 * ({@link LastTare}). Not for concurrent use.
 */
public final class RunSetup {
  /** The zero averages this long of samples unless a count is given. */
  public static final double ZERO_S = 0.5;
  /** The zero averages at least this many samples. */
  public static final int ZERO_MIN_SAMPLES = 5;

  private final DeviceReader reader;
  private final Path archive;
  private final SimSetup simulated;
  private final Map<String, String> deviceFields;
  private final Clock clock;
  private SampleRate rate;
  private ZeroCheck.Tare lastTare;

  /**
   * @param reader the started device reader
   * @param archive where runs go (for a free run id)
   * @param simulated the simulated frame, or null for a real device
   * @param deviceFields more device fields stored with runs (e.g. the simulator's scenario)
   * @param clock for the time of each tare
   */
  public RunSetup(DeviceReader reader, Path archive, SimSetup simulated,
      Map<String, String> deviceFields, Clock clock) {
    this.reader = Precondition.notNull(reader, "reader");
    this.archive = Precondition.notNull(archive, "archive");
    this.simulated = simulated;
    this.deviceFields = Map.copyOf(deviceFields);
    this.clock = Precondition.notNull(clock, "clock");
  }

  /**
   * What a run is to be.
   *
   * @param template the specimen as described
   * @param scale how counts become force (null: none chosen, the run is refused)
   * @param ratedCapacity_N the capacity the user gave, or null (from the calibration's cell
   *     profile or the simulated cell)
   * @param settings start and stop rules; the rated capacity is set here
   * @param zeroDriftLimit_N the zero check's limit, or null for the default
   * @param zeroSamples samples the zero averages, or null for {@link #ZERO_S} of samples
   * @param manualStart whether the run starts at once instead of at the start threshold
   * @param softwareVersion Loadstone's version, stored with the run
   */
  public record Request(RunTemplate template, ScaleChoice scale, Double ratedCapacity_N,
      RunSettings.Builder settings, Double zeroDriftLimit_N, Integer zeroSamples,
      boolean manualStart, String softwareVersion) {
    public Request {
      Precondition.notNull(template, "template");
      Precondition.notNull(settings, "settings");
    }
  }

  /**
   * A run ready to arm.
   *
   * @param settings start and stop rules with the rated capacity
   * @param metadata what is known before the start (stored with the run)
   * @param scale how counts become force
   * @param zero_counts the fresh zero
   * @param rate the sample rate and where it comes from
   * @param warnings to show before the run; also stored with it
   * @param decideFrom ring index of the first sample after the zero: the run is decided from
   *     there (arm with {@code recorder.arm(decideFrom)}), so load that comes on while the run is
   *     being set up is not missed
   */
  public record Prepared(RunSettings settings, RunMetadata metadata, ScaleChoice scale,
      double zero_counts, SampleRate rate, List<String> warnings, long decideFrom) {}

  /** @return the simulated frame, or null for a real device */
  public SimSetup simulated() {
    return simulated;
  }

  /** @return the last tare of this device, or null when none is known */
  public ZeroCheck.Tare lastTare() {
    return lastTare;
  }

  /**
   * Records a tare taken elsewhere (e.g. the live view's zero), for the next zero check.
   *
   * @param zero_counts the zero, counts
   */
  public void noteTare(double zero_counts) {
    lastTare = new ZeroCheck.Tare(zero_counts, clock.instant());
  }

  /**
   * The device's sample rate, known after the first call: the identity's, or measured from the
   * device's clock when it sends none within {@link DeviceIdentity#WAIT_MS}.
   *
   * @throws LoadstoneException when the device is lost, speaks another protocol version, or sends
   *     too few samples to measure the rate
   */
  public SampleRate sampleRate() {
    if (rate == null) {
      DeviceIdentity.await(reader);
      rate = SampleRate.await(reader, DeviceIdentity.WAIT_MS);
    }
    return rate;
  }

  /**
   * Checks a request without a device: a scale is chosen, the capacity is known, the settings and
   * the zero check's limit are in range.
   *
   * @param r what the run is to be
   * @param device the device's name, for messages
   * @return the run's settings, with the rated capacity
   * @throws LoadstoneException naming what is wrong and what would fix it
   */
  public static RunSettings check(Request r, String device) {
    ScaleChoice scale = ScalePolicy.require(r.scale(), device);
    double capacity_N = ScalePolicy.capacity_N(r.ratedCapacity_N(), scale);
    boolean crush = r.template().testType() == TestType.CRUSH;
    if (!crush && r.settings().crushEnd() != null) {
      throw new LoadstoneException("a travel limit or low-force end is for crush runs, which go "
          + "on through the load drops; this run is a " + r.template().testType().wireName()
          + " test and ends at its break: make it a crush test or leave those limits out",
          Setting.TRAVEL_LIMIT, Setting.LOW_FORCE_LEVEL);
    }
    if (crush && r.settings().crushEnd() == null) {
      r.settings().crushEnd(CrushEnd.DEFAULTS);
    }
    RunSettings settings = r.settings().ratedCapacity_N(capacity_N).build();
    ZeroCheck.of(r.zeroDriftLimit_N(), capacity_N);
    if (r.zeroSamples() != null && r.zeroSamples() < 1) {
      throw new LoadstoneException("the zero must average at least 1 sample, was "
          + r.zeroSamples() + ": leave it to the default (half a second of samples) or give a "
          + "positive count", Setting.ZERO_SAMPLES);
    }
    return settings;
  }

  /**
   * Checks the request, takes a fresh zero and applies the zero check. Blocks while the zero's
   * samples arrive (about {@link #ZERO_S}); on the first call also while the device identifies
   * itself.
   *
   * @param r what the run is to be
   * @param say told what is happening (e.g. "zeroing…"), on this thread
   * @return the run, ready to arm with {@link #recorder}
   * @throws LoadstoneException when no scale is chosen, the capacity is unknown, a setting is out
   *     of range, the archive's disk lacks the room for the run, or the device is lost or silent
   */
  public Prepared prepare(Request r, Consumer<String> say) {
    RunSettings settings = check(r, reader.transport().name());
    ZeroCheck check = ZeroCheck.of(r.zeroDriftLimit_N(), settings.ratedCapacity_N());
    RunTemplate t = r.template();
    String notes = t.notes();
    if (simulated != null) {
      SimulatedSpecimen.Described d = SimulatedSpecimen.fill(simulated, t.geometry(), t.mass_g());
      if (d.filled()) {
        notes = notes.isEmpty() ? SimulatedSpecimen.NOTE : notes + " " + SimulatedSpecimen.NOTE;
      }
      t = new RunTemplate(t.specimen(), t.group(), t.tags(), t.operator(), notes, d.mass_g(),
          d.geometry(), t.testType());
    }
    SampleRate rateNow = sampleRate();
    if (settings.crushEnd() != null && settings.crushEnd().travelLimit_mm() > 0
        && reader.identity().map(id -> id.channels() < 2 || !(id.countsPerMm() > 0))
            .orElse(true)) {
      throw new LoadstoneException("the crush run's travel limit needs the crosshead's position, "
          + "but the device states no position channel with its counts per mm: end the crush "
          + "by force, by time or by hand instead", Setting.TRAVEL_LIMIT, Setting.TIME_LIMIT);
    }
    // before the zero and the arming, so the operator loads no specimen for a run with no room
    DiskSpace.requireBeforeArming(archive, rateNow.rate_Hz(), settings);
    // a calibration made for another cell than the connected one is warned about
    ScaleChoice scale = r.scale().forDevice(reader.identity());
    if (lastTare == null) {
      lastTare = LastTare.fromArchive(archive, reader.transport().name(),
          reader.identity().map(id -> id.fields().get("name")).orElse(null));
    }
    int n = r.zeroSamples() != null ? r.zeroSamples()
        : rateNow.samplesIn(ZERO_S, ZERO_MIN_SAMPLES);
    say.accept("zeroing on " + n + " samples: keep the specimen unloaded");
    Zeroing.Zero taken = Zeroing.settled(reader, n,
        10_000 + (long) (n / rateNow.rate_Hz() * 2000), check.limit_N(), scale.scale(), say);
    double zero = taken.counts();
    ZeroCheck.Tare fresh = new ZeroCheck.Tare(zero, clock.instant());
    List<String> warnings = new ArrayList<>(scale.warnings());
    if (rateNow.source() == SampleRate.Source.DEVICE_CLOCK) {
      warnings.add("the device did not state its sample rate: " + rateNow.describe());
    }
    check.check(lastTare, fresh, scale.scale()).ifPresent(warnings::add);
    lastTare = fresh;
    Map<String, String> fields = new LinkedHashMap<>(deviceFields);
    RunMetadata meta = t.build(archive, reader, fields, rateNow, scale, zero,
        settings.pretrigger_s(), r.manualStart() ? null : settings.startThreshold_N(),
        r.softwareVersion(), warnings);
    return new Prepared(settings, meta, scale, zero, rateNow, List.copyOf(warnings),
        taken.nextIndex());
  }

  /**
   * @param p a prepared run
   * @param store where the run goes
   * @param listener progress, may be null
   * @return the recorder for the run, not yet armed: arm it with {@code
   *     arm(p.decideFrom())}
   */
  public Recorder recorder(Prepared p, RunStore store, Recorder.Listener listener) {
    return new Recorder(reader, p.scale().scale(), p.zero_counts(), p.settings(), p.metadata(),
        store, listener);
  }
}
