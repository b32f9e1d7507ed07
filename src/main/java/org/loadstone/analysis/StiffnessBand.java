package org.loadstone.analysis;

import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.units.LoadstoneException;

/**
 * The stiffness over a band chosen by the user: the least-squares slope over every sample of the
 * rise from where the loading path first reaches the band's lower bound to the last sample before
 * it first passes the upper bound. A force band is located on the lightly smoothed force (see
 * {@link RiseProfile}), so noise neither cuts the band short nor drops samples from inside it;
 * a displacement or position band on the channel itself.
 */
final class StiffnessBand {
  static final int MIN_SAMPLES = 3;

  private StiffnessBand() {}

  /**
   * @param p the rise
   * @param bounds the band
   * @param position0_mm the raw position at the first sample (position bands)
   * @throws LoadstoneException when the band lies outside the rise, holds fewer than 3 samples or
   *     no rising slope; the message names the band, what the curve offers and the fix
   */
  static StiffnessFit fit(RiseProfile p, StiffnessBounds bounds, double position0_mm) {
    double peakForce = p.y[p.peak];
    String band = bounds.words();
    int from;
    int to;
    switch (bounds.basis()) {
      case FORCE_N, PEAK_FRACTION -> {
        double scale = bounds.basis() == AnalysisSettings.Basis.PEAK_FRACTION ? peakForce : 1;
        double lo = bounds.low() * scale;
        double hi = bounds.high() * scale;
        if (hi > peakForce || hi <= p.smooth[0]) {
          throw outside(band, StiffnessBounds.plain(lo) + " to " + StiffnessBounds.plain(hi)
              + " N", "the rise runs from " + StiffnessBounds.plain(p.smooth[0])
              + " N to the peak force " + StiffnessBounds.plain(peakForce) + " N",
              "forces inside the rise, for example 10–40 % of the peak");
        }
        from = p.firstForce(lo, 0, p.peak);
        to = p.firstForce(Math.nextUp(hi), from, p.peak) - 1;
      }
      case DISPLACEMENT_MM, POSITION_MM -> {
        double shift = bounds.basis() == AnalysisSettings.Basis.POSITION_MM ? position0_mm : 0;
        double lo = bounds.low();
        double hi = bounds.high();
        if (hi > p.x[p.peak] + shift || hi <= p.x[0] + shift) {
          throw outside(band, band, "the rise runs from " + StiffnessBounds.plain(p.x[0] + shift)
              + " mm to " + StiffnessBounds.plain(p.x[p.peak] + shift) + " mm at the peak",
              "a band between those");
        }
        from = p.firstDisplacement(lo, shift);
        to = p.firstDisplacement(Math.nextUp(hi), shift) - 1;
      }
      default -> throw new IllegalStateException("unhandled band basis " + bounds.basis());
    }
    int count = Math.max(0, to - from + 1);
    if (count < MIN_SAMPLES) {
      throw new LoadstoneException("The stiffness band " + band + " holds " + count
          + " sample(s) of the rise; a fit needs at least " + MIN_SAMPLES + ". Widen the band "
          + "or move it onto the rising part of the curve.");
    }
    StiffnessFit fit = StiffnessFit.over(p.x, p.y, from, to, method(bounds.basis()));
    if (fit == null) {
      throw new LoadstoneException("The stiffness band " + band + " (samples " + from + " to "
          + to + ") shows no force rising with displacement: the displacement does not change or "
          + "the force falls there. Choose a band where the specimen deflects under rising load.");
    }
    return fit;
  }

  private static LoadstoneException outside(String band, String asForce, String offer, String fix) {
    String shown = band.equals(asForce) ? band : band + " (" + asForce + ")";
    return new LoadstoneException("The stiffness band " + shown + " lies outside the curve: "
        + offer + ", so no or only part of the band is on it and a fit needs at least "
        + MIN_SAMPLES + " samples in the band. Choose " + fix + ".");
  }

  private static StiffnessFit.Method method(AnalysisSettings.Basis basis) {
    return switch (basis) {
      case FORCE_N -> StiffnessFit.Method.FORCE_BOUNDS;
      case PEAK_FRACTION -> StiffnessFit.Method.PEAK_FRACTION_BOUNDS;
      case DISPLACEMENT_MM -> StiffnessFit.Method.DISPLACEMENT_BOUNDS;
      case POSITION_MM -> StiffnessFit.Method.POSITION_BOUNDS;
    };
  }
}
