package org.loadstone.video;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/**
 * Follows one marked point from frame to frame.
 *
 * <p>The template is half the first frame's patch, fixed, and half a learnt patch: each frame
 * matched at least {@link TrackSettings#adaptAbove} blends its patch, resampled at the tracked
 * sub-pixel place, into the learnt half at {@link TrackSettings#adaptRate}. The fixed half
 * anchors the template to the first frame, so small errors cannot add up into drift; the learnt
 * half follows slow changes of blur, lighting and perspective.
 *
 * <p>The search is centred on the place predicted from the last two matches (constant
 * velocity), first ±{@value #NEAR_PX} pixels, then the whole search window when the best place
 * there lies on that small window's edge or is weak. A weak match, or one at the window's edge,
 * is searched for again three times as far around the last good place; still weak, the frame is lost: no position is reported for
 * it, and the template does not learn from it.
 */
final class PointTracker {
  /** One frame's result: the point's place in pixels (NaN when lost) and the match score. */
  record Step(double x, double y, double score, boolean lost) {}

  /** Reach of the first, small search around the prediction, pixels. */
  static final int NEAR_PX = 4;

  private final TrackSettings settings;
  private final PatchMatcher matcher;
  private final int side;
  private final float[] fixed;
  private final float[] learnt;
  private final float[] template;
  private double templateNorm;
  private final double offsetX;
  private final double offsetY;
  private double lastX;
  private double lastY;
  private double prevX = Double.NaN;
  private double prevY = Double.NaN;
  private boolean lastGood = true;

  /**
   * @param first the first frame
   * @param point the marked point
   * @param what what the point marks, for messages
   * @throws LoadstoneException when the point or its template lies outside the frame, or the
   *     patch around it is flat (nothing to track)
   */
  PointTracker(GreyFrame first, PixelPoint point, TrackSettings settings, String what) {
    this.settings = settings;
    int half = settings.templateHalf_px();
    this.side = 2 * half + 1;
    this.matcher = new PatchMatcher(half);
    int cx = (int) Math.round(point.x());
    int cy = (int) Math.round(point.y());
    if (point.x() < 0 || point.y() < 0 || point.x() > first.width() - 1
        || point.y() > first.height() - 1) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the %s %s lies outside the "
          + "%dx%d frame: give a point inside it (pixels from the top-left corner, y down)", what,
          point, first.width(), first.height()));
    }
    if (cx - half < 0 || cy - half < 0 || cx + half >= first.width()
        || cy + half >= first.height()) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the %s %s is closer than %d "
          + "pixels to the edge of the %dx%d frame, so its %d-pixel template does not fit: mark "
          + "a point further in or track with a smaller template", what, point, half,
          first.width(), first.height(), side),
          org.loadstone.units.Setting.TRACK_WINDOW);
    }
    fixed = new float[side * side];
    sample(first, cx, cy, fixed);
    double spread = spread(fixed);
    normalise(fixed);
    learnt = fixed.clone();
    template = new float[side * side];
    rebuild();
    if (spread < 2) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the %s %s sits on a flat patch "
          + "(no edge or texture within %d pixels), so it cannot be followed: mark a point on a "
          + "marker, an edge or a printed pattern", what, point, half));
    }
    offsetX = point.x() - cx;
    offsetY = point.y() - cy;
    lastX = cx;
    lastY = cy;
  }

  /** @return the point in this frame */
  Step step(GreyFrame frame) {
    int reach = settings.searchHalf_px();
    double px = lastX;
    double py = lastY;
    if (lastGood && !Double.isNaN(prevX)) {
      px += lastX - prevX;
      py += lastY - prevY;
    }
    int cx = (int) Math.round(px);
    int cy = (int) Math.round(py);
    // near the prediction first (a constant-velocity guess is rarely more than a few pixels
    // off); a best place on the small window's edge or a weak one means look wider
    PatchMatcher.Match m = matcher.find(frame, template, templateNorm, cx, cy,
        Math.min(NEAR_PX, reach));
    if (reach > NEAR_PX && (m == null || m.score() < settings.lostBelow() || m.atEdge())) {
      m = matcher.find(frame, template, templateNorm, cx, cy, reach);
    }
    if (m == null || m.score() < settings.lostBelow() || m.atEdge()) {
      PatchMatcher.Match wide = matcher.find(frame, template, templateNorm,
          (int) Math.round(lastX), (int) Math.round(lastY), 3 * reach);
      if (wide != null && (m == null || wide.score() > m.score())) {
        m = wide;
      }
    }
    if (m == null || m.score() < settings.lostBelow()) {
      lastGood = false;
      prevX = Double.NaN;
      return new Step(Double.NaN, Double.NaN, m == null ? 0 : Math.max(0, m.score()), true);
    }
    double[] fine = matcher.refine(frame, template, m.x(), m.y());
    m = new PatchMatcher.Match(fine[0], fine[1], m.score(), m.atEdge());
    prevX = lastGood ? lastX : Double.NaN;
    prevY = lastY;
    lastX = m.x();
    lastY = m.y();
    lastGood = true;
    if (m.score() >= settings.adaptAbove() && settings.adaptRate() > 0) {
      learn(frame, m.x(), m.y());
    }
    return new Step(m.x() + offsetX, m.y() + offsetY, m.score(), false);
  }

  private void learn(GreyFrame frame, double x, double y) {
    int half = side / 2;
    if (x - half < 0 || y - half < 0 || x + half + 1 >= frame.width()
        || y + half + 1 >= frame.height()) {
      return;
    }
    float[] patch = new float[side * side];
    int x0 = (int) Math.floor(x);
    int y0 = (int) Math.floor(y);
    float fx = (float) (x - x0);
    float fy = (float) (y - y0);
    int k = 0;
    for (int j = -half; j <= half; j++) {
      for (int i = -half; i <= half; i++) {
        int xi = x0 + i;
        int yj = y0 + j;
        float a = frame.at(xi, yj) * (1 - fx) + frame.at(xi + 1, yj) * fx;
        float b = frame.at(xi, yj + 1) * (1 - fx) + frame.at(xi + 1, yj + 1) * fx;
        patch[k++] = a * (1 - fy) + b * fy;
      }
    }
    normalise(patch);
    float r = (float) settings.adaptRate();
    for (int i = 0; i < learnt.length; i++) {
      learnt[i] = (1 - r) * learnt[i] + r * patch[i];
    }
    rebuild();
  }

  private void sample(GreyFrame f, int cx, int cy, float[] out) {
    int half = side / 2;
    int k = 0;
    for (int j = -half; j <= half; j++) {
      for (int i = -half; i <= half; i++) {
        out[k++] = f.at(cx + i, cy + j);
      }
    }
  }

  /** @return the standard deviation of the grey values, grey levels */
  private static double spread(float[] p) {
    double s = 0;
    double q = 0;
    for (float v : p) {
      s += v;
      q += v * v;
    }
    double mean = s / p.length;
    return Math.sqrt(Math.max(0, q / p.length - mean * mean));
  }

  /** Zero mean, unit spread, so the fixed and learnt halves weigh alike whatever the light. */
  private static void normalise(float[] p) {
    double s = 0;
    for (float v : p) {
      s += v;
    }
    float mean = (float) (s / p.length);
    double q = 0;
    for (int i = 0; i < p.length; i++) {
      p[i] -= mean;
      q += p[i] * p[i];
    }
    float k = q > 0 ? (float) (64 / Math.sqrt(q / p.length)) : 0;
    for (int i = 0; i < p.length; i++) {
      p[i] *= k;
    }
  }

  private void rebuild() {
    double s = 0;
    for (int i = 0; i < template.length; i++) {
      template[i] = 0.5f * (fixed[i] + learnt[i]);
      s += template[i];
    }
    float mean = (float) (s / template.length);
    double q = 0;
    for (int i = 0; i < template.length; i++) {
      template[i] -= mean;
      q += template[i] * template[i];
    }
    templateNorm = Math.sqrt(q);
  }
}
