package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import org.assertj.core.data.Percentage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.cli.LoadstoneCommand;

/**
 * The whole chain on the command line: a simulated run recorded into an archive, a clip of its
 * crosshead filmed with a known clock offset, {@code loadstone track} storing the table beside the
 * run (the run's files untouched), and {@code analyze --video-table} giving the stiffness the
 * run's own crosshead channel gives.
 */
@Timeout(HangGuard.TEST_S)
class TrackCommandTest {
  @TempDir Path tmp;

  record Out(int exit, String out, String err) {
    JsonNode json() throws Exception {
      String[] lines = out.strip().split("\\R");
      return new ObjectMapper().readTree(lines[lines.length - 1]);
    }
  }

  static Out cli(String... args) {
    StringWriter o = new StringWriter();
    StringWriter e = new StringWriter();
    int code = LoadstoneCommand.run(new PrintWriter(o, true), new PrintWriter(e, true), args);
    return new Out(code, o.toString(), e.toString());
  }

  @Test
  void trackedClipGivesTheCrossheadsStiffness() throws Exception {
    Path archive = tmp.resolve("runs");
    Out rec = cli("record", "--port", "sim", "--scenario", "panel-balsa", "--seed", "5",
        "--rate-hz", "200", "--sim-speed", "10", "--specimen", "b5", "--group", "balsa",
        "--archive", archive.toString(), "--json");
    assertThat(rec.exit()).as(rec.err()).isZero();
    String id = rec.json().get("run_id").asText();
    Path csv = archive.resolve(id + ".csv");
    byte[] csvBefore = Files.readAllBytes(csv);
    byte[] jsonBefore = Files.readAllBytes(archive.resolve(id + ".json"));
    Run run = RunReader.read(csv);
    // the recorder lit the sync light at the start, after the trigger sample (PROTOCOL.md, LIGHT)
    Object light = run.metadata().extra().get(org.loadstone.archive.RunMetadata.SYNC_LIGHT_KEY);
    assertThat(light).isInstanceOf(Number.class);
    // on the run's clock, after its first sample (the pre-trigger history) and before its end
    assertThat(((Number) light).doubleValue()).isBetween(run.data().time_s()[0],
        run.data().time_s()[run.data().size() - 1]);
    double[] t = run.data().time_s();
    double[] x = run.data().position_mm();
    double travel = Arrays.stream(x).max().orElseThrow() - x[0];
    double mmPerPx = travel / 60;
    double offset = 0.45; // clip time = run time + 0.45 s: filming began before the run
    SyntheticScene s = new SyntheticScene(160, 120, 21);
    s.marker = tau -> new double[] {80,
        25 + (VideoSyncTest.interp(t, x, tau - offset) - x[0]) / mmPerPx};
    s.reference = new double[] {28, 100};
    // the recorder's sync light, filmed: on from clip time sync_light_s + offset
    s.lamp = new PixelRegion(140, 4, 12, 10);
    s.lampOn_s = ((Number) light).doubleValue() + offset;
    Path clip = tmp.resolve("b5.avi");
    int frames = (int) ((t[t.length - 1] + offset) * 30);
    try (ClipWriter w = new ClipWriter(clip, ClipWriter.Kind.MJPEG_AVI, 160, 120, 30, 30, 0)) {
      for (int k = 0; k < frames; k++) {
        w.write(s.frame(k / 30.0, k), k);
      }
    }
    String scale = String.format(Locale.ROOT, "10,60 130,60 = %.9f mm", 120 * mmPerPx);
    Out tr = cli("track", clip.toString(), "--point", "80,25", "--reference", "28,100",
        "--scale", scale, "--sync", "offset", Double.toString(offset), "--run", id,
        "--archive", archive.toString(), "--json");
    assertThat(tr.exit()).as(tr.err()).isZero();
    assertThat(tr.err()).contains("frame 0").contains("mjpeg");
    Path table = archive.resolve("video").resolve(id + ".csv");
    assertThat(Path.of(tr.json().get("table_file").asText())).isEqualTo(table);
    assertThat(tr.json().get("lost_frame_count").asInt()).isZero();
    assertThat(archive.resolve("video").resolve(id + ".json")).exists();
    // the run's own files are never changed
    assertThat(Files.readAllBytes(csv)).isEqualTo(csvBefore);
    assertThat(Files.readAllBytes(archive.resolve(id + ".json"))).isEqualTo(jsonBefore);

    Out own = cli("analyze", id, "--archive", archive.toString(), "--json");
    assertThat(own.exit()).as(own.err()).isZero();
    Out video = cli("analyze", id, "--archive", archive.toString(), "--video-table",
        table.toString(), "--json");
    assertThat(video.exit()).as(video.err()).isZero();
    assertThat(video.out()).contains("position from the video table").contains("sync by offset");
    double kOwn = own.json().get("stiffness_N_per_mm").asDouble();
    double kVideo = video.json().get("stiffness_N_per_mm").asDouble();
    System.out.printf(Locale.ROOT, "stiffness: crosshead %.3f N/mm, video %.3f N/mm%n", kOwn,
        kVideo);
    // the clip films the same crosshead: the same stiffness within the ±3 % precision the
    // stiffness search asks for by default (DEVELOPERS.md, "How the stiffness is chosen")
    assertThat(kVideo).isCloseTo(kOwn, Percentage.withPercentage(3));

    // a second tracking of the same run, synchronised by the light this time, is stored beside
    // the first, never over it; the light gives the offset within one frame (1/30 s)
    Out again = cli("track", clip.toString(), "--point", "80,25", "--scale", scale, "--sync",
        "light", "140,4,12,10", "--run", id, "--archive", archive.toString(), "--json");
    assertThat(again.exit()).as(again.err()).isZero();
    assertThat(again.json().get("table_file").asText()).endsWith(id + "-2.csv");
    assertThat(again.json().get("sync_method").asText()).isEqualTo("light");
    assertThat(again.json().get("sync_offset_s").asDouble())
        .isBetween(offset - 1e-9, offset + 1.0 / 30 + 1e-9);
  }

  @Test
  void aBadClipIsRefusedNamingIt() throws Exception {
    Path notVideo = Files.writeString(tmp.resolve("clip.mov"), "hello");
    Out o = cli("track", notVideo.toString(), "--point", "10,10", "--scale",
        "0,0 100,0 = 50 mm", "--out", tmp.resolve("t.csv").toString());
    assertThat(o.exit()).isNotZero();
    assertThat(o.err()).contains("clip.mov").contains("H.264").doesNotContain("Exception");
    Out zero = cli("track", notVideo.toString(), "--point", "10,10", "--scale",
        "5,5 5,5 = 50 mm", "--out", tmp.resolve("t.csv").toString());
    assertThat(zero.err()).contains("pixels apart");
  }
}
