package org.loadstone.video;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * What tracking adds to decoding: one pass over a 1080p H.264 clip at 240 frames/s, decoded only,
 * against decoded and tracked (a point and a reference, the default 25-pixel template and ±16
 * pixel search). The issue asks for at most 25 % more than decoding alone.
 *
 * <p>The clip is a proxy for the 10 s, 240 frames/s 1080p clip: the same frame size and
 * rate, {@code seconds} long (1 s by default; encoding 2400 frames at 1080p with openh264 takes
 * minutes on the build machine). The fork runs with a 160 MB heap: holding more than a few
 * 2 MB frames would run it out of memory, so a finished run shows memory bounded by design.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 4)
@Measurement(iterations = 8)
@Fork(value = 1, jvmArgsAppend = "-Xmx160m")
public class VideoTrackingBenchmark {
  static final int W = 1920;
  static final int H = 1080;
  static final int FPS = 240;

  @Param({"1"})
  public int seconds;

  Path dir;
  Path clip;

  @Setup(Level.Trial)
  public void makeClip() throws Exception {
    dir = Files.createTempDirectory("video-bench");
    clip = dir.resolve("proxy.mp4");
    // a fixed random texture larger than the frame; each frame is a window of it moved by the
    // crosshead's path (half a pixel per frame down in whole-pixel steps, a slow sway across), so everything visible moves
    int tw = W + 64;
    int th = H + FPS * seconds / 2 + 64;
    byte[] tex = new byte[tw * th];
    Random r = new Random(1);
    for (int i = 0; i < tex.length; i++) {
      tex[i] = (byte) (80 + r.nextInt(16));
    }
    for (int b = 0; b < tw * th / 400; b++) {
      int cx = r.nextInt(tw);
      int cy = r.nextInt(th);
      int v = 60 + r.nextInt(150);
      for (int y = Math.max(0, cy - 3); y < Math.min(th, cy + 4); y++) {
        for (int x = Math.max(0, cx - 3); x < Math.min(tw, cx + 4); x++) {
          tex[y * tw + x] = (byte) v;
        }
      }
    }
    byte[] frame = new byte[W * H];
    try (ClipWriter w = new ClipWriter(clip, ClipWriter.Kind.H264_MP4, W, H, FPS, FPS, 0)) {
      for (int k = 0; k < FPS * seconds; k++) {
        int ox = 32 + (int) Math.round(8 * Math.sin(k * 0.01));
        int oy = th - H - 32 - k / 2;
        for (int y = 0; y < H; y++) {
          System.arraycopy(tex, (oy + y) * tw + ox, frame, y * W, W);
        }
        w.write(frame, k);
      }
    }
  }

  @TearDown(Level.Trial)
  public void removeClip() throws Exception {
    Files.deleteIfExists(clip);
    Files.deleteIfExists(dir);
  }

  /** Decoding alone: every frame's grey values, touched once. */
  @Benchmark
  public long decodeOnly() {
    long sum = 0;
    try (ClipSource c = Clips.open(clip, null)) {
      GreyFrame f;
      while ((f = c.next()) != null) {
        sum += f.luma()[f.luma().length / 2];
      }
    }
    return sum;
  }

  /** Decoding and tracking a point and a reference. */
  @Benchmark
  public int decodeAndTrack() {
    try (ClipSource c = Clips.open(clip, null)) {
      Track t = VideoTracker.track(c, new VideoTracker.Request(new PixelPoint(960, 300),
          new PixelPoint(300, 400), null, TrackSettings.DEFAULTS), null, null);
      return t.frames().size();
    }
  }
}
