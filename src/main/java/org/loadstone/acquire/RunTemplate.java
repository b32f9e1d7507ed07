package org.loadstone.acquire;

import java.nio.file.Path;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunIds;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.TestType;

/**
 * The metadata of a run about to be armed, as the command line and the console both build it:
 * a fresh time-sortable id, the specimen as described, the device's identity and the scale.
 *
 * @param specimen specimen id as typed
 * @param group group name, may be empty
 * @param tags tags
 * @param operator who runs it
 * @param notes free notes
 * @param mass_g specimen mass, or null
 * @param geometry specimen geometry
 * @param testType kind of test
 */
public record RunTemplate(String specimen, String group, List<String> tags, String operator,
    String notes, Double mass_g, Geometry geometry, TestType testType) {

  /**
   * @param archive where the run will go (for a free id)
   * @param reader the device (identity, port)
   * @param extraDevice more device fields, e.g. the simulator's scenario and seed
   * @param rate the sample rate and where it comes from
   * @param scale how counts become force
   * @param zero_counts the tare
   * @param pretrigger_s history kept before the start
   * @param startAt_N start threshold, or null for a manual start
   * @param softwareVersion Loadstone's version
   * @param warnings to store with the run (the scale's, the zero check's…)
   * @return the metadata known before the start
   */
  public RunMetadata build(Path archive, DeviceReader reader, Map<String, String> extraDevice,
      SampleRate rate, ScaleChoice scale, double zero_counts, double pretrigger_s,
      Double startAt_N, String softwareVersion, List<String> warnings) {
    Instant now = Instant.now();
    Map<String, String> device = new LinkedHashMap<>();
    reader.identity().ifPresent(id -> device.putAll(id.fields()));
    device.put("port", reader.transport().name());
    device.putAll(extraDevice);
    return RunMetadata.builder()
        .runId(RunIds.newId(archive, now, specimen))
        .startedAt(now)
        .specimen(specimen)
        .group(group)
        .tags(tags)
        .operator(operator)
        .notes(notes)
        .mass_g(mass_g)
        .geometry(geometry)
        .testType(testType)
        .device(device)
        .sampleRate_Hz(rate.rate_Hz())
        .sampleRateSource(rate.source().wireName())
        .calibrationId(scale.calibrationId())
        .calibrationSha256(scale.calibrationSha256())
        .scale(scale.description())
        .scaleSpec(scale.spec())
        .zeroOffset_counts(zero_counts)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.MANUAL)
        .pretrigger_s(pretrigger_s)
        .startThreshold_N(startAt_N)
        .checkWeight(scale.checkWeight())
        .warnings(warnings)
        .softwareVersion(softwareVersion)
        .extra(Map.of())
        .build();
  }
}
