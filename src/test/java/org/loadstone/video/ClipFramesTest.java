package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

/**
 * Replay reads a tracked clip at any frame, in any order: each frame read by winding back to a key
 * frame and decoding forward is the very frame a straight decode from the start gives (the
 * decoders are deterministic: the same coded data from the same key frame decode to the same
 * pixels, ITU-T H.264 §8 and ISO/IEC 10918-1), and winding reaches a frame from its key frame,
 * not from the start of the clip.
 */
class ClipFramesTest {
  @TempDir Path dir;
  static final int FRAMES = 90;
  static final int GOP = 30;

  Path encoded(ClipWriter.Kind kind, String name) {
    SyntheticScene s = TrackingAccuracyTest.scene(21);
    Path clip = dir.resolve(name);
    try (ClipWriter w = new ClipWriter(clip, kind, 160, 120, GOP, GOP, 0)) {
      for (int k = 0; k < FRAMES; k++) {
        w.write(s.frame(k / (double) GOP, k), k);
      }
    }
    return clip;
  }

  Path folder() throws Exception {
    SyntheticScene s = TrackingAccuracyTest.scene(22);
    Path d = Files.createDirectories(dir.resolve("frames"));
    for (int k = 0; k < 40; k++) {
      BufferedImage img = new BufferedImage(160, 120, BufferedImage.TYPE_BYTE_GRAY);
      img.getRaster().setDataElements(0, 0, 160, 120, s.frame(k / 25.0, k));
      ImageIO.write(img, "png", d.resolve(String.format("f-%04d.png", k + 7)).toFile());
    }
    return d;
  }

  /** Every frame of the clip decoded from the start, as a track lists them. */
  static List<GreyFrame> straight(Path clip, Double rate) {
    List<GreyFrame> out = new ArrayList<>();
    try (ClipSource c = Clips.open(clip, rate)) {
      for (GreyFrame g = c.next(); g != null; g = c.next()) {
        out.add(g);
      }
    }
    return out;
  }

  static List<TrackedFrame> rows(List<GreyFrame> frames) {
    List<TrackedFrame> t = new ArrayList<>();
    for (GreyFrame g : frames) {
      t.add(new TrackedFrame(g.index(), g.time_s(), 0, 0, Double.NaN, Double.NaN, 1, false,
          Double.NaN, Double.NaN));
    }
    return t;
  }

  void readsEveryFrameInAnyOrderAsDecodedStraight(Path clip, Double rate, int gop) {
    List<GreyFrame> truth = straight(clip, rate);
    List<Integer> order = new ArrayList<>();
    for (int i = 0; i < truth.size(); i++) {
      order.add(i);
    }
    Collections.shuffle(order, new Random(5));
    try (ClipFrames frames = ClipFrames.open(clip, rate, rows(truth))) {
      for (int row : order) {
        GreyFrame f = frames.frame(row);
        assertThat(f.index()).isEqualTo(truth.get(row).index());
        assertThat(f.time_s()).isEqualTo(truth.get(row).time_s());
        assertThat(f.luma()).as("frame %d read out of order", row)
            .isEqualTo(truth.get(row).luma());
      }
      // stepping back one frame at a time: each from the key frame before it, at most a group
      // of pictures decoded per step (and the first step forward, when near, from where the
      // reading left off), where decoding from the start would take up to the whole clip
      // (about n²/2 frames in all)
      long before = frames.decoded();
      for (int row = truth.size() - 1; row >= 0; row--) {
        assertThat(frames.frame(row).luma()).isEqualTo(truth.get(row).luma());
      }
      long stepped = frames.decoded() - before;
      assertThat(stepped).as("frames decoded stepping back").isLessThanOrEqualTo(
          (long) truth.size() * gop + (gop > 1 || rate == null ? ClipFrames.NEAR : 0));
    }
  }

  @Test
  void h264FramesReadInAnyOrderAreTheStraightDecodesOwn() {
    readsEveryFrameInAnyOrderAsDecodedStraight(encoded(ClipWriter.Kind.H264_MP4, "c.mp4"), null,
        GOP);
  }

  @Test
  void mjpegFramesReadInAnyOrderAreTheStraightDecodesOwn() {
    // every MJPEG frame is a key frame: a step back decodes one frame
    readsEveryFrameInAnyOrderAsDecodedStraight(encoded(ClipWriter.Kind.MJPEG_AVI, "c.avi"), null,
        1);
  }

  @Test
  void imageFolderFramesReadInAnyOrderAreTheImagesOwn() throws Exception {
    readsEveryFrameInAnyOrderAsDecodedStraight(folder(), 25.0, 1);
  }

  @Test
  void aClipChangedSinceItWasTrackedIsNamed() {
    Path clip = encoded(ClipWriter.Kind.MJPEG_AVI, "short.avi");
    List<TrackedFrame> rows = new ArrayList<>(rows(straight(clip, null)));
    // the track said the clip went on for another frame
    TrackedFrame last = rows.get(rows.size() - 1);
    rows.add(new TrackedFrame(last.index() + 1, last.time_s() + 1.0 / GOP, 0, 0, 0, 0, 1, false,
        0, 0));
    try (ClipFrames frames = ClipFrames.open(clip, null, rows)) {
      assertThatThrownBy(() -> frames.frame(rows.size() - 1))
          .isInstanceOf(LoadstoneException.class)
          .hasMessageContaining("short.avi ends before it")
          .hasMessageContaining("track it again");
    }
  }
}
