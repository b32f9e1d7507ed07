package org.loadstone.video;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A tracked clip read at any of its frames, in any order, for replay: a frame near ahead of the
 * last one read is decoded forward, any other from the key frame before it (the decoder is wound
 * back), and the last {@link #KEPT} frames read are kept — never the whole clip, so a long
 * high-rate clip replays in bounded memory.
 *
 * <p>Frames are known by their row in the track and found by their capture time (a frame's number
 * is not known after winding back). Not thread-safe: one thread reads.
 */
public final class ClipFrames implements AutoCloseable {
  /** Frames kept after reading. */
  static final int KEPT = 8;
  /**
   * Rows ahead of the last one read that are reached by decoding forward, not by winding (a
   * phone's clip has a key frame every second or so).
   */
  static final int NEAR = 48;

  private final Path file;
  private final Double rate_fps;
  private final double[] times;
  private final int[] numbers;
  private final double tolerance_s;
  private final Map<Integer, GreyFrame> kept = new LinkedHashMap<>(16, 0.75f, true) {
    @Override
    protected boolean removeEldestEntry(Map.Entry<Integer, GreyFrame> e) {
      return size() > KEPT;
    }
  };
  private ClipSource clip;
  /** Capture time and row of the last frame the decoder gave (row −1: not a tracked frame). */
  private double lastTime = Double.NEGATIVE_INFINITY;
  private int lastRow = -1;
  /** Frames decoded so far, winding included: for tests and measurements. */
  private long decoded;

  private ClipFrames(Path file, Double rate_fps, List<TrackedFrame> frames) {
    this.file = file;
    this.rate_fps = rate_fps;
    int n = frames.size();
    times = new double[n];
    numbers = new int[n];
    double gap = Double.POSITIVE_INFINITY;
    for (int i = 0; i < n; i++) {
      times[i] = frames.get(i).time_s();
      numbers[i] = frames.get(i).index();
      if (i > 0) {
        gap = Math.min(gap, times[i] - times[i - 1]);
      }
    }
    tolerance_s = Double.isFinite(gap) ? 0.25 * gap : 1e-6;
    clip = Clips.open(file, rate_fps);
    try {
      frame(0); // the decoder learns the clip's first timestamp, which winding is measured from
    } catch (RuntimeException e) {
      clip.close();
      throw e;
    }
  }

  /**
   * @param file the clip tracked (file or image folder)
   * @param rate_fps as given when it was tracked ({@link Clips#open})
   * @param frames the track's frames, at least one
   * @throws LoadstoneException when the clip cannot be opened
   */
  public static ClipFrames open(Path file, Double rate_fps, List<TrackedFrame> frames) {
    Precondition.notNull(file, "file");
    if (frames.isEmpty()) {
      throw new IllegalArgumentException("no frames");
    }
    return new ClipFrames(file, rate_fps, frames);
  }

  /** @return the number of frames */
  public int rows() {
    return times.length;
  }

  /** @return frames decoded so far, those decoded on the way to the one asked for included */
  public long decoded() {
    return decoded;
  }

  /**
   * @param row a row of the track, 0 to {@link #rows()} − 1
   * @return that frame, numbered as in the track
   * @throws LoadstoneException when the clip no longer holds a frame at that time (it was changed
   *     since it was tracked) or is damaged there
   */
  public GreyFrame frame(int row) {
    if (row < 0 || row >= times.length) {
      throw new IndexOutOfBoundsException("row " + row + " of " + times.length);
    }
    GreyFrame k = kept.get(row);
    if (k != null) {
      return k;
    }
    double want = times[row];
    // an image of a folder is read on its own: going there is free
    int near = clip instanceof ImageFolderClip ? 1 : NEAR;
    if (!(lastTime < want - tolerance_s && row - lastRow <= near)) {
      windBefore(want);
    }
    while (true) {
      GreyFrame g = clip.next();
      if (g == null) {
        throw changed(want, "ends before it");
      }
      decoded++;
      lastTime = g.time_s();
      lastRow = rowOf(g.time_s());
      if (lastRow == row) {
        GreyFrame f = new GreyFrame(numbers[row], g.time_s(), g.width(), g.height(), g.luma());
        kept.put(row, f);
        return f;
      }
      if (g.time_s() > want + tolerance_s) {
        throw changed(want, "holds no frame there");
      }
    }
  }

  private LoadstoneException changed(double want, String how) {
    return new LoadstoneException(String.format(Locale.ROOT, "clip %s %s at %.4f s, where it "
        + "had a frame when it was tracked: it has been changed since; track it again", file,
        how, want));
  }

  private int rowOf(double t) {
    int i = ReplayTimeline.nearest(times, t);
    return Math.abs(times[i] - t) <= tolerance_s ? i : -1;
  }

  private void windBefore(double time_s) {
    if (clip instanceof FfmpegClip f) {
      f.seekBefore(time_s);
    } else if (clip instanceof ImageFolderClip i) {
      i.seekBefore(time_s);
    } else {
      clip.close();
      clip = Clips.open(file, rate_fps);
    }
    lastTime = Double.NEGATIVE_INFINITY;
    lastRow = -1;
  }

  @Override
  public void close() {
    clip.close();
  }
}
