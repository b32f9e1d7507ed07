package org.loadstone.acquire;

import java.time.Instant;
import java.util.List;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.protocol.DecoderCounters;

/**
 * The stored run's metadata, from the moment load started it to its finish: the template known at
 * arming, completed with when the run began (its first, pre-trigger sample), the tare, the
 * device's counters over the run, the finish cause, the break and the return to zero. Made on the
 * recorder's thread at the start; {@link Recorder} keeps the run's lifecycle, this class what is
 * written about it.
 */
final class RunRecordMeta {
  /**
   * The metadata of a finished run with the counters it was built from.
   *
   * @param metadata the run's metadata as stored
   * @param dropped samples missing from the device sequence during the run
   * @param checksumErrors checksum errors during the run
   */
  record Finished(RunMetadata metadata, long dropped, long checksumErrors) {}

  private final RunMetadata template;
  private final double zero_counts;
  private final RunSettings settings;
  private final RunControl.Started started;
  private final DecoderCounters atStart;
  private final double runStartTime_s;
  private final Instant startedAt;
  private final Double lightAt_s;

  /**
   * @param template run metadata known before the start
   * @param zero_counts the tare
   * @param settings the run's start and stop rules
   * @param started the start, as the run control declared it
   * @param reader the device reader, read now for its counters and the first sample's time
   * @param lightAt_s device time (s, the ring's axis) at which the sync light was switched on,
   *     or null when it was not
   */
  RunRecordMeta(RunMetadata template, double zero_counts, RunSettings settings,
      RunControl.Started started, DeviceReader reader, Double lightAt_s) {
    this.lightAt_s = lightAt_s;
    this.template = template;
    this.zero_counts = zero_counts;
    this.settings = settings;
    this.started = started;
    this.atStart = reader.counters();
    this.runStartTime_s = reader.ring().timeUsAt(started.firstIndex()) / 1e6;
    this.startedAt = Instant.now().minusNanos(
        (long) ((started.triggerTime_s() - runStartTime_s) * 1e9));
  }

  /** @return the metadata the run's journal begins with (a run that ends now ends by hand) */
  RunMetadata atStart(List<String> warnings) {
    return build(FinishCause.MANUAL, null, 0, 0, warnings).build();
  }

  /**
   * @param cause why the run ended
   * @param b the break, or null
   * @param returnToZero_N force at the end relative to the tare, or null with load on the cell
   * @param now the device's counters at the finish
   * @param warnings warnings given during the run
   * @return the finished run's metadata and counters
   */
  Finished atFinish(FinishCause cause, BreakDetector.Break b, Double returnToZero_N,
      DecoderCounters now, List<String> warnings) {
    long dropped = now.dropped() - atStart.dropped();
    long crc = now.checksumErrors() - atStart.checksumErrors();
    RunMetadata.Builder m = build(cause, b, dropped, crc, warnings).returnToZero_N(returnToZero_N);
    return new Finished(m.build(), dropped, crc);
  }

  private RunMetadata.Builder build(FinishCause cause, BreakDetector.Break b, long dropped,
      long crc, List<String> warnings) {
    RunMetadata t = template;
    return RunMetadata.builder()
        .runId(t.runId())
        .startedAt(startedAt)
        .specimen(t.specimen())
        .group(t.group())
        .tags(t.tags())
        .operator(t.operator())
        .notes(t.notes())
        .mass_g(t.mass_g())
        .geometry(t.geometry())
        .testType(t.testType())
        .device(t.device())
        .sampleRate_Hz(t.sampleRate_Hz())
        .sampleRateSource(t.sampleRateSource())
        .calibrationId(t.calibrationId())
        .calibrationSha256(t.calibrationSha256())
        .scale(t.scale())
        .scaleSpec(t.scaleSpec())
        .zeroOffset_counts(zero_counts)
        .dropped(dropped)
        .checksumErrors(crc)
        .cause(cause)
        .breakIndex(b == null ? null : (int) (b.index() - started.firstIndex()))
        .breakTime_s(b == null ? null : b.time_s() - runStartTime_s)
        .peakBeforeBreak_N(b == null ? null : b.peakBefore_N())
        .dropAtBreak_pct(b == null ? null : b.dropPct())
        .pretrigger_s(settings.pretrigger_s())
        .startThreshold_N(started.manual() ? null : settings.startThreshold_N())
        .checkWeight(t.checkWeight())
        .warnings(List.copyOf(warnings))
        .softwareVersion(t.softwareVersion())
        .extra(extra(t));
  }

  /**
   * The template's other fields, with a crush run's end rule in words under {@code crush_end}
   * and the run time of the sync light when it was switched.
   */
  private java.util.Map<String, Object> extra(RunMetadata t) {
    if (settings.crushEnd() == null && lightAt_s == null) {
      return t.extra();
    }
    java.util.Map<String, Object> m = new java.util.LinkedHashMap<>(t.extra());
    if (settings.crushEnd() != null) {
      String words = settings.crushEnd().words();
      m.put(RunMetadata.CRUSH_END_KEY, words.startsWith("by hand") ? words
          : words + ", at the time limit or by hand");
    }
    if (lightAt_s != null) {
      m.put(RunMetadata.SYNC_LIGHT_KEY, lightAt_s - runStartTime_s);
    }
    return m;
  }
}
