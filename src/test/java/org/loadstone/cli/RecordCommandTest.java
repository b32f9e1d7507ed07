package org.loadstone.cli;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.StoredRun;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SocatPair;
import org.loadstone.sim.SimulatedFrame;

/** {@code loadstone record} end to end: the simulated frame, a pseudo-terminal cable, a crash. */
class RecordCommandTest {
  @TempDir Path tmp;

  record Outcome(int exit, String out, String err) {
    JsonNode json() throws Exception {
      String[] lines = out.trim().split("\n");
      return new ObjectMapper().readTree(lines[lines.length - 1]);
    }
  }

  static Outcome run(String... args) {
    StringWriter o = new StringWriter();
    StringWriter e = new StringWriter();
    int code = LoadstoneCommand.run(new PrintWriter(o, true), new PrintWriter(e, true), args);
    return new Outcome(code, o.toString(), e.toString());
  }

  /**
   * Waits until the archive's journal holds at least {@code samples} intact records: the test
   * waits for a count of samples, never for a time.
   */
  static void awaitJournalSamples(Path archive, int samples) throws InterruptedException {
    awaitJournalSamples(archive, samples, () -> true, () -> "");
  }

  /**
   * As {@link #awaitJournalSamples(Path, int)}, failing at once (with what the recorder said)
   * when the recorder ended before its journal held them.
   */
  static void awaitJournalSamples(Path archive, int samples,
      java.util.function.BooleanSupplier recording, java.util.function.Supplier<String> said)
      throws InterruptedException {
    Path dir = archive.resolve(".journal");
    long deadline = System.nanoTime() + java.util.concurrent.TimeUnit.SECONDS.toNanos(HangGuard.S);
    while (System.nanoTime() < deadline) {
      if (!recording.getAsBoolean()) {
        throw new AssertionError("the recorder ended before its journal held " + samples
            + " samples: " + said.get());
      }
      try (var files = Files.list(dir)) {
        for (Path f : files.filter(x -> x.toString().endsWith(".journal")).toList()) {
          if (JournalRecovery.readJournal(f).data().size() >= samples) {
            return;
          }
        }
      } catch (java.io.IOException | org.loadstone.units.LoadstoneException notYet) {
        // no journal yet, or its header not yet complete
      }
      Thread.sleep(20);
    }
    throw new AssertionError("the journal in " + dir + " never held " + samples
        + " samples (a hang guard, not a timing limit: the stream stopped or record never began)");
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void brittleRunOnTheSimulatorStopsAtTheBreakAndIsStored() throws Exception {
    // an earlier run of the same device whose tare read 10 N more than the cell's zero
    SimSetup sim = new SimSetup("panel-balsa", 1, 1000, false, 8);
    var cell = sim.cell();
    var earlier = org.loadstone.archive.RunMetadata.builder().runId("20261203-080000-000-old")
        .startedAt(java.time.Instant.parse("2026-12-03T08:00:00Z")).specimen("old")
        .device(java.util.Map.of("port", "sim", "name", "loadstone-sim")).sampleRate_Hz(1000)
        .scaleSpec(org.loadstone.archive.ScaleSpec.nominal(cell.countsPerN()))
        .zeroOffset_counts(cell.zeroOffset_counts() + 10 * cell.countsPerN())
        .cause(FinishCause.MANUAL).build();
    org.loadstone.archive.RunWriter.write(tmp, earlier, new org.loadstone.archive.RunData(
        new double[] {0}, new double[] {0}, null, new int[] {0}, null, new int[] {0}));
    Outcome r = run("record", "--port", "sim", "--scenario", "panel-balsa", "--rate-hz", "1000",
        "--sim-speed", "8", "--specimen", "balsa-01", "--group", "balsa", "--mass-g", "61.5",
        "--span-mm", "200", "--width-mm", "50", "--depth-mm", "12", "--archive",
        tmp.toString(), "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    JsonNode j = r.json();
    assertThat(j.get("cause").asText()).isEqualTo("break");
    assertThat(j.get("dropped").asLong()).isZero();
    Run run = RunReader.read(Path.of(j.get("csv_file").asText()));
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(run.metadata().group()).isEqualTo("balsa");
    assertThat(run.metadata().mass_g()).isEqualTo(61.5);
    // the set-up service's rules: the rate the device stated, the zero check against the
    // archive's last tare of this device, the fresh zero used
    assertThat(run.metadata().sampleRate_Hz()).isEqualTo(1000.0);
    assertThat(run.metadata().sampleRateSource()).isEqualTo("identity");
    assertThat(r.err()).contains("zeroing on 500 samples").contains("warning: zero check: the "
        + "zero moved by -");
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w).startsWith("zero check"));
    assertThat(run.data().size()).isEqualTo(j.get("sample_count").asInt());
    assertThat(Files.list(tmp.resolve(".journal")).count()).as("journal removed").isZero();
    assertThat(r.err()).contains("no calibration");
    // the post-run figures are the archive's analysis of the stored run
    var m = org.loadstone.study.RunMetrics.of(run.metadata(), run.data());
    JsonNode a = j.get("analysis");
    assertThat(a.get("stiffness_N_per_mm").asDouble())
        .isEqualTo(m.analysis().stiffness_N_per_mm().getAsDouble());
    assertThat(a.get("energy_to_break_J").asDouble())
        .isEqualTo(m.analysis().energyToBreak_J().getAsDouble());
    assertThat(a.get("specific_peak_N_per_g").asDouble())
        .isEqualTo(m.analysis().peakForce_N() / 61.5);
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aRunWithACalibrationReferencesItByIdAndHashAndCarriesItsWarnings() throws Exception {
    Path calDir = tmp.resolve("cal");
    Path project = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration");
    Files.createDirectories(calDir.resolve("cells"));
    Files.copy(project.resolve("shelf-rig-500N-2026-12-02.json"),
        calDir.resolve("shelf-rig-500N-2026-12-02.json"));
    Files.copy(project.resolve("cells/shelf-rig-500N.json"), calDir.resolve("cells/shelf-rig-500N.json"));
    Path cal = calDir.resolve("shelf-rig-500N-2026-12-02.json");
    var doc = org.loadstone.calibration.CalibrationFiles.readCalibration(cal);
    Outcome r = run("record", "--port", "sim", "--scenario", "brittle", "--rate-hz", "1000",
        "--sim-speed", "8", "--specimen", "c1", "--cal", cal.toString(), "--archive",
        tmp.resolve("runs").toString(), "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    // no check weight has been logged for this calibration yet: said before the run
    assertThat(r.err()).contains("no check-weight verification");
    Run run = RunReader.read(Path.of(r.json().get("csv_file").asText()));
    assertThat(run.metadata().calibrationId()).isEqualTo(doc.id());
    assertThat(run.metadata().calibrationSha256()).isEqualTo(doc.contentSha256());
    assertThat(run.metadata().scaleSpec().kind()).isEqualTo("calibration");
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w).contains("check-weight"));
    // a missing calibration is refused before anything starts
    Outcome missing = run("record", "--port", "sim", "--specimen", "c2", "--cal",
        calDir.resolve("nope.json").toString(), "--archive", tmp.resolve("runs").toString());
    assertThat(missing.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(missing.err()).contains("nope.json");
  }

  @Test
  void badThresholdsAreRefusedBeforeTheDeviceOpens() {
    Outcome r = run("record", "--port", "/dev/ttyNOPE9", "--counts-per-n", "100",
        "--capacity-n", "500", "--specimen", "x", "--stop-drop-pct", "100",
        "--archive", tmp.toString());
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("--stop-drop-pct").doesNotContain("ttyNOPE9").doesNotContain("at org.");
    Outcome r2 = run("record", "--port", "sim", "--specimen", "x", "--start-at-n", "-3",
        "--archive", tmp.toString());
    assertThat(r2.err()).contains("--start-at-n");
  }

  @Test
  void aZeroDriftLimitOfZeroIsRefusedNamingTheOption() {
    Outcome r = run("record", "--port", "/dev/ttyNOPE9", "--counts-per-n", "100",
        "--capacity-n", "500", "--specimen", "x", "--zero-drift-n", "0",
        "--archive", tmp.toString());
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("the zero-drift limit must be a force greater than 0 N")
        .contains("(--zero-drift-n)").doesNotContain("ttyNOPE9");
    Outcome z = run("record", "--port", "/dev/ttyNOPE9", "--counts-per-n", "100",
        "--capacity-n", "500", "--specimen", "x", "--zero-samples", "0",
        "--archive", tmp.toString());
    assertThat(z.err()).contains("the zero must average at least 1 sample")
        .contains("(--zero-samples)");
  }

  @Test
  void unwritableArchiveIsReportedBeforeTheRun() throws Exception {
    Path file = Files.writeString(tmp.resolve("afile"), "x");
    Outcome r = run("record", "--port", "sim", "--specimen", "x", "--archive",
        file.resolve("runs").toString());
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("cannot write runs to the archive folder").contains("--archive");
  }

  @Test
  void serialDeviceWithoutCalibrationOrCapacityIsRefused() {
    Outcome r = run("record", "--port", "/dev/ttyNOPE9", "--specimen", "x",
        "--archive", tmp.toString());
    assertThat(r.err()).contains("--cal").contains("--counts-per-n");
    Outcome r2 = run("record", "--port", "/dev/ttyNOPE9", "--specimen", "x", "--counts-per-n",
        "100", "--archive", tmp.toString());
    assertThat(r2.err()).contains("--capacity-n");
  }

  /**
   * A simulated ductile specimen (seed 4, 1 kS/s) streamed into the pair's other end for an hour,
   * longer than any test waits, so a slow start of record on a busy machine never finds the
   * stream already ended; the stream stops when the pair is killed.
   */
  private static void streamDuctile(SocatPair pty) {
    Thread writer = new Thread(() -> LoadstoneCommand.run(new PrintWriter(new StringWriter()),
        new PrintWriter(new StringWriter()), "simulate", "--scenario", "ductile", "--rate-hz",
        "1000", "--duration-s", "3600", "--seed", "4", "--out", pty.a().toString()));
    writer.setDaemon(true);
    writer.start();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  @Tag("fault")
  void cablePulledMidRunKeepsTheDataAsDeviceLost() throws Exception {
    try (SocatPair pty = SocatPair.start()) {
      streamDuctile(pty);
      AtomicInteger exit = new AtomicInteger(-1);
      StringWriter o = new StringWriter();
      StringWriter e = new StringWriter();
      Thread rec = new Thread(() -> exit.set(LoadstoneCommand.run(new PrintWriter(o, true),
          new PrintWriter(e, true), "record", "--port", pty.b().toString(), "--counts-per-n",
          Double.toString(new SimSetup("ductile", 4, 1000, false, 1).nominalCountsPerN()),
          "--capacity-n", "500", "--specimen", "cable", "--manual-start", "--archive",
          // the stream's press starts by itself, maybe during the zero: any zero will do here
          tmp.toString(), "--zero-drift-n", "1000", "--json")));
      rec.start();
      awaitJournalSamples(tmp, 1100, rec::isAlive, e::toString); // counted, not timed
      pty.kill();
      rec.join(HangGuard.MS);
      // the run is stored, and the exit code says the device was lost
      assertThat(exit.get()).as(e.toString()).isEqualTo(LoadstoneCommand.EXIT_DEVICE_LOST);
      Outcome r = new Outcome(exit.get(), o.toString(), e.toString());
      assertThat(r.err()).contains("the run is stored up to the last sample received");
      assertThat(r.json().get("cause").asText()).isEqualTo("device-lost");
      assertThat(r.json().get("sample_count").asLong()).isGreaterThan(1000);
      assertThat(r.err()).doesNotContain("Exception").doesNotContain("\tat ");
      Run run = RunReader.read(Path.of(r.json().get("csv_file").asText()));
      assertThat(run.metadata().cause()).isEqualTo(FinishCause.DEVICE_LOST);
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  @Tag("fault")
  void cablePulledWhileArmedEndsRecordWithTheDeviceLostCode() throws Exception {
    // issue 14: record never ended (and spun a core) when the device went while armed
    try (SocatPair pty = SocatPair.start()) {
      streamDuctile(pty);
      AtomicInteger exit = new AtomicInteger(-1);
      StringWriter e = new StringWriter();
      java.util.concurrent.CountDownLatch armed = new java.util.concurrent.CountDownLatch(1);
      PrintWriter errors = new PrintWriter(e, true) {
        @Override
        public void println(String x) {
          super.println(x);
          if (x.startsWith("armed")) {
            armed.countDown();
          }
        }
      };
      Thread rec = new Thread(() -> exit.set(LoadstoneCommand.run(
          new PrintWriter(new StringWriter()), errors, "record", "--port", pty.b().toString(),
          "--counts-per-n", "100", "--capacity-n", "1e6", "--start-at-n", "5e5", "--specimen",
          "armed", "--archive", tmp.toString())));
      rec.start();
      assertThat(armed.await(HangGuard.S, TimeUnit.SECONDS)).as(e.toString()).isTrue();
      pty.kill();
      rec.join(HangGuard.MS);
      assertThat(rec.isAlive()).as("record ended").isFalse();
      assertThat(exit.get()).as(e.toString()).isEqualTo(LoadstoneCommand.EXIT_DEVICE_LOST);
      assertThat(e.toString()).contains("stopped answering").contains("no run recorded")
          .doesNotContain("\tat ");
      assertThat(Files.list(tmp).filter(f -> f.toString().endsWith(".csv")).count()).isZero();
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  @Tag("fault")
  void killedWithSigkillTheJournalIsRecoveredAtTheNextStart() throws Exception {
    ProcessBuilder pb = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java")
        .toString(), "-cp", System.getProperty("java.class.path"), "org.loadstone.Main", "record",
        "--port", "sim", "--scenario", "panel-foam", "--seed", "9", "--rate-hz", "1000",
        "--specimen", "crash-01", "--manual-start", "--sim-start-delay-s", "60", "--archive",
        tmp.toString());
    pb.redirectErrorStream(true);
    Process p = pb.start();
    BufferedReader lines = new BufferedReader(
        new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8));
    String line;
    while ((line = lines.readLine()) != null && !line.contains("recording now")) {
      // wait for the run to start
    }
    awaitJournalSamples(tmp, 2000); // counted in the journal, not timed
    p.destroyForcibly(); // SIGKILL
    assertThat(p.waitFor(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    assertThat(Files.list(tmp).filter(f -> f.toString().endsWith(".csv")).count()).isZero();

    List<StoredRun> recovered = JournalRecovery.recoverAll(tmp);
    assertThat(recovered).hasSize(1);
    Run run = RunReader.read(recovered.get(0).csv());
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.RECOVERED);
    // a killed process leaves what it wrote to the journal (the force cadence, which covers a
    // power cut, is checked with an injected clock in JournalFallingBehindTest): every sample
    // seen in the journal before the kill is recovered
    int n = run.data().size();
    assertThat(n).isGreaterThanOrEqualTo(2000);
    // and what was recovered is bit-exact with the simulator's stream for the same seed, from the
    // sample the run began at (a busy machine arms later: the run begins further into the
    // stream). The press starts 60 simulated seconds after arming, later than the kill, so the
    // stream is the unloaded cell's whatever the moment of arming.
    SimulatedFrame truth = new SimSetup("panel-foam", 9, 1000, false, 1).buildFrame();
    int[] counts = run.data().rawCounts();
    int[] seq = run.data().seq();
    int[] first = {-1, 0}; // the simulated stream's sequence number and counts
    for (int i = 0; i < 10_000_000 && first[0] != seq[0]; i++) {
      truth.next((s, us, load, pos) -> {
        first[0] = s;
        first[1] = load;
      });
    }
    assertThat(first[0]).as("the run's first sample is in the simulated stream").isEqualTo(seq[0]);
    int[] mismatch = {first[1] == counts[0] ? 0 : 1};
    for (int i = 1; i < n; i++) {
      int k = i;
      truth.next((s, us, load, pos) -> {
        if (s != seq[k] || load != counts[k]) {
          mismatch[0]++;
        }
      });
    }
    assertThat(mismatch[0]).isZero();
    assertThat(Files.list(tmp.resolve(".journal")).filter(Files::isRegularFile).count()).isZero();
  }
}
