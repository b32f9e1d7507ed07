package org.loadstone.sim;

/**
 * A specimen made of an intact loading curve, a failure criterion and a post-failure envelope,
 * with elastic unloading: below the largest deflection reached, the force follows a line of the
 * elastic slope down from the envelope at that largest deflection (and is never below zero), so a
 * crosshead that backs off and comes again unloads and reloads along a straight line.
 */
final class HistorySpecimen implements SpecimenModel {
  private final PreCurve pre;
  private final PostFailure post;
  private final double unloadStiffness_N_per_mm;
  private boolean failed;
  private double failure_s = Double.NaN;
  private double maxDeflection_mm;

  HistorySpecimen(PreCurve pre, PostFailure post) {
    this.pre = pre;
    this.post = post;
    this.unloadStiffness_N_per_mm = pre.stiffness_N_per_mm;
  }

  private double envelope_N(double deflection_mm, double time_s) {
    double f =
        failed
            ? Math.min(pre.uncappedForce_N(deflection_mm), post.force_N(deflection_mm, time_s))
            : pre.force_N(deflection_mm);
    return Math.max(0, f);
  }

  @Override
  public double force_N(double deflection_mm, double time_s) {
    double e = envelope_N(deflection_mm, time_s);
    if (deflection_mm >= maxDeflection_mm) {
      return e;
    }
    double line =
        envelope_N(maxDeflection_mm, time_s)
            - unloadStiffness_N_per_mm * (maxDeflection_mm - deflection_mm);
    return Math.max(0, Math.min(e, line));
  }

  @Override
  public double commit(double deflection_mm, double time_s) {
    double f = force_N(deflection_mm, time_s);
    if (!failed
        && (f >= pre.strength_N() * (1 - 1e-12) || deflection_mm >= pre.failureDeflection_mm())) {
      failed = true;
      failure_s = time_s;
      post.start(deflection_mm, f, time_s);
    } else if (failed) {
      post.commit(deflection_mm, f, time_s);
    }
    maxDeflection_mm = Math.max(maxDeflection_mm, deflection_mm);
    return f;
  }

  @Override
  public double elasticStiffness_N_per_mm() {
    return pre.stiffness_N_per_mm;
  }

  @Override
  public double failureTime_s() {
    return failure_s;
  }
}
