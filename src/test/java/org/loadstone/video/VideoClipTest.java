package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

/** Timestamps, scale, lost frames, the table's files and refusals of bad input. */
class VideoClipTest {
  @TempDir Path dir;

  /** Writes the scene's first frames at 30 frames/s as an MJPEG AVI. */
  Path mjpeg(SyntheticScene s, String name, int frames) {
    Path clip = dir.resolve(name);
    try (ClipWriter w = new ClipWriter(clip, ClipWriter.Kind.MJPEG_AVI, 160, 120, 30, 30, 0)) {
      for (int k = 0; k < frames; k++) {
        w.write(s.frame(k / 30.0, k), k);
      }
    }
    return clip;
  }

  @Test
  void variableFrameRateTimestampsAreTheStreamsOwn() {
    // uneven gaps as a phone writes them: 30 and 24 frames/s mixed with jitter, in 1/90000 s
    java.util.Random r = new java.util.Random(11);
    List<Long> pts = new ArrayList<>();
    long p = 0;
    for (int k = 0; k < 40; k++) {
      pts.add(p);
      p += (r.nextBoolean() ? 3000 : 3750) + r.nextInt(200);
    }
    SyntheticScene s = TrackingAccuracyTest.scene(3);
    Path clip = dir.resolve("vfr.mp4");
    try (ClipWriter w = new ClipWriter(clip, ClipWriter.Kind.H264_MP4, 160, 120, 90_000, 30, 0)) {
      for (int k = 0; k < pts.size(); k++) {
        w.write(s.frame(pts.get(k) / 90_000.0, k), pts.get(k));
      }
    }
    try (ClipSource c = Clips.open(clip, null)) {
      for (int k = 0; k < pts.size(); k++) {
        GreyFrame f = c.next();
        assertThat(f).as("frame %d", k).isNotNull();
        // MP4 keeps the 1/90000 s ticks as written (ISO/IEC 14496-12 media time scale)
        assertThat(f.time_s()).isCloseTo(pts.get(k) / 90_000.0, within(1e-9));
      }
      assertThat(c.next()).isNull();
    }
  }

  @Test
  void slowMotionClipIsTimedAtItsStatedCaptureRate() {
    SyntheticScene s = TrackingAccuracyTest.scene(4);
    Path clip = dir.resolve("slomo.mp4");
    try (ClipWriter w = new ClipWriter(clip, ClipWriter.Kind.H264_MP4, 160, 120, 30, 30, 240)) {
      for (int k = 0; k < 10; k++) {
        w.write(s.frame(k / 240.0, k), k);
      }
    }
    try (ClipSource c = Clips.open(clip, null)) {
      assertThat(c.info().timeScale()).isCloseTo(30.0 / 240, within(1e-9));
      c.next();
      GreyFrame second = c.next();
      // played at 30 frames/s, captured at 240: one frame is 1/240 s of real time
      assertThat(second.time_s()).isCloseTo(1 / 240.0, within(1e-9));
    }
  }

  @Test
  void scaleIsAppliedExactly() {
    SyntheticScene s = TrackingAccuracyTest.scene(5);
    Path clip = mjpeg(s, "s.avi", 20);
    Track t;
    try (ClipSource c = Clips.open(clip, null)) {
      t = VideoTracker.track(c, TrackingAccuracyTest.request(s), null, null);
    }
    ImageScale scale = ImageScale.parse("10,20 130,20 = 5 cm");
    assertThat(scale.mm_per_px()).isEqualTo(50.0 / 120);
    // two points each good to 0.5 px: u(d) = √2·0.5 px over d = 120 px (GUM, sum in quadrature)
    assertThat(scale.relativeUncertainty()).isCloseTo(Math.sqrt(2) * 0.5 / 120, within(1e-15));
    VideoTable table = VideoTable.of(t, scale, LoadingDirection.DOWN);
    TrackedFrame f0 = t.frames().get(0);
    for (int i = 0; i < t.frames().size(); i++) {
      TrackedFrame f = t.frames().get(i);
      double dy = f.y() - f0.y() - (f.refY() - f0.refY());
      double dx = f.x() - f0.x() - (f.refX() - f0.refX());
      assertThat(table.position_mm()[i]).isEqualTo(dy * (50.0 / 120));
      // across a downward travel, positive to its right is the image's −x
      assertThat(table.across_mm()[i]).isEqualTo(-dx * (50.0 / 120));
    }
  }

  @Test
  void aMarkerCoveredForTenFramesIsLostNotInterpolated() {
    SyntheticScene s = TrackingAccuracyTest.scene(6);
    s.occludedFrom = 30;
    s.occludedTo = 39;
    Path clip = mjpeg(s, "o.avi", 60);
    Track t;
    try (ClipSource c = Clips.open(clip, null)) {
      t = VideoTracker.track(c, TrackingAccuracyTest.request(s), null, null);
    }
    for (TrackedFrame f : t.frames()) {
      boolean covered = f.index() >= 30 && f.index() <= 39;
      assertThat(f.lost()).as("frame %d", f.index()).isEqualTo(covered);
      if (covered) {
        assertThat(f.x()).isNaN();
      }
    }
    assertThat(t.lostSpans()).hasSize(1);
    assertThat(t.lostSpans().get(0).firstFrame()).isEqualTo(30);
    assertThat(t.lostSpans().get(0).lastFrame()).isEqualTo(39);
    VideoTable table = VideoTable.of(t, ImageScale.parse("0,0 100,0 = 10 mm"),
        LoadingDirection.DOWN);
    // the position source stops at the first lost frame: nothing is drawn across the gap
    assertThat(table.positionTable().time_s()).hasSize(30);
    Path csv = VideoTableFiles.publish(dir.resolve("o.csv"), table);
    VideoTable back = VideoTableFiles.read(csv);
    assertThat(back.lostCount()).isEqualTo(10);
    assertThat(back.position_mm()[35]).isNaN();
    assertThat(back.position_mm()[20]).isCloseTo(table.position_mm()[20], within(1e-6));
    assertThat(back.scale().mm_per_px()).isEqualTo(0.1);
    // never overwritten
    assertThatThrownBy(() -> VideoTableFiles.publish(csv, table))
        .isInstanceOf(LoadstoneException.class);
  }

  @Test
  void badInputIsRefusedWithTheFix() throws Exception {
    Path text = Files.writeString(dir.resolve("notes.mp4"), "not a video");
    assertThatThrownBy(() -> Clips.open(text, null)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("notes.mp4").hasMessageContaining("H.264");
    Path noVideo = dir.resolve("none.mov");
    assertThatThrownBy(() -> Clips.open(noVideo, null)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("does not exist");
    assertThatThrownBy(() -> ImageScale.parse("10,10 10,10 = 50 mm"))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("0.00 pixels apart");
    SyntheticScene s = TrackingAccuracyTest.scene(8);
    Path clip = mjpeg(s, "b.avi", 3);
    try (ClipSource c = Clips.open(clip, null)) {
      assertThatThrownBy(() -> VideoTracker.track(c, new VideoTracker.Request(
          new PixelPoint(170, 50), null, null, TrackSettings.DEFAULTS), null, null))
          .isInstanceOf(LoadstoneException.class).hasMessageContaining("outside the 160x120");
    }
    Path folder = Files.createDirectory(dir.resolve("empty"));
    assertThatThrownBy(() -> Clips.open(folder, 30.0)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 2");
  }
}
